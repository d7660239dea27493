// The load chart rows of the configuration used: pasted from a spreadsheet (tab- or
// comma-separated, with or without a header row) into an editable table. Each column has
// one unit for all its rows; changing it relabels the numbers, as the person typed them.
import { useId, useState, type ClipboardEvent } from 'react';
import { Controller, get, useFieldArray, useWatch } from 'react-hook-form';
import { liftPath, useLiftFormContext, type LiftFormValues } from '../../hooks/use-lift-form';
import type { UnitSystem } from '@shared/schemas/common';
import { Button } from '@/components/ui/button';
import { parseChartRows } from '../../lib/chart-paste';
import { defaultUnit, unitLabel, UNITS_BY_KIND } from '@shared/vocabulary/units';
import { NumberText } from './number-text';
import { ErrorText } from './lift-field';
import { useFieldError } from './field-errors';

type Row = {
  radius?: { value: number; unit: string };
  boomLength?: { value: number; unit: string };
  capacity?: { value: number; unit: string };
  interpolationAllowed?: boolean;
};
type ChartRowDraft = NonNullable<NonNullable<NonNullable<LiftFormValues['chart']>['rows']>[number]>;

/** The unit pickers offer only the schema's units for each column, so a row's units are the schema's. */
function asDraft<T>(value: T): T & ChartRowDraft {
  return value as T & ChartRowDraft;
}

const COLUMNS = [
  { key: 'radius', label: 'Radius', kind: 'length' },
  { key: 'boomLength', label: 'Boom length', kind: 'length' },
  { key: 'capacity', label: 'Rated capacity', kind: 'weight' },
] as const;

type ColumnKey = (typeof COLUMNS)[number]['key'];

function isEmpty(row: Row | undefined): boolean {
  return !row || (!row.radius && !row.boomLength && !row.capacity);
}

/**
 * `base` is where the chart sits: 'chart' for the crane at the top, 'multiCrane.others.N.chart' for
 * another. `disabled` (a chart from the fleet library, not detached) puts every control in a
 * disabled fieldset; the table's scroll box stays outside it so the rows still scroll by keyboard.
 */
export function ChartRowsEditor({
  system,
  base = 'chart',
  disabled = false,
}: {
  system: UnitSystem;
  base?: string;
  disabled?: boolean;
}) {
  const rowsPath = `${base}.rows` as 'chart.rows';
  const {
    control,
    getValues,
    setValue,
    formState: { errors },
  } = useLiftFormContext();
  const { fields, append, remove, replace } = useFieldArray({ control, name: rowsPath });
  const rows = (useWatch({ control, name: rowsPath }) as Row[] | undefined) ?? [];
  const baseId = useId();
  const [pasteText, setPasteText] = useState('');
  const [report, setReport] = useState<{ text: string; problems: string[] } | null>(null);

  const unitOf = (key: ColumnKey, kind: 'length' | 'weight') =>
    rows.find((row) => row?.[key])?.[key]?.unit ?? defaultUnit(kind, system);
  const [units, setUnits] = useState<Record<ColumnKey, string>>(() => ({
    radius: unitOf('radius', 'length'),
    boomLength: unitOf('boomLength', 'length'),
    capacity: unitOf('capacity', 'weight'),
  }));

  function changeUnit(key: ColumnKey, unit: string) {
    setUnits((current) => ({ ...current, [key]: unit }));
    const current = (getValues(rowsPath) as Row[] | undefined) ?? [];
    current.forEach((row, index) => {
      const q = row?.[key];
      if (q)
        setValue(`${rowsPath}.${index}.${key}`, asDraft({ [key]: { value: q.value, unit } })[key], {
          shouldDirty: true,
          shouldValidate: true,
        });
    });
  }

  function addPasted(text: string) {
    const parsed = parseChartRows(text);
    const next = { ...units };
    if (parsed.units.radius) next.radius = parsed.units.radius;
    if (parsed.units.boomLength) next.boomLength = parsed.units.boomLength;
    if (parsed.units.capacity) next.capacity = parsed.units.capacity;
    setUnits(next);
    const newRows: Row[] = parsed.rows.map((row) => ({
      radius: { value: row.radius, unit: next.radius },
      boomLength: { value: row.boomLength, unit: next.boomLength },
      capacity: { value: row.capacity, unit: next.capacity },
    }));
    const kept = ((getValues(rowsPath) as Row[] | undefined) ?? []).filter((row) => !isEmpty(row));
    replace([...kept, ...newRows].map(asDraft));
    const added = `${newRows.length} ${newRows.length === 1 ? 'row' : 'rows'} added`;
    setReport({
      text: parsed.skippedHeader
        ? `${added}; the header row was read for the column order and units.`
        : `${added}.`,
      problems: parsed.problems,
    });
    setPasteText('');
  }

  function onPaste(event: ClipboardEvent<HTMLTextAreaElement>) {
    const text = event.clipboardData.getData('text');
    if (!text) return;
    event.preventDefault();
    addPasted(text);
  }

  const node = get(errors, rowsPath) as { message?: string; root?: { message?: string } } | undefined;
  const chartError = useFieldError(base);
  const listError = node?.message ?? node?.root?.message ?? (fields.length === 0 ? chartError : undefined);

  return (
    <section aria-labelledby={`${baseId}-title`} className="col-span-full flex flex-col gap-2">
      <h3 id={`${baseId}-title`} className="text-[13px] font-bold">
        Chart rows for this configuration
      </h3>
      <fieldset className="contents" disabled={disabled}>
        <div className="grid gap-2 md:grid-cols-[1fr_auto]">
          <label className="flex flex-col gap-1 text-[13px]">
            <span className="font-bold">Paste from a spreadsheet</span>
            <span className="text-[12.5px] text-ink-soft">
              Copy the columns radius, boom length and capacity (a header row is optional; “Capacity (kip)”
              sets the unit) and paste here. Rows are added below.
            </span>
            <textarea
              value={pasteText}
              onChange={(event) => setPasteText(event.target.value)}
              onPaste={onPaste}
              rows={3}
              placeholder={'radius\tboom\tcapacity\n10\t30.5\t22.5'}
              className="rounded-[3px] border border-rule-strong bg-sheet px-2 py-1 font-mono text-[13px] text-ink"
            />
          </label>
          <div className="flex items-end">
            <Button size="sm" disabled={pasteText.trim() === ''} onClick={() => addPasted(pasteText)}>
              Add typed rows
            </Button>
          </div>
        </div>
      </fieldset>
      {report && (
        <div role="status" className="text-[13px]">
          <p className="font-bold text-pass-ink">{report.text}</p>
          {report.problems.map((problem) => (
            <p key={problem} className="text-caution-ink">
              {problem}
            </p>
          ))}
        </div>
      )}

      {/* focusable so the rows scroll by keyboard even when every input is read-only (library) */}
      <div
        tabIndex={0}
        className="max-h-[26rem] overflow-auto border border-rule focus-visible:outline-2 focus-visible:outline-verdigris"
      >
        <fieldset className="contents" disabled={disabled}>
          <table className="w-full border-collapse text-[13px]" aria-label="Chart rows">
            <thead className="sticky top-0 bg-sheet-alt">
              <tr>
                <th scope="col" className="w-8 px-2 py-1 text-left font-bold text-ink-soft">
                  #
                </th>
                {COLUMNS.map((column) => (
                  <th key={column.key} scope="col" className="px-2 py-1 text-left font-bold text-ink-soft">
                    <span className="flex items-center gap-1.5">
                      {column.label}
                      <select
                        aria-label={`Unit of the ${column.label.toLowerCase()} column`}
                        value={units[column.key]}
                        onChange={(event) => changeUnit(column.key, event.target.value)}
                        className="h-6 rounded-[3px] border border-rule-strong bg-sheet px-0.5 text-[12.5px] font-normal text-ink"
                      >
                        {UNITS_BY_KIND[column.kind].map((unit) => (
                          <option key={unit} value={unit}>
                            {unitLabel(unit)}
                          </option>
                        ))}
                      </select>
                    </span>
                  </th>
                ))}
                <th scope="col" className="px-2 py-1 text-left font-bold text-ink-soft">
                  Chart allows interpolation
                </th>
                <th scope="col" className="w-10">
                  <span className="sr-only">Remove</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {fields.length === 0 && (
                <tr>
                  <td colSpan={6} className="px-3 py-4 text-ink-soft">
                    No chart rows yet. Paste them above or add them one by one.
                  </td>
                </tr>
              )}
              {fields.map((row, index) => (
                <tr key={row.id} className="border-t border-rule align-top even:bg-sheet-alt">
                  <td className="px-2 py-1 tabular text-ink-soft">{index + 1}</td>
                  {COLUMNS.map((column) => {
                    const name = `${rowsPath}.${index}.${column.key}`;
                    const id = `${baseId}-${index}-${column.key}`;
                    return (
                      <td key={column.key} className="px-2 py-1">
                        <ChartCell
                          name={name}
                          id={id}
                          label={`Row ${index + 1} ${column.label.toLowerCase()} (${unitLabel(units[column.key])})`}
                          unit={units[column.key]}
                        />
                      </td>
                    );
                  })}
                  <td className="px-2 py-1">
                    <Controller
                      control={control}
                      name={`${rowsPath}.${index}.interpolationAllowed`}
                      render={({ field }) => (
                        <input
                          type="checkbox"
                          aria-label={`Row ${index + 1}: the chart allows interpolation`}
                          checked={field.value === true}
                          onChange={(event) => field.onChange(event.target.checked || undefined)}
                          className="mt-2 size-4 accent-verdigris"
                        />
                      )}
                    />
                  </td>
                  <td className="px-1 py-1">
                    <Button
                      size="sm"
                      variant="quiet"
                      aria-label={`Remove chart row ${index + 1}`}
                      onClick={() => remove(index)}
                    >
                      ✕
                    </Button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </fieldset>
      </div>
      <ErrorText id={`${baseId}-error`} message={listError} />
      <fieldset className="contents" disabled={disabled}>
        <div className="flex gap-2">
          <Button size="sm" onClick={() => append({})}>
            + Add a row
          </Button>
          {fields.length > 0 && (
            <Button size="sm" variant="quiet" onClick={() => replace([])}>
              Clear all rows
            </Button>
          )}
        </div>
      </fieldset>
    </section>
  );
}

function ChartCell({ name, id, label, unit }: { name: string; id: string; label: string; unit: string }) {
  const { control } = useLiftFormContext();
  const message = useFieldError(name);
  return (
    <>
      <Controller
        control={control}
        name={liftPath(name)}
        render={({ field }) => (
          <NumberText
            id={id}
            aria-label={label}
            value={(field.value as { value: number } | undefined)?.value}
            onValue={(value) => field.onChange(value === undefined ? undefined : { value, unit })}
            onBlur={field.onBlur}
            aria-invalid={message ? true : undefined}
            aria-describedby={message ? `${id}-error` : undefined}
            className="w-24"
          />
        )}
      />
      <ErrorText id={`${id}-error`} message={message} />
    </>
  );
}
