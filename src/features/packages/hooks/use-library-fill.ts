// Fills a crane's configuration and chart from a fleet library version (the parts the library
// keeps), keeping the planner's own figures (boom length, angle, radius, slew) and the hook block
// height. Slot 0 is the crane of the first steps (crane, chart, hookBlock, chartDeductions); slot
// i (1 to 3) is multiCrane.others.{i-1} with the same four parts.
import { useCallback, type ReactNode } from 'react';
import type { LibraryFill } from '@shared/library/to-lift-input';
import { isLibraryPath } from '@shared/library/to-lift-input';
import type { useLiftForm } from './use-lift-form';

type Form = ReturnType<typeof useLiftForm>;
type Crane = { boomLength?: unknown; boomAngle?: unknown; radius?: unknown; slewAngle?: unknown };

/** Where slot `slot`'s crane sits in the lift input: '' for the crane at the top. */
export function slotPrefix(slot: number): string {
  return slot === 0 ? '' : `multiCrane.others.${slot - 1}.`;
}

/** A path of the lift input that slot's library version fills (read-only while it is in use). */
export function isSlotLibraryPath(slot: number, path: string): boolean {
  const prefix = slotPrefix(slot);
  return path.startsWith(prefix) && isLibraryPath(path.slice(prefix.length));
}

export function useLibraryFill(form: Form) {
  return useCallback(
    (fill: LibraryFill, slot = 0) => {
      const p = slotPrefix(slot);
      // react-hook-form's typed paths cannot name an index chosen at run time; the paths are the
      // lift input's own (crane, chart, hookBlock, chartDeductions under the slot's prefix).
      const get = (path: string) => form.getValues(path as never) as unknown;
      const set = (path: string, value: unknown) =>
        form.setValue(path as never, value as never, { shouldDirty: true, shouldTouch: true });
      const crane = (get(`${p}crane`) ?? {}) as Crane;
      set(`${p}crane`, {
        ...fill.crane,
        boomLength: crane.boomLength,
        boomAngle: crane.boomAngle,
        radius: crane.radius,
        slewAngle: crane.slewAngle,
      });
      set(`${p}chart`, fill.chart);
      if (fill.hookBlock)
        set(`${p}hookBlock`, { ...((get(`${p}hookBlock`) ?? {}) as object), ...fill.hookBlock });
      if (fill.chartDeductions) set(`${p}chartDeductions`, fill.chartDeductions);
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
