// Reading the stored raw lift input for the calculation sheet: it is printed as the contractor
// entered it (their numbers and units), read loosely; only a quantity entered in the other unit
// system than the document's is converted (inputsInSystem), so the document keeps one system.
import type { UnitSystem } from '@shared/schemas/common';
import { fromSI, TO_SI, WEIGHT_UNITS, type AnyUnit } from '@shared/engineering/units';
import { quantityAsEntered } from '@shared/vocabulary/units';

export type Obj = Record<string, unknown>;
export const obj = (v: unknown): Obj | null =>
  v && typeof v === 'object' && !Array.isArray(v) ? (v as Obj) : null;
export const arr = (v: unknown): unknown[] => (Array.isArray(v) ? v : []);
export const str = (v: unknown): string | null => (typeof v === 'string' && v.trim() ? v : null);

/** A quantity as entered: its own number and unit, no rounding (converted ones: 4 significant figures). */
export function asEntered(q: unknown): string | null {
  const o = obj(q);
  if (!o || typeof o.value !== 'number' || !Number.isFinite(o.value)) return null;
  const value = o.converted === true ? Number(o.value.toPrecision(4)) : o.value;
  return quantityAsEntered(value, typeof o.unit === 'string' ? o.unit : '');
}

/** The unit of the document's system a unit of the other system is printed in (neutral ones: none). */
const INTO: Record<UnitSystem, Partial<Record<AnyUnit, AnyUnit>>> = {
  metric: {
    ft: 'm',
    in: 'mm',
    lb: 'kg',
    kip: 't',
    ton_us: 't',
    psf: 'kPa',
    psi: 'kPa',
    mph: 'm/s',
    ft2: 'm2',
    lb_ft: 'kN_m',
    kip_ft: 'kN_m',
  },
  imperial: {
    m: 'ft',
    mm: 'in',
    kg: 'lb',
    t: 'kip',
    N: 'lb',
    kN: 'kip',
    Pa: 'psf',
    kPa: 'psf',
    'm/s': 'mph',
    'km/h': 'mph',
    m2: 'ft2',
    N_m: 'lb_ft',
    kN_m: 'kip_ft',
    t_m: 'kip_ft',
  },
};

/**
 * The raw input with every quantity entered in the other unit system converted into the
 * document's (marked `converted`, full precision kept for figures drawn from it); quantities
 * already in the document's system, and everything that is not a quantity, stay as entered.
 */
export function inputsInSystem(v: unknown, system: UnitSystem): unknown {
  if (Array.isArray(v)) return v.map((x) => inputsInSystem(x, system));
  const o = obj(v);
  if (!o) return v;
  if (typeof o.value === 'number' && typeof o.unit === 'string') {
    const from = o.unit as AnyUnit;
    const to = Object.hasOwn(INTO[system], from) ? INTO[system][from] : undefined;
    if (!to || !Number.isFinite(o.value)) return o;
    return { ...o, value: fromSI(o.value * TO_SI[from], to), unit: to, converted: true };
  }
  return Object.fromEntries(Object.entries(o).map(([k, x]) => [k, inputsInSystem(x, system)]));
}

/** Whether inputsInSystem converted any quantity. */
export function anyConverted(v: unknown): boolean {
  if (Array.isArray(v)) return v.some(anyConverted);
  const o = obj(v);
  return !!o && (o.converted === true || Object.values(o).some(anyConverted));
}

export function add(list: [string, string][], label: string, value: string | null | undefined) {
  if (value) list.push([label, value]);
}

export function weightAt(o: unknown, armKey: string, armWords: string): string | null {
  const w = asEntered(obj(o)?.weight);
  if (!w) return null;
  const arm = asEntered(obj(o)?.[armKey]);
  return arm ? `${w}, centre of gravity ${arm} ${armWords}` : w;
}

/** A weight quantity in newtons; NaN for anything that is not a weight. */
export function weightSI(q: Obj): number {
  const unit = String(q.unit);
  const f = (WEIGHT_UNITS as readonly string[]).includes(unit) ? TO_SI[unit as keyof typeof TO_SI] : 0;
  return typeof q.value === 'number' && f ? q.value * f : NaN;
}
