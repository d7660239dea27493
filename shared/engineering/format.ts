// Display of engine values: an SI value and its unit kind become a string in the user's unit
// system, to three significant figures. The client, the CLI and the PDF calculation sheet all use
// this so a number reads the same everywhere. Rounding happens here only, never in the engine.
import { STANDARD_GRAVITY, TO_SI } from './units';
import type { FormulaPart, UnitKind, UnitSystem } from './types';

const LBF = TO_SI.lb;
const FT = TO_SI.ft;

function group(intPart: string): string {
  if (intPart.length <= 3) return intPart;
  let out = '';
  const n = intPart.length;
  for (let i = 0; i < n; i++) {
    out += intPart[i];
    const left = n - 1 - i;
    if (left > 0 && left % 3 === 0) out += ',';
  }
  return out;
}

const POW10 = [1, 10, 100, 1000, 1e4, 1e5, 1e6, 1e7, 1e8];

/** Three significant figures, no exponent, thousands grouped: 16.0, 0.613, 12,000. */
export function sig3(x: number): string {
  if (!Number.isFinite(x)) return x > 0 ? '∞' : x < 0 ? '−∞' : '—';
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a < 1e-4 || a >= 1e15) return x.toExponential(2).replace('-', '−');
  let d =
    a >= 1 && a < 10 ? 0 : a >= 10 && a < 100 ? 1 : a >= 100 && a < 1000 ? 2 : Math.floor(Math.log10(a));
  let decimals = 2 - d;
  let r =
    decimals >= 0
      ? Math.round(a * POW10[decimals]) / POW10[decimals]
      : Math.round(a / 10 ** -decimals) * 10 ** -decimals;
  if (r >= 10 ** (d + 1)) {
    d += 1;
    decimals = 2 - d;
    r =
      decimals >= 0
        ? Math.round(a * POW10[decimals]) / POW10[decimals]
        : Math.round(a / 10 ** -decimals) * 10 ** -decimals;
  }
  const str = r.toFixed(decimals > 0 ? decimals : 0);
  const body = r >= 1000 ? group(str) : str;
  return x < 0 ? '−' + body : body;
}

/** A percentage: whole when it rounds to a whole number at one decimal, else one decimal. */
export function formatPercent(pct: number): string {
  if (!Number.isFinite(pct)) return '—';
  const r = Math.round(pct * 10) / 10;
  return (Number.isInteger(r) ? r.toFixed(0) : r.toFixed(1)) + '%';
}

export interface DisplayValue {
  value: number;
  unit: string;
}

/** Convert an SI value to the display unit of its kind in a unit system (no rounding). */
export function toDisplay(si: number, kind: UnitKind, system: UnitSystem): DisplayValue {
  const metric = system === 'metric';
  switch (kind) {
    case 'length':
      return metric ? { value: si, unit: 'm' } : { value: si / FT, unit: 'ft' };
    case 'weight': {
      if (metric) {
        const kg = si / STANDARD_GRAVITY;
        return Math.abs(kg) < 1000 ? { value: kg, unit: 'kg' } : { value: kg / 1000, unit: 't' };
      }
      const lb = si / LBF;
      return Math.abs(lb) < 10000 ? { value: lb, unit: 'lb' } : { value: lb / 1000, unit: 'kip' };
    }
    case 'force': {
      if (metric) return { value: si / 1000, unit: 'kN' };
      const lb = si / LBF;
      return Math.abs(lb) < 10000 ? { value: lb, unit: 'lb' } : { value: lb / 1000, unit: 'kip' };
    }
    case 'pressure':
      return metric ? { value: si / 1000, unit: 'kPa' } : { value: si / (LBF / (FT * FT)), unit: 'psf' };
    case 'speed':
      return metric ? { value: si, unit: 'm/s' } : { value: si / 0.44704, unit: 'mph' };
    case 'area':
      return metric ? { value: si, unit: 'm²' } : { value: si / (FT * FT), unit: 'ft²' };
    case 'moment':
      return metric ? { value: si / 1000, unit: 'kN·m' } : { value: si / (1000 * LBF * FT), unit: 'kip·ft' };
    case 'angle':
      return { value: si, unit: '°' };
    case 'voltage':
      return { value: si / 1000, unit: 'kV' };
    case 'percent':
      return { value: si, unit: '%' };
    case 'ratio':
    case 'count':
      return { value: si, unit: '' };
  }
}

/** "16.0 t", "35.3 kip", "1.52", "82%". */
export function formatQuantity(si: number | null | undefined, kind: UnitKind, system: UnitSystem): string {
  if (si == null) return '—';
  if (kind === 'percent') return formatPercent(si);
  if (kind === 'count') return Number.isInteger(si) ? String(si) : sig3(si);
  const d = toDisplay(si, kind, system);
  if (kind === 'angle') return `${sig3(d.value)}°`;
  return d.unit ? `${sig3(d.value)} ${d.unit}` : sig3(d.value);
}

/** "82% of 16.0 t" */
export function formatPercentOf(pct: number, of: number, kind: UnitKind, system: UnitSystem): string {
  return `${formatPercent(pct)} of ${formatQuantity(of, kind, system)}`;
}

/** Render a structured formula in a unit system. */
export function formatFormula(parts: readonly FormulaPart[], system: UnitSystem): string {
  let out = '';
  for (const p of parts) out += typeof p === 'string' ? p : formatQuantity(p.v, p.k, system);
  return out;
}
