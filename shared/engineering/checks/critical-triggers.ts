// Check 12 — why the lift is critical (PRODUCT.md §12). Triggers from USACE EM 385-1-1 §16.H
// (load over the critical threshold of rated capacity, default 75%; load out of the operator's view;
// more than one crane; non-routine rigging; hoisting personnel; any lift the operator or supervisor
// considers critical), DOE-STD-1090 (consequence: hazardous or irreplaceable load), OSHA 1926.1408(a)
// work zone near power lines (from memory), and site rules (over occupied areas or operating plant,
// gross load at or above a site threshold).
import { exceeds } from '../compare';
import { check, item, type Ctx } from '../context';
import { formatQuantity } from '../format';
import { SOURCES } from '../sources';
import { si, TO_SI } from '../units';
import type { CheckItem, CheckResult, CriticalTrigger } from '../types';

export function criticalTriggers(ctx: Ctx): CriticalTrigger[] {
  const { input, policy, chart, gross } = ctx;
  const out: CriticalTrigger[] = [];
  const s = input.site ?? {};
  if (chart.capacity !== null && chart.capacity > 0) {
    const pct = (gross / chart.capacity) * 100;
    if (exceeds(pct, policy.criticalThresholdPct))
      // a hair over from rounding of unit conversions is not over
      out.push({
        id: 'capacity-threshold',
        reason: `Gross load is ${pct.toFixed(1)}% of the chart capacity, over the ${policy.criticalThresholdPct}% threshold.`,
        source: SOURCES.policy(
          `critical threshold ${policy.criticalThresholdPct}% (default: ${SOURCES.usaceCritical.text})`,
        ),
      });
  }
  const craneCount = input.multiCrane
    ? input.multiCrane.others.length + 1
    : input.tandem
      ? input.tandem.cranes.length
      : 1;
  if (craneCount > 1)
    out.push({
      id: 'tandem',
      reason: `More than one crane (${craneCount}) lifts the load.`,
      source: SOURCES.usaceCritical,
    });
  if (input.personnel)
    out.push({ id: 'personnel', reason: 'Personnel are hoisted.', source: SOURCES.usaceCritical });
  if (s.overOccupiedArea)
    out.push({
      id: 'over-occupied-area',
      reason: 'The load passes over an occupied area.',
      source: SOURCES.policy('lifts over occupied areas are critical'),
    });
  if (s.overOperatingPlant)
    out.push({
      id: 'over-operating-plant',
      reason: 'The load passes over operating plant or equipment.',
      source: SOURCES.policy('lifts over operating plant are critical'),
    });
  const lines = input.environment?.powerLines ?? [];
  for (const l of lines) {
    const kV = si(l.voltage)! / 1000;
    const zone = (kV <= 350 ? 20 : 50) * TO_SI.ft;
    const d = si(l.distance)!;
    if (d < zone) {
      out.push({
        id: 'near-power-lines',
        reason: `Within ${formatQuantity(zone, 'length', ctx.system)} of ${l.name ?? 'a power line'} (${formatQuantity(d, 'length', ctx.system)} entered).`,
        source: SOURCES.oshaNearLines,
      });
      break;
    }
  }
  if (s.loadOutOfOperatorView)
    out.push({
      id: 'load-out-of-view',
      reason: "The load is out of the operator's view.",
      source: SOURCES.usaceCritical,
    });
  if (s.nonRoutineRigging)
    out.push({
      id: 'non-routine-rigging',
      reason: 'The rigging is non-routine.',
      source: SOURCES.usaceCritical,
    });
  if (s.hazardousOrIrreplaceableLoad)
    out.push({
      id: 'consequence',
      reason: 'The load is hazardous or irreplaceable.',
      source: SOURCES.doeCritical,
    });
  if (s.declaredCritical)
    out.push({
      id: 'declared',
      reason: 'The operator or supervisor considers the lift critical.',
      source: SOURCES.usaceCritical,
    });
  if (policy.criticalGrossLoadN !== null && gross >= policy.criticalGrossLoadN)
    out.push({
      id: 'site-gross-load',
      reason: `Gross load ${formatQuantity(gross, 'weight', ctx.system)} is at or above the site's ${formatQuantity(policy.criticalGrossLoadN, 'weight', ctx.system)}.`,
      source: SOURCES.policy('gross load threshold for critical lifts'),
    });
  return out;
}

export function criticalTriggersCheck(ctx: Ctx, triggers: CriticalTrigger[]): CheckResult {
  const items: CheckItem[] = triggers.length
    ? triggers.map((t) =>
        item(ctx, {
          id: `critical-triggers.${t.id}`,
          label: 'Critical-lift trigger',
          status: 'caution',
          value: 1,
          unit: 'count',
          formula: [t.reason],
          source: t.source,
          message: `${t.reason} A critical lift needs a written plan and review.`,
        }),
      )
    : [
        item(ctx, {
          id: 'critical-triggers.none',
          label: 'Critical-lift triggers',
          status: 'pass',
          value: 0,
          unit: 'count',
          formula: ['no trigger applies'],
          source: SOURCES.usaceCritical,
          message: 'No critical-lift trigger applies to the data entered.',
        }),
      ];
  const c = check('critical-triggers', 'Why the lift is critical', items);
  c.value = triggers.length;
  c.unit = 'count';
  return c;
}
