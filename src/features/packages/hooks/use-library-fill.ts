// Fills a crane's configuration and chart from a fleet library version (the parts the library
// keeps), keeping the planner's own figures (boom length, angle, radius, slew) and the hook block
// height. Slot 0 is the crane of the first steps (crane, chart, hookBlock, chartDeductions); slot
// i (1 to 3) is multiCrane.others.{i-1} with the same four parts.
import { useCallback, type ReactNode } from 'react';
import type { LibraryFill } from '@shared/library/to-lift-input';
import { isLibraryPath } from '@shared/library/to-lift-input';
import type { LiftFormValues, useLiftForm } from './use-lift-form';

type Form = ReturnType<typeof useLiftForm>;

/** Where slot `slot`'s crane sits in the lift input: '' for the crane at the top. */
export function slotPrefix(slot: number): string {
  return slot === 0 ? '' : `multiCrane.others.${slot - 1}.`;
}

/** A path of the lift input that slot's library version fills (read-only while it is in use). */
export function isSlotLibraryPath(slot: number, path: string): boolean {
  const prefix = slotPrefix(slot);
  return path.startsWith(prefix) && isLibraryPath(path.slice(prefix.length));
}

type Slot = Pick<LiftFormValues, 'crane' | 'chart' | 'hookBlock' | 'chartDeductions'>;

/** A crane slot's four parts with the library's filled in; the planner's own figures stay. */
function filled(cur: Slot, fill: LibraryFill): Slot {
  return {
    crane: {
      ...fill.crane,
      boomLength: cur.crane?.boomLength,
      boomAngle: cur.crane?.boomAngle,
      radius: cur.crane?.radius,
      slewAngle: cur.crane?.slewAngle,
    },
    chart: fill.chart,
    hookBlock: fill.hookBlock ? { ...cur.hookBlock, ...fill.hookBlock } : cur.hookBlock,
    chartDeductions: fill.chartDeductions ?? cur.chartDeductions,
  };
}

export function useLibraryFill(form: Form) {
  return useCallback(
    (fill: LibraryFill, slot = 0) => {
      const opts = { shouldDirty: true, shouldTouch: true };
      if (slot === 0) {
        const next = filled(form.getValues(), fill);
        form.setValue('crane', next.crane, opts);
        form.setValue('chart', next.chart, opts);
        if (fill.hookBlock) form.setValue('hookBlock', next.hookBlock, opts);
        if (fill.chartDeductions) form.setValue('chartDeductions', next.chartDeductions, opts);
        return;
      }
      const i = slot - 1;
      const next = filled(form.getValues(`multiCrane.others.${i}`) ?? {}, fill);
      form.setValue(`multiCrane.others.${i}.crane`, next.crane, opts);
      form.setValue(`multiCrane.others.${i}.chart`, next.chart, opts);
      if (fill.hookBlock) form.setValue(`multiCrane.others.${i}.hookBlock`, next.hookBlock, opts);
      if (fill.chartDeductions)
        form.setValue(`multiCrane.others.${i}.chartDeductions`, next.chartDeductions, opts);
    },
    [form],
  );
}

/** What the page hands the editor when the package may use the fleet library. */
export interface EditorLibrary {
  /** For a crane slot (0 to 3): a library version is in use and not detached, its fields read-only */
  locked: (slot: number) => boolean;
  /** The picker of a crane slot, shown on the crane and chart steps (slot 0) and in each other crane */
  picker: (fill: (f: LibraryFill) => void, slot: number) => ReactNode;
  /**
   * A crane of several was removed (slot 1 to 3), or the lift went back to one crane (null): the
   * library uses of the cranes after it follow them up one slot.
   */
  onCraneRemoved?: (slot: number | null) => void;
}
