// The outcome of one check (pass, caution, fail, not applicable) as word + shape + colour.
import type { CheckStatus } from '@shared/schemas/packages';
import { CHECK_STATUS_LABELS } from '@shared/vocabulary/check-statuses';

const STYLES: Record<CheckStatus, string> = {
  pass: 'bg-pass-tint text-pass-ink',
  caution: 'bg-caution-tint text-caution-ink',
  fail: 'bg-fail-tint text-fail-ink',
  not_applicable: 'bg-na-tint text-na-ink',
};

export function CheckShape({ status, className = 'size-3.5' }: { status: CheckStatus; className?: string }) {
  const common = {
    className,
    viewBox: '0 0 14 14',
    'aria-hidden': true,
    focusable: false,
    fill: 'none',
    stroke: 'currentColor',
    strokeWidth: 1.6,
    strokeLinecap: 'round',
    strokeLinejoin: 'round',
  } as const;
  switch (status) {
    case 'pass': // a tick inside a circle
      return (
        <svg {...common}>
          <circle cx="7" cy="7" r="5.8" />
          <path d="M4.3 7.2 L6.2 9 L9.8 5" />
        </svg>
      );
    case 'caution': // an exclamation in a triangle
      return (
        <svg {...common}>
          <path d="M7 1.4 L12.8 11.8 H1.2 Z" />
          <path d="M7 5.2 V8" />
          <circle cx="7" cy="10" r="0.5" fill="currentColor" />
        </svg>
      );
    case 'fail': // a cross inside an octagon
      return (
        <svg {...common}>
          <path d="M4.6 1.2 H9.4 L12.8 4.6 V9.4 L9.4 12.8 H4.6 L1.2 9.4 V4.6 Z" fill="currentColor" />
          <path d="M5 5 L9 9 M9 5 L5 9" stroke="#fff" />
        </svg>
      );
    case 'not_applicable': // a dash inside a dotted circle
      return (
        <svg {...common}>
          <circle cx="7" cy="7" r="5.8" strokeDasharray="1.6 1.6" />
          <path d="M4.5 7 H9.5" />
        </svg>
      );
  }
}

export function CheckStatusMark({ status, className = '' }: { status: CheckStatus; className?: string }) {
  return (
    <span
      className={`inline-flex items-center gap-1 whitespace-nowrap rounded-sm px-1.5 py-px text-[12.5px] font-bold leading-5 ${STYLES[status]} ${className}`}
    >
      <CheckShape status={status} />
      {CHECK_STATUS_LABELS[status]}
    </span>
  );
}
