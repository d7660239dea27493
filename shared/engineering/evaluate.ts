// The independent check: evaluateLift runs checks 1–12 of PRODUCT.md on a parsed LiftInput (upgraded
// to the current schema version first; with several cranes, every single-crane check per crane for
// its share, see multi-crane.ts) and
// returns a LiftResult (versioned, with the policy used copied in). checkLift parses unknown JSON
// first and returns the zod issues (path and message) instead of throwing.
import { LiftInput } from '../schemas/lift-input';
import { DEFAULT_POLICY, SitePolicy } from '../schemas/site-policy';
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
import { multiCraneCheck, singleCraneTandem, tandemMarginPct, type CraneDemand } from './checks/tandem';
import { sharePlan } from './multi-crane';
import { upgradeLiftInput } from './upgrade';
import { check } from './context';
import { computeWind, windCheck } from './checks/wind';
import { compareStated } from './discrepancies';
import { si } from './units';
import { edgeBalance, planModel } from './crane-model';
import type {
  CheckResult,
  CraneResult,
  Discrepancy,
  Fix,
  LiftFigures,
  LiftResult,
  UnitSystem,
} from './types';

export const RESULT_VERSION = 2 as const;
export const ENGINE_VERSION = '2.2.1';

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

/** Every single-crane check of one crane; `multi` set when it is one of several cranes. */
function evaluateOne(input: LiftInput, pol: SitePolicy, system: UnitSystem, multi: boolean): LiftResult {
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
    groundBearingCheck(ctx, figures, fixes),
    riggingCheck(ctx, figures),
    reevingCheck(ctx, figures),
    powerLineCheck(ctx),
    windCheck(ctx),
    singleCraneTandem(ctx),
    personnelCheck(ctx),
    criticalTriggersCheck(ctx, triggers),
  ];
  if (multi)
    checks.splice(
      checks.findIndex((c) => c.id === 'tandem'),
      1,
    );
  const discrepancies = compareStated(input, figures, pol, system);
  return {
    resultVersion: RESULT_VERSION,
    engineVersion: ENGINE_VERSION,
    units: system,
    overallStatus: overallOf(checks, discrepancies),
    checks,
    critical: { isCritical: triggers.length > 0, triggers },
    discrepancies,
    fixes: fixes.filter((fx) => Number.isFinite(fx.value) && fx.value >= 0),
    policy: pol,
    figures,
    cautions: [...CAUTIONS],
  };
}

function overallOf(checks: CheckResult[], discrepancies: Discrepancy[]): LiftResult['overallStatus'] {
  let overall = worst(checks.map((c) => c.status));
  if (overall === 'not_applicable') overall = 'pass';
  if (overall === 'pass' && discrepancies.some((d) => d.status === 'discrepancy')) overall = 'caution';
  return overall;
}

/** Checks repeated for every crane of a lift with several cranes; the rest are the lift's own. */
const PER_CRANE: ReadonlySet<CheckResult['id']> = new Set([
  'gross-load',
  'geometry',
  'capacity',
  'stability',
  'ground-bearing',
  'rigging',
  'reeving',
]);

type Multi = NonNullable<LiftInput['multiCrane']>;

/** The lower of the chart's capacity and a capacity the plan states (either may be absent). */
const lowerOf = (chart: number | null, stated: number | undefined) =>
  chart === null ? (stated ?? null) : stated === undefined ? chart : Math.min(chart, stated);
type Other = Multi['others'][number];

/** The single-crane input of crane k (0 = lead) carrying `share` of the load. */
function craneInput(input: LiftInput, k: number, share: number): LiftInput {
  const W = si(input.load.weight)!;
  const frac = W > 0 ? share / W : 0;
  const area = input.load.windArea;
  const load = {
    ...input.load,
    weight: { value: share, unit: 'N' as const },
    windArea: area ? { value: area.value * frac, unit: area.unit } : undefined,
  };
  if (k === 0) return { ...input, load };
  const o = input.multiCrane!.others[k - 1];
  return {
    ...input,
    crane: o.crane ?? input.crane,
    chart: o.chart ?? input.chart,
    rigging: o.rigging,
    hookBlock: o.hookBlock,
    loadLineAllowance: o.loadLineAllowance,
    chartDeductions: o.chartDeductions,
    reeving: o.reeving,
    ground: o.ground,
    personnel: undefined,
    stated: undefined,
    load,
  };
}

function craneName(input: LiftInput, k: number): string {
  const mc = input.multiCrane!;
  if (k === 0) return mc.lead.name ?? input.crane.name ?? 'Crane 1';
  const o: Other = mc.others[k - 1];
  return o.name ?? o.crane?.name ?? `Crane ${k + 1}`;
}

function prefixed(c: CheckResult, k: number, name: string): CheckResult['items'] {
  return c.items.map((it) => ({
    ...it,
    id: k === 0 ? it.id : `crane-${k + 1}.${it.id}`,
    label: `${name}: ${it.label}`,
  }));
}

function evaluateMulti(input: LiftInput, pol: SitePolicy, system: UnitSystem): LiftResult {
  const mc = input.multiCrane!;
  const plan = sharePlan(input);
  const n = mc.others.length + 1;
  const W = plan.W;
  const shareOf = (k: number) => (plan.shares ? Math.max(0, plan.shares[k]) : W);
  const names = Array.from({ length: n }, (_, k) => craneName(input, k));
  const results: (LiftResult | null)[] = [];
  const demands: CraneDemand[] = [];
  for (let k = 0; k < n; k++) {
    const ci = craneInput(input, k, shareOf(k));
    const configured = k === 0 || !!mc.others[k - 1].crane;
    if (configured) {
      const r = evaluateOne(ci, pol, system, true);
      results.push(r);
      demands.push({
        name: names[k],
        gross: r.figures.grossLoad,
        own: r.figures.grossLoad - shareOf(k),
        capacity: lowerOf(
          r.figures.chartCapacity,
          si(k === 0 ? mc.lead.chartCapacity : mc.others[k - 1].chartCapacity),
        ),
      });
    } else {
      // version 1 form: only its chart capacity and own hook block are known
      const g = grossLoadParts(ci).gross;
      results.push(null);
      demands.push({
        name: names[k],
        gross: g,
        own: g - shareOf(k),
        capacity: si(mc.others[k - 1].chartCapacity) ?? null,
      });
    }
  }
  const lead = results[0]!;
  const ctx = { system, policy: pol } as Ctx;
  const tandem = multiCraneCheck(ctx, plan, demands);
  const checks: CheckResult[] = [];
  for (const c of lead.checks) {
    if (c.id === 'personnel') checks.push(tandem);
    if (!PER_CRANE.has(c.id)) {
      checks.push(c);
      continue;
    }
    const items = prefixed(c, 0, names[0]);
    results.forEach((r, k) => {
      if (k === 0) return;
      if (!r) {
        items.push({
          ...c.items[0],
          id: `crane-${k + 1}.${c.items[0].id}`,
          label: `${names[k]}: ${c.label}`,
          status: 'not_applicable',
          value: null,
          limit: null,
          limitType: null,
          formula: [],
          formulaText: '',
          source: { kind: 'input', text: 'no data entered' },
          message: 'Enter this crane’s configuration and chart rows to check it for its share.',
        });
        return;
      }
      const rc = r.checks.find((x) => x.id === c.id);
      if (rc) items.push(...prefixed(rc, k, names[k]));
    });
    const merged = check(c.id, c.label, items);
    checks.push(merged);
  }
  const cranes: CraneResult[] = names.map((name, k) => {
    const r = results[k];
    const p = plan.picks[k];
    return {
      index: k + 1,
      name,
      share: plan.shares ? plan.shares[k] : null,
      grossLoad: demands[k].gross,
      chartCapacity: demands[k].capacity,
      pickPoint: p ? { x: p[0], y: p[1] } : null,
      shareRange: plan.sensitivity ? { min: plan.sensitivity.min[k], max: plan.sensitivity.max[k] } : null,
      overallStatus: r
        ? overallOf(
            [
              ...r.checks,
              {
                ...tandem,
                status: worst(tandem.items.filter((i) => i.id.endsWith(`-${k + 1}`)).map((i) => i.status)),
              },
            ],
            r.discrepancies,
          )
        : worst(tandem.items.filter((i) => i.id.endsWith(`-${k + 1}`)).map((i) => i.status)) === 'fail'
          ? 'fail'
          : 'caution',
      checks: r ? r.checks : [],
      figures: r ? r.figures : null,
    };
  });
  const fixes: Fix[] = [];
  results.forEach((r, k) => {
    if (r)
      for (const fx of r.fixes)
        fixes.push(
          k === 0 ? fx : { ...fx, message: `${names[k]}: ${fx.message}`, text: `${names[k]}: ${fx.text}` },
        );
  });
  return {
    ...lead,
    overallStatus: overallOf(checks, lead.discrepancies),
    checks,
    fixes,
    cranes,
    multiCrane: {
      method: plan.method,
      loadWeight: W,
      cg: { x: plan.cg[0], y: plan.cg[1] },
      spacing: plan.spacing,
      sensitivityOffset: plan.sensitivity?.offset ?? null,
      marginPct: tandemMarginPct(pol, n),
    },
  };
}

export function evaluateLift(
  input: LiftInput,
  policy?: Partial<SitePolicy> | null,
  options: EvaluateOptions = {},
): LiftResult {
  const pol = resolvePolicy(policy);
  const system: UnitSystem = options.units ?? 'metric';
  const current = upgradeLiftInput(input);
  return current.multiCrane ? evaluateMulti(current, pol, system) : evaluateOne(current, pol, system, false);
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
  /** parsed here like the input: a file's or a request's policy arrives unchecked */
  policy?: unknown,
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
