// Defect 6: every quantity has a plausible upper bound; a value beyond it is an input error naming
// the field and the limit (bounds are ours: "common practice, no source", chosen well above any
// crane lift on record so that every product in the engine stays finite).
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { LiftInput } from '@shared/schemas/lift-input';
import { checkLift } from '@shared/engineering/evaluate';
import { outriggerLift, q } from './support';

describe('upper bounds on quantities', () => {
  it('when a chart capacity of 1e308 t is entered, then it is refused naming the field and the limit', () => {
    const l = outriggerLift();
    l.chart.rows[0].capacity = q(1e308, 't');
    const out = checkLift(l);
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.issues.map((i) => i.message).join('\n')).toMatch(
      /chart\.rows\[\]\.capacity must be 100,000 t or less/,
    );
  });
  it('when a wind speed of 1e200 m/s is entered, then it is refused naming the limit in the unit typed', () => {
    const l = outriggerLift();
    l.environment = { windSpeed: q(1e200, 'm/s') };
    const out = checkLift(l);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.issues[0].message).toMatch(/environment\.windSpeed must be 100 m\/s or less/);
  });
  it('when a limit is typed in another unit, then the message gives the limit in that unit', () => {
    const l = outriggerLift();
    l.load = { weight: q(1e9, 'lb') };
    const out = checkLift(l);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.issues[0].message).toMatch(/load\.weight must be 220,462,262 lb or less/);
  });

  it('when any number anywhere in the lift input is 1e300 in any of its units, then that field refuses it with its limit', () => {
    const loose: string[] = [];
    for (const { path, schema } of numberFields(LiftInput, '')) {
      const c = core(schema);
      const units =
        c instanceof z.ZodObject
          ? ((core((c.shape as { unit: z.ZodType }).unit) as z.ZodEnum).options as string[])
          : [null];
      for (const unit of units) {
        const r = schema.safeParse(unit === null ? 1e300 : { value: 1e300, unit });
        const said = r.success ? '' : r.error.issues.map((i) => i.message).join(' ');
        if (r.success || !/or less|between|at most/.test(said)) loose.push(`${path} ${unit ?? ''}: ${said}`);
      }
    }
    expect(loose).toEqual([]);
  });
});

/** Unwraps optional, default and pipe layers down to the schema that holds the shape. */
function core(schema: z.ZodType): z.ZodType {
  let s: z.ZodType = schema;
  for (let i = 0; i < 10; i++) {
    if (s instanceof z.ZodOptional || s instanceof z.ZodNullable || s instanceof z.ZodDefault)
      s = s.unwrap() as z.ZodType;
    else if (s instanceof z.ZodPipe) s = s.in as z.ZodType;
    else break;
  }
  return s;
}

/** Every number of the schema: quantities ({ value, unit }) and plain numbers, with their paths. */
function numberFields(schema: z.ZodType, path: string): { path: string; schema: z.ZodType }[] {
  const c = core(schema);
  if (c instanceof z.ZodObject) {
    const shape = c.shape as Record<string, z.ZodType>;
    if ('value' in shape && 'unit' in shape) return [{ path, schema }];
    return Object.entries(shape).flatMap(([k, v]) => numberFields(v, path ? `${path}.${k}` : k));
  }
  if (c instanceof z.ZodArray) return numberFields(c.element as z.ZodType, `${path}[]`);
  if (c instanceof z.ZodNumber) return [{ path, schema }];
  return [];
}
