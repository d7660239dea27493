// Public entry of the calculation engine (pure TypeScript: no I/O, no DOM, no Node APIs).
// Import from '@shared/engineering' (server, worker, client) or relatively inside shared/.
export {
  evaluateLift,
  checkLift,
  tippingBalance,
  resolvePolicy,
  CAUTIONS,
  RESULT_VERSION,
  ENGINE_VERSION,
} from './evaluate';
export type { EvaluateOptions, CheckLiftOutcome, InputIssue } from './evaluate';
export { liftInputJsonSchema, sitePolicyJsonSchema } from './json-schema';
export { formatQuantity, formatPercent, formatPercentOf, formatFormula, toDisplay, sig3 } from './format';
export { TO_SI, si, fromSI, STANDARD_GRAVITY } from './units';
export { SOURCES } from './sources';
export { minimumClearanceFt } from './checks/power-line';
export { leadLineFactor, SHEAVE_BEARING_CONSTANT, ROPE_DESIGN_FACTOR } from './checks/reeving';
export { angleFactor, twoLegTensions } from './checks/rigging';
export { dynamicPressure, AIR_DENSITY } from './checks/wind';
export { twoCraneShares, tandemMarginPct } from './checks/tandem';
export { IBC_1806_2_PSF } from './checks/ground-bearing-pressure';
export { lookupCapacity } from './chart';
export type * from './types';
export { LiftInput } from '../schemas/lift-input';
export { SitePolicy, POLICY_DEFAULTS, DEFAULT_POLICY } from '../schemas/site-policy';
