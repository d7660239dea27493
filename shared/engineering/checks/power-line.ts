// Check 8 — power-line clearance (PRODUCT.md §8): the closest approach entered for each line
// against the minimum clearance for its voltage, OSHA 29 CFR 1926.1408 Table A:
// up to 50 kV 10 ft; over 50 to 200 kV 15 ft; over 200 to 350 kV 20 ft; over 350 to 500 kV 25 ft;
// over 500 to 750 kV 35 ft; over 750 to 1,000 kV 45 ft; over 1,000 kV set by the utility or a
// registered professional engineer. "To" includes the upper value (200 kV → 15 ft).
import { fallsShort } from '../compare';
import { check, f, item, statusMin, term, type Ctx } from '../context';
import { SOURCES } from '../sources';
import { si, TO_SI } from '../units';
import type { CheckItem, CheckResult } from '../types';

const TABLE_A: readonly (readonly [number, number])[] = [
  [50, 10],
  [200, 15],
  [350, 20],
  [500, 25],
  [750, 35],
  [1000, 45],
];

/** Minimum clearance in feet for a nominal voltage in kV; null over 1,000 kV (utility or PE decides). */
export function minimumClearanceFt(kV: number): number | null {
  for (const [upTo, ft] of TABLE_A) if (kV <= upTo) return ft;
  return null;
}

export function powerLineCheck(ctx: Ctx): CheckResult {
  const lines = ctx.input.environment?.powerLines;
  if (!lines || lines.length === 0)
    return check('power-line', 'Power-line clearance', [
      item(ctx, {
        id: 'power-line.clearance-1',
        label: 'Power-line clearance',
        status: 'not_applicable',
        value: null,
        unit: 'length',
        source: SOURCES.input,
        message: 'No power lines entered.',
      }),
    ]);
  const items: CheckItem[] = lines.map((l, i) => {
    const volts = si(l.voltage)!;
    const kV = volts / 1000;
    const dist = si(l.distance)!;
    const ft = minimumClearanceFt(kV);
    const label = `Clearance to ${l.name ?? `line ${i + 1}`}`;
    if (ft === null)
      return item(ctx, {
        id: `power-line.clearance-${i + 1}`,
        label,
        status: 'fail',
        value: dist,
        unit: 'length',
        formula: f`${term(volts, 'voltage')} is over 1,000 kV: minimum clearance set by the utility or a registered professional engineer`,
        source: SOURCES.oshaTableA,
        message:
          'Over 1,000 kV: the clearance must be set by the utility/owner or a registered professional engineer; enter it as a site rule.',
      });
    const lim = ft * TO_SI.ft;
    return item(ctx, {
      id: `power-line.clearance-${i + 1}`,
      label,
      status: statusMin(dist, lim, ctx.policy),
      value: dist,
      limit: lim,
      limitType: 'min',
      unit: 'length',
      formula: f`closest approach ${term(dist, 'length')} against the Table A clearance ${term(lim, 'length')} for ${term(volts, 'voltage')}`,
      source: SOURCES.oshaTableA,
      message: fallsShort(dist, lim)
        ? 'Closer than the minimum clearance for this voltage.'
        : 'Clearance against OSHA Table A.',
    });
  });
  return check('power-line', 'Power-line clearance', items);
}
