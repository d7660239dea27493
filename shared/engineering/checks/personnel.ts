// Check 11 — personnel lifts (PRODUCT.md §11): platform, rigging, occupants, tools and everything
// else on the hook (block, load-line allowance, chart deductions) against the
// personnel limit of the rated capacity at the radius and configuration (site policy, default 50%:
// OSHA 29 CFR 1926.1431), and occupants plus tools against the platform's own rating.
import { exceeds } from '../compare';
import { check, f, item, statusMax, term, type Ctx } from '../context';
import { SOURCES } from '../sources';
import { si, siOr } from '../units';
import type { CheckItem, CheckResult } from '../types';

export function personnelCheck(ctx: Ctx): CheckResult {
  const p = ctx.input.personnel;
  if (!p)
    return check('personnel', 'Personnel lift', [
      item(ctx, {
        id: 'personnel.load',
        label: 'Personnel platform load',
        status: 'not_applicable',
        value: null,
        unit: 'weight',
        source: SOURCES.input,
        message: 'Not a personnel lift.',
      }),
    ]);
  const platform = si(p.platformWeight)!;
  const rig = siOr(p.riggingWeight, 0);
  const occ = (p.occupants ?? 0) * siOr(p.occupantWeight, 0);
  const tools = siOr(p.toolsWeight, 0);
  // Everything on the hook counts, as in the capacity check (ASME B30.5: block, hook and rigging are
  // part of the load): the hook block, load-line allowance and listed chart deductions as well.
  const block = siOr(ctx.input.hookBlock?.weight, 0);
  const line = siOr(ctx.input.loadLineAllowance, 0);
  let deductions = 0;
  for (const d of ctx.input.chartDeductions ?? []) deductions += si(d.weight)!;
  const onHook = block + line + deductions;
  const total = platform + rig + occ + tools + onHook;
  const items: CheckItem[] = [];
  const cap = ctx.chart.capacity;
  const pct = ctx.policy.personnelLimitPct;
  if (cap === null) {
    items.push(
      item(ctx, {
        id: 'personnel.load',
        label: 'Personnel platform load',
        status: 'fail',
        value: total,
        unit: 'weight',
        source: SOURCES.oshaPersonnel,
        message: 'No rated capacity at this radius and configuration: personnel cannot be lifted.',
      }),
    );
  } else {
    const limit = (cap * pct) / 100;
    items.push(
      item(ctx, {
        id: 'personnel.load',
        label: 'Personnel platform load',
        status: statusMax(total, limit, ctx.policy),
        value: total,
        limit,
        limitType: 'max',
        unit: 'weight',
        formula: f`platform ${term(platform, 'weight')} + rigging ${term(rig, 'weight')} + occupants ${term(occ, 'weight')} + tools ${term(
          tools,
          'weight',
        )} + hook block, load line and chart deductions ${term(onHook, 'weight')} = ${term(total, 'weight')} against ${term(pct, 'percent')} of ${term(cap, 'weight')} = ${term(limit, 'weight')}`,
        source: SOURCES.policy(`personnel limit ${pct}% (default: ${SOURCES.oshaPersonnel.text})`),
        message: exceeds(total, limit)
          ? `Platform load is over ${pct}% of the rated capacity.`
          : `Platform load within ${pct}% of the rated capacity.`,
      }),
    );
  }
  const rated = si(p.platformRatedLoad);
  if (rated !== undefined) {
    items.push(
      item(ctx, {
        id: 'personnel.platform-rating',
        label: 'Occupants and tools against platform rating',
        status: statusMax(occ + tools, rated, ctx.policy),
        value: occ + tools,
        limit: rated,
        limitType: 'max',
        unit: 'weight',
        formula: f`occupants ${term(occ, 'weight')} + tools ${term(tools, 'weight')} against platform rating ${term(rated, 'weight')}`,
        source: { kind: 'input', text: "platform manufacturer's rated load (entered)" },
        message: exceeds(occ + tools, rated) ? 'The platform is overloaded.' : 'Within the platform rating.',
      }),
    );
  }
  return check('personnel', 'Personnel lift', items, 'personnel.load');
}
