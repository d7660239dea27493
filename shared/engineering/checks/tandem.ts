// Check 10 — several cranes (PRODUCT.md §10): how each crane's share was found, the stated shares'
// balance, each crane's gross load against its chart capacity less the multi-crane margin, and the
// shares if the centre of gravity is off by a fraction of the pick spacing. Shares: multi-crane.ts.
// Margin: each crane's capacity must exceed its calculated share by 20% (two cranes), 33% (three),
// 50% (four or more) — Queensland Mobile Crane Code of Practice 2006 §14.3.2 (read); site policy.
// The share compared is everything that crane carries (its share, own rigging, block, load line).
import type { SitePolicy } from '../../schemas/site-policy';
import { check, f, item, statusMax, term, type Ctx } from '../context';
import { exceeds } from '../compare';
import { SHARE_BALANCE_TOLERANCE, type SharePlan } from '../multi-crane';
import { SOURCES } from '../sources';
import type { CheckItem, CheckResult } from '../types';

export function twoCraneShares(W: number, dA: number, dB: number): [number, number] {
  const s = dA + dB;
  if (s <= 0) return [W / 2, W / 2];
  return [(W * dB) / s, (W * dA) / s];
}

export function tandemMarginPct(policy: SitePolicy, cranes: number): number {
  const m = policy.tandemMarginPct;
  return cranes <= 2 ? m.twoCranes : cranes === 3 ? m.threeCranes : m.fourOrMore;
}

export function singleCraneTandem(ctx: Ctx): CheckResult {
  return check('tandem', 'Several cranes', [
    item(ctx, {
      id: 'tandem.shares',
      label: 'Several cranes',
      status: 'not_applicable',
      value: null,
      unit: 'weight',
      source: SOURCES.input,
      message: 'Single-crane lift.',
    }),
  ]);
}

export interface CraneDemand {
  name: string;
  /** gross load on this crane's hook (N): its share plus its own rigging, block and allowances */
  gross: number | null;
  /** gross load less the share: what the crane carries besides its share of the load */
  own: number;
  capacity: number | null;
}

export function multiCraneCheck(ctx: Ctx, plan: SharePlan, cranes: CraneDemand[]): CheckResult {
  const n = cranes.length;
  const items: CheckItem[] = [];
  const pol = ctx.policy;
  const margin = tandemMarginPct(pol, n);
  const marginSource = SOURCES.policy(
    `multi-crane margin ${margin}% for ${n} cranes (default: ${SOURCES.queenslandTandem.text})`,
  );
  const W = plan.W;
  const sh = plan.shares;
  if (plan.method === 'none' || !sh) {
    items.push(
      item(ctx, {
        id: 'tandem.shares',
        label: 'Shares of the load',
        status: 'fail',
        value: null,
        unit: 'weight',
        source: SOURCES.tandemShare,
        message: `${plan.reason ?? 'The shares could not be found.'} Each crane is checked for the whole load until then.`,
      }),
    );
  } else {
    const list = sh.map((s, i) => f`${cranes[i].name} ${term(s, 'weight')}`);
    const joined = list.flatMap((p, i) => (i ? ['; ', ...p] : p));
    const negative = sh.findIndex((s) => s < -1e-9 * W);
    const how =
      plan.method === 'two'
        ? 'two cranes: centre of gravity projected on the line between the picks, share A = W · d_B / (d_A + d_B)'
        : plan.method === 'three'
          ? 'three picks not in a line: ΣV = W and the moments about both plan axes'
          : 'shares as stated in the lift plan';
    items.push(
      item(ctx, {
        id: 'tandem.shares',
        label: 'Shares of the load',
        status: negative >= 0 ? 'fail' : 'pass',
        value: W,
        unit: 'weight',
        formula: [...f`load ${term(W, 'weight')}, ${how}: `, ...joined],
        source:
          plan.method === 'stated'
            ? { kind: 'input', text: 'shares as stated in the lift plan' }
            : SOURCES.tandemShare,
        message:
          negative >= 0
            ? `The centre of gravity is outside the pick points: ${cranes[negative].name} would have to push the load up. Move the picks so the centre of gravity lies between them.`
            : 'Each crane’s share of the load from statics, hoist lines plumb.',
      }),
    );
    if (plan.balance) {
      const b = plan.balance;
      items.push(
        item(ctx, {
          id: 'tandem.balance',
          label: 'Stated shares against force and moment balance',
          status: b.ok ? 'pass' : 'fail',
          value: Math.abs(b.force),
          limit: SHARE_BALANCE_TOLERANCE * W,
          limitType: 'max',
          unit: 'weight',
          formula:
            b.moment === null
              ? f`Σ shares − load = ${term(b.force, 'weight')}; no pick points entered, moment balance not checked`
              : f`Σ shares − load = ${term(b.force, 'weight')}; Σ share × arm about the centre of gravity = ${term(
                  b.moment,
                  'moment',
                )} (limit ${term(SHARE_BALANCE_TOLERANCE * W * plan.spacing, 'moment')})`,
          source: {
            kind: 'common_practice',
            text: 'Statics: ΣV = W and ΣM = 0 within 1% (common practice, no source)',
          },
          message: b.ok
            ? b.moment === null
              ? 'The stated shares add up to the load; enter the pick points to check their moments too.'
              : 'The stated shares balance the load in force and moment.'
            : 'Refused: the stated shares do not balance the load (force or moment about its centre of gravity). Recompute them.',
        }),
      );
    }
  }
  cranes.forEach((c, i) => {
    const id = `tandem.crane-${i + 1}`;
    if (c.gross === null || c.capacity === null) {
      items.push(
        item(ctx, {
          id,
          label: `${c.name}: multi-crane margin`,
          status: 'fail',
          value: c.gross,
          unit: 'weight',
          source: marginSource,
          message: 'No chart capacity for this crane at its radius: the margin cannot be shown.',
        }),
      );
      return;
    }
    const allowed = c.capacity / (1 + margin / 100);
    items.push(
      item(ctx, {
        id,
        label: `${c.name}: multi-crane margin`,
        status: statusMax(c.gross, allowed, pol),
        value: c.gross,
        limit: allowed,
        limitType: 'max',
        unit: 'weight',
        formula: f`gross load on the hook ${term(c.gross, 'weight')} against capacity ${term(c.capacity, 'weight')} ÷ (1 + ${term(
          margin,
          'percent',
        )}) = ${term(allowed, 'weight')}`,
        source: marginSource,
        message: exceeds(c.gross, allowed)
          ? `Capacity does not exceed this crane's share by the ${margin}% multi-crane margin.`
          : `Capacity exceeds this crane's share by at least the ${margin}% multi-crane margin.`,
      }),
    );
    const sens = plan.sensitivity;
    if (sens && sh) {
      const worst = sens.max[i] + c.own;
      items.push(
        item(ctx, {
          id: `tandem.sensitivity-${i + 1}`,
          label: `${c.name}: share if the centre of gravity is off`,
          status: exceeds(worst, allowed) ? 'caution' : 'pass',
          value: sens.max[i],
          unit: 'weight',
          formula: f`centre of gravity moved ${term(sens.offset, 'length')} (${term(
            (sens.offset / Math.max(plan.spacing, 1e-12)) * 100,
            'percent',
          )} of the pick spacing ${term(plan.spacing, 'length')}) each way: share from ${term(sens.min[i], 'weight')} to ${term(
            sens.max[i],
            'weight',
          )}; gross up to ${term(worst, 'weight')} against ${term(allowed, 'weight')}`,
          source: {
            kind: 'common_practice',
            text: 'Sensitivity to the centre of gravity: 5% of the pick spacing by default (common practice, no source)',
          },
          message: exceeds(worst, allowed)
            ? 'If the centre of gravity is off by the sensitivity offset, this crane loses its multi-crane margin: confirm the centre of gravity.'
            : 'The multi-crane margin holds with the centre of gravity off by the sensitivity offset.',
        }),
      );
    }
  });
  return check('tandem', 'Several cranes', items);
}
