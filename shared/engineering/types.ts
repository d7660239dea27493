// Result types of the calculation engine. Values are SI (N, m, Pa, m/s, m², N·m, V); angles in
// degrees; ratios and percentages as plain numbers. `unit` tells the caller how to display a value.

export type UnitKind =
  | 'length'
  | 'weight'
  | 'force'
  | 'pressure'
  | 'speed'
  | 'area'
  | 'angle'
  | 'voltage'
  | 'moment'
  | 'ratio'
  | 'percent'
  | 'count';

export type UnitSystem = 'metric' | 'imperial';

export type CheckStatus = 'pass' | 'caution' | 'fail' | 'not_applicable';

export type SourceKind =
  'standard' | 'site_policy' | 'common_practice' | 'from_memory' | 'input' | 'computed';

export interface Source {
  kind: SourceKind;
  /** e.g. "OSHA 29 CFR 1926.1408, Table A" or "site policy: maximum chart use". */
  text: string;
}

/** A term of a formula: a number with its unit kind, rendered in the caller's unit system. */
export interface FormulaTerm {
  v: number;
  k: UnitKind;
}
export type FormulaPart = string | FormulaTerm;

export interface CheckItem {
  id: string;
  label: string;
  status: CheckStatus;
  value: number | null;
  limit: number | null;
  /** 'max': value must not exceed limit; 'min': value must reach limit; null: informational. */
  limitType: 'max' | 'min' | null;
  unit: UnitKind;
  /** The formula in words with numbers substituted, as structured parts (re-render with formatFormula). */
  formula: FormulaPart[];
  /** The formula rendered in the unit system asked for in evaluateLift's options. */
  formulaText: string;
  source: Source;
  message: string;
}

export type CheckId =
  | 'gross-load'
  | 'geometry'
  | 'capacity'
  | 'stability'
  | 'ground-bearing'
  | 'rigging'
  | 'reeving'
  | 'power-line'
  | 'wind'
  | 'tandem'
  | 'personnel'
  | 'critical-triggers';

export interface CheckResult extends Omit<CheckItem, 'id'> {
  id: CheckId;
  /** Sub-checks; the headline fields above repeat the governing one. */
  items: CheckItem[];
}

export interface CriticalTrigger {
  id: string;
  reason: string;
  source: Source;
}

export type StatedFigure =
  | 'grossLoad'
  | 'radius'
  | 'boomAngle'
  | 'chartCapacity'
  | 'percentOfChart'
  | 'overturningMoment'
  | 'resistingMoment'
  | 'stabilityRatio'
  | 'maxSupportReaction'
  | 'groundPressure'
  | 'maxSlingTension'
  | 'linePull';

export interface Discrepancy {
  figure: StatedFigure;
  label: string;
  unit: UnitKind;
  stated: number;
  computed: number | null;
  /** |stated − computed| / |computed|, as a percentage. */
  differencePct: number | null;
  tolerancePct: number;
  status: 'agrees' | 'discrepancy' | 'cannot_compare';
  /** True when the stated figure is on the unsafe side (understates a demand or overstates a capacity). */
  unsafeSide: boolean;
  message: string;
}

export interface Fix {
  checkId: 'capacity' | 'stability';
  kind: 'extra_counterweight' | 'counterweight_arm' | 'max_radius' | 'max_gross_load';
  value: number;
  unit: UnitKind;
  message: string;
  /** The message rendered in the requested unit system. */
  text: string;
  formula: FormulaPart[];
}

export interface LiftResult {
  resultVersion: 1;
  engineVersion: string;
  units: UnitSystem;
  overallStatus: Exclude<CheckStatus, 'not_applicable'>;
  checks: CheckResult[];
  critical: { isCritical: boolean; triggers: CriticalTrigger[] };
  discrepancies: Discrepancy[];
  fixes: Fix[];
  /** The policy the lift was checked against, copied so stored results record it. */
  policy: import('../schemas/site-policy').SitePolicy;
  /** Key computed figures in SI for plots (capacity curve, schematic, reactions). */
  figures: LiftFigures;
  cautions: string[];
}

export interface LiftFigures {
  grossLoad: number;
  radius: number | null;
  boomAngleDeg: number | null;
  tipHeight: number | null;
  chartCapacity: number | null;
  percentOfChart: number | null;
  overturningMoment: number | null;
  resistingMoment: number | null;
  stabilityRatio: number | null;
  supportReactions: { label: string; x: number; y: number; reaction: number }[];
  /**
   * The tipping line the stability check found governing (mobile cranes): the slew angle it
   * used (degrees from over the rear) and the line's distance from the centre of rotation
   * measured along the boom (m). Drawings take it from here so they show the check's line.
   * Absent in results stored before it was added.
   */
  tipping?: { slewDeg: number; edge: string; distanceAlongBoom: number } | null;
  maxSupportReaction: number | null;
  groundPressure: number | null;
  maxSlingTension: number | null;
  linePull: number | null;
}
