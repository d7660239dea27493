// Ground bearing pressure against the allowable (check 5). Pressure under the mats = reaction ÷
// (mat area × mats per support), mats taken as rigid. Allowable bearing: as entered (geotechnical
// value), else IBC Table 1806.2 presumptive value for the soil class; mud, organic soils, peat and
// unprepared fill have none (geotechnical value needed).
import { exceeds } from '../compare';
import type { SoilClass } from '../../schemas/lift-input';
import { f, item, statusMax, term, type Ctx } from '../context';
import { SOURCES } from '../sources';
import { si, TO_SI } from '../units';
import type { CheckItem, Fix, LiftFigures, Source } from '../types';
import { formatQuantity } from '../format';

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

export function allowable(ctx: Ctx): { value: number | null; source: Source; message: string } {
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

export function pressureItem(
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
