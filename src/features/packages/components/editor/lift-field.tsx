// One field of the submission form from its description in shared/catalogue/lift-fields.ts: the label, the
// input (a quantity with its unit, a number, a choice, text, a tick box or a list of rows)
// and, under it, the schema's message naming the limit that was broken.
import { useId } from 'react';
import { Controller, get, useFieldArray } from 'react-hook-form';
import { liftListPath, liftPath, useLiftFormContext } from '../../hooks/use-lift-form';
import type { UnitSystem } from '@shared/schemas/common';
import { Button } from '@/components/ui/button';
import type { FieldDef } from '@shared/catalogue/lift-fields';
import { QuantityInput, type QuantityValue } from './quantity-input';
import { NumberText } from './number-text';
import { useFieldError } from './field-errors';

const textInput =
  'h-8 w-full min-w-0 rounded-[3px] border border-rule-strong bg-sheet px-2 text-[14px] text-ink aria-[invalid=true]:border-2 aria-[invalid=true]:border-failed-ink';

function ErrorText({ id, message }: { id: string; message: string | undefined }) {
  if (!message) return null;
  return (
    <p id={id} className="flex items-start gap-1 text-[12.5px] font-bold leading-snug text-failed-ink">
      <svg className="mt-0.5 size-3 shrink-0" viewBox="0 0 12 12" aria-hidden="true">
        <path d="M3.8 1 H8.2 L11 3.8 V8.2 L8.2 11 H3.8 L1 8.2 V3.8 Z" fill="currentColor" />
        <path d="M4.3 4.3 L7.7 7.7 M7.7 4.3 L4.3 7.7" stroke="#fff" strokeWidth="1.3" />
      </svg>
      {message}
    </p>
  );
}

/** The input alone, without its label: used in form rows and in list cells. */
function FieldInput({
  def,
  name,
  id,
  system,
  errorId,
  invalid,
  label,
  compact,
}: {
  def: Exclude<FieldDef, { kind: 'list' }>;
  name: string;
  id: string;
  system: UnitSystem;
  errorId: string;
  invalid: boolean;
  label: string;
  /** A list cell: narrower, and with no <label> of its own it is named by its list, row and column. */
  compact?: boolean;
}) {
  const named = compact ? label : undefined;
  const { control } = useLiftFormContext();
  const describedBy = invalid ? errorId : undefined;
  return (
    <Controller
      control={control}
      name={liftPath(name)}
      render={({ field }) => {
        switch (def.kind) {
          case 'quantity':
            return (
              <QuantityInput
                id={id}
                value={field.value as QuantityValue}
                onChange={field.onChange}
                onBlur={field.onBlur}
                kind={def.q}
                system={system}
                label={label}
                invalid={invalid}
                describedBy={describedBy}
                compact={compact}
                ariaLabel={named}
              />
            );
          case 'number':
            return (
              <span className="flex items-center gap-1">
                <NumberText
                  id={id}
                  value={field.value as number | undefined}
                  onValue={field.onChange}
                  onBlur={field.onBlur}
                  aria-invalid={invalid ? true : undefined}
                  aria-describedby={describedBy}
                  aria-label={named}
                  className={compact ? 'w-20' : 'w-28'}
                />
                {def.suffix && <span className="text-[13px] text-ink-soft">{def.suffix}</span>}
              </span>
            );
          case 'select':
            return (
              <select
                id={id}
                value={(field.value as string | undefined) ?? ''}
                onChange={(event) => field.onChange(event.target.value || undefined)}
                onBlur={field.onBlur}
                aria-invalid={invalid ? true : undefined}
                aria-describedby={describedBy}
                aria-label={named}
                className={`${textInput} px-1`}
              >
                <option value="">Not given</option>
                {def.options.map(([value, text]) => (
                  <option key={value} value={value}>
                    {text}
                  </option>
                ))}
              </select>
            );
          case 'text':
            return (
              <input
                id={id}
                type="text"
                maxLength={200}
                value={(field.value as string | undefined) ?? ''}
                onChange={(event) => field.onChange(event.target.value)}
                onBlur={field.onBlur}
                aria-invalid={invalid ? true : undefined}
                aria-describedby={describedBy}
                aria-label={named}
                className={textInput}
              />
            );
          case 'checkbox':
            return (
              <input
                id={id}
                type="checkbox"
                checked={field.value === true}
                onChange={(event) => field.onChange(event.target.checked)}
                onBlur={field.onBlur}
                className="size-4 accent-verdigris"
              />
            );
        }
      }}
    />
  );
}

function CellField({
  column,
  name,
  id,
  system,
  label,
}: {
  column: Exclude<FieldDef, { kind: 'list' }>;
  name: string;
  id: string;
  system: UnitSystem;
  label: string;
}) {
  const message = useFieldError(name);
  return (
    <>
      <FieldInput
        def={column}
        name={name}
        id={id}
        system={system}
        errorId={`${id}-error`}
        invalid={Boolean(message)}
        label={label}
        compact
      />
      <ErrorText id={`${id}-error`} message={message} />
    </>
  );
}

function ListField({ def, system }: { def: Extract<FieldDef, { kind: 'list' }>; system: UnitSystem }) {
  const {
    control,
    formState: { errors },
  } = useLiftFormContext();
  const { fields, append, remove } = useFieldArray({ control, name: liftListPath(def.path) });
  const baseId = useId();
  const node = get(errors, def.path) as { message?: string; root?: { message?: string } } | undefined;
  const schemaError = useFieldError(def.path);
  const listError = node?.message ?? node?.root?.message ?? (fields.length === 0 ? schemaError : undefined);
  return (
    <fieldset className="col-span-full flex min-w-0 flex-col gap-1.5">
      <legend className="mb-1 text-[13px] font-bold">{def.label}</legend>
      {def.hint && <p className="text-[12.5px] text-ink-soft">{def.hint}</p>}
      {fields.length > 0 && (
        <div className="overflow-x-auto border border-rule">
          <table className="w-full border-collapse text-[13px]">
            <thead className="bg-sheet-alt">
              <tr>
                <th scope="col" className="w-8 px-2 py-1 text-left font-bold text-ink-soft">
                  #
                </th>
                {def.columns.map((column) => (
                  <th key={column.path} scope="col" className="px-2 py-1 text-left font-bold text-ink-soft">
                    {column.label}
                  </th>
                ))}
                <th scope="col" className="w-10 px-2 py-1">
                  <span className="sr-only">Remove</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {fields.map((row, index) => (
                <tr key={row.id} className="border-t border-rule align-top">
                  <td className="px-2 py-1.5 tabular text-ink-soft">{index + 1}</td>
                  {def.columns.map((column) => {
                    if (column.kind === 'list') return null;
                    const name = `${def.path}.${index}.${column.path}`;
                    const id = `${baseId}-${index}-${column.path}`;
                    return (
                      <td key={column.path} className="px-2 py-1.5">
                        <CellField
                          column={column}
                          name={name}
                          id={id}
                          system={system}
                          label={`${def.label}, row ${index + 1}: ${column.label}`}
                        />
                      </td>
                    );
                  })}
                  <td className="px-1 py-1.5">
                    <Button
                      size="sm"
                      variant="quiet"
                      aria-label={`Remove row ${index + 1} of ${def.label}`}
                      onClick={() => remove(index)}
                    >
                      ✕
                    </Button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <ErrorText id={`${baseId}-error`} message={listError} />
      <div>
        <Button size="sm" onClick={() => append({})}>
          + {def.addLabel}
        </Button>
      </div>
    </fieldset>
  );
}

export function LiftField({ def, system }: { def: FieldDef; system: UnitSystem }) {
  const id = useId();
  const message = useFieldError(def.path);
  if (def.kind === 'list') return <ListField def={def} system={system} />;
  const errorId = `${id}-error`;
  if (def.kind === 'checkbox') {
    return (
      <div className="col-span-full flex items-center gap-2">
        <FieldInput
          def={def}
          name={def.path}
          id={id}
          system={system}
          errorId={errorId}
          invalid={Boolean(message)}
          label={def.label}
        />
        <label htmlFor={id} className="text-[14px]">
          {def.label}
        </label>
      </div>
    );
  }
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="text-[13px] font-bold leading-tight">
        {def.label}
      </label>
      <FieldInput
        def={def}
        name={def.path}
        id={id}
        system={system}
        errorId={errorId}
        invalid={Boolean(message)}
        label={def.label}
      />
      {def.hint && !message && <p className="text-[12px] leading-snug text-ink-soft">{def.hint}</p>}
      <ErrorText id={errorId} message={message} />
    </div>
  );
}

export { ErrorText };
