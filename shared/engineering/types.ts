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
  /**
   * The same text with its quantities in one unit system, where it names quantities (a document
   * prints the one of its own system: sourceText() in sources.ts); absent when it names none.
   */
  textIn?: Record<UnitSystem, string>;
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
  checkId: 'capacity' | 'stability' | 'ground-bearing';
  kind:
    | 'extra_counterweight'
    | 'counterweight_arm'
    | 'max_radius'
    | 'max_gross_load'
    | 'mat_area'
    | 'track_mat_length';
  value: number;
  unit: UnitKind;
  message: string;
  /** The message rendered in the requested unit system. */
  text: string;
  formula: FormulaPart[];
}

/** One crane of a lift with several cranes (lead crane first). */
export interface CraneResult {
  /** 1-based position: 1 is the crane entered at the top of the input */
  index: number;
  name: string;
  /** this crane's share of the load (N) from statics or as stated; null when not found */
  share: number | null;
  /** share plus this crane's own rigging, hook block, load line and deductions (N) */
  grossLoad: number | null;
  chartCapacity: number | null;
  /** plan position of the pick point (m), in the plan frame of the input */
  pickPoint: { x: number; y: number } | null;
  /** the share's range when the centre of gravity moves by the sensitivity offset (N) */
  shareRange: { min: number; max: number } | null;
  overallStatus: Exclude<CheckStatus, 'not_applicable'>;
  /** every single-crane check for this crane's share; empty when its configuration is not entered */
  checks: CheckResult[];
  figures: LiftFigures | null;
}

export interface LiftResult {
  /** 2 adds `cranes` and `multiCrane` for lifts with several cranes; 1 results stay readable. */
  resultVersion: 1 | 2;
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
  /** Lifts with several cranes: each crane's share and checks (absent for one crane). */
  cranes?: CraneResult[];
  multiCrane?: {
    method: 'two' | 'three' | 'stated' | 'none';
    loadWeight: number;
    cg: { x: number; y: number };
    /** largest distance between two pick points (m) */
    spacing: number;
    /** the centre of gravity moved by this much for the sensitivity line (m) */
    sensitivityOffset: number | null;
    marginPct: number;
  };
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
