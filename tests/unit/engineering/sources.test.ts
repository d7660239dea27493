// "Every new check names its source, or 'common practice, no source', or 'from memory'" (issue 14):
// every item of every example's result, and every source the engine declares, names where its limit
// or method comes from, and a rule of thumb or a recalled value says so in its own words.
import { describe, expect, it } from 'vitest';
import { SOURCES } from '@shared/engineering/sources';
import type { LiftResult, Source } from '@shared/engineering/types';
import type { LiftInputRaw } from '@shared/schemas/lift-input';
import { example, exampleNames, outriggerLift, q, run } from './support';

const KINDS = ['standard', 'site_policy', 'common_practice', 'from_memory', 'input', 'computed'];

/** What is wrong with a source, or null. */
function problem(s: Source): string | null {
  if (!KINDS.includes(s.kind)) return `unknown kind ${s.kind}`;
  if (s.text.trim().length < 5) return 'no text';
  if (s.kind === 'common_practice' && !/common practice, no source/i.test(s.text))
    return 'common practice without "common practice, no source"';
  if (s.kind === 'from_memory' && !/from memory/i.test(s.text)) return 'from memory without "from memory"';
  return null;
}

function itemProblems(name: string, r: LiftResult): string[] {
  const out: string[] = [];
  const all = [r, ...(r.cranes ?? [])] as { checks: LiftResult['checks'] }[];
  for (const x of all)
    for (const c of x.checks)
      for (const i of c.items) {
        const p = problem(i.source);
        if (p) out.push(`${name} ${i.id}: ${p} (${i.source.text})`);
      }
  return out;
}

describe('every check names its source', () => {
  it('when the engine’s declared sources are listed, then each names its kind and says so for rules of thumb and recalled values', () => {
    const out: string[] = [];
    for (const [key, s] of Object.entries(SOURCES)) {
      const src = typeof s === 'function' ? s('x') : s;
      const p = problem(src);
      if (p) out.push(`${key}: ${p}`);
    }
    expect(out).toEqual([]);
  });

  it('when every example is checked, then every item names its source in those terms', () => {
    const out = exampleNames().flatMap((n) => itemProblems(n, run(example(n))));
    expect(out).toEqual([]);
  });

  it('when bridles of three and four legs (equalised or not) and crawler tracks on mats are checked, then their items name their sources too', () => {
    const at = (x: number, y: number) => ({ pickPoint: { x: q(x, 'm'), y: q(y, 'm') } });
    const cases: [string, LiftInputRaw][] = [];
    for (const [legs, equalised] of [
      [[at(-2, -1), at(2, -1), at(0, 2)], false],
      [[at(-2, -1), at(2, -1), at(2, 1), at(-2, 1)], false],
      [[at(-2, -1), at(2, -1), at(2, 1), at(-2, 1)], true],
    ] as const) {
      const l = outriggerLift();
      l.rigging = {
        slings: {
          material: 'wire',
          hitch: 'choker',
          chokeAngle: q(100, 'deg'),
          ratedLoadVertical: q(8, 't'),
          hookHeight: q(3, 'm'),
          equalised,
          legs: [...legs],
        },
      };
      cases.push([`${legs.length} legs${equalised ? ' equalised' : ''}`, l]);
    }
    const crawler = example('pass-crawler.json');
    crawler.ground = { ...crawler.ground, mat: { length: q(4, 'm'), width: q(1.2, 'm'), perSupport: 7 } };
    cases.push(['crawler on mats', crawler]);
    expect(cases.flatMap(([name, l]) => itemProblems(name, run(l)))).toEqual([]);
  });
});
