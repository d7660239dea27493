// A quantity as the person types it: the number and, beside it, the unit it is in. The
// unit selector relabels the number (it does not convert it). An empty box means the
// quantity is not given; the unit chosen is kept for when a number is typed.
import { useState } from 'react';
import { defaultUnit, unitLabel, UNITS_BY_KIND, type QuantityKind } from '@shared/vocabulary/units';
import type { UnitSystem } from '@shared/schemas/common';
import { NumberText } from './number-text';

export type QuantityValue = { value: number; unit: string } | undefined;

export function QuantityInput({
  id,
  value,
  onChange,
  onBlur,
  kind,
  system,
  label,
  invalid,
  describedBy,
  compact = false,
  ariaLabel,
}: {
  id: string;
  value: QuantityValue;
  onChange: (value: QuantityValue) => void;
  onBlur?: () => void;
  kind: QuantityKind;
  system: UnitSystem;
  /** The field's name, used to label the unit selector for screen readers. */
  label: string;
  invalid?: boolean;
  describedBy?: string;
  compact?: boolean;
  /** The number's accessible name where no <label> points at it (a cell of a list). */
  ariaLabel?: string;
}) {
  const [chosenUnit, setChosenUnit] = useState(() => value?.unit ?? defaultUnit(kind, system));
  const unit = value?.unit ?? chosenUnit;
  const units = UNITS_BY_KIND[kind];
  return (
    <span className="flex min-w-0 items-stretch">
      <NumberText
        id={id}
        value={value?.value}
        onValue={(next) => onChange(next === undefined ? undefined : { value: next, unit })}
        onBlur={onBlur}
        aria-invalid={invalid ? true : undefined}
        aria-describedby={describedBy}
        aria-label={ariaLabel}
        className={`${compact ? 'w-[5.5rem]' : 'w-28'} rounded-r-none`}
      />
      {units.length === 1 ? (
        <span className="flex h-8 items-center rounded-r-[3px] border border-l-0 border-rule-strong bg-sheet-alt px-2 text-[13px] text-ink-soft">
          {unitLabel(unit)}
        </span>
      ) : (
        <select
          aria-label={`Unit of ${label}`}
          value={unit}
          onChange={(event) => {
            setChosenUnit(event.target.value);
            if (value) onChange({ value: value.value, unit: event.target.value });
          }}
          onBlur={onBlur}
          className="h-8 rounded-r-[3px] border border-l-0 border-rule-strong bg-sheet-alt px-1 text-[13px] text-ink"
        >
          {units.map((u) => (
            <option key={u} value={u}>
              {unitLabel(u)}
            </option>
          ))}
        </select>
      )}
    </span>
  );
}
