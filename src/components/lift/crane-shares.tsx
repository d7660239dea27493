// Each crane of a lift with several cranes: its share of the load (and the range of that share when
// the centre of gravity is off by the sensitivity offset), its gross load with its own block and
// rigging, its chart capacity and its worst check. Read alike by the live check and the package page.
import { formatQuantity } from '@shared/engineering/format';
import type { LiftResult, UnitSystem } from '@shared/engineering/types';
import { SHARE_METHOD_WORDS } from '@shared/vocabulary/multi-crane';
import { CheckStatusMark } from '@/components/ui/check-status-mark';

export function CraneShares({
  result,
  system,
  compact = false,
}: {
  result: LiftResult;
  system: UnitSystem;
  compact?: boolean;
}) {
  const cranes = result.cranes;
  const multi = result.multiCrane;
  if (!cranes || !multi) return null;
  const w = (v: number | null | undefined) => formatQuantity(v ?? null, 'weight', system);
  return (
    <section aria-label="Shares of the cranes" className="border border-rule bg-sheet px-3 py-2 text-[13px]">
      <h3 className="font-bold">
        {cranes.length} cranes · margin {multi.marginPct}% on each share
      </h3>
      <p className="text-[12.5px] text-ink-soft">{SHARE_METHOD_WORDS[multi.method]}</p>
      <table className="mt-1 w-full border-collapse tabular">
        <thead>
          <tr className="border-b border-rule text-left text-ink-soft">
            <th scope="col" className="py-0.5 pr-2 font-bold">
              Crane
            </th>
            <th scope="col" className="py-0.5 pr-2 text-right font-bold">
              Share
            </th>
            {!compact && (
              <th scope="col" className="py-0.5 pr-2 text-right font-bold">
                If the CG is off
              </th>
            )}
            <th scope="col" className="py-0.5 pr-2 text-right font-bold">
              Gross
            </th>
            {!compact && (
              <th scope="col" className="py-0.5 pr-2 text-right font-bold">
                Chart
              </th>
            )}
            <th scope="col" className="py-0.5 font-bold">
              <span className="sr-only">Status</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {cranes.map((crane) => (
            <tr key={crane.index} className="border-b border-rule" data-testid="crane-share">
              <th scope="row" className="py-0.5 pr-2 text-left font-bold">
                {crane.index}. {crane.name}
              </th>
              <td className="py-0.5 pr-2 text-right">{w(crane.share)}</td>
              {!compact && (
                <td className="py-0.5 pr-2 text-right">
                  {crane.shareRange ? `${w(crane.shareRange.min)} – ${w(crane.shareRange.max)}` : '—'}
                </td>
              )}
              <td className="py-0.5 pr-2 text-right">{w(crane.grossLoad)}</td>
              {!compact && <td className="py-0.5 pr-2 text-right">{w(crane.chartCapacity)}</td>}
              <td className="py-0.5">
                <CheckStatusMark status={crane.overallStatus} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {multi.sensitivityOffset !== null && (
        <p className="mt-1 text-[12px] text-ink-soft">
          Range: the centre of gravity moved {formatQuantity(multi.sensitivityOffset, 'length', system)} (a
          fraction of the {formatQuantity(multi.spacing, 'length', system)} pick spacing) each way.
        </p>
      )}
    </section>
  );
}
