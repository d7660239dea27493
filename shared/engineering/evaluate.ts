// The independent check: evaluateLift runs checks 1–12 of PRODUCT.md on a parsed LiftInput and
// returns a LiftResult (versioned, with the policy used copied in). checkLift parses unknown JSON
// first and returns the zod issues (path and message) instead of throwing.
import { LiftInput } from '../schemas/lift-input';
import { DEFAULT_POLICY, SitePolicy, type SitePolicyInput } from '../schemas/site-policy';
import { lookupCapacity, type ChartRowSI } from './chart';
import type { Ctx } from './context';
import { worst } from './context';
import { capacityCheck } from './checks/capacity';
import { criticalTriggers, criticalTriggersCheck } from './checks/critical-triggers';
import { computeGeometry, geometryCheck } from './checks/geometry';
import { grossLoadCheck, grossLoadParts } from './checks/gross-load';
import { groundBearingCheck } from './checks/ground-bearing';
import { personnelCheck } from './checks/personnel';
import { powerLineCheck } from './checks/power-line';
import { reevingCheck } from './checks/reeving';
import { riggingCheck } from './checks/rigging';
import { stabilityCheck } from './checks/stability';
import { tandemCheck } from './checks/tandem';
import { computeWind, windCheck } from './checks/wind';
import { compareStated } from './discrepancies';
import { si } from './units';
import { edgeBalance, planModel } from './crane-model';
import type { CheckResult, Fix, LiftFigures, LiftResult, UnitSystem } from './types';

export const RESULT_VERSION = 1 as const;
export const ENGINE_VERSION = '1.1.0';

export const CAUTIONS: readonly string[] = [
  "This check recomputes the arithmetic and consistency of the lift plan. It does not replace the crane manufacturer's load chart and operating instructions.",
  'It does not replace a qualified lift director or rigging supervisor, or the judgement of the engineer of record.',
  'Local codes and regulations, the site rules and the current editions of the standards named here govern where they differ.',
];

export interface EvaluateOptions {
  /** Unit system for the formula text, fixes and messages (values stay SI). Default metric. */
  units?: UnitSystem;
}

/** Merge a partial policy over the defaults without validation (use SitePolicy.parse for untrusted data). */
export function resolvePolicy(policy?: Partial<SitePolicy> | null): SitePolicy {
  if (!policy) return DEFAULT_POLICY;
  return {
    ...DEFAULT_POLICY,
    ...policy,
    tandemMarginPct: { ...DEFAULT_POLICY.tandemMarginPct, ...(policy.tandemMarginPct ?? {}) },
  };
}

export function evaluateLift(
  input: LiftInput,
  policy?: Partial<SitePolicy> | null,
  options: EvaluateOptions = {},
): LiftResult {
  const pol = resolvePolicy(policy);
  const system: UnitSystem = options.units ?? 'metric';
  const parts = grossLoadParts(input);
  const geometry = computeGeometry(input);
  const rows: ChartRowSI[] = input.chart.rows.map((r) => ({
    radius: si(r.radius)!,
    boomLength: si(r.boomLength)!,
    capacity: si(r.capacity)!,
    interpolationAllowed: r.interpolationAllowed === true,
  }));
  const chart =
    geometry.radius === null
      ? { capacity: null, method: '', outside: 'no radius', radiusUsed: null, boomLengthUsed: null }
      : lookupCapacity(
          rows,
          input.crane.type === 'gantry_a_frame' ? null : geometry.boomLength,
          geometry.radius,
        );
  const ctx: Ctx = {
    input,
    policy: pol,
    system,
    gross: parts.gross,
    belowHook: parts.belowHook,
    geometry,
    chart,
    rows,
    wind: null,
  };
  ctx.wind = computeWind(ctx);
  const figures: LiftFigures = {
    grossLoad: parts.gross,
    radius: geometry.radius,
    boomAngleDeg: geometry.boomAngleDeg,
    tipHeight: geometry.tipHeight,
    chartCapacity: chart.capacity,
    percentOfChart:
      chart.capacity !== null && chart.capacity > 0 ? (parts.gross / chart.capacity) * 100 : null,
    overturningMoment: null,
    resistingMoment: null,
    stabilityRatio: null,
    supportReactions: [],
    maxSupportReaction: null,
    groundPressure: null,
    maxSlingTension: null,
    linePull: null,
  };
  const fixes: Fix[] = [];
  const triggers = criticalTriggers(ctx);
  const checks: CheckResult[] = [
    grossLoadCheck(ctx, parts),
    geometryCheck(ctx, geometry),
    capacityCheck(ctx, fixes),
    stabilityCheck(ctx, fixes, figures),
    groundBearingCheck(ctx, figures),
    riggingCheck(ctx, figures),
    reevingCheck(ctx, figures),
    powerLineCheck(ctx),
    windCheck(ctx),
    tandemCheck(ctx),
    personnelCheck(ctx),
    criticalTriggersCheck(ctx, triggers),
  ];
  const discrepancies = compareStated(input, figures, pol, system);
  let overall = worst(checks.map((c) => c.status));
  if (overall === 'not_applicable') overall = 'pass';
  if (overall === 'pass' && discrepancies.some((d) => d.status === 'discrepancy')) overall = 'caution';
  return {
    resultVersion: RESULT_VERSION,
    engineVersion: ENGINE_VERSION,
    units: system,
    overallStatus: overall,
    checks,
    critical: { isCritical: triggers.length > 0, triggers },
    discrepancies,
    fixes: fixes.filter((fx) => Number.isFinite(fx.value) && fx.value >= 0),
    policy: pol,
    figures,
    cautions: [...CAUTIONS],
  };
}

export interface InputIssue {
  path: string;
  message: string;
}

export type CheckLiftOutcome =
  { ok: true; result: LiftResult; input: LiftInput } | { ok: false; issues: InputIssue[] };

function issuesOf(err: { issues: { path: PropertyKey[]; message: string }[] }, prefix = ''): InputIssue[] {
  return err.issues.map((i) => ({
    path: prefix + (i.path.map(String).join('.') || '(root)'),
    message: i.message,
  }));
}

/** Parse unknown data (e.g. a request body) and evaluate it; never throws for bad input. */
export function checkLift(
  raw: unknown,
  policy?: SitePolicyInput | null,
  options: EvaluateOptions = {},
): CheckLiftOutcome {
  const parsed = LiftInput.safeParse(raw);
  const pol = SitePolicy.safeParse(policy ?? {});
  if (!parsed.success || !pol.success) {
    return {
      ok: false,
      issues: [
        ...(parsed.success ? [] : issuesOf(parsed.error)),
        ...(pol.success ? [] : issuesOf(pol.error, 'policy.')),
      ],
    };
  }
  return { ok: true, input: parsed.data, result: evaluateLift(parsed.data, pol.data, options) };
}

/**
 * Moment balance about each tipping line of a mobile crane for a slew angle (for the crane
 * schematic plot and for tests): overturning and resisting moments (N·m) and their ratio per edge.
 * Null for a gantry or when the crane weights or supports are missing.
 */
export function tippingBalance(
  input: LiftInput,
  slewDeg: number,
  policy?: Partial<SitePolicy> | null,
): { edge: string; overturning: number; resisting: number; ratio: number }[] | null {
  const parts = grossLoadParts(input);
  const geometry = computeGeometry(input);
  if (geometry.radius === null) return null;
  const ctx: Ctx = {
    input,
    policy: resolvePolicy(policy),
    system: 'metric',
    gross: parts.gross,
    belowHook: parts.belowHook,
    geometry,
    chart: { capacity: null, method: '', outside: null, radiusUsed: null, boomLengthUsed: null },
    rows: [],
    wind: null,
  };
  ctx.wind = computeWind(ctx);
  const m = planModel(ctx, geometry.radius);
  if (!m) return null;
  return m.edges.map((e, i) => {
    const b = edgeBalance(m, slewDeg, i);
    return { edge: e.label, overturning: b.overturning, resisting: b.resisting, ratio: b.ratio };
  });
}
