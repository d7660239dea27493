// A package status told three ways: the word, a shape of its own and a colour, so it
// reads in greyscale print and for people who do not tell the colours apart.
import type { PackageStatus } from '@shared/schemas/common';
import { PACKAGE_STATUS_LABELS } from '@shared/schemas/common';

const STYLES: Record<PackageStatus, string> = {
  draft: 'bg-draft-tint text-draft-ink border-draft-edge border-dashed',
  checking: 'bg-checking-tint text-checking-ink border-checking-edge',
  check_failed: 'bg-failed-tint text-failed-ink border-failed-edge',
  ready_for_review: 'bg-ready-tint text-ready-ink border-ready-edge',
  with_engineer: 'bg-engineer-tint text-engineer-ink border-engineer-edge',
  decided: 'bg-decided-tint text-decided-ink border-decided-edge',
  returned: 'bg-returned-tint text-returned-ink border-returned-edge',
};

/** 12×12 shapes drawn for Counterpoise; each status has a different outline, not just a colour. */
export function StatusShape({ status, className = 'size-3' }: { status: PackageStatus; className?: string }) {
  const common = {
    className,
    viewBox: '0 0 12 12',
    'aria-hidden': true,
    focusable: false,
    fill: 'none',
    stroke: 'currentColor',
    strokeWidth: 1.5,
  } as const;
  switch (status) {
    case 'draft': // an open, dashed ring: not yet a submission
      return (
        <svg {...common}>
          <circle cx="6" cy="6" r="4.5" strokeDasharray="2.2 1.6" />
        </svg>
      );
    case 'checking': // a ring half filled: work in progress
      return (
        <svg {...common}>
          <circle cx="6" cy="6" r="4.5" />
          <path d="M6 1.5 A4.5 4.5 0 0 1 6 10.5 Z" fill="currentColor" stroke="none" />
        </svg>
      );
    case 'check_failed': // a square with a cross: stopped
      return (
        <svg {...common}>
          <rect x="1.5" y="1.5" width="9" height="9" />
          <path d="M4 4 L8 8 M8 4 L4 8" />
        </svg>
      );
    case 'ready_for_review': // a solid diamond: a package on the reviewer's desk
      return (
        <svg {...common}>
          <path d="M6 0.8 L11.2 6 L6 11.2 L0.8 6 Z" fill="currentColor" stroke="none" />
        </svg>
      );
    case 'with_engineer': // a ring around a point: under examination
      return (
        <svg {...common}>
          <circle cx="6" cy="6" r="4.5" />
          <circle cx="6" cy="6" r="1.7" fill="currentColor" stroke="none" />
        </svg>
      );
    case 'decided': // a stamp seen from the side
      return (
        <svg {...common}>
          <path d="M4.2 1.3 H7.8 V5 L10 7 V8.3 H2 V7 L4.2 5 Z" fill="currentColor" stroke="none" />
          <path d="M1.5 10.4 H10.5" />
        </svg>
      );
    case 'returned': // an arrow turning back to the sender
      return (
        <svg {...common}>
          <path d="M10.2 2.2 V6 H2.5" />
          <path d="M5 3.4 L2.2 6 L5 8.6" />
        </svg>
      );
  }
}

export function StatusBadge({ status, className = '' }: { status: PackageStatus; className?: string }) {
  return (
    <span
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-sm border px-1.5 py-px text-[12.5px] font-bold leading-5 ${STYLES[status]} ${className}`}
    >
      <StatusShape status={status} />
      {PACKAGE_STATUS_LABELS[status]}
    </span>
  );
}
