// Ground bearing under crawler tracks (check 5): each track is an eccentric footing:
//   p_max = V_t/(b·L)·(1 + 6e/L) when e ≤ L/6, 2·V_t/(3·b·(L/2 − e)) when e > L/6 (triangular).
// Crawler tracks on mats (mat length across the track, mats per support laid along it covering the
// length in contact): the track pressure × shoe width ÷ mat length (rigid mats; common practice, no
// source). The wind blows from its least favourable direction for the peak (worstWind).
import { atLeast, exceeds } from '../compare';
import { resultant, SLEW_SWEEP, windDirections, type PlanModel } from '../crane-model';
import { f, item, statusMax, term, type Ctx } from '../context';
import { allowable } from './ground-bearing-pressure';
import { NO_WIND, withWind, worstWind } from './ground-bearing-wind';
import { SOURCES } from '../sources';
import { si } from '../units';
import type { CheckItem, Fix, LiftFigures } from '../types';
import { formatQuantity } from '../format';
import { trackMatFix } from './track-mat-fix';

/** Peak bearing pressure under a track carrying Vt with eccentricity e along its length L, width w. */
export function trackPeakPressure(
  Vt: number,
  e: number,
  L: number,
  w: number,
): {
  p: number;
  shape: 'uniform' | 'trapezoidal' | 'triangular' | 'tipping';
  /** pressure at the light end of the track */
  pMin: number;
  /** length of track in contact with the ground */
  contact: number;
} {
  const ae = Math.abs(e);
  if (ae === 0) return { p: Vt / (w * L), shape: 'uniform', pMin: Vt / (w * L), contact: L };
  if (ae <= L / 6)
    return {
      p: (Vt / (w * L)) * (1 + (6 * ae) / L),
      shape: 'trapezoidal',
      pMin: (Vt / (w * L)) * (1 - (6 * ae) / L),
      contact: L,
    };
  if (ae < L / 2)
    return { p: (2 * Vt) / (3 * w * (L / 2 - ae)), shape: 'triangular', pMin: 0, contact: 3 * (L / 2 - ae) };
  return { p: Infinity, shape: 'tipping', pMin: 0, contact: 0 };
}

export function crawler(ctx: Ctx, m: PlanModel, items: CheckItem[], figures: LiftFigures, fixes?: Fix[]) {
  const tr = ctx.input.crane.tracks!;
  const L = si(tr.length)!;
  const w = si(tr.shoeWidth)!;
  const entered = ctx.input.crane.slewAngle;
  const slews = entered ? [entered.value] : SLEW_SWEEP;
  type Case = { p: number; Vt: number; e: number; shape: string; pMin: number; contact: number };
  /** The more loaded track's case for a resultant. */
  const peak = (r: { V: number; ex: number; ey: number }): Case => {
    const e = r.ex - m.x0;
    let out: Case | null = null;
    for (const Vt of [(r.V * (m.b + r.ey)) / (2 * m.b), (r.V * (m.b - r.ey)) / (2 * m.b)]) {
      const tp = Vt > r.V ? trackPeakPressure(r.V, e, L, w) : trackPeakPressure(Math.max(Vt, 0), e, L, w);
      if (!out || tp.p > out.p * (1 + 1e-9))
        out = {
          p: tp.p,
          Vt: Math.min(Math.max(Vt, 0), r.V),
          e,
          shape: tp.shape,
          pMin: tp.pMin,
          contact: tp.contact,
        };
    }
    return out!;
  };
  let worst: Case & { slew: number } = {
    p: -Infinity,
    Vt: 0,
    e: 0,
    slew: 0,
    shape: 'uniform',
    pMin: 0,
    contact: 0,
  };
  // Each slew with the wind from the seed directions first; then the full search of the wind's
  // direction, only for the slews whose bound (the largest track load and eccentricity any wind
  // could give, together) could still beat the worst case found.
  const M = m.windMoment;
  const trials = slews.map((t) => {
    const calm = resultant(m, t, NO_WIND);
    const seeds = M > 0 ? windDirections(m.a, m.b, calm.ex - m.x0, calm.ey) : [];
    let c = peak(calm);
    for (const dir of seeds) {
      const k = peak(withWind(calm, M, dir));
      if (k.p > c.p * (1 + 1e-9)) c = k;
    }
    const shift = calm.V > 0 ? M / calm.V : 0;
    const Vmax = Math.min(calm.V, (calm.V * (m.b + Math.abs(calm.ey) + shift)) / (2 * m.b));
    const bound = M > 0 ? trackPeakPressure(Vmax, Math.abs(calm.ex - m.x0) + shift, L, w).p : c.p;
    return { t, calm, seeds, c, bound };
  });
  for (const k of trials)
    if (k.c.p > worst.p * (1 + 1e-9) || worst.p === -Infinity) worst = { ...k.c, slew: k.t };
  if (M > 0)
    for (const k of [...trials].sort((x, y) => (y.bound > x.bound ? 1 : y.bound < x.bound ? -1 : 0))) {
      if (!(k.bound > worst.p * (1 + 1e-9))) break;
      const c = worstWind((dir) => peak(withWind(k.calm, M, dir)), k.seeds);
      if (c.p > worst.p * (1 + 1e-9)) worst = { ...c, slew: k.t };
    }
  const area = w * L;
  const tipping = !Number.isFinite(worst.p);
  // Mats under the tracks (rigid mats, as under outriggers; common practice, no source): mats of
  // `length` across the track laid side by side along it, `perSupport` per track. When they cover
  // the length in contact, the track's pressure is spread over the mat length instead of the shoe.
  const mat = ctx.input.ground?.mat;
  let spread: { across: number; cover: number; applied: boolean } | null = null;
  if (mat && !tipping) {
    const across = si(mat.length)!;
    const cover = si(mat.width)! * (mat.perSupport ?? 1);
    spread = { across, cover, applied: atLeast(cover, worst.contact) && exceeds(across, w) };
  }
  const trackP = worst.p;
  if (spread?.applied)
    worst = { ...worst, p: (worst.p * w) / spread.across, pMin: (worst.pMin * w) / spread.across };
  figures.groundPressure = tipping ? null : worst.p;
  const formula = f`slew ${worst.slew.toFixed(0)}°: track load ${term(worst.Vt, 'weight')}, eccentricity ${term(
    Math.abs(worst.e),
    'length',
  )} on track length ${term(L, 'length')} (L/6 = ${term(L / 6, 'length')}), shoe ${term(w, 'length')} → ${worst.shape} pressure, peak ${
    tipping ? 'unbounded' : ''
  }${tipping ? '' : term(trackP, 'pressure')}`;
  if (spread?.applied)
    formula.push(
      ...f`; on mats ${term(spread.across, 'length')} across the track: × shoe ${term(w, 'length')} ÷ ${term(
        spread.across,
        'length',
      )} = ${term(worst.p, 'pressure')} on the ground`,
    );
  const al = allowable(ctx);
  const status = tipping
    ? 'fail'
    : al.value === null
      ? ctx.input.ground?.soilClass === 'mud_organic_fill'
        ? 'fail'
        : 'caution'
      : statusMax(worst.p, al.value, ctx.policy);
  items.push(
    item(ctx, {
      id: 'ground-bearing.pressure',
      label: spread?.applied ? 'Peak bearing pressure under the track mats' : 'Peak track bearing pressure',
      status,
      value: tipping ? null : worst.p,
      limit: al.value,
      limitType: al.value === null ? null : 'max',
      unit: 'pressure',
      formula: al.value === null ? formula : [...formula, ' against allowable ', term(al.value, 'pressure')],
      source: spread?.applied
        ? { kind: 'common_practice', text: `${SOURCES.trackMats.text}; allowable: ${al.source.text}` }
        : al.source,
      message: tipping
        ? 'The resultant falls outside the track: the crane would tip.'
        : al.value === null
          ? al.message
          : spread?.applied
            ? `Track pressure (eccentric footing, ${worst.shape}) spread across the mats under the track.`
            : spread
              ? `Track ground pressure (eccentric footing, ${worst.shape}) on the shoes alone: the mats entered (${formatQuantity(
                  spread.cover,
                  'length',
                  ctx.system,
                )} along the track) do not cover the ${formatQuantity(worst.contact, 'length', ctx.system)} in contact or are no wider than the shoe.`
              : `Track ground pressure (eccentric footing, ${worst.shape}); no mats entered (area ${area.toFixed(2)} m² per track).`,
    }),
  );
  items.push(trackContactItem(ctx, L, worst));
  const fx =
    !tipping && al.value !== null && exceeds(worst.p, al.value)
      ? trackMatFix(ctx, trackP, w, worst.contact, al.value)
      : null;
  if (fx && fixes) fixes.push(fx);
}

function trackContactItem(
  ctx: Ctx,
  L: number,
  worst: { pMin: number; contact: number; p: number },
): CheckItem {
  return item(ctx, {
    id: 'ground-bearing.track-contact',
    label: 'Track length in contact (most loaded track)',
    status: worst.contact > 0 ? 'pass' : 'fail',
    value: worst.contact,
    unit: 'length',
    formula: f`contact ${term(worst.contact, 'length')} of ${term(L, 'length')}; pressure from ${term(worst.pMin, 'pressure')} to ${
      Number.isFinite(worst.p) ? term(worst.p, 'pressure') : 'unbounded'
    }`,
    source: SOURCES.eccentricFooting,
    message:
      worst.contact < L
        ? 'Part of the track lifts off the ground: the pressure is triangular over the length in contact.'
        : 'The whole track bears on the ground.',
  });
}
