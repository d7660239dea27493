// The contractor's stated figures against the recomputed ones; disagreements first.
import { formatPercent, formatQuantity } from '@shared/engineering/format';
import type { Discrepancy, UnitSystem } from '@shared/engineering/types';
import { sortDiscrepancies } from './result-order';
import { DisagreeMark } from '@/components/ui/check-status-mark';

/** The engine's message starts with the figure's name, already shown beside it. */
export function withoutLabel(d: Discrepancy): string {
  return d.message.startsWith(`${d.label}: `) ? d.message.slice(d.label.length + 2) : d.message;
}

function value(si: number | null, d: Discrepancy, system: UnitSystem) {
  if (si === null) return '—';
  return d.unit === 'percent' ? formatPercent(si) : formatQuantity(si, d.unit, system);
}

export function DiscrepancyTable({
  items,
  system,
  caption = 'Stated figures against the recomputed ones',
}: {
  items: readonly Discrepancy[];
  system: UnitSystem;
  caption?: string;
}) {
  if (items.length === 0) return null;
  const sorted = sortDiscrepancies(items);
  return (
    <table className="w-full border-collapse text-[13px]">
      <caption className="mb-1 text-left text-[13px] font-bold">{caption}</caption>
      <thead className="bg-sheet-alt text-left text-[12px] uppercase tracking-[0.05em] text-ink-soft">
        <tr className="border-b border-rule-strong">
          <th scope="col" className="px-2 py-1">
            Figure
          </th>
          <th scope="col" className="px-2 py-1 text-right">
            Stated
          </th>
          <th scope="col" className="px-2 py-1 text-right">
            Recomputed
          </th>
          <th scope="col" className="px-2 py-1 text-right">
            Difference
          </th>
          <th scope="col" className="px-2 py-1">
            Outcome
          </th>
        </tr>
      </thead>
      <tbody>
        {sorted.map((d) => (
          <tr
            key={d.figure}
            className="border-b border-rule align-top last:border-b-0"
            data-testid="discrepancy-row"
          >
            <th scope="row" className="px-2 py-1.5 text-left font-bold">
              {d.label}
              {d.status === 'discrepancy' && (
                <p className="text-[12px] font-normal text-ink-soft">{d.message}</p>
              )}
            </th>
            <td className="px-2 py-1.5 text-right tabular">{value(d.stated, d, system)}</td>
            <td className="px-2 py-1.5 text-right tabular">{value(d.computed, d, system)}</td>
            <td className="px-2 py-1.5 text-right tabular">
              {d.differencePct === null ? '—' : formatPercent(d.differencePct)}
              <span className="block text-[11.5px] text-ink-soft">
                tolerance {formatPercent(d.tolerancePct)}
              </span>
            </td>
            <td className="px-2 py-1.5">
              {d.status === 'discrepancy' ? (
                <span className="flex flex-col items-start gap-0.5">
                  <DisagreeMark />
                  {d.unsafeSide && (
                    <span className="text-[12px] font-bold text-fail-ink">▲ on the unsafe side</span>
                  )}
                </span>
              ) : d.status === 'agrees' ? (
                <span className="inline-flex items-center gap-1 text-[12.5px] font-bold text-pass-ink">
                  = Agrees
                </span>
              ) : (
                <span className="text-[12.5px] text-ink-soft">Cannot compare</span>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
