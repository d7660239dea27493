// A chart grid as a table: boom lengths across, radii down, blanks where the chart rates
// nothing. Cells listed in `marked` (a detached copy's changes) are outlined and say so.
import type { ChartGrid } from '@shared/library/chart-grid';

export function ChartGridTable({
  grid,
  caption,
  marked = [],
}: {
  grid: ChartGrid;
  caption: string;
  marked?: { boomLength: number; radius: number }[];
}) {
  const u = grid.units;
  const isMarked = (b: number, r: number) => marked.some((m) => m.boomLength === b && m.radius === r);
  return (
    <div className="max-h-[480px] overflow-auto border border-rule bg-sheet">
      <table className="border-collapse text-[13px] tabular-nums">
        <caption className="sr-only">{caption}</caption>
        <thead className="sticky top-0 bg-sheet-alt">
          <tr>
            <th scope="col" className="border-b border-r border-rule px-2 py-1 text-left font-bold">
              Radius ({u.radius}) ╲ boom ({u.boomLength})
            </th>
            {grid.boomLengths.map((b) => (
              <th key={b} scope="col" className="border-b border-rule px-2 py-1 text-right font-bold">
                {b}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {grid.radii.map((r, i) => (
            <tr key={r} className="even:bg-sheet-alt">
              <th scope="row" className="border-r border-rule px-2 py-0.5 text-left font-bold">
                {r}
              </th>
              {grid.boomLengths.map((b, j) => {
                const c = grid.capacities[i][j];
                const m = isMarked(b, r);
                return (
                  <td
                    key={b}
                    className={`px-2 py-0.5 text-right ${m ? 'outline-2 -outline-offset-2 outline-failed-ink font-bold text-failed-ink' : ''}`}
                  >
                    {c === null ? <span className="text-ink-soft">–</span> : `${c} ${u.capacity}`}
                    {m && <span className="sr-only"> (changed from the library)</span>}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
