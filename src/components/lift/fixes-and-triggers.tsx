// What would make a failing lift pass, why the lift counts as critical, and the engine's
// cautions — the short lists shown beside the check table and in the live check.
import { formatFormula } from '@shared/engineering/format';
import type { Fix, LiftResult, UnitSystem } from '@shared/engineering/types';

export function FixList({ fixes, system }: { fixes: readonly Fix[]; system: UnitSystem }) {
  if (fixes.length === 0) return null;
  return (
    <section
      aria-label="What would fix it"
      className="border-l-4 border-verdigris bg-verdigris-tint px-3 py-2"
    >
      <h3 className="text-[13px] font-bold">What would fix it</h3>
      <ul className="mt-1 flex flex-col gap-1 text-[13px]">
        {fixes.map((fix) => (
          <li key={`${fix.checkId}-${fix.kind}`}>
            <span aria-hidden="true">→ </span>
            {fix.text || fix.message}
            {fix.formula.length > 0 && (
              <span className="block pl-4 text-[12px] text-ink-soft">
                {formatFormula(fix.formula, system)}
              </span>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}

export function CriticalTriggers({ result }: { result: LiftResult }) {
  const { isCritical, triggers } = result.critical;
  return (
    <section aria-label="Why the lift is critical" className="border border-rule bg-sheet px-3 py-2">
      <h3 className="text-[13px] font-bold">
        {isCritical ? 'Why this is a critical lift' : 'Critical lift triggers'}
      </h3>
      {triggers.length === 0 ? (
        <p className="text-[13px] text-ink-soft">No critical-lift trigger applies under the site policy.</p>
      ) : (
        <ul className="mt-1 flex flex-col gap-1 text-[13px]">
          {triggers.map((trigger) => (
            <li key={trigger.id} className="flex gap-1.5">
              <svg className="mt-1 size-2.5 shrink-0" viewBox="0 0 10 10" aria-hidden="true">
                <path d="M5 0.5 L9.5 5 L5 9.5 L0.5 5 Z" fill="currentColor" />
              </svg>
              <span>
                {trigger.reason}
                <span className="block text-[12px] text-ink-soft">{trigger.source.text}</span>
              </span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

export function ResultCautions({ cautions }: { cautions: readonly string[] }) {
  if (cautions.length === 0) return null;
  return (
    <section
      aria-label="Cautions"
      className="border border-caution-ink/40 bg-caution-tint px-3 py-2 text-[12.5px] text-ink"
    >
      <h3 className="font-bold text-caution-ink">Caution</h3>
      {cautions.map((text) => (
        <p key={text} className="mt-0.5">
          {text}
        </p>
      ))}
    </section>
  );
}
