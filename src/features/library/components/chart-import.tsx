// Import a chart: paste cells from a spreadsheet or choose a CSV or .xlsx file, see how every
// cell was read and which units the header gave, fix what the errors name, then accept. Nothing
// is stored until the person accepts; accepting hands the grid to the caller (a new version).
import { useId, useState } from 'react';
import type { ChartGrid } from '@shared/library/chart-grid';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panel-message';
import { useChartPreview, type ChartPreview } from '../api/chart-import';

// Shown as the empty box's placeholder, said to be an example so it is not taken for content.
const EXAMPLE = 'For example:\nradius (m) / boom (m) / capacity (t)\t12.2\t18.3\n3\t40\t\n5\t30\t28';

function PreviewTable({ preview }: { preview: ChartPreview }) {
  return (
    <div className="max-h-[420px] overflow-auto border border-rule bg-sheet">
      <table className="border-collapse text-[12.5px] tabular-nums" aria-label="How each cell was read">
        <tbody>
          {preview.cells.map((row, i) => (
            <tr key={i}>
              {row.map((c) => {
                const tone =
                  c.problem === 'error'
                    ? 'bg-fail-tint text-fail-ink outline-2 -outline-offset-2 outline-fail-ink'
                    : c.problem === 'warning'
                      ? 'bg-caution-tint text-caution-ink'
                      : c.role === 'capacity'
                        ? ''
                        : 'bg-sheet-alt font-bold';
                return (
                  <td
                    key={c.ref}
                    className={`min-w-16 border border-rule px-1.5 py-0.5 align-top ${tone}`}
                    title={c.message ?? undefined}
                    data-ref={c.ref}
                  >
                    <span className="block text-[10.5px] text-ink-soft">{c.ref}</span>
                    {c.role === 'units' ? (
                      <span className="block max-w-56 whitespace-normal">{c.raw}</span>
                    ) : c.value !== null ? (
                      <span>
                        {c.value}
                        {c.unit ? ` ${c.unit}` : ''}
                      </span>
                    ) : c.raw.trim() ? (
                      <span>“{c.raw}”</span>
                    ) : (
                      <span className="text-ink-soft">blank</span>
                    )}
                    {c.problem && (
                      <span className="block text-[10.5px] font-bold">
                        {c.problem === 'error' ? '✕ error' : '! check'}
                      </span>
                    )}
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

export function ChartImport({
  onAccept,
  accepting,
  acceptLabel = 'Use this chart',
}: {
  onAccept: (grid: ChartGrid) => void;
  accepting?: boolean;
  acceptLabel?: string;
}) {
  const id = useId();
  const [text, setText] = useState('');
  const [file, setFile] = useState<File | null>(null);
  const preview = useChartPreview();
  const p = preview.data;
  return (
    <section aria-label="Import a chart" className="flex flex-col gap-3">
      <div className="grid gap-3 md:grid-cols-2">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-text`} className="text-[13.5px] font-bold">
            Paste the chart cells
          </label>
          <textarea
            id={`${id}-text`}
            value={text}
            onChange={(e) => setText(e.target.value)}
            rows={6}
            placeholder={EXAMPLE}
            className="rounded-[3px] border border-rule-strong bg-sheet p-2 font-mono text-[12.5px]"
          />
          <p className="text-[12.5px] text-ink-soft">
            Top-left cell names the units, e.g. “radius (m) / boom (m) / capacity (t)”; boom lengths across
            the first row, radii down the first column; leave a cell blank where the chart rates nothing.
          </p>
          <div>
            <Button
              size="sm"
              disabled={!text.trim() || preview.isPending}
              onClick={() => preview.mutate({ text })}
            >
              Read the pasted cells
            </Button>
          </div>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-file`} className="text-[13.5px] font-bold">
            Or choose a CSV or .xlsx file
          </label>
          <input
            id={`${id}-file`}
            type="file"
            accept=".csv,.txt,.xlsx,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
            className="text-sm"
          />
          <p className="text-[12.5px] text-ink-soft">
            From a workbook only the first sheet's stored values are read; formulas are never calculated and
            workbooks with macros are refused.
          </p>
          <div>
            <Button
              size="sm"
              disabled={!file || preview.isPending}
              onClick={() => file && preview.mutate({ file })}
            >
              Read the file
            </Button>
          </div>
        </div>
      </div>
      {preview.isError && (
        <ErrorPanel
          title="The chart could not be read"
          message={isApiError(preview.error) ? preview.error.message : 'Try again.'}
        />
      )}
      {p && (
        <div className="flex flex-col gap-2" aria-live="polite">
          <p className="text-sm">
            <strong>Units read:</strong> {p.unitsSource || 'none'} ·{' '}
            {p.orientation === 'boom_down'
              ? 'boom lengths down, radii across'
              : 'radii down, boom lengths across'}{' '}
            · {p.ratedCells} rated cells
          </p>
          {p.errors.length > 0 && (
            <div role="alert" className="border border-l-4 border-fail-ink bg-fail-tint px-3 py-2">
              <h3 className="text-sm font-bold text-fail-ink">
                ✕ {p.errors.length === 1 ? '1 error: fix it' : `${p.errors.length} errors: fix them`} in the
                source and read it again
              </h3>
              <ul className="list-disc pl-5 text-[13px]">
                {p.errors.map((e, k) => (
                  <li key={k}>{e.message}</li>
                ))}
              </ul>
            </div>
          )}
          {p.warnings.length > 0 && (
            <div className="border border-l-4 border-caution-ink bg-caution-tint px-3 py-2">
              <h3 className="text-sm font-bold text-caution-ink">! {p.warnings.length} to check</h3>
              <ul className="list-disc pl-5 text-[13px]">
                {p.warnings.map((e, k) => (
                  <li key={k}>{e.message}</li>
                ))}
              </ul>
            </div>
          )}
          <PreviewTable preview={p} />
          <div>
            <Button
              variant="primary"
              disabled={!p.grid || accepting}
              onClick={() => p.grid && onAccept(p.grid)}
            >
              {accepting ? 'Saving…' : acceptLabel}
            </Button>
          </div>
        </div>
      )}
    </section>
  );
}
