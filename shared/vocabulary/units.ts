// How units are written for people, declared once: the editor's unit selectors, the calculation
// sheet's "as entered" values and the seed's notes. Conversion factors live in
// shared/engineering/units.ts (`TO_SI`).
import type { UnitSystem } from '@shared/schemas/common';
import {
  ANGLE_UNITS,
  AREA_UNITS,
  LENGTH_UNITS,
  MOMENT_UNITS,
  PRESSURE_UNITS,
  SPEED_UNITS,
  VOLTAGE_UNITS,
  WEIGHT_UNITS,
} from '@shared/engineering/units';

export type QuantityKind =
  'length' | 'weight' | 'pressure' | 'speed' | 'area' | 'angle' | 'voltage' | 'moment';

export const UNITS_BY_KIND: Record<QuantityKind, readonly string[]> = {
  length: LENGTH_UNITS,
  weight: WEIGHT_UNITS,
  pressure: PRESSURE_UNITS,
  speed: SPEED_UNITS,
  area: AREA_UNITS,
  angle: ANGLE_UNITS,
  voltage: VOLTAGE_UNITS,
  moment: MOMENT_UNITS,
};

const LABELS: Record<string, string> = {
  m2: 'm²',
  ft2: 'ft²',
  ton_us: 'US ton',
  deg: '°',
  N_m: 'N·m',
  kN_m: 'kN·m',
  t_m: 't·m',
  lb_ft: 'lb·ft',
  kip_ft: 'kip·ft',
  knot: 'knot',
};

/** A unit's symbol as people write it ('kN_m' → 'kN·m'). */
export function unitLabel(unit: string): string {
  return LABELS[unit] ?? unit.replace(/_/g, '·');
}

/** A number and its unit as entered, no rounding: "12 knots", "30°", "12,500 kg". */
export function quantityAsEntered(value: number, unit: string): string {
  const n = Math.abs(value) >= 10000 ? value.toLocaleString('en-GB') : String(value);
  const label = unit === 'knot' ? 'knots' : unitLabel(unit);
  return label === '°' ? `${n}°` : `${n} ${label}`.trim();
}

const DEFAULTS: Record<UnitSystem, Record<QuantityKind, string>> = {
  metric: {
    length: 'm',
    weight: 't',
    pressure: 'kPa',
    speed: 'm/s',
    area: 'm2',
    angle: 'deg',
    voltage: 'kV',
    moment: 'kN_m',
  },
  imperial: {
    length: 'ft',
    weight: 'lb',
    pressure: 'psf',
    speed: 'mph',
    area: 'ft2',
    angle: 'deg',
    voltage: 'kV',
    moment: 'kip_ft',
  },
};

/** The unit a new field starts with in each unit system. */
export function defaultUnit(kind: QuantityKind, system: UnitSystem): string {
  return DEFAULTS[system][kind];
}

/** A bound in a message ("must be 2,000 t or less"): whole above 100, else up to 3 decimals. */
export function limitFigure(x: number): string {
  return x.toLocaleString('en-US', { maximumFractionDigits: x >= 100 ? 0 : 3 });
}

/** A unit system in words, as the documents and the package page name it. */
export const UNIT_SYSTEM_WORDS: Record<UnitSystem, string> = {
  metric: 'metric (m, t, kN, kPa)',
  imperial: 'US customary (ft, lb, kip, psf)',
};
