// POST /api/calculations: evaluate a lift without storing it.
import { z } from 'zod';
import { LiftInput } from './lift-input';
import { SitePolicy } from './site-policy';
import { UnitSystem } from './common';

export const CalculationBody = z.object({
  input: LiftInput,
  policy: SitePolicy.optional(),
  /** Unit system of the formula text in the answer (values stay SI). Defaults to the person's own. */
  units: UnitSystem.optional(),
});
export type CalculationBody = z.infer<typeof CalculationBody>;
