// Shared plumbing for the checks: the evaluation context (parsed input, policy, figures computed
// once and reused), formula building, item construction and the status rules.
//
// Status rules (documented for reviewers):
// - fail: the value breaks its limit (above a maximum, below a minimum).
// - caution: the value is within the policy's caution margin (default 10%) of its limit, or a
//   check-specific band applies (capacity use between the critical threshold and the maximum).
// - pass: otherwise.  not_applicable: the data the check needs is absent (the message says what).
import type { LiftInput } from '../schemas/lift-input';
import type { SitePolicy } from '../schemas/site-policy';
import type { ChartLookup, ChartRowSI } from './chart';
import { atLeast, atMost } from './compare';
import { formatFormula } from './format';
import type {
  CheckId,
  CheckItem,
  CheckResult,
  CheckStatus,
  FormulaPart,
  Source,
  UnitKind,
  UnitSystem,
} from './types';

export interface Geometry {
  radius: number | null;
  boomAngleDeg: number | null;
  tipHeight: number | null;
  /** horizontal distance from centre of rotation (or gantry leg feet) to the boom tip */
  boomLength: number | null;
  pivotOffset: number;
  pivotHeight: number;
  /** radius could not be reached with the boom entered */
  unreachable: boolean;
}

export interface Ctx {
  input: LiftInput;
  policy: SitePolicy;
  system: UnitSystem;
  gross: number;
  /** the weight hanging below the hook: load + rigging items + slings + hardware */
  belowHook: number;
  geometry: Geometry;
  chart: ChartLookup;
  /** chart rows in SI */
  rows: ChartRowSI[];
  /** wind force on the load and boom (N) and their heights (m), filled by the wind module */
  wind: { loadForce: number; boomForce: number; loadHeight: number; boomHeight: number } | null;
}

export const term = (v: number, k: UnitKind) => ({ v, k });

/** Tagged template building a formula: f`${term(W,'weight')} × ${term(r,'length')}` */
export function f(strings: TemplateStringsArray, ...vals: (FormulaPart | number)[]): FormulaPart[] {
  const out: FormulaPart[] = [];
  for (let i = 0; i < strings.length; i++) {
    if (strings[i]) out.push(strings[i]);
    if (i < vals.length) {
      const v = vals[i];
      out.push(typeof v === 'number' ? String(v) : v);
    }
  }
  return out;
}

export interface ItemSpec {
  id: string;
  label: string;
  status: CheckStatus;
  value: number | null;
  limit?: number | null;
  limitType?: 'max' | 'min' | null;
  unit: UnitKind;
  formula?: FormulaPart[];
  source: Source;
  message: string;
}

export function item(ctx: Ctx, s: ItemSpec): CheckItem {
  const formula = s.formula ?? [];
  // Results are stored as JSON: an unbounded term (e.g. no overturning moment) is written as words.
  for (let i = 0; i < formula.length; i++) {
    const p = formula[i];
    if (typeof p !== 'string' && !Number.isFinite(p.v))
      formula[i] = Number.isNaN(p.v) ? '—' : p.v > 0 ? '∞' : '−∞';
  }
  const finite = s.value != null && Number.isFinite(s.value);
  // A value that could not be computed never passes: the reader is told to look at it.
  const unknownPass = s.status === 'pass' && !finite && s.value !== null;
  return {
    id: s.id,
    label: s.label,
    status: unknownPass ? 'caution' : s.status,
    value: finite ? s.value : null,
    limit: s.limit != null && Number.isFinite(s.limit) ? s.limit : null,
    limitType: s.limitType ?? null,
    unit: s.unit,
    formula,
    formulaText: formatFormula(formula, ctx.system),
    source: s.source,
    message: unknownPass
      ? `${s.message} The value could not be computed from the figures entered.`
      : s.message,
  };
}

const RANK: Record<CheckStatus, number> = { not_applicable: 0, pass: 1, caution: 2, fail: 3 };

export function worst(statuses: Iterable<CheckStatus>): CheckStatus {
  let w: CheckStatus = 'not_applicable';
  for (const s of statuses) if (RANK[s] > RANK[w]) w = s;
  return w;
}

/** Build a check from its items; the headline repeats the governing (worst, first) item. */
export function check(id: CheckId, label: string, items: CheckItem[], headlineId?: string): CheckResult {
  let head: CheckItem | undefined = headlineId ? items.find((i) => i.id === headlineId) : undefined;
  if (!head) {
    for (const it of items) if (!head || RANK[it.status] > RANK[head.status]) head = it;
  }
  const status = worst(items.map((i) => i.status));
  const h = head!;
  return {
    id,
    label,
    status,
    value: h.value,
    limit: h.limit,
    limitType: h.limitType,
    unit: h.unit,
    formula: h.formula,
    formulaText: h.formulaText,
    source: h.source,
    message: h.message,
    items,
  };
}

export function notApplicable(ctx: Ctx, id: CheckId, label: string, reason: string): CheckResult {
  return check(id, label, [
    item(ctx, {
      id,
      label,
      status: 'not_applicable',
      value: null,
      unit: 'count',
      source: { kind: 'input', text: 'no data entered' },
      message: reason,
    }),
  ]);
}

/**
 * value must not exceed limit; caution within the margin below it. Every comparison goes through
 * compare.ts (SI, relative tolerance REL_TOL), so a value at a limit gives one verdict in any unit.
 * A missing or non-finite value never passes.
 */
export function statusMax(value: number, limit: number, policy: SitePolicy): CheckStatus {
  if (!Number.isFinite(value) || !atMost(value, limit)) return 'fail';
  if (!atMost(value, limit * (1 - policy.cautionMarginPct / 100))) return 'caution';
  return 'pass';
}

/** value must reach limit; caution within the margin above it. A missing or NaN value fails. */
export function statusMin(value: number, limit: number, policy: SitePolicy): CheckStatus {
  if (Number.isNaN(value) || !atLeast(value, limit)) return 'fail';
  if (!atLeast(value, limit * (1 + policy.cautionMarginPct / 100))) return 'caution';
  return 'pass';
}
