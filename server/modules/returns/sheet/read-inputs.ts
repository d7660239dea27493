// Reading the stored raw lift input for the calculation sheet: it is printed as the contractor
// entered it (their numbers and units), so it is read loosely and never converted for display.
import { TO_SI, WEIGHT_UNITS } from '@shared/engineering/units';
import { quantityAsEntered } from '@shared/vocabulary/units';

export type Obj = Record<string, unknown>;
export const obj = (v: unknown): Obj | null =>
  v && typeof v === 'object' && !Array.isArray(v) ? (v as Obj) : null;
export const arr = (v: unknown): unknown[] => (Array.isArray(v) ? v : []);
export const str = (v: unknown): string | null => (typeof v === 'string' && v.trim() ? v : null);

/** A quantity as entered: its own number and unit, no rounding. */
export function asEntered(q: unknown): string | null {
  const o = obj(q);
  if (!o || typeof o.value !== 'number' || !Number.isFinite(o.value)) return null;
  return quantityAsEntered(o.value, typeof o.unit === 'string' ? o.unit : '');
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
