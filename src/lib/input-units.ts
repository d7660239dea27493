// The units a person may type each kind of quantity in, the labels shown in the unit
// selectors, and the unit a new field starts with in each unit system.
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

export function unitLabel(unit: string): string {
  return LABELS[unit] ?? unit;
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

export function defaultUnit(kind: QuantityKind, system: UnitSystem): string {
  return DEFAULTS[system][kind];
}

/** Reads the unit out of a header cell such as "Capacity (kip)" or "radius [ft]". */
export function unitInText(text: string, kind: QuantityKind): string | null {
  const match = /[([]\s*([^)\]]+?)\s*[)\]]/.exec(text);
  if (!match) return null;
  const wanted = match[1].toLowerCase().replace('²', '2').replace(' ', '_');
  return UNITS_BY_KIND[kind].find((unit) => unit.toLowerCase() === wanted) ?? null;
}
