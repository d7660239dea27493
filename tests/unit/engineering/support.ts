// Test helpers: a plain metric lift (hand-checkable numbers) and item lookup.
import { readFileSync, readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { LiftInput, type LiftInputRaw } from '@shared/schemas/lift-input';
import { evaluateLift } from '@shared/engineering/evaluate';
import type { CheckItem, LiftResult } from '@shared/engineering/types';

export const G = 9.80665;
export const q = <U extends string>(value: number, unit: U) => ({ value, unit });
export const EXAMPLES_DIR = fileURLToPath(new URL('../../../shared/engineering/examples/', import.meta.url));

export function exampleNames(): string[] {
  return readdirSync(EXAMPLES_DIR).filter((f) => f.endsWith('.json'));
}
export function example(name: string): LiftInputRaw {
  return JSON.parse(readFileSync(EXAMPLES_DIR + name, 'utf8')) as LiftInputRaw;
}

/** Outriggers 6 m × 6 m, boom 20 m, radius 10 m, slew over the left side (hand-worked in moment tests). */
export function outriggerLift(): LiftInputRaw {
  return {
    crane: {
      type: 'mobile_outriggers',
      boomLength: q(20, 'm'),
      radius: q(10, 'm'),
      pivotOffset: q(0, 'm'),
      pivotHeight: q(0, 'm'),
      slewAngle: q(90, 'deg'),
      upperWorks: { weight: q(20, 't'), cgBehindRotation: q(1, 'm') },
      counterweight: { weight: q(15, 't'), cgBehindRotation: q(4, 'm') },
      carrier: { weight: q(30, 't'), cgRearOfRotation: q(0, 'm') },
      boom: { weight: q(4, 't'), cgFromFoot: q(10, 'm') },
      outriggers: { longitudinalSpread: q(6, 'm'), transverseSpread: q(6, 'm') },
    },
    chart: {
      rows: [8, 10, 12, 14].map((r, i) => ({
        radius: q(r, 'm'),
        boomLength: q(20, 'm'),
        capacity: q([30, 24, 20, 16][i], 't'),
      })),
    },
    load: { weight: q(10, 't') },
    hookBlock: { weight: q(0.5, 't') },
  };
}

export function run(
  raw: LiftInputRaw,
  policy?: Parameters<typeof evaluateLift>[1],
  units: 'metric' | 'imperial' = 'metric',
): LiftResult {
  return evaluateLift(LiftInput.parse(raw), policy, { units });
}

export function findItem(r: LiftResult, id: string): CheckItem {
  for (const c of r.checks) for (const it of c.items) if (it.id === id) return it;
  throw new Error(`no item ${id}; have ${r.checks.flatMap((c) => c.items.map((i) => i.id)).join(', ')}`);
}

export function checkOf(r: LiftResult, id: string) {
  const c = r.checks.find((x) => x.id === id);
  if (!c) throw new Error(`no check ${id}`);
  return c;
}

/** Every number anywhere in the result: none may be NaN (Infinity is allowed only where documented: none). */
export function badNumbers(v: unknown, path = '', out: string[] = []): string[] {
  if (typeof v === 'number') {
    if (!Number.isFinite(v)) out.push(`${path}=${v}`);
  } else if (typeof v === 'string') {
    if (v.includes('NaN') || v.includes('undefined')) out.push(`${path}="${v}"`);
  } else if (Array.isArray(v)) v.forEach((x, i) => badNumbers(x, `${path}[${i}]`, out));
  else if (v && typeof v === 'object')
    for (const [k, x] of Object.entries(v)) badNumbers(x, path ? `${path}.${k}` : k, out);
  return out;
}

/** A crawler on its tracks, 20 t at 12 m with a 24 m boom (invented figures for hand-worked tests). */
export function crawlerLift(): LiftInputRaw {
  return {
    crane: {
      type: 'mobile_crawler',
      boomLength: q(24, 'm'),
      radius: q(12, 'm'),
      slewAngle: q(0, 'deg'),
      upperWorks: { weight: q(30, 't'), cgBehindRotation: q(0.5, 'm') },
      counterweight: { weight: q(25, 't'), cgBehindRotation: q(4.5, 'm') },
      carrier: { weight: q(40, 't'), cgRearOfRotation: q(0, 'm') },
      boom: { weight: q(5, 't'), cgFromFoot: q(12, 'm') },
      tracks: { length: q(6, 'm'), shoeWidth: q(1, 'm'), gauge: q(4.4, 'm') },
    },
    chart: { rows: [{ radius: q(12, 'm'), boomLength: q(24, 'm'), capacity: q(32, 't') }] },
    load: { weight: q(20, 't') },
    ground: { allowableBearing: q(250, 'kPa') },
  };
}
