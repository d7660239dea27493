// The form's fields are named by string paths in the field catalogue (shared/catalogue/lift-fields), and the
// form turns them into typed paths with liftPath(). These tests keep that honest: every
// catalogue path leads to a field of the shared lift-input schema.
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { LiftInput } from '@shared/schemas/lift-input';
import { STEPS, type FieldDef } from '@shared/catalogue/lift-fields';
import { multiCraneCatalogue } from '@shared/catalogue/multi-crane-steps';

/** Unwraps optional, nullable, default and pipe layers down to the schema that holds the shape. */
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

function schemaAt(root: z.ZodType, path: string): z.ZodType | null {
  let s: z.ZodType | null = root;
  for (const part of path.split('.')) {
    if (!s) return null;
    const c = core(s);
    if (c instanceof z.ZodObject) s = (c.shape as Record<string, z.ZodType>)[part] ?? null;
    else if (c instanceof z.ZodArray && /^\d+$/.test(part)) s = c.element as z.ZodType;
    else return null;
  }
  return s;
}

function catalogue(): { path: string; def: FieldDef }[] {
  const out: { path: string; def: FieldDef }[] = [];
  for (const step of STEPS)
    for (const group of step.groups)
      for (const def of group.fields) {
        out.push({ path: def.path, def });
        if (def.kind === 'list')
          for (const column of def.columns) out.push({ path: `${def.path}.0.${column.path}`, def: column });
      }
  // the several-cranes step (crane 2's fields stand for every other crane)
  for (const def of multiCraneCatalogue()) {
    out.push({ path: def.path, def });
    if (def.kind === 'list')
      for (const column of def.columns) out.push({ path: `${def.path}.0.${column.path}`, def: column });
  }
  return out;
}

describe('the field catalogue against the lift-input schema', () => {
  it('when every catalogue path is looked up in the schema, then each leads to a field', () => {
    const missing = catalogue()
      .filter(({ path }) => schemaAt(LiftInput, path) === null)
      .map(({ path }) => path);
    expect(missing).toEqual([]);
  });

  it('when a catalogue field is a list, then the schema has a list there', () => {
    const notLists = catalogue()
      .filter(({ def }) => def.kind === 'list')
      .filter(({ path }) => !(core(schemaAt(LiftInput, path)!) instanceof z.ZodArray))
      .map(({ path }) => path);
    expect(notLists).toEqual([]);
  });

  it('when a path is not in the schema, then the look-up says so', () => {
    expect(schemaAt(LiftInput, 'crane.noSuchField')).toBeNull();
    expect(schemaAt(LiftInput, 'chart.rows.0.radius')).not.toBeNull();
  });

  it('when every field of the lift-input schema is listed, then the editor has a field for each', () => {
    // Entered elsewhere than the catalogue: chart rows (the chart rows editor), several cranes
    // beside their catalogue (the version 1 form, chartCapacity of a version 1 crane), the title
    // (review step), the input's version and the files (documents step).
    const elsewhere = [
      /^schemaVersion$/,
      /^title$/,
      /^chart\.rows\b/,
      /^tandem\b/,
      /^multiCrane\.others\.0\.chart\.rows\b/,
      /^multiCrane\.others\.0\.chartCapacity$/,
    ];
    const known = new Set(catalogue().map(({ path }) => path));
    const missing = leaves(LiftInput, '')
      .filter((path) => !known.has(path) && !elsewhere.some((re) => re.test(path)))
      // a leg's or a row's name is its row number in the editor's lists
      .filter((path) => !/\.0\.name$/.test(path) || !known.has(path.replace(/\.0\.name$/, '')));
    expect(missing).toEqual([]);
  });
});

/** Every field path of the schema a person enters: quantities ({ value, unit }) count as one field. */
function leaves(schema: z.ZodType, path: string): string[] {
  const c = core(schema);
  if (c instanceof z.ZodObject) {
    const shape = c.shape as Record<string, z.ZodType>;
    if ('value' in shape && 'unit' in shape) return [path];
    return Object.entries(shape).flatMap(([key, child]) => leaves(child, path ? `${path}.${key}` : key));
  }
  if (c instanceof z.ZodArray) return leaves(c.element as z.ZodType, `${path}.0`);
  return [path];
}
