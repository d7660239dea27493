// The recomputed lift on the package page: what disagrees with the contractor's figures
// first, then the checks worst first, why the lift is critical, what would fix it, the
// plots, and the caution.
import type { LiftResult, UnitSystem } from '@shared/engineering/types';
import { CheckStatusMark } from '@/components/ui/check-status-mark';
import { CheckResultsTable } from '@/components/lift/check-results-table';
import { DiscrepancyTable } from '@/components/lift/discrepancy-list';
import { CriticalTriggers, FixList, ResultCautions } from '@/components/lift/fixes-and-triggers';
import { CapacityPlot } from '@/components/lift/capacity-plot';
import { CraneSideView } from '@/components/lift/crane-side-view';
import { countByStatus } from '@/components/lift/result-order';
import { CraneShares } from '@/components/lift/crane-shares';
import { TO_SI, type AnyUnit } from '@shared/engineering/units';
import { craneSideViews } from '@shared/drawing/side-view';

function boomLengthSi(inputs: Record<string, unknown>): number | null {
  const q = (inputs.crane as { boomLength?: { value?: number; unit?: string } } | undefined)?.boomLength;
  if (!q || typeof q.value !== 'number') return null;
  const factor = TO_SI[q.unit as AnyUnit];
  return factor === undefined ? null : q.value * factor;
}

export function PackageResults({
  result,
  inputs,
  system,
}: {
  result: LiftResult;
  inputs: Record<string, unknown>;
  system: UnitSystem;
}) {
  const counts = countByStatus(result.checks);
  const disagreements = result.discrepancies.filter((d) => d.status === 'discrepancy').length;
  const rows = ((inputs.chart as { rows?: unknown[] } | undefined)?.rows ?? []) as Parameters<
    typeof CapacityPlot
  >[0]['rows'];
  return (
    <section aria-labelledby="results-title" className="flex flex-col gap-3">
      <header className="flex flex-wrap items-center gap-3 border-b border-rule pb-1.5">
        <h2 id="results-title" className="text-[17px] font-black">
          Independent check
        </h2>
        <CheckStatusMark status={result.overallStatus} />
        <p className="text-[13px] text-ink-soft">
          {counts.fail} fail · {counts.caution} caution · {counts.pass} pass · {counts.not_applicable} not
          applicable · {disagreements} stated {disagreements === 1 ? 'figure disagrees' : 'figures disagree'}
        </p>
      </header>
      {result.discrepancies.length > 0 && (
        <div className="border border-rule bg-sheet px-3 py-2">
          <DiscrepancyTable
            items={result.discrepancies}
            system={system}
            caption="Your figures against the recomputed ones — disagreements first"
          />
        </div>
      )}
      <CraneShares result={result} system={system} />
      <CheckResultsTable result={result} system={system} />
      <div className="grid gap-3 lg:grid-cols-2">
        <CriticalTriggers result={result} />
        {result.fixes.length > 0 ? (
          <FixList fixes={result.fixes} system={system} />
        ) : (
          <section className="border border-rule bg-sheet px-3 py-2 text-[13px] text-ink-soft">
            <h3 className="font-bold text-ink">What would fix it</h3>
            No capacity or stability fix is needed.
          </section>
        )}
      </div>
      <div className="grid gap-3">
        <section aria-labelledby="plot-capacity" className="border border-rule bg-sheet px-3 py-2">
          <h3 id="plot-capacity" className="mb-1 text-[14px] font-bold">
            Chart capacity against radius
          </h3>
          <CapacityPlot rows={rows} boomLength={boomLengthSi(inputs)} result={result} system={system} />
        </section>
        {craneSideViews(result, inputs).map((view) => (
          <section
            key={view.key}
            aria-labelledby={`plot-side-${view.key}`}
            className="border border-rule bg-sheet px-3 py-2"
          >
            <h3 id={`plot-side-${view.key}`} className="mb-1 text-[14px] font-bold">
              {view.title}
            </h3>
            <CraneSideView inputs={view.inputs} result={view.result} system={system} />
          </section>
        ))}
      </div>
      <ResultCautions cautions={result.cautions} />
    </section>
  );
}
