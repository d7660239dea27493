// Units at the engine's edges. Every input quantity is { value, unit }; the engine multiplies by
// the factor below to get SI (N, m, Pa, m/s, m², N·m, V) and never works in any other unit inside.
// Angles are the one exception: they stay in degrees (inputs and results), radians only in trig calls.
// Factors are exact definitions: 1 ft = 0.3048 m, 1 lb = 0.45359237 kg, standard gravity 9.80665 m/s²
// (weights given as mass are converted to force with standard gravity).

export const STANDARD_GRAVITY = 9.80665;
const LB_KG = 0.45359237;
const FT = 0.3048;
const IN = 0.0254;
const LBF = LB_KG * STANDARD_GRAVITY;

export const LENGTH_UNITS = ['m', 'mm', 'ft', 'in'] as const;
export const WEIGHT_UNITS = ['kg', 't', 'lb', 'kip', 'ton_us', 'N', 'kN'] as const;
export const PRESSURE_UNITS = ['Pa', 'kPa', 'psf', 'psi'] as const;
export const SPEED_UNITS = ['m/s', 'km/h', 'mph', 'knot'] as const;
export const AREA_UNITS = ['m2', 'ft2'] as const;
export const ANGLE_UNITS = ['deg'] as const;
export const VOLTAGE_UNITS = ['kV', 'V'] as const;
export const MOMENT_UNITS = ['N_m', 'kN_m', 't_m', 'lb_ft', 'kip_ft'] as const;

export type LengthUnit = (typeof LENGTH_UNITS)[number];
export type WeightUnit = (typeof WEIGHT_UNITS)[number];
export type PressureUnit = (typeof PRESSURE_UNITS)[number];
export type SpeedUnit = (typeof SPEED_UNITS)[number];
export type AreaUnit = (typeof AREA_UNITS)[number];
export type AngleUnit = (typeof ANGLE_UNITS)[number];
export type VoltageUnit = (typeof VOLTAGE_UNITS)[number];
export type MomentUnit = (typeof MOMENT_UNITS)[number];
export type AnyUnit =
  LengthUnit | WeightUnit | PressureUnit | SpeedUnit | AreaUnit | AngleUnit | VoltageUnit | MomentUnit;

/** Multiply a value in the given unit by this factor to get SI (degrees stay degrees). */
export const TO_SI: Readonly<Record<AnyUnit, number>> = {
  m: 1,
  mm: 0.001,
  ft: FT,
  in: IN,
  N: 1,
  kN: 1000,
  kg: STANDARD_GRAVITY,
  t: 1000 * STANDARD_GRAVITY,
  lb: LBF,
  kip: 1000 * LBF,
  ton_us: 2000 * LBF,
  Pa: 1,
  kPa: 1000,
  psf: LBF / (FT * FT),
  psi: LBF / (IN * IN),
  'm/s': 1,
  'km/h': 1000 / 3600,
  mph: (5280 * FT) / 3600,
  knot: 1852 / 3600,
  m2: 1,
  ft2: FT * FT,
  deg: 1,
  kV: 1000,
  V: 1,
  N_m: 1,
  kN_m: 1000,
  t_m: 1000 * STANDARD_GRAVITY,
  lb_ft: LBF * FT,
  kip_ft: 1000 * LBF * FT,
};

export interface Quantity<U extends string = AnyUnit> {
  value: number;
  unit: U;
}

/** SI value of a quantity; undefined stays undefined so optional inputs read naturally. */
export function si(q: Quantity | undefined | null): number | undefined {
  return q == null ? undefined : q.value * TO_SI[q.unit as AnyUnit];
}

/** SI value of a quantity, or the fallback when it is absent. */
export function siOr(q: Quantity | undefined | null, fallback: number): number {
  return q == null ? fallback : q.value * TO_SI[q.unit as AnyUnit];
}

/** Express an SI value in a unit (the inverse of si). */
export function fromSI(value: number, unit: AnyUnit): number {
  return value / TO_SI[unit];
}

export const DEG = Math.PI / 180;
