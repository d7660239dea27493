// A finding's severity and state for the contractor's side: a word and a shape, with
// colour only as a third cue.
import type { Finding } from '@shared/schemas/reviews';

type Severity = Finding['severity'];
type State = Finding['state'];

export const SEVERITY_WORDS: Record<Severity, string> = {
  note: 'Note',
  minor: 'Minor',
  major: 'Major',
  blocking: 'Blocking',
};

const SEVERITY_STYLE: Record<Severity, string> = {
  note: 'bg-na-tint text-na-ink',
  minor: 'bg-caution-tint text-caution-ink',
  major: 'bg-failed-tint text-failed-ink',
  blocking: 'bg-fail-ink text-white',
};

/** Filled bars, one per step of severity, so "how bad" reads without colour. */
export function SeverityBadge({ severity }: { severity: Severity }) {
  const bars = { note: 1, minor: 2, major: 3, blocking: 4 }[severity];
  return (
    <span
      className={`inline-flex items-center gap-1 whitespace-nowrap rounded-sm px-1.5 text-[12px] font-bold leading-5 ${SEVERITY_STYLE[severity]}`}
    >
      <svg className="size-3" viewBox="0 0 12 12" aria-hidden="true">
        {[0, 1, 2, 3].map((i) => (
          <rect
            key={i}
            x={1 + i * 2.7}
            y={8 - i * 2}
            width="2"
            height={3 + i * 2}
            fill="currentColor"
            opacity={i < bars ? 1 : 0.25}
          />
        ))}
      </svg>
      {SEVERITY_WORDS[severity]}
    </span>
  );
}

const STATE_WORDS: Record<State, string> = {
  open: 'Waiting for your answer',
  answered: 'Answered',
  closed: 'Closed by the engineer',
};

const STATE_STYLE: Record<State, string> = {
  open: 'border-caution-ink text-caution-ink',
  answered: 'border-ready-edge text-ready-ink',
  closed: 'border-pass-ink text-pass-ink',
};

export function FindingState({ state }: { state: State }) {
  return (
    <span
      className={`inline-flex items-center gap-1 whitespace-nowrap rounded-sm border bg-sheet px-1.5 text-[12px] font-bold leading-[18px] ${STATE_STYLE[state]}`}
    >
      <svg
        className="size-3"
        viewBox="0 0 12 12"
        aria-hidden="true"
        fill="none"
        stroke="currentColor"
        strokeWidth="1.5"
      >
        {state === 'open' && <circle cx="6" cy="6" r="4.5" />}
        {state === 'answered' && (
          <>
            <circle cx="6" cy="6" r="4.5" />
            <circle cx="6" cy="6" r="1.8" fill="currentColor" stroke="none" />
          </>
        )}
        {state === 'closed' && (
          <>
            <circle cx="6" cy="6" r="4.8" fill="currentColor" stroke="none" />
            <path d="M3.8 6.2 L5.4 7.7 L8.3 4.5" stroke="#fff" strokeLinecap="round" />
          </>
        )}
      </svg>
      {STATE_WORDS[state]}
    </span>
  );
}
