// Several cranes (2 to 4), each with its own configuration, chart, rigging and pick point.
// Shares from statics, hoist lines plumb (read, load-sharing articles; REFERENCES.md): two cranes
// share A = W·d_B/(d_A + d_B); three picks from ΣV = W and ΣM = 0 about both plan axes.
// Margins: Queensland Mobile Crane Code of Practice 2006 §14.3.2 (read): capacity 20% (two),
// 33% (three), 50% (four or more) greater than the calculated share.
import { describe, expect, it } from 'vitest';
import { LiftInput, type LiftInputRaw } from '@shared/schemas/lift-input';
import { upgradeLiftInput } from '@shared/engineering/upgrade';
import { evaluateLift } from '@shared/engineering/evaluate';
import { checkOf, findItem, G, outriggerLift, q, run } from './support';

const t = (x: number) => x * 1000 * G;
const at = (x: number, y: number) => ({ x: q(x, 'm'), y: q(y, 'm') });

function other(name: string, block: number, pick: ReturnType<typeof at>) {
  const base = outriggerLift();
  return {
    name,
    crane: base.crane,
    chart: base.chart,
    hookBlock: { weight: q(block, 't') },
    pickPoint: pick,
  };
}

function twoCranes(): LiftInputRaw {
  const l = outriggerLift();
  l.schemaVersion = 2;
  l.load = { weight: q(20, 't') };
  l.multiCrane = {
    loadCg: at(0, 0),
    lead: { name: 'North crane', pickPoint: at(-4, 0) },
    others: [other('South crane', 0.3, at(6, 0))],
  };
  return l;
}

describe('two cranes', () => {
  // Hand-worked: W = 20 t, d_A = 4 m, d_B = 6 m → A 20·6/10 = 12 t, B 8 t.
  // A: 12 t + 0.5 t block = 12.5 t against 24 t at 10 m (52.1%); margin 24 ÷ 1.2 = 20 t.
  // B: 8 t + 0.3 t block = 8.3 t (34.6%). CG off by 5% of 10 m = 0.5 m: A from 11 t to 13 t.
  it('when the CG lies between the picks, then each crane gets every check for its own share', () => {
    const r = run(twoCranes());
    expect(r.cranes!.map((c) => c.share! / t(1))).toEqual([expect.closeTo(12, 9), expect.closeTo(8, 9)]);
    expect(r.figures.grossLoad).toBeCloseTo(t(12.5), 6);
    expect(findItem(r, 'capacity.use').value).toBeCloseTo((12.5 / 24) * 100, 9);
    expect(findItem(r, 'crane-2.capacity.use').value).toBeCloseTo((8.3 / 24) * 100, 9);
    expect(findItem(r, 'crane-2.stability.ratio').status).not.toBe('not_applicable');
    expect(r.cranes![1].figures!.grossLoad).toBeCloseTo(t(8.3), 6);
    const m = findItem(r, 'tandem.crane-1');
    expect(m.value).toBeCloseTo(t(12.5), 6);
    expect(m.limit).toBeCloseTo(t(20), 6);
    expect(r.multiCrane!.marginPct).toBe(20);
    expect(r.cranes![0].shareRange!.min).toBeCloseTo(t(11), 6);
    expect(r.cranes![0].shareRange!.max).toBeCloseTo(t(13), 6);
    expect(findItem(r, 'tandem.sensitivity-1').formulaText).toMatch(/0\.500 m/);
    expect(r.critical.triggers.map((x) => x.id)).toContain('tandem');
  });
  it('when each crane has its own reeving, then its supports and its line pull carry its share, not the whole load', () => {
    // Each crane weighs 20 + 15 + 30 + 4 = 69 t; its supports carry that and its gross share:
    // A 69 + 12.5 = 81.5 t, B 69 + 8.3 = 77.3 t (with the whole 20 t it would be 89.5 t).
    // Line pull: 4 parts over 3 roller sheaves, K = 1.04: F = W·K^S(K − 1)/(K^N − 1).
    const l = twoCranes();
    const reeving = { partsOfLine: 4, sheavesPassed: 3, bearing: 'roller' } as const;
    l.reeving = reeving;
    l.multiCrane!.others[0].reeving = reeving;
    const r = run(l);
    const K = 1.04;
    const factor = (K ** 3 * (K - 1)) / (K ** 4 - 1);
    const sum = (c: { figures: { supportReactions: { reaction: number }[] } | null }) =>
      c.figures!.supportReactions.reduce((a, s) => a + s.reaction, 0);
    expect(sum(r.cranes![0])).toBeCloseTo(t(81.5), 4);
    expect(sum(r.cranes![1])).toBeCloseTo(t(77.3), 4);
    expect(r.cranes![0].figures!.linePull).toBeCloseTo(t(12.5) * factor, 6);
    expect(r.cranes![1].figures!.linePull).toBeCloseTo(t(8.3) * factor, 6);
    expect(findItem(r, 'crane-2.reeving.line-pull').value).toBeCloseTo(t(8.3) * factor, 6);
  });
  it('when crane 2 has its own slings, then they carry its share: 8 t on two legs at 60° is 4.619 t a leg', () => {
    const l = twoCranes();
    l.multiCrane!.others[0].rigging = {
      slings: {
        material: 'wire',
        hitch: 'vertical',
        ratedLoadVertical: q(5, 't'),
        legs: [{ angle: q(60, 'deg') }, { angle: q(60, 'deg') }],
      },
    };
    const r = run(l);
    // T = 8 t ÷ (2 sin 60°) = 4.6188 t, under its 5 t rating; with the whole 20 t it would be 11.5 t
    expect(findItem(r, 'crane-2.rigging.leg-1').value).toBeCloseTo(t(8 / (2 * Math.sin(Math.PI / 3))), 6);
    expect(findItem(r, 'crane-2.rigging.leg-1').status).not.toBe('fail');
    // crane 1 has no slings of its own: nothing is checked in its name
    expect(findItem(r, 'rigging.leg-1').status).toBe('not_applicable');
  });
  it('when the site sets a 25% two-crane margin, then crane 1 may carry 24 ÷ 1.25 = 19.2 t', () => {
    const r = run(twoCranes(), { tandemMarginPct: { twoCranes: 25, threeCranes: 33, fourOrMore: 50 } });
    expect(r.multiCrane!.marginPct).toBe(25);
    expect(findItem(r, 'tandem.crane-1').limit).toBeCloseTo(t(19.2), 6);
  });
  it('when the planner states a CG uncertainty of 10% of the pick spacing, then crane 1’s share ranges 10 t to 14 t', () => {
    // CG moved 0.1 × 10 m = 1 m: A = 20 × (6 ∓ 1) ÷ 10
    const l = twoCranes();
    l.multiCrane!.cgOffsetFraction = 0.1;
    const r = run(l);
    expect(r.cranes![0].shareRange!.min).toBeCloseTo(t(10), 6);
    expect(r.cranes![0].shareRange!.max).toBeCloseTo(t(14), 6);
    expect(r.cranes![1].shareRange!.min).toBeCloseTo(t(6), 6);
    expect(r.cranes![1].shareRange!.max).toBeCloseTo(t(10), 6);
  });
  it('when the CG lies outside the picks, then the shares fail (a crane would push the load up)', () => {
    const l = twoCranes();
    l.multiCrane!.loadCg = at(7, 0);
    const r = run(l);
    expect(findItem(r, 'tandem.shares').status).toBe('fail');
    expect(r.cranes![0].share!).toBeLessThan(0);
  });
  it('when a crane cannot carry its share with the 20% margin, then the multi-crane check fails', () => {
    const l = twoCranes();
    l.load = { weight: q(40, 't') };
    // A: 24 t + 0.5 t = 24.5 t against 20 t
    expect(findItem(run(l), 'tandem.crane-1').status).toBe('fail');
  });
});

describe('three cranes', () => {
  // Hand-worked: picks A (0, 0), B (6, 0), C (0, 6), CG (1, 2), W = 30 t.
  // ΣM about the y axis: 6·s_B = 30·1 → s_B = 5 t; about the x axis: 6·s_C = 30·2 → s_C = 10 t;
  // ΣV: s_A = 30 − 5 − 10 = 15 t. Margin 33%.
  it('when three picks are not in a line, then the shares follow from the CG plan position', () => {
    const l = outriggerLift();
    l.load = { weight: q(30, 't') };
    l.multiCrane = {
      loadCg: at(1, 2),
      lead: { pickPoint: at(0, 0) },
      others: [other('B', 0.3, at(6, 0)), other('C', 0.3, at(0, 6))],
    };
    const r = run(l);
    expect(r.cranes!.map((c) => c.share! / t(1))).toEqual([
      expect.closeTo(15, 9),
      expect.closeTo(5, 9),
      expect.closeTo(10, 9),
    ]);
    expect(r.multiCrane!.marginPct).toBe(33);
    expect(findItem(r, 'tandem.crane-3').limit).toBeCloseTo(t(24 / 1.33), 6);
    expect(findItem(r, 'crane-3.capacity.use').value).toBeCloseTo((10.3 / 24) * 100, 9);
  });
  it('when three picks are in a line, then statics leaves the shares open and they must be stated', () => {
    const l = outriggerLift();
    l.multiCrane = {
      lead: { pickPoint: at(0, 0) },
      others: [other('B', 0.3, at(3, 0)), other('C', 0.3, at(6, 0))],
    };
    const s = findItem(run(l), 'tandem.shares');
    expect(s.status).toBe('fail');
    expect(s.message).toMatch(/state each crane’s share/);
  });
});

describe('four cranes', () => {
  // Picks at the corners of a 10 m × 4 m rectangle around the CG; W = 20 t.
  function four(shares: number[]): LiftInputRaw {
    const l = outriggerLift();
    l.load = { weight: q(20, 't') };
    const picks = [at(-5, -2), at(5, -2), at(5, 2), at(-5, 2)];
    l.multiCrane = {
      loadCg: at(0, 0),
      lead: { pickPoint: picks[0], statedShare: q(shares[0], 't') },
      others: [1, 2, 3].map((i) => ({
        ...other(`Crane ${i + 1}`, 0.3, picks[i]),
        statedShare: q(shares[i], 't'),
      })),
    };
    return l;
  }
  it('when the stated shares balance force and moment, then they are used, with the 50% margin', () => {
    const r = run(four([5, 5, 5, 5]));
    expect(findItem(r, 'tandem.balance').status).toBe('pass');
    expect(r.multiCrane!.marginPct).toBe(50);
    expect(findItem(r, 'tandem.crane-4').limit).toBeCloseTo(t(16), 6);
  });
  it('when the stated shares add up but their moments do not balance, then they are refused', () => {
    // ΣF = 8 + 2 + 5 + 5 = 20 t; ΣM about the CG: 8·(−5) + 2·5 + 5·5 + 5·(−5) = −30 t·m ≠ 0
    const r = run(four([8, 2, 5, 5]));
    const b = findItem(r, 'tandem.balance');
    expect(b.status).toBe('fail');
    expect(b.message).toMatch(/Refused: the stated shares do not balance/);
    expect(checkOf(r, 'tandem').status).toBe('fail');
    expect(r.overallStatus).toBe('fail');
  });
  it('when a fifth crane is listed, then the input names the limit', () => {
    const l = four([4, 4, 4, 4]);
    l.multiCrane!.others.push(other('E', 0.3, at(0, 0)));
    const p = LiftInput.safeParse(l);
    expect(p.success).toBe(false);
    if (!p.success) expect(p.error.issues[0].message).toMatch(/1 to 3 cranes \(2 to 4 cranes in all\)/);
  });
});

describe('version 1 inputs', () => {
  it('when a stored version 1 tandem input is upgraded, then it validates as version 2 and evaluates the same', () => {
    const v1 = outriggerLift();
    v1.schemaVersion = 1;
    v1.tandem = {
      cranes: [
        { name: 'A', pickPointDistance: q(4, 'm'), chartCapacity: q(24, 't') },
        { name: 'B', pickPointDistance: q(6, 'm'), chartCapacity: q(8, 't'), ownHookWeight: q(0.3, 't') },
      ],
    };
    const parsed = LiftInput.parse(v1);
    const up = upgradeLiftInput(parsed);
    expect(up.schemaVersion).toBe(2);
    expect(up.tandem).toBeUndefined();
    const again = LiftInput.parse(JSON.parse(JSON.stringify(up)));
    expect(evaluateLift(again)).toEqual(evaluateLift(parsed));
    expect(findItem(evaluateLift(parsed), 'tandem.crane-2').value).toBeCloseTo(t(4.3), 6);
  });
  it('when both forms are given, or tandem with version 2, then the input says which to keep', () => {
    const l = twoCranes();
    l.tandem = { cranes: [{ chartCapacity: q(1, 't') }, { chartCapacity: q(1, 't') }] };
    expect(LiftInput.safeParse(l).error?.issues[0].message).toMatch(/keep multiCrane/);
    delete l.multiCrane;
    expect(LiftInput.safeParse(l).error?.issues[0].message).toMatch(/with schemaVersion 2 enter multiCrane/);
  });
  it('when a single-crane input is upgraded, then only its version changes', () => {
    const l = LiftInput.parse(outriggerLift());
    expect(upgradeLiftInput(l)).toEqual({ ...l, schemaVersion: 2 });
  });
});
