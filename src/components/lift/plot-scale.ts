// Small helpers for the SVG plots: tidy tick steps and display-unit conversion of axes.
import { toDisplay } from '@shared/engineering/format';
import type { UnitKind, UnitSystem } from '@shared/engineering/types';

export function niceStep(range: number, targetTicks = 6): number {
  if (!(range > 0)) return 1;
  const raw = range / targetTicks;
  const power = 10 ** Math.floor(Math.log10(raw));
  const unit = raw / power;
  const nice = unit < 1.5 ? 1 : unit < 3 ? 2 : unit < 7 ? 5 : 10;
  return nice * power;
}

/** Ticks for an SI axis, placed at round numbers of the display unit. */
export function ticks(minSi: number, maxSi: number, kind: UnitKind, system: UnitSystem, target = 6) {
  const factor = toDisplay(1, kind, system).value; // display units per SI unit
  const lo = minSi * factor;
  const hi = maxSi * factor;
  const step = niceStep(hi - lo, target);
  const out: { si: number; label: string }[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + step * 1e-9; v += step) {
    const rounded = Math.round(v / step) * step;
    out.push({ si: rounded / factor, label: String(Number(rounded.toPrecision(6))) });
  }
  return out;
}

/** The single display unit of an axis (weights in t or kip, whichever the largest value reads in). */
export function axisUnit(
  maxSi: number,
  kind: UnitKind,
  system: UnitSystem,
): { unit: string; factor: number } {
  const d = toDisplay(maxSi, kind, system);
  return { unit: d.unit, factor: maxSi === 0 ? 1 : d.value / maxSi };
}
