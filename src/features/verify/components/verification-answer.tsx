// The one answer a person on site needs first, as big and as plain as it can be, then
// the facts to compare with the paper in their hand. Built for a phone in sunlight:
// large type, near-black on white or white on deep colour, and a shape for each answer.
import type { ReactNode } from 'react';
import type { Verification } from '@shared/schemas/reviews';
import { formatDate } from '@/lib/format';

export type AnswerKind = 'go' | 'stop' | 'unknown' | 'wait';

const FRAME: Record<AnswerKind, string> = {
  go: 'border-pass-ink bg-sheet text-ink',
  stop: 'border-fail-ink bg-fail-ink text-white',
  unknown: 'border-ink bg-sheet text-ink',
  wait: 'border-ink bg-sheet text-ink',
};

function AnswerShape({ kind }: { kind: AnswerKind }) {
  const common = { className: 'size-14 shrink-0', viewBox: '0 0 56 56', 'aria-hidden': true } as const;
  switch (kind) {
    case 'go': // a solid disc with a tick
      return (
        <svg {...common}>
          <circle cx="28" cy="28" r="26" fill="var(--color-pass-ink)" />
          <path
            d="M15 29 L24 38 L41 19"
            fill="none"
            stroke="#fff"
            strokeWidth="6"
            strokeLinecap="round"
            strokeLinejoin="round"
          />
        </svg>
      );
    case 'stop': // an octagon with a bar: do not go on
      return (
        <svg {...common}>
          <path d="M18 2 H38 L54 18 V38 L38 54 H18 L2 38 V18 Z" fill="#fff" />
          <rect x="13" y="24" width="30" height="8" fill="var(--color-fail-ink)" />
        </svg>
      );
    case 'unknown': // an empty square with a question mark
      return (
        <svg {...common}>
          <rect x="3" y="3" width="50" height="50" fill="none" stroke="currentColor" strokeWidth="5" />
          <path
            d="M20 21 Q20 12 28 12 Q36 12 36 20 Q36 26 28 29 V34"
            fill="none"
            stroke="currentColor"
            strokeWidth="5"
            strokeLinecap="round"
          />
          <circle cx="28" cy="43" r="3.5" fill="currentColor" />
        </svg>
      );
    case 'wait': // an hourglass
      return (
        <svg {...common}>
          <path
            d="M14 4 H42 M14 52 H42 M17 4 Q17 22 28 28 Q39 34 39 52 M39 4 Q39 22 28 28 Q17 34 17 52"
            fill="none"
            stroke="currentColor"
            strokeWidth="5"
            strokeLinecap="round"
          />
        </svg>
      );
  }
}

export function AnswerBlock({
  kind,
  headline,
  children,
}: {
  kind: AnswerKind;
  headline: ReactNode;
  children?: ReactNode;
}) {
  return (
    <section
      aria-live="polite"
      aria-labelledby="verify-answer"
      className={`flex items-start gap-4 border-[5px] px-5 py-5 ${FRAME[kind]}`}
    >
      <AnswerShape kind={kind} />
      <div className="min-w-0">
        <h1 id="verify-answer" className="text-[28px] font-black leading-[1.12] sm:text-[34px]">
          {headline}
        </h1>
        {children && <div className="mt-2 text-[18px] font-bold leading-snug">{children}</div>}
      </div>
    </section>
  );
}

const GOOD = new Set(['accepted', 'accepted_as_noted']);

/** Which answer the verification gives, and in which words. */
export function answerFor(v: Verification): { kind: AnswerKind; headline: string; line: string } {
  if (!v.current) {
    return {
      kind: 'stop',
      headline:
        v.supersededBy !== null
          ? `Superseded by revision ${v.supersededBy} — do not lift to this plan`
          : 'Superseded by a later stamped return — do not lift to this plan',
      line: 'Get the current stamped return from the lift coordinator before anyone lifts.',
    };
  }
  if (GOOD.has(v.decision)) {
    return {
      kind: 'go',
      headline: `This is the current revision — ${v.decisionLabel}`,
      line:
        v.decision === 'accepted_as_noted'
          ? 'Accepted with conditions: follow the conditions written in the stamp block.'
          : 'No later revision has been submitted for this lift.',
    };
  }
  return {
    kind: 'stop',
    headline: `This is the current revision — ${v.decisionLabel}`,
    line: 'It was not accepted: do not lift to this plan.',
  };
}

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="border-b border-rule py-3 last:border-b-0">
      <dt className="text-[13px] font-bold uppercase tracking-[0.08em] text-ink-soft">{label}</dt>
      <dd className="mt-0.5 text-[19px] font-bold leading-snug text-ink">{children}</dd>
    </div>
  );
}

/** The sha-256 in groups of eight, so it can be compared by eye, group by group. */
function HashGroups({ hash }: { hash: string }) {
  const groups = hash.match(/.{1,8}/g) ?? [hash];
  return (
    <span className="flex flex-wrap gap-x-2.5 gap-y-0.5 font-mono text-[16px] font-normal tracking-[0.02em]">
      {groups.map((group, index) => (
        <span key={index}>{group}</span>
      ))}
    </span>
  );
}

export function VerificationDetails({ v, code }: { v: Verification; code: string }) {
  return (
    <dl className="border border-rule bg-sheet px-5 py-1">
      <Row label="Lift package">
        <span className="font-mono">{v.reference}</span>
        <span className="block text-[17px] font-normal">{v.title}</span>
      </Row>
      <Row label="Revision">{v.revision}</Row>
      <Row label="Decision">{v.decisionLabel}</Row>
      <Row label="Conditions">
        {v.conditions.trim() ? (
          <span className="block whitespace-pre-wrap break-words text-[18px] font-normal">
            {v.conditions}
          </span>
        ) : (
          <span className="text-[17px] font-normal">None.</span>
        )}
      </Row>
      {v.overrideReason && (
        <Row label="Accepted over an open item — the engineer’s reason">
          <span className="block whitespace-pre-wrap break-words text-[18px] font-normal">
            {v.overrideReason}
          </span>
          <span className="mt-1 block text-[14px] font-normal text-ink-soft">
            A check, finding or stated figure stood against this acceptance; the engineer of record accepted
            it for the reason above, as the stamped return prints it.
          </span>
        </Row>
      )}
      <Row label="Decided on">{formatDate(v.decidedOn)}</Row>
      <Row label="Stamped return issued on">{formatDate(v.issuedOn)}</Row>
      <Row label="SHA-256 of the stamped PDF">
        <HashGroups hash={v.sha256} />
        <span className="mt-1 block text-[14px] font-normal text-ink-soft">
          A PDF whose fingerprint differs is not this stamped return.
        </span>
      </Row>
      <Row label="Digital signature">
        {v.signingCertificateSha256 ? (
          <>
            <span className="block text-[17px] font-normal">
              The stamped PDF is digitally signed by the review desk. A PDF reader can check the signature: it
              reports whether the file was changed after signing.
            </span>
            <span className="mt-2 block text-[14px] font-bold uppercase tracking-[0.08em] text-ink-soft">
              SHA-256 of the signing certificate
            </span>
            <HashGroups hash={v.signingCertificateSha256} />
          </>
        ) : (
          <span className="text-[17px] font-normal">This return was issued before returns were signed.</span>
        )}
      </Row>
      <Row label="Verification code">
        <span className="break-all font-mono font-normal">{code}</span>
      </Row>
    </dl>
  );
}
