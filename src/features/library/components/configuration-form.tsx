// A configuration's details, chart notes, the manufacturer's document reference and the chart
// itself (imported through the preview). Used for a new configuration and for an edit, which
// the server writes as a new version; an edit starts from the current version's values.
import { useState } from 'react';
import {
  VersionBody,
  WORKING_AREA_LABELS,
  WORKING_AREAS,
  type CraneFixedData,
} from '@shared/schemas/library';
import type { ChartGrid } from '@shared/library/chart-grid';
import type { UnitSystem } from '@shared/schemas/common';
import type { VersionDetail } from '@shared/schemas/library';
import type { z } from 'zod';
import { inputClasses, selectClasses } from '@/components/ui/form-field';
import { Button } from '@/components/ui/button';
import { zodFieldErrors } from '../lib/zod-fields';
import { ChartImport } from './chart-import';
import { ChartGridTable } from './chart-grid-table';
import { fieldError, QuantityField, type Q } from './quantity-field';

export type VersionDraft = z.input<typeof VersionBody>;

export function ConfigurationForm({
  system,
  fixed,
  from,
  withName,
  submitLabel,
  busy,
  serverErrors,
  onSubmit,
}: {
  system: UnitSystem;
  fixed: CraneFixedData;
  from?: VersionDetail;
  withName?: boolean;
  submitLabel: string;
  busy?: boolean;
  serverErrors?: { path: string; message: string }[];
  onSubmit: (body: VersionDraft, name: string) => void;
}) {
  const [name, setName] = useState('');
  const [d, setD] = useState({
    workingArea: from?.details.workingArea ?? 'full_circle',
    outriggerSpread: from?.details.outriggerSpread ?? fixed.outriggerSpreads?.[0]?.name ?? '',
    jib: from?.details.jib ?? '',
    cwArrangement: from?.details.counterweight?.arrangement ?? '',
    hookName: from?.details.hookBlock?.name ?? '',
    title: from?.document.title ?? '',
    edition: from?.document.edition ?? '',
    page: from?.document.page ?? '',
    blockIncluded: from?.notes.blockIncluded ?? false,
    interpolationAllowed: from?.notes.interpolationAllowed ?? false,
    notes: from?.notes.text ?? '',
    changeNote: '',
  });
  const [q, setQ] = useState<Record<string, Q>>({
    cw: from?.details.counterweight?.weight,
    cwCg: from?.details.counterweight?.cgBehindRotation,
    hook: from?.details.hookBlock?.weight,
    bMin: from?.details.boomLengthMin,
    bMax: from?.details.boomLengthMax,
  });
  const [chart, setChart] = useState<ChartGrid | null>(from?.chart ?? null);
  const [reimport, setReimport] = useState(!from);
  const [errors, setErrors] = useState<{ path: string; message: string }[]>([]);
  const all = [...errors, ...(serverErrors ?? [])];
  const set = (k: keyof typeof d) => (e: { target: { value: string } }) =>
    setD((x) => ({ ...x, [k]: e.target.value }));
  const tx = (label: string, k: keyof typeof d, path: string) => (
    <label className="flex flex-col gap-1 text-[13px] font-bold">
      {label}
      <input
        className={inputClasses}
        value={String(d[k])}
        onChange={set(k)}
        aria-invalid={!!fieldError(all, path)}
      />
      {fieldError(all, path) && (
        <span className="text-[12.5px] text-failed-ink">{fieldError(all, path)}</span>
      )}
    </label>
  );
  const submit = () => {
    // The draft as typed (units as strings); the schema below checks it and gives the typed body.
    const draft = {
      details: {
        workingArea: d.workingArea,
        ...(d.outriggerSpread ? { outriggerSpread: d.outriggerSpread } : {}),
        ...(d.jib.trim() ? { jib: d.jib } : {}),
        ...(q.bMin ? { boomLengthMin: q.bMin } : {}),
        ...(q.bMax ? { boomLengthMax: q.bMax } : {}),
        ...(d.cwArrangement.trim() || q.cw
          ? {
              counterweight: {
                arrangement: d.cwArrangement,
                weight: q.cw,
                cgBehindRotation: q.cwCg,
              },
            }
          : {}),
        ...(q.hook
          ? { hookBlock: { ...(d.hookName.trim() ? { name: d.hookName } : {}), weight: q.hook } }
          : {}),
      },
      notes: {
        deductions: from?.notes.deductions ?? [],
        blockIncluded: d.blockIncluded,
        interpolationAllowed: d.interpolationAllowed,
        ...(d.notes.trim() ? { text: d.notes } : {}),
      },
      document: {
        title: d.title,
        ...(d.edition.trim() ? { edition: d.edition } : {}),
        ...(d.page.trim() ? { page: d.page } : {}),
      },
      chart,
      ...(d.changeNote.trim() ? { changeNote: d.changeNote } : {}),
    };
    const fieldsMissing = [];
    if (withName && !name.trim()) fieldsMissing.push({ path: 'name', message: 'name is required' });
    if (!chart)
      fieldsMissing.push({ path: 'chart', message: 'import the load chart and accept its preview' });
    const parsed = VersionBody.safeParse(draft);
    const found = [
      ...fieldsMissing,
      ...(parsed.success
        ? []
        : zodFieldErrors(parsed.error).filter((e) => !(e.path.startsWith('chart') && !chart))),
    ];
    setErrors(found);
    if (found.length === 0 && parsed.success) onSubmit(parsed.data, name);
  };
  return (
    <form
      aria-label={submitLabel}
      className="flex flex-col gap-4 border border-rule bg-sheet p-4"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      {withName && (
        <label className="flex flex-col gap-1 text-[13px] font-bold md:w-1/2">
          Configuration name (e.g. “Main boom, 18 t counterweight, full spread, 360°”)
          <input
            className={inputClasses}
            value={name}
            onChange={(e) => setName(e.target.value)}
            aria-invalid={!!fieldError(all, 'name')}
          />
          {fieldError(all, 'name') && (
            <span className="text-[12.5px] text-failed-ink">{fieldError(all, 'name')}</span>
          )}
        </label>
      )}
      <fieldset className="grid gap-3 md:grid-cols-4">
        <legend className="mb-1 text-sm font-bold">Configuration</legend>
        <label className="flex flex-col gap-1 text-[13px] font-bold">
          Working area
          <select className={selectClasses} value={d.workingArea} onChange={set('workingArea')}>
            {WORKING_AREAS.map((w) => (
              <option key={w} value={w}>
                {WORKING_AREA_LABELS[w]}
              </option>
            ))}
          </select>
        </label>
        {fixed.outriggerSpreads?.length ? (
          <label className="flex flex-col gap-1 text-[13px] font-bold">
            Outrigger spread
            <select className={selectClasses} value={d.outriggerSpread} onChange={set('outriggerSpread')}>
              {fixed.outriggerSpreads.map((s) => (
                <option key={s.name} value={s.name}>
                  {s.name}
                </option>
              ))}
            </select>
          </label>
        ) : null}
        <QuantityField
          label="Boom length from"
          value={q.bMin}
          onChange={(v) => setQ((x) => ({ ...x, bMin: v }))}
          kind="length"
          system={system}
          error={fieldError(all, 'details.boomLengthMin')}
        />
        <QuantityField
          label="Boom length to"
          value={q.bMax}
          onChange={(v) => setQ((x) => ({ ...x, bMax: v }))}
          kind="length"
          system={system}
          error={fieldError(all, 'details.boomLengthMax')}
        />
        {tx('Jib (if fitted)', 'jib', 'details.jib')}
        {tx('Counterweight arrangement', 'cwArrangement', 'details.counterweight.arrangement')}
        <QuantityField
          label="Counterweight mass"
          value={q.cw}
          onChange={(v) => setQ((x) => ({ ...x, cw: v }))}
          kind="weight"
          system={system}
          error={fieldError(all, 'details.counterweight.weight')}
        />
        <QuantityField
          label="Its CG behind rotation"
          value={q.cwCg}
          onChange={(v) => setQ((x) => ({ ...x, cwCg: v }))}
          kind="length"
          system={system}
          error={fieldError(all, 'details.counterweight.cgBehindRotation')}
        />
        {tx('Hook block', 'hookName', 'details.hookBlock.name')}
        <QuantityField
          label="Hook block mass"
          value={q.hook}
          onChange={(v) => setQ((x) => ({ ...x, hook: v }))}
          kind="weight"
          system={system}
          error={fieldError(all, 'details.hookBlock.weight')}
        />
      </fieldset>
      <fieldset className="grid gap-3 md:grid-cols-4">
        <legend className="mb-1 text-sm font-bold">Manufacturer's document and chart notes</legend>
        {tx('Document title', 'title', 'document.title')}
        {tx('Edition', 'edition', 'document.edition')}
        {tx('Page', 'page', 'document.page')}
        <div className="flex flex-col gap-1 text-[13px]">
          <label className="flex items-center gap-2">
            <input
              type="checkbox"
              checked={d.blockIncluded}
              onChange={(e) => setD((x) => ({ ...x, blockIncluded: e.target.checked }))}
            />
            Capacities include the hook block
          </label>
          <label className="flex items-center gap-2">
            <input
              type="checkbox"
              checked={d.interpolationAllowed}
              onChange={(e) => setD((x) => ({ ...x, interpolationAllowed: e.target.checked }))}
            />
            The chart allows interpolation
          </label>
        </div>
        <label className="flex flex-col gap-1 text-[13px] font-bold md:col-span-4">
          Notes (deductions, conditions)
          <textarea
            className="rounded-[3px] border border-rule-strong p-2 text-sm"
            rows={2}
            value={d.notes}
            onChange={set('notes')}
          />
        </label>
      </fieldset>
      <section aria-label="Load chart" className="flex flex-col gap-2">
        <h3 className="text-sm font-bold">Load chart</h3>
        {chart && !reimport ? (
          <>
            <ChartGridTable grid={chart} caption="The chart of this version" />
            <div>
              <Button size="sm" onClick={() => setReimport(true)}>
                Import a changed chart
              </Button>
            </div>
          </>
        ) : (
          <ChartImport
            acceptLabel="Use this chart"
            onAccept={(g) => {
              setChart(g);
              setReimport(false);
            }}
          />
        )}
        {fieldError(all, 'chart') && (
          <p className="text-sm font-bold text-failed-ink">{fieldError(all, 'chart')}</p>
        )}
      </section>
      {from && tx('What changed (shown in the history)', 'changeNote', 'changeNote')}
      <div className="flex flex-wrap items-center gap-3 border-t border-rule pt-3">
        <Button type="submit" variant="primary" disabled={busy}>
          {busy ? 'Saving…' : submitLabel}
        </Button>
        {!chart && (
          <p className="text-[13px] text-ink-soft" data-testid="chart-not-accepted">
            No chart accepted yet: read the pasted cells or the file above, check the preview, then press “Use
            this chart”.
          </p>
        )}
      </div>
    </form>
  );
}
