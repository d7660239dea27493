// A finding's severity and state, each told by a word, a shape of its own and a colour.
import type { Finding } from '@shared/schemas/reviews';

type Severity = Finding['severity'];
type State = Finding['state'];

export const SEVERITY_LABELS: Record<Severity, string> = {
  note: 'Note',
  minor: 'Minor',
  major: 'Major',
  blocking: 'Blocking',
};

export const STATE_LABELS: Record<State, string> = {
  open: 'Open',
  answered: 'Answered',
  closed: 'Closed',
};

const SEVERITY_STYLES: Record<Severity, string> = {
  note: 'bg-na-tint text-na-ink',
  minor: 'bg-caution-tint text-caution-ink',
  major: 'bg-failed-tint text-failed-ink',
  blocking: 'bg-fail-ink text-white',
};

const STATE_STYLES: Record<State, string> = {
  open: 'border-caution-ink text-caution-ink',
  answered: 'border-ready-edge text-ready-ink',
  closed: 'border-pass-ink text-pass-ink',
};

const svg = {
  className: 'size-3',
  viewBox: '0 0 12 12',
  'aria-hidden': true,
  focusable: false,
  fill: 'none',
  stroke: 'currentColor',
  strokeWidth: 1.5,
} as const;

function SeverityShape({ severity }: { severity: Severity }) {
  switch (severity) {
    case 'note': // one short bar: worth knowing
      return (
        <svg {...svg}>
          <path d="M3 6 H9" strokeLinecap="round" />
        </svg>
      );
    case 'minor': // one bar over a rule
      return (
        <svg {...svg}>
          <path d="M2 4 H10 M2 8.5 H10" strokeDasharray="2 1.5" />
        </svg>
      );
    case 'major': // two solid bars
      return (
        <svg {...svg}>
          <rect x="1.5" y="2.5" width="9" height="2.5" fill="currentColor" stroke="none" />
          <rect x="1.5" y="7" width="9" height="2.5" fill="currentColor" stroke="none" />
        </svg>
      );
    case 'blocking': // a barrier: a bar across a ring
      return (
        <svg {...svg}>
          <circle cx="6" cy="6" r="4.8" />
          <path d="M2.8 6 H9.2" strokeWidth="2.2" />
        </svg>
      );
  }
}

function StateShape({ state }: { state: State }) {
  switch (state) {
    case 'open': // an empty ring: waiting for an answer
      return (
        <svg {...svg}>
          <circle cx="6" cy="6" r="4.5" />
        </svg>
      );
    case 'answered': // a ring with a return mark: the contractor has replied
      return (
        <svg {...svg}>
          <circle cx="6" cy="6" r="4.5" />
          <path d="M8 4.5 H4.5 V7.5 M4.5 4.5 L3.6 5.4" strokeLinecap="round" />
        </svg>
      );
    case 'closed': // a filled ring: settled
      return (
        <svg {...svg}>
          <circle cx="6" cy="6" r="4.8" fill="currentColor" stroke="none" />
          <path d="M3.8 6.2 L5.4 7.7 L8.3 4.5" stroke="#fff" strokeLinecap="round" />
        </svg>
      );
  }
}

export function SeverityMark({ severity }: { severity: Severity }) {
  return (
    <span
      className={`inline-flex items-center gap-1 whitespace-nowrap rounded-sm px-1.5 text-[12px] font-bold leading-5 ${SEVERITY_STYLES[severity]}`}
    >
      <SeverityShape severity={severity} />
      {SEVERITY_LABELS[severity]}
    </span>
  );
}

export function FindingStateMark({ state }: { state: State }) {
  return (
    <span
      className={`inline-flex items-center gap-1 whitespace-nowrap rounded-sm border bg-sheet px-1.5 text-[12px] font-bold leading-[18px] ${STATE_STYLES[state]}`}
    >
      <StateShape state={state} />
      {STATE_LABELS[state]}
    </span>
  );
}
