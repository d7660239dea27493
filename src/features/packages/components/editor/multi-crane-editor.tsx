// The "Several cranes" step: turn a lift into one with 2 to 4 cranes, add or remove cranes, and
// enter each other crane in full (configuration, chart rows, reeving, ground, block, rigging, pick
// point). The crane entered in the first steps is crane 1. Fields come from multi-crane-steps.
// With the fleet library, each other crane has its own picker (slot index + 1): a crane picked
// from the library keeps its configuration and chart read-only until a copy is detached.
import { useState } from 'react';
import { useFieldArray, useWatch } from 'react-hook-form';
import type { LibraryFill } from '@shared/library/to-lift-input';
import type { UnitSystem } from '@shared/schemas/common';
import type { FieldGroup } from '@shared/catalogue/lift-fields';
import { MAX_OTHER_CRANES, MULTI_CRANE_GROUPS, otherCraneGroups } from '@shared/catalogue/multi-crane-steps';
import { Button } from '@/components/ui/button';
import { useLiftFormContext } from '../../hooks/use-lift-form';
import { isSlotLibraryPath, type EditorLibrary } from '../../hooks/use-library-fill';
import { ChartRowsEditor } from './chart-rows-editor';
import { LiftField } from './lift-field';

export function FieldGroups({
  groups,
  values,
  system,
  locked,
}: {
  groups: FieldGroup[];
  values: Record<string, unknown>;
  system: UnitSystem;
  /** Fields filled from the fleet library, read-only until a copy is detached. */
  locked?: (path: string) => boolean;
}) {
  return (
    <>
      {groups
        .filter((group) => !group.when || group.when(values))
        .map((group) => (
          <fieldset key={group.title} className="mb-4 min-w-0 border-t border-rule pt-2">
            <legend className="pr-2 text-[12px] font-bold uppercase tracking-[0.06em] text-ink-soft">
              {group.title}
            </legend>
            {group.note && <p className="mb-2 text-[12.5px] text-ink-soft">{group.note}</p>}
            <div className="grid grid-cols-[repeat(auto-fill,minmax(13.5rem,1fr))] gap-x-4 gap-y-3">
              {group.fields.map((def) =>
                locked ? (
                  <fieldset key={def.path} className="contents" disabled={locked(def.path)}>
                    <LiftField def={def} system={system} />
                  </fieldset>
                ) : (
                  <LiftField key={def.path} def={def} system={system} />
                ),
              )}
            </div>
          </fieldset>
        ))}
    </>
  );
}

export function MultiCraneEditor({
  system,
  library,
}: {
  system: UnitSystem;
  /** The page's fleet library, with the editor's fill for a slot */
  library?: EditorLibrary & { fill: (f: LibraryFill, slot: number) => void };
}) {
  const { control, setValue, getValues } = useLiftFormContext();
  const multi = useWatch({ control, name: 'multiCrane' });
  const values = useWatch({ control }) as Record<string, unknown>;
  const { fields, append, remove } = useFieldArray({ control, name: 'multiCrane.others' });
  // A fill from the library remounts that crane's chart rows editor, so its rows and column units
  // are read again from the filled chart.
  const [fills, setFills] = useState<Record<number, number>>({});
  const fillSlot = (f: LibraryFill, slot: number) => {
    library?.fill(f, slot);
    setFills((n) => ({ ...n, [slot]: (n[slot] ?? 0) + 1 }));
  };

  if (!multi) {
    return (
      <div className="flex flex-col items-start gap-2 text-[13.5px]">
        <p>
          This lift uses one crane. A lift with 2 to 4 cranes gives each crane its own configuration, chart,
          reeving, supports, ground, rigging and hook block, and its pick point on the load; each crane is
          checked for its share with the multi-crane margin.
        </p>
        <Button
          onClick={() => {
            setValue('multiCrane.lead', {}, { shouldDirty: true });
            append({});
            // a use left over from an earlier several-crane draft must not lock the new crane 2
            library?.onCraneRemoved?.(null);
          }}
        >
          Use several cranes
        </Button>
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-3">
      <FieldGroups groups={MULTI_CRANE_GROUPS} values={values} system={system} />
      {fields.map((field, index) => {
        const slot = index + 1;
        const locked = !!library?.locked(slot);
        return (
          <section
            key={field.id}
            aria-labelledby={`crane-${index + 2}-title`}
            className="border border-rule-strong px-3 py-2"
            data-testid="other-crane"
          >
            <header className="mb-2 flex items-center justify-between gap-2">
              <h3 id={`crane-${index + 2}-title`} className="text-[15px] font-black">
                Crane {index + 2}
              </h3>
              <Button
                size="sm"
                variant="quiet"
                disabled={fields.length <= 1}
                onClick={() => {
                  remove(index);
                  library?.onCraneRemoved?.(slot);
                }}
                aria-label={`Remove crane ${index + 2}`}
              >
                Remove crane
              </Button>
            </header>
            {library?.picker((f) => fillSlot(f, slot), slot)}
            <FieldGroups
              groups={otherCraneGroups(index)}
              values={values}
              system={system}
              locked={locked ? (path) => isSlotLibraryPath(slot, path) : undefined}
            />
            <ChartRowsEditor
              disabled={locked}
              key={fills[slot] ?? 0}
              system={system}
              base={`multiCrane.others.${index}.chart`}
            />
          </section>
        );
      })}
      <div className="flex flex-wrap gap-2">
        <Button disabled={fields.length >= MAX_OTHER_CRANES} onClick={() => append({})}>
          + Add a crane ({fields.length + 1} of 4)
        </Button>
        <Button
          variant="quiet"
          onClick={() => {
            if (getValues('multiCrane.others')?.length) remove();
            setValue('multiCrane', undefined, { shouldDirty: true });
            library?.onCraneRemoved?.(null);
          }}
        >
          Back to one crane
        </Button>
      </div>
    </div>
  );
}
