// A finding's severity and state, each told by a word, a shape and a colour, the same on the
// engineer's side and the contractor's. Only the state's words change with the reader: the
// contractor reads "open" as waiting for their answer.
import type { Finding } from '@shared/schemas/reviews';

type Severity = Finding['severity'];
type State = Finding['state'];

/** Who reads the marks: the desk (engineer, coordinator) or the contractor who answers. */
export type FindingReader = 'desk' | 'contractor';

export const SEVERITY_LABELS: Record<Severity, string> = {
  note: 'Note',
  minor: 'Minor',
  major: 'Major',
  blocking: 'Blocking',
};

const STATE_LABELS: Record<FindingReader, Record<State, string>> = {
  desk: { open: 'Open', answered: 'Answered', closed: 'Closed' },
  contractor: { open: 'Waiting for your answer', answered: 'Answered', closed: 'Closed by the engineer' },
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

const BARS: Record<Severity, number> = { note: 1, minor: 2, major: 3, blocking: 4 };

const svg = {
  className: 'size-3',
  viewBox: '0 0 12 12',
  'aria-hidden': true,
  focusable: false,
} as const;

/** Rising bars, one filled per step of severity, so "how bad" reads without colour. */
export function SeverityMark({ severity }: { severity: Severity }) {
  return (
    <span
      className={`inline-flex items-center gap-1 whitespace-nowrap rounded-sm px-1.5 text-[12px] font-bold leading-5 ${SEVERITY_STYLES[severity]}`}
    >
      <svg {...svg}>
        {[0, 1, 2, 3].map((i) => (
          <rect
            key={i}
            x={1 + i * 2.7}
            y={8 - i * 2}
            width="2"
            height={3 + i * 2}
            fill="currentColor"
            opacity={i < BARS[severity] ? 1 : 0.25}
          />
        ))}
      </svg>
      {SEVERITY_LABELS[severity]}
    </span>
  );
}

function StateShape({ state }: { state: State }) {
  const line = { fill: 'none', stroke: 'currentColor', strokeWidth: 1.5 } as const;
  switch (state) {
    case 'open': // an empty ring: waiting for an answer
      return (
        <svg {...svg} {...line}>
          <circle cx="6" cy="6" r="4.5" />
        </svg>
      );
    case 'answered': // a ring with a dot: the contractor has replied
      return (
        <svg {...svg} {...line}>
          <circle cx="6" cy="6" r="4.5" />
          <circle cx="6" cy="6" r="1.8" fill="currentColor" stroke="none" />
        </svg>
      );
    case 'closed': // a filled ring with a tick: settled
      return (
        <svg {...svg} {...line}>
          <circle cx="6" cy="6" r="4.8" fill="currentColor" stroke="none" />
          <path d="M3.8 6.2 L5.4 7.7 L8.3 4.5" stroke="#fff" strokeLinecap="round" />
        </svg>
      );
  }
}

export function FindingStateMark({ state, reader = 'desk' }: { state: State; reader?: FindingReader }) {
  return (
    <span
      className={`inline-flex items-center gap-1 whitespace-nowrap rounded-sm border bg-sheet px-1.5 text-[12px] font-bold leading-[18px] ${STATE_STYLES[state]}`}
    >
      <StateShape state={state} />
      {STATE_LABELS[reader][state]}
    </span>
  );
}
