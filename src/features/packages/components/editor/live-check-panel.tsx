// The independent check run in the browser as the contractor types: the same engine the
// worker runs, on the form's values once they make a complete lift. Worst results first;
// the worker's result on submit is the one that counts.
import { useDeferredValue, useMemo } from 'react';
import { LiftInput } from '@shared/schemas/lift-input';
import { evaluateLift } from '@shared/engineering/evaluate';
import { formatQuantity } from '@shared/engineering/format';
import type { LiftResult, UnitSystem } from '@shared/engineering/types';
import { CheckStatusMark } from '@/components/ui/check-status-mark';
import { sortChecks, sortDiscrepancies } from '@/components/lift/result-order';
import { formatCheckLimit, formatCheckValue } from '@/components/lift/result-format';
import { FixList, ResultCautions } from '@/components/lift/fixes-and-triggers';
import { withoutLabel } from '@/components/lift/discrepancy-list';
import { CraneShares } from '@/components/lift/crane-shares';
import { prune } from '../../lib/prune';
import { readableField, readableIssue } from '@shared/catalogue/readable-issue';

type Outcome =
  | { ok: true; result: LiftResult }
  | { ok: false; missing: { path: string; label: string; message: string }[]; total: number }
  | { ok: 'error'; message: string };

const SHOW_MISSING = 5;

export function runLiveCheck(values: unknown, system: UnitSystem): Outcome {
  const parsed = LiftInput.safeParse(prune(values) ?? {});
  if (!parsed.success) {
    const seen = new Set<string>();
    const missing: { path: string; label: string; message: string }[] = [];
    for (const issue of parsed.error.issues) {
      const path = issue.path.map(String).join('.');
      if (seen.has(path)) continue;
      seen.add(path);
      missing.push({ path, label: readableField(path), message: readableIssue(path, issue.message) });
    }
    return { ok: false, missing: missing.slice(0, SHOW_MISSING), total: missing.length };
  }
  try {
    return { ok: true, result: evaluateLift(parsed.data, null, { units: system }) };
  } catch (error) {
    return { ok: 'error', message: error instanceof Error ? error.message : 'The check could not run.' };
  }
}

export function LiveCheckPanel({ values, system }: { values: unknown; system: UnitSystem }) {
  const deferred = useDeferredValue(values);
  const outcome = useMemo(() => runLiveCheck(deferred, system), [deferred, system]);

  return (
    <aside
      aria-label="Live check"
      className="flex flex-col gap-2 border border-rule bg-sheet p-3"
      aria-live="polite"
    >
      <header className="flex items-center justify-between gap-2 border-b border-rule pb-1.5">
        <h2 className="text-[15px] font-black">Live check</h2>
        {outcome.ok === true && <CheckStatusMark status={outcome.result.overallStatus} />}
      </header>
      {outcome.ok === false && (
        <div className="text-[13px]">
          <p className="font-bold">Complete these fields to see the check:</p>
          <ul className="mt-1 flex flex-col gap-1">
            {outcome.missing.map((item) => (
              <li key={item.path} className="border-l-2 border-rule-strong pl-2">
                <span className="font-bold">{item.label}</span>
                <span className="block text-[12.5px] text-ink-soft">{item.message}</span>
              </li>
            ))}
          </ul>
          {outcome.total > outcome.missing.length && (
            <p className="mt-1 text-[12.5px] text-ink-soft">
              …and {outcome.total - outcome.missing.length} more.
            </p>
          )}
        </div>
      )}
      {outcome.ok === 'error' && <p className="text-[13px] text-fail-ink">{outcome.message}</p>}
      {outcome.ok === true && <LiveResult result={outcome.result} system={system} />}
    </aside>
  );
}

function LiveResult({ result, system }: { result: LiftResult; system: UnitSystem }) {
  const disagreements = sortDiscrepancies(result.discrepancies).filter((d) => d.status === 'discrepancy');
  const checks = sortChecks(result.checks).filter((check) => check.status !== 'not_applicable');
  const skipped = result.checks.length - checks.length;
  const f = result.figures;
  return (
    <div className="flex flex-col gap-2 text-[13px]">
      {result.cranes && (
        <p className="text-[12px] text-ink-soft">
          Figures below: crane 1 ({result.cranes[0].name}) for its share; each check covers every crane.
        </p>
      )}
      <dl className="grid grid-cols-2 gap-x-3 gap-y-0.5">
        <dt className="text-ink-soft">Gross load</dt>
        <dd className="text-right font-bold tabular">{formatQuantity(f.grossLoad, 'weight', system)}</dd>
        <dt className="text-ink-soft">Radius</dt>
        <dd className="text-right font-bold tabular">{formatQuantity(f.radius, 'length', system)}</dd>
        <dt className="text-ink-soft">Chart capacity</dt>
        <dd className="text-right font-bold tabular">{formatQuantity(f.chartCapacity, 'weight', system)}</dd>
        <dt className="text-ink-soft">Critical lift</dt>
        <dd className="text-right font-bold">{result.critical.isCritical ? 'Yes' : 'No'}</dd>
      </dl>
      <CraneShares result={result} system={system} compact />
      {disagreements.length > 0 && (
        <section
          aria-label="Stated figures that disagree"
          className="border-l-4 border-caution-ink bg-caution-tint px-2 py-1.5"
        >
          <h3 className="font-bold text-caution-ink">
            {disagreements.length} stated{' '}
            {disagreements.length === 1 ? 'figure disagrees' : 'figures disagree'}
          </h3>
          <ul>
            {disagreements.map((d) => (
              <li key={d.figure} className="text-[12.5px]">
                <span className="font-bold">{d.label}:</span> {withoutLabel(d)}
              </li>
            ))}
          </ul>
        </section>
      )}
      <ol
        aria-label="Checks, worst first"
        className="flex flex-col divide-y divide-rule border-y border-rule"
      >
        {checks.map((check) => (
          <li key={check.id} className="flex flex-col gap-0.5 py-1.5" data-testid="live-check">
            <span className="flex items-center justify-between gap-2">
              <span className="font-bold">{check.label}</span>
              <CheckStatusMark status={check.status} />
            </span>
            <span className="tabular text-[12.5px] text-ink-soft">
              {formatCheckValue(check, result, system)}
              {check.limit !== null && <> · limit {formatCheckLimit(check, system)}</>}
            </span>
            {check.status !== 'pass' && <span className="text-[12.5px]">{check.message}</span>}
          </li>
        ))}
      </ol>
      {skipped > 0 && (
        <p className="text-[12px] text-ink-soft">
          {skipped} {skipped === 1 ? 'check does' : 'checks do'} not apply to the data entered so far.
        </p>
      )}
      <FixList fixes={result.fixes} system={system} />
      <ResultCautions cautions={result.cautions.slice(0, 1)} />
      <p className="text-[11.5px] text-ink-soft">
        Checked in your browser against the default site policy; the worker’s check on submit, against the
        site’s own policy, is the one that counts.
      </p>
    </div>
  );
}
