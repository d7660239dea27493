// The decision on record, for anyone reading the package (a phone on site included): what the
// engineer of record decided, on which revision and when, the conditions in full, and any
// override reason. The stamped return carries the same words.
import { DECISION_LABELS, type Decision } from '@shared/schemas/common';
import { formatDateTime } from '@/lib/format';

export function DecisionPanel({
  decision,
}: {
  decision: {
    decision: Decision;
    conditions: string;
    engineer: string;
    revisionNumber: number;
    at: string;
    overrideReason: string | null;
  };
}) {
  return (
    <section aria-labelledby="decision-title" className="border border-rule bg-sheet">
      <h2 id="decision-title" className="border-b border-rule px-3 py-2 text-[14px] font-bold">
        Decision on record
      </h2>
      <dl className="flex flex-col gap-2 px-3 py-2.5 text-[13.5px]">
        <div>
          <dt className="sr-only">Decision</dt>
          <dd className="text-[15px] font-black">{DECISION_LABELS[decision.decision]}</dd>
          <dd className="text-[12.5px] text-ink-soft">
            Revision {decision.revisionNumber} · {decision.engineer} · {formatDateTime(decision.at)}
          </dd>
        </div>
        {decision.conditions && (
          <div>
            <dt className="text-[12px] font-bold uppercase tracking-[0.05em] text-ink-soft">Conditions</dt>
            <dd className="whitespace-pre-line break-words">{decision.conditions}</dd>
          </div>
        )}
        {decision.overrideReason && (
          <div>
            <dt className="text-[12px] font-bold uppercase tracking-[0.05em] text-ink-soft">
              Override reason
            </dt>
            <dd className="whitespace-pre-line break-words">{decision.overrideReason}</dd>
          </div>
        )}
      </dl>
    </section>
  );
}
