// Check 10 — tandem lifts (PRODUCT.md §10): each crane's share of the load from the centre of
// gravity and its use against the tandem limit.
// Two cranes, hoist lines plumb: share_A = W·d_B / (d_A + d_B), d the horizontal distance from the
// centre of gravity to each pick point (load-sharing statics). Three or more cranes: the shares come
// from the plan (entered per crane) and must add up to the load. Each crane's capacity must exceed
// its share plus its own hook weight by the tandem margin: 20% two cranes, 33% three, 50% four or more
// (Queensland Mobile Crane Code of Practice 2006 §14.3.2; site policy may change them).
import type { SitePolicy } from '../../schemas/site-policy';
import { check, f, item, statusMax, term, type Ctx } from '../context';
import { SOURCES } from '../sources';
import { si, siOr } from '../units';
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

export function tandemCheck(ctx: Ctx): CheckResult {
  const t = ctx.input.tandem;
  const na = (message: string) =>
    check('tandem', 'Tandem lift', [
      item(ctx, {
        id: 'tandem.crane-1',
        label: 'Tandem share',
        status: 'not_applicable',
        value: null,
        unit: 'weight',
        source: SOURCES.input,
        message,
      }),
    ]);
  if (!t) return na('Single-crane lift.');
  const n = t.cranes.length;
  const W = ctx.belowHook;
  let shares: number[];
  let shareSource = SOURCES.tandemShare;
  const dists = t.cranes.map((c) => si(c.pickPointDistance));
  const items: CheckItem[] = [];
  if (n === 2 && dists[0] !== undefined && dists[1] !== undefined) {
    shares = twoCraneShares(W, dists[0], dists[1]);
  } else if (t.cranes.every((c) => c.share)) {
    shares = t.cranes.map((c) => si(c.share)!);
    shareSource = { kind: 'input', text: "shares as entered from the lift plan's calculation" };
    const sum = shares.reduce((a, b) => a + b, 0);
    const diff = W > 0 ? Math.abs(sum - W) / W : 0;
    items.push(
      item(ctx, {
        id: 'tandem.shares-sum',
        label: 'Shares add up to the load',
        status: diff * 100 > ctx.policy.discrepancyTolerancePct ? 'fail' : 'pass',
        value: sum,
        limit: W,
        unit: 'weight',
        formula: f`sum of shares ${term(sum, 'weight')} against load below the hooks ${term(W, 'weight')}`,
        source: SOURCES.policy('discrepancy tolerance'),
        message:
          diff * 100 > ctx.policy.discrepancyTolerancePct
            ? 'The shares entered do not add up to the load.'
            : 'Shares add up to the load.',
      }),
    );
  } else {
    return na(
      n === 2
        ? 'Enter each crane pick point distance from the centre of gravity (or each share).'
        : 'Three or more cranes: enter each crane share from the lift plan.',
    );
  }
  const margin = tandemMarginPct(ctx.policy, n);
  t.cranes.forEach((c, i) => {
    const own = siOr(c.ownHookWeight, 0);
    const demand = shares[i] + own;
    const cap = si(c.chartCapacity)!;
    const allowed = cap / (1 + margin / 100);
    const shareFormula =
      shareSource === SOURCES.tandemShare
        ? f`share = W ${term(W, 'weight')} × ${term(dists[1 - i]!, 'length')} ÷ (${term(dists[0]!, 'length')} + ${term(
            dists[1]!,
            'length',
          )}) = ${term(shares[i], 'weight')}`
        : f`share as entered ${term(shares[i], 'weight')}`;
    items.push(
      item(ctx, {
        id: `tandem.crane-${i + 1}`,
        label: `${c.name ?? `Crane ${i + 1}`} share against tandem limit`,
        status: statusMax(demand, allowed, ctx.policy),
        value: demand,
        limit: allowed,
        limitType: 'max',
        unit: 'weight',
        formula: [
          ...shareFormula,
          ...f`; + own hook ${term(own, 'weight')} = ${term(demand, 'weight')}; capacity ${term(cap, 'weight')} ÷ (1 + ${term(
            margin,
            'percent',
          )}) = ${term(allowed, 'weight')}`,
        ],
        source: SOURCES.policy(
          `tandem margin ${margin}% for ${n} cranes (default: ${SOURCES.queenslandTandem.text})`,
        ),
        message:
          demand > allowed
            ? `Capacity does not exceed the share by the ${margin}% tandem margin.`
            : `Capacity exceeds the share by at least the ${margin}% tandem margin.`,
      }),
    );
  });
  return check('tandem', 'Tandem lift', items);
}
