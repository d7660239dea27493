// Check 5 — support reactions and ground bearing (PRODUCT.md §5).
// Outriggers: rigid base on four supports of equal stiffness (statics, common practice):
//   R_i = V/4 ± M_L/(2·L) ± M_T/(2·B), with V the total weight, M_L = V·e_x and M_T = V·e_y its
//   moments about the box centre, L and B the longitudinal and transverse spreads. When one R_i goes
//   negative that support lifts off; the load is then shared by the other three (statically
//   determinate) and the result is flagged. When the resultant lies outside the box no compressive
//   reactions balance the crane: "no support solution", fail, and no force is reported.
// Wind: for each slew the wind is tried from the directions that load each corner most, along the
//   axes and straight out along the eccentricity; the largest reaction or pressure governs.
// Crawlers: each track is an eccentric footing: p_max = V_t/(b·L)·(1 + 6e/L) when e ≤ L/6,
//   2·V_t/(3·b·(L/2 − e)) when e > L/6 (triangular).
// Pressure under the mats = reaction ÷ (mat area × mats per support), mats taken as rigid. Crawler
//   tracks on mats (mat length across the track, mats per support laid along it covering the length
//   in contact): the track pressure × shoe width ÷ mat length (rigid mats; common practice, no source).
// Allowable bearing: as entered (geotechnical value), else IBC Table 1806.2 presumptive value for
// the soil class; mud, organic soils, peat and unprepared fill have none (geotechnical value needed).
import { atLeast, exceeds } from '../compare';
import type { SoilClass } from '../../schemas/lift-input';
import { planModel, resultant, SLEW_SWEEP, windDirections, type PlanModel } from '../crane-model';
import { check, f, item, statusMax, term, type Ctx } from '../context';
import { gantryStatics } from './stability-gantry';
import { fourSupportReactions, supportReactions } from './support-reactions';
import { SOURCES } from '../sources';
import { si, TO_SI } from '../units';
import type { CheckItem, CheckResult, Fix, LiftFigures, Source } from '../types';
import { formatQuantity } from '../format';
import { trackMatFix } from './track-mat-fix';

/** IBC Table 1806.2 (2012) presumptive load-bearing values, psf; null: none (geotechnical value). */
export const IBC_1806_2_PSF: Readonly<Record<SoilClass, number | null>> = {
  crystalline_bedrock: 12000,
  sedimentary_rock: 4000,
  sandy_gravel: 3000,
  sand_silty_clayey: 2000,
  clay_silt: 1500,
  mud_organic_fill: null,
};

const SOIL_WORDS: Record<SoilClass, string> = {
  crystalline_bedrock: 'crystalline bedrock',
  sedimentary_rock: 'sedimentary and foliated rock',
  sandy_gravel: 'sandy gravel and gravel (GW, GP)',
  sand_silty_clayey: 'sand, silty sand, clayey sand, silty gravel, clayey gravel (SW, SP, SM, SC, GM, GC)',
  clay_silt: 'clay, sandy clay, silty clay, clayey silt, silt, sandy silt (CL, ML, MH, CH)',
  mud_organic_fill: 'mud, organic soil, peat or unprepared fill',
};

const NO_WIND = [0, 0] as const;
const CALM = [undefined];

/** The calm resultant moved by a wind moment M blowing along the plan direction dir. */
function withWind(r: { V: number; ex: number; ey: number }, M: number, dir: readonly [number, number]) {
  return r.V > 0 ? { V: r.V, ex: r.ex + (M * dir[0]) / r.V, ey: r.ey + (M * dir[1]) / r.V } : r;
}

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

function allowable(ctx: Ctx): { value: number | null; source: Source; message: string } {
  const g = ctx.input.ground;
  const entered = si(g?.allowableBearing);
  if (entered !== undefined)
    return {
      value: entered,
      source: { kind: 'input', text: 'allowable bearing pressure as entered (geotechnical value)' },
      message: '',
    };
  if (g?.soilClass) {
    const psf = IBC_1806_2_PSF[g.soilClass];
    if (psf === null)
      return {
        value: null,
        source: SOURCES.ibc1806,
        message: `IBC Table 1806.2 gives no presumptive value for ${SOIL_WORDS[g.soilClass]}: a geotechnical bearing value is required.`,
      };
    return {
      value: psf * TO_SI.psf,
      source: {
        kind: 'standard',
        text: `${SOURCES.ibc1806.text}: ${SOIL_WORDS[g.soilClass]} ${psf.toLocaleString('en-US')} psf`,
      },
      message: '',
    };
  }
  return {
    value: null,
    source: SOURCES.input,
    message: 'No allowable bearing pressure or soil class entered.',
  };
}

function pressureItem(
  ctx: Ctx,
  p: number,
  area: number,
  R: number,
  what: string,
  items: CheckItem[],
  figures: LiftFigures,
  fixes?: Fix[],
) {
  figures.groundPressure = p;
  const al = allowable(ctx);
  const formula = f`pressure = ${what} ${term(R, 'force')} ÷ bearing area ${term(area, 'area')} = ${term(p, 'pressure')}`;
  if (al.value === null) {
    const noValue = ctx.input.ground?.soilClass === 'mud_organic_fill';
    items.push(
      item(ctx, {
        id: 'ground-bearing.pressure',
        label: 'Ground bearing pressure',
        status: noValue ? 'fail' : 'caution',
        value: p,
        unit: 'pressure',
        formula,
        source: al.source,
        message: al.message,
      }),
    );
    return;
  }
  const mat = ctx.input.ground?.mat;
  if (exceeds(p, al.value) && mat && fixes) {
    // What would fix it: the mat area under each support that brings the pressure to the allowable
    // (rigid mats, pressure = reaction ÷ area), and the number of mats of the size entered.
    const need = R / al.value;
    const one = si(mat.length)! * si(mat.width)!;
    const count = Math.ceil(need / one - 1e-9);
    fixes.push({
      checkId: 'ground-bearing',
      kind: 'mat_area',
      value: need,
      unit: 'area',
      formula: f`bearing area = ${what} ${term(R, 'force')} ÷ allowable ${term(al.value, 'pressure')} = ${term(need, 'area')}`,
      message: `Spread each support over at least ${formatQuantity(need, 'area', ctx.system)} (${count} mats of ${formatQuantity(
        si(mat.length)!,
        'length',
        ctx.system,
      )} × ${formatQuantity(si(mat.width)!, 'length', ctx.system)}, or one mat of ${formatQuantity(Math.sqrt(need), 'length', ctx.system)} square), on ground that carries it.`,
      text: '',
    });
    fixes[fixes.length - 1].text = fixes[fixes.length - 1].message;
  }
  items.push(
    item(ctx, {
      id: 'ground-bearing.pressure',
      label: 'Ground bearing pressure',
      status: statusMax(p, al.value, ctx.policy),
      value: p,
      limit: al.value,
      limitType: 'max',
      unit: 'pressure',
      formula: [...formula, ' against allowable ', term(al.value, 'pressure')],
      source: al.source,
      message: exceeds(p, al.value)
        ? 'Pressure under the mats exceeds the allowable bearing pressure.'
        : 'Pressure under the mats against the allowable bearing pressure.',
    }),
  );
}

function outriggers(ctx: Ctx, m: PlanModel, figures: LiftFigures, items: CheckItem[], fixes?: Fix[]) {
  const entered = ctx.input.crane.slewAngle;
  const slews = entered ? [entered.value] : SLEW_SWEEP;
  let worst = { max: -Infinity, R: [0, 0, 0, 0], slew: 0, liftOff: -1, V: 0, ex: 0, ey: 0 };
  let tips: { slew: number; edge: string; ex: number; ey: number; V: number } | null = null;
  for (const t of slews) {
    const calm = resultant(m, t, NO_WIND);
    const dirs = m.windMoment > 0 ? windDirections(m.a, m.b, calm.ex - m.x0, calm.ey) : CALM;
    for (const dir of dirs) {
      const r = dir ? withWind(calm, m.windMoment, dir) : calm;
      const ex = r.ex - m.x0;
      const R = supportReactions(r.V, ex, r.ey, m.a, m.b);
      if (!R) {
        // no compressive reactions balance the crane: it tips about the line the resultant is beyond
        if (!tips) {
          let e = 0;
          let beyond = -Infinity;
          m.edges.forEach((E, i) => {
            const over = E.nx * r.ex + E.ny * r.ey - E.d;
            if (over > beyond) {
              beyond = over;
              e = i;
            }
          });
          tips = { slew: t, edge: m.edges[e].label, ex, ey: r.ey, V: r.V };
        }
        continue;
      }
      const four = fourSupportReactions(r.V, ex, r.ey, m.a, m.b);
      let liftOff = -1;
      for (let i = 0; i < 4; i++) if (four[i] < 0 && (liftOff < 0 || four[i] < four[liftOff])) liftOff = i;
      const mx = Math.max(R[0], R[1], R[2], R[3]);
      if (mx > worst.max * (1 + 1e-9)) worst = { max: mx, R, slew: t, liftOff, V: r.V, ex, ey: r.ey };
    }
  }
  if (tips) {
    figures.supportReactions = [];
    figures.maxSupportReaction = null;
    items.push(
      item(ctx, {
        id: 'ground-bearing.reactions',
        label: 'Outrigger reactions',
        status: 'fail',
        value: null,
        unit: 'weight',
        formula: f`slew ${tips.slew.toFixed(0)}°: resultant ${term(tips.V, 'weight')} at eₓ ${term(tips.ex, 'length')}, e_y ${term(
          tips.ey,
          'length',
        )} from the box centre, outside the box of half-length ${term(m.a, 'length')} and half-width ${term(m.b, 'length')}`,
        source: SOURCES.rigidBase,
        message: `No support solution: the crane tips about the ${tips.edge}. No set of compressive outrigger reactions balances it.`,
      }),
    );
    return;
  }
  figures.supportReactions = m.supports.map((s, i) => ({
    label: s.label,
    x: s.x,
    y: s.y,
    reaction: worst.R[i],
  }));
  figures.maxSupportReaction = worst.max;
  const L = 2 * m.a;
  const B = 2 * m.b;
  items.push(
    item(ctx, {
      id: 'ground-bearing.reactions',
      label: 'Largest outrigger reaction',
      status: worst.liftOff >= 0 ? 'caution' : 'pass',
      value: worst.max,
      unit: 'weight',
      formula: f`slew ${worst.slew.toFixed(0)}°${entered ? '' : ' (largest reaction)'}: R = V/4 ± V·eₓ/(2L) ± V·e_y/(2B), V ${term(
        worst.V,
        'weight',
      )}, eₓ ${term(worst.ex, 'length')}, e_y ${term(worst.ey, 'length')}, L ${term(L, 'length')}, B ${term(B, 'length')} → ${
        m.supports[0].label
      } ${term(worst.R[0], 'weight')}, ${m.supports[1].label} ${term(worst.R[1], 'weight')}, ${m.supports[2].label} ${term(
        worst.R[2],
        'weight',
      )}, ${m.supports[3].label} ${term(worst.R[3], 'weight')}`,
      source: SOURCES.rigidBase,
      message:
        worst.liftOff >= 0
          ? `The ${m.supports[worst.liftOff].label} outrigger lifts off in the four-support model; reactions shown are shared by the other three. Confirm with the manufacturer's outrigger load figures.`
          : 'Reactions from the rigid-base model on four supports.',
    }),
  );
  const mat = ctx.input.ground?.mat;
  if (mat) {
    const area = si(mat.length)! * si(mat.width)! * (mat.perSupport ?? 1);
    pressureItem(ctx, worst.max / area, area, worst.max, 'largest reaction', items, figures, fixes);
  }
}

function crawler(ctx: Ctx, m: PlanModel, items: CheckItem[], figures: LiftFigures, fixes?: Fix[]) {
  const tr = ctx.input.crane.tracks!;
  const L = si(tr.length)!;
  const w = si(tr.shoeWidth)!;
  const entered = ctx.input.crane.slewAngle;
  const slews = entered ? [entered.value] : SLEW_SWEEP;
  let worst = { p: -Infinity, Vt: 0, e: 0, slew: 0, shape: 'uniform' as string, pMin: 0, contact: 0 };
  for (const t of slews) {
    const calm = resultant(m, t, NO_WIND);
    const dirs = m.windMoment > 0 ? windDirections(m.a, m.b, calm.ex - m.x0, calm.ey) : CALM;
    for (const dir of dirs) {
      const r = dir ? withWind(calm, m.windMoment, dir) : calm;
      const e = r.ex - m.x0;
      const VL = (r.V * (m.b + r.ey)) / (2 * m.b);
      const VR = (r.V * (m.b - r.ey)) / (2 * m.b);
      for (const Vt of [VL, VR]) {
        const tp = Vt > r.V ? trackPeakPressure(r.V, e, L, w) : trackPeakPressure(Math.max(Vt, 0), e, L, w);
        if (tp.p > worst.p * (1 + 1e-9) || worst.p === -Infinity)
          worst = {
            p: tp.p,
            Vt: Math.min(Math.max(Vt, 0), r.V),
            e,
            slew: t,
            shape: tp.shape,
            pMin: tp.pMin,
            contact: tp.contact,
          };
      }
    }
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

export function groundBearingCheck(ctx: Ctx, figures: LiftFigures, fixes?: Fix[]): CheckResult {
  const items: CheckItem[] = [];
  if (ctx.input.crane.type === 'gantry_a_frame') {
    const gs = gantryStatics(ctx);
    const mat = ctx.input.ground?.mat;
    if (!gs || !mat) return na(ctx, 'Enter the mat size under each gantry foot.');
    const Wf = si(ctx.input.crane.gantry!.frameWeight)!;
    const foot =
      (gs.frameCompression *
        Math.cos(
          Math.asin(Math.min(1, gs.outreach / Math.max(1e-9, Math.hypot(gs.outreach, gs.apexHeight)))),
        ) +
        Wf / 2) /
      2;
    const area = si(mat.length)! * si(mat.width)! * (mat.perSupport ?? 1);
    items.push(
      item(ctx, {
        id: 'ground-bearing.reactions',
        label: 'Reaction at each leg foot',
        status: 'pass',
        value: foot,
        unit: 'weight',
        formula: f`(frame compression ${term(gs.frameCompression, 'force')} × cos(inclination) + half frame weight ${term(Wf / 2, 'weight')}) ÷ 2 feet = ${term(foot, 'weight')}`,
        source: SOURCES.statics,
        message: 'Vertical reaction at each foot of the legs.',
      }),
    );
    figures.maxSupportReaction = foot;
    pressureItem(ctx, foot / area, area, foot, 'foot reaction', items, figures, fixes);
    return check('ground-bearing', 'Support reactions and ground bearing', items);
  }
  if (ctx.geometry.radius === null) return na(ctx, 'No radius entered.');
  const m = planModel(ctx, ctx.geometry.radius);
  if (!m) return na(ctx, 'Enter the crane weights and the outrigger spread or track geometry.');
  if (m.kind === 'outriggers') outriggers(ctx, m, figures, items, fixes);
  else crawler(ctx, m, items, figures, fixes);
  if (items.length === 1 && m.kind === 'outriggers')
    items.push(
      item(ctx, {
        id: 'ground-bearing.pressure',
        label: 'Ground bearing pressure',
        status: 'not_applicable',
        value: null,
        unit: 'pressure',
        source: SOURCES.input,
        message: 'Enter the mat size to check the pressure under the outriggers.',
      }),
    );
  return check('ground-bearing', 'Support reactions and ground bearing', items, 'ground-bearing.pressure');
}

function na(ctx: Ctx, message: string): CheckResult {
  return check('ground-bearing', 'Support reactions and ground bearing', [
    item(ctx, {
      id: 'ground-bearing.pressure',
      label: 'Ground bearing pressure',
      status: 'not_applicable',
      value: null,
      unit: 'pressure',
      source: SOURCES.input,
      message,
    }),
  ]);
}
