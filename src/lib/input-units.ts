// Reading a unit out of a pasted table's header cell; the units themselves and their labels are
// declared in shared/vocabulary/units.ts.
import { UNITS_BY_KIND, type QuantityKind } from '@shared/vocabulary/units';

/** Reads the unit out of a header cell such as "Capacity (kip)" or "radius [ft]". */
export function unitInText(text: string, kind: QuantityKind): string | null {
  const match = /[([]\s*([^)\]]+?)\s*[)\]]/.exec(text);
  if (!match) return null;
  const wanted = match[1].toLowerCase().replace('²', '2').replace(' ', '_');
  return UNITS_BY_KIND[kind].find((unit) => unit.toLowerCase() === wanted) ?? null;
}
