// Check 3 — rated-capacity use: gross load against the chart capacity for the configuration
// (PRODUCT.md §3). Limits: site policy maximum chart use (default 85%, common practice) and
// critical threshold (default 75%, USACE EM 385-1-1 §16.H). Chart read without upward
// interpolation (chart.ts). A failed check gets fixes: the largest radius that restores the
// limit (from the chart rows), and the heaviest gross load allowed at this radius.
import { exceeds } from '../compare';
import { columns, largestRadiusFor } from '../chart';
import { check, f, item, term, type Ctx } from '../context';
import { SOURCES } from '../sources';
import type { CheckItem, CheckResult, Fix } from '../types';
import { formatFormula, formatQuantity } from '../format';

export function capacityCheck(ctx: Ctx, fixes: Fix[]): CheckResult {
  const { policy, chart, gross, geometry } = ctx;
  const items: CheckItem[] = [];
  const maxUse = policy.maxChartUsePct;
  if (geometry.radius === null) {
    items.push(
      item(ctx, {
        id: 'capacity.use',
        label: 'Chart capacity use',
        status: 'not_applicable',
        value: null,
        unit: 'percent',
        source: SOURCES.input,
        message: 'No radius: enter the boom angle or the radius.',
      }),
    );
    return check('capacity', 'Rated-capacity use', items);
  }
  if (chart.capacity === null) {
    items.push(
      item(ctx, {
        id: 'capacity.use',
        label: 'Chart capacity use',
        status: 'fail',
        value: null,
        unit: 'percent',
        formula: f`radius ${term(geometry.radius, 'length')}${
          geometry.boomLength !== null ? ', boom ' : ''
        }${geometry.boomLength !== null ? term(geometry.boomLength, 'length') : ''}: ${chart.outside ?? 'not rated'}`,
        source: SOURCES.manufacturerChart,
        message: `${chart.outside ?? 'The chart does not rate this configuration'}. The lift cannot be checked against the chart; the manufacturer does not rate it.`,
      }),
    );
    return check('capacity', 'Rated-capacity use', items);
  }
  const cap = chart.capacity;
  const pct = cap > 0 ? (gross / cap) * 100 : Infinity;
  const allowed = (cap * maxUse) / 100;
  items.push(
    item(ctx, {
      id: 'capacity.chart',
      label: 'Chart capacity',
      status: 'pass',
      value: cap,
      unit: 'weight',
      formula: f`chart capacity at radius ${term(geometry.radius, 'length')} = ${term(cap, 'weight')} (${chart.method}${
        chart.radiusUsed !== null && Math.abs(chart.radiusUsed - geometry.radius) > 1e-9 ? ', row at ' : ''
      }${chart.radiusUsed !== null && Math.abs(chart.radiusUsed - geometry.radius) > 1e-9 ? term(chart.radiusUsed, 'length') : ''})`,
      source: SOURCES.chartRule,
      message: 'Capacity read from the chart rows entered, never interpolated upward.',
    }),
  );
  // compare.ts: unit conversions must not push an exact 75% or 85% over its limit
  const status =
    !Number.isFinite(pct) || exceeds(pct, maxUse) || exceeds(pct, 100)
      ? 'fail'
      : exceeds(pct, policy.criticalThresholdPct)
        ? 'caution'
        : 'pass';
  items.push(
    item(ctx, {
      id: 'capacity.use',
      label: 'Chart capacity use',
      status,
      value: pct,
      limit: maxUse,
      limitType: 'max',
      unit: 'percent',
      formula: f`use = gross load ${term(gross, 'weight')} ÷ chart capacity ${term(cap, 'weight')} = ${term(
        pct,
        'percent',
      )} (limit ${term(maxUse, 'percent')} = ${term(allowed, 'weight')}; critical above ${term(policy.criticalThresholdPct, 'percent')})`,
      source: SOURCES.policy(
        `maximum chart use ${maxUse}%; critical threshold ${policy.criticalThresholdPct}%`,
      ),
      message:
        status === 'fail'
          ? `Gross load is ${pct.toFixed(1)}% of the chart capacity, above the ${maxUse}% allowed.`
          : status === 'caution'
            ? `Gross load is ${pct.toFixed(1)}% of the chart capacity, above the ${policy.criticalThresholdPct}% critical threshold.`
            : `Gross load is ${pct.toFixed(1)}% of the chart capacity.`,
    }),
  );
  if (status === 'fail') {
    fixes.push({
      checkId: 'capacity',
      kind: 'max_gross_load',
      value: allowed,
      unit: 'weight',
      formula: f`largest gross load = ${term(cap, 'weight')} × ${term(maxUse, 'percent')} = ${term(allowed, 'weight')}`,
      message: `Reduce the gross load to at most ${formatQuantity(allowed, 'weight', ctx.system)} at this radius.`,
      text: '',
    });
    const col = columns(ctx.rows).find(
      (c) => chart.boomLengthUsed !== null && Math.abs(c.boomLength - chart.boomLengthUsed) < 1e-6,
    );
    const r = col ? largestRadiusFor(col.rows, (gross * 100) / maxUse, geometry.radius) : null;
    if (r !== null && r < geometry.radius) {
      fixes.push({
        checkId: 'capacity',
        kind: 'max_radius',
        value: r,
        unit: 'length',
        formula: f`largest radius where gross ${term(gross, 'weight')} ≤ ${term(maxUse, 'percent')} of chart = ${term(r, 'length')}`,
        message: `Work at a radius of ${formatQuantity(r, 'length', ctx.system)} or less (same boom length).`,
        text: '',
      });
    }
  }
  for (const fx of fixes) if (!fx.text) fx.text = `${fx.message} (${formatFormula(fx.formula, ctx.system)})`;
  return check('capacity', 'Rated-capacity use', items, 'capacity.use');
}
