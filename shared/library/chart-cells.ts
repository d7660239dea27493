// Reading the pieces of a chart table: spreadsheet references, unit words, the units header in
// the top-left cell and a number with the unit it may carry ("30.5 m", "12.5 t"). Pure: no I/O.
import { LENGTH_UNITS, WEIGHT_UNITS, type LengthUnit, type WeightUnit } from '../engineering/units';

export type RawCell = string | number | null | undefined;

export function columnName(index0: number): string {
  let n = index0 + 1;
  let s = '';
  while (n > 0) {
    const m = (n - 1) % 26;
    s = String.fromCharCode(65 + m) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

export const cellRef = (row0: number, col0: number) => `${columnName(col0)}${row0 + 1}`;

const UNIT_ALIASES: Record<string, string> = {
  m: 'm',
  metre: 'm',
  metres: 'm',
  meter: 'm',
  meters: 'm',
  mm: 'mm',
  ft: 'ft',
  feet: 'ft',
  foot: 'ft',
  "'": 'ft',
  in: 'in',
  inch: 'in',
  t: 't',
  tonne: 't',
  tonnes: 't',
  kg: 'kg',
  lb: 'lb',
  lbs: 'lb',
  kip: 'kip',
  kips: 'kip',
  ton_us: 'ton_us',
  'us ton': 'ton_us',
  'us tons': 'ton_us',
  kn: 'kN',
  n: 'N',
};

function normaliseUnit(word: string): string | null {
  return UNIT_ALIASES[word.trim().toLowerCase()] ?? null;
}

export const isLength = (u: string | null): u is LengthUnit =>
  !!u && (LENGTH_UNITS as readonly string[]).includes(u);
export const isWeight = (u: string | null): u is WeightUnit =>
  !!u && (WEIGHT_UNITS as readonly string[]).includes(u);

interface HeaderRead {
  units: Partial<Record<'radius' | 'boom' | 'capacity', string>>;
  order: ('radius' | 'boom' | 'capacity')[];
  unknown: string[];
}

/** "radius (m) / boom (m) / capacity (t)" → the unit of each word, in the order they come. */
export function readUnitsHeader(text: string): HeaderRead {
  const out: HeaderRead = { units: {}, order: [], unknown: [] };
  const part =
    /^(radius|radii|boom(?:\s+lengths?)?|booms|capacity|capacities)\b\s*(?:in\s+)?[[(]?\s*([^\])]*?)\s*[\])]?$/i;
  for (const piece of text.split(/[/|;,\\\n]+/)) {
    const m = part.exec(piece.trim());
    if (!m) continue;
    const word = m[1].toLowerCase();
    const key = word.startsWith('rad') ? 'radius' : word.startsWith('boom') ? 'boom' : 'capacity';
    if (!out.order.includes(key)) out.order.push(key);
    if (m[2]) {
      const u = normaliseUnit(m[2]);
      if (u) out.units[key] = u;
      else out.unknown.push(`${key} "${m[2].trim()}"`);
    }
  }
  return out;
}

/** "12.5", "12,5"? no: "1,250" is a thousands separator; "30.5 m" gives the number and its unit. */
export function readNumber(raw: string): { value: number | null; unit: string | null; ok: boolean } {
  const s = raw.trim();
  if (s === '') return { value: null, unit: null, ok: true };
  const m = /^([-+]?(?:\d{1,3}(?:,\d{3})+|\d+)(?:\.\d+)?|[-+]?\.\d+)\s*([a-zA-Z_'. ]*)$/.exec(s);
  if (!m) return { value: null, unit: null, ok: false };
  const value = Number(m[1].replace(/,/g, ''));
  if (!Number.isFinite(value)) return { value: null, unit: null, ok: false };
  const unitText = m[2].replace(/\.$/, '').trim();
  if (unitText === '') return { value, unit: null, ok: true };
  const unit = normaliseUnit(unitText);
  return unit ? { value, unit, ok: true } : { value: null, unit: null, ok: false };
}
