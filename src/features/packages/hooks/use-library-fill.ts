// Fills the editor's crane and chart from a fleet library version (the parts the library keeps),
// keeping the planner's own figures (boom length, angle, radius, slew) and the hook block height.
import { useCallback } from 'react';
import type { LibraryFill } from '@shared/library/to-lift-input';
import type { useLiftForm } from './use-lift-form';

export function useLibraryFill(form: ReturnType<typeof useLiftForm>) {
  return useCallback(
    (fill: LibraryFill) => {
      const now = form.getValues();
      const crane = now.crane ?? {};
      const opts = { shouldDirty: true, shouldTouch: true } as const;
      form.setValue(
        'crane',
        {
          ...fill.crane,
          boomLength: crane.boomLength,
          boomAngle: crane.boomAngle,
          radius: crane.radius,
          slewAngle: crane.slewAngle,
        } as never,
        opts,
      );
      form.setValue('chart', fill.chart as never, opts);
      if (fill.hookBlock) form.setValue('hookBlock', { ...now.hookBlock, ...fill.hookBlock } as never, opts);
      if (fill.chartDeductions) form.setValue('chartDeductions', fill.chartDeductions as never, opts);
    },
    [form],
  );
}

/** What the page hands the editor when the package may use the fleet library. */
export interface EditorLibrary {
  /** A library version is in use and not detached: its fields are read-only */
  locked: boolean;
  /** The picker, shown on the crane and chart steps; it calls fill with the version picked */
  picker: (fill: (f: LibraryFill) => void) => import('react').ReactNode;
}
