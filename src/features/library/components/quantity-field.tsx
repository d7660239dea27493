// A labelled quantity (number and unit) for the library's forms; empty means not given.
import { useId } from 'react';
import type { UnitSystem } from '@shared/schemas/common';
import { defaultUnit, unitLabel, UNITS_BY_KIND } from '@shared/vocabulary/units';
import { inputClasses, selectClasses } from '@/components/ui/form-field';

export type Q = { value: number; unit: string } | undefined;

export function QuantityField({
  label,
  value,
  onChange,
  kind,
  system,
  error,
}: {
  label: string;
  value: Q;
  onChange: (q: Q) => void;
  kind: 'length' | 'weight';
  system: UnitSystem;
  error?: string;
}) {
  const id = useId();
  const unit = value?.unit ?? defaultUnit(kind, system);
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-[13px] font-bold">
        {label}
      </label>
      <div className="flex gap-1">
        <input
          id={id}
          inputMode="decimal"
          className={`${inputClasses.replace('w-full', '')} w-28`}
          aria-invalid={!!error}
          aria-describedby={error ? `${id}-e` : undefined}
          defaultValue={value?.value ?? ''}
          onChange={(e) => {
            const t = e.target.value.trim();
            const n = Number(t);
            onChange(t === '' ? undefined : { value: Number.isFinite(n) ? n : NaN, unit });
          }}
        />
        <select
          aria-label={`${label}: unit`}
          className={`${selectClasses.replace('w-full', '')} w-20`}
          value={unit}
          onChange={(e) => onChange(value ? { ...value, unit: e.target.value } : undefined)}
        >
          {UNITS_BY_KIND[kind].map((u) => (
            <option key={u} value={u}>
              {unitLabel(u)}
            </option>
          ))}
        </select>
      </div>
      {error && (
        <p id={`${id}-e`} className="text-[12.5px] font-bold text-failed-ink">
          {error}
        </p>
      )}
    </div>
  );
}

/** The message of the first field error whose path starts with `path`. */
export function fieldError(fields: { path: string; message: string }[] | undefined, path: string) {
  return fields?.find((f) => f.path === path || f.path.startsWith(`${path}.`))?.message;
}
