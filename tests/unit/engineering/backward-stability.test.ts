// Defect 2: backward stability, the crane unloaded (hook block only) with the boom at the shortest
// radius of the plan (the shortest radius listed for the boom used) in the least favourable direction.
// Criteria (ASME B30.5 §5-1.1.2, from memory — the clause could not be read in a public copy; the
// same test in ASME B30.4-2020 §4-1.3.4 was read, with 60% for portal and pedestal cranes):
// - crawlers: the crane's centre of gravity no further from the axis of rotation than 70% of the
//   distance from that axis to the backward tipping fulcrum;
// - outriggers or wheels: the supports on the boom side carry at least 15% of the crane's weight.
// Hand-worked with the outrigger lift of support.ts (box 6 m × 6 m, a = b = 3 m), counterweight
// raised to 70 t at 4 m: shortest radius listed 8 m → boom CG at 10 × 8/20 = 4 m, block at 8 m.
//   Σw·s = 0.5·8 + 4·4 − 20·1 − 70·4 = −280 t·m; W = 0.5 + 4 + 20 + 70 + 30 = 124.5 t
//   CG 280/124.5 = 2.249 m behind the axis; boom-side pair = 2 (W/4 − W·2.249/(4·3)) = 15.58 t = 12.5%.
import { describe, expect, it } from 'vitest';
import { example, findItem, G, outriggerLift, q, run } from './support';

function heavyCounterweight() {
  const l = outriggerLift();
  l.crane.counterweight = { weight: q(70, 't'), cgBehindRotation: q(4, 'm') };
  return l;
}

describe('backward stability (unloaded crane)', () => {
  it('when a heavy counterweight passes the loaded check, then the unloaded crane fails backward stability', () => {
    const r = run(heavyCounterweight());
    expect(findItem(r, 'stability.ratio').status).not.toBe('fail');
    const it = findItem(r, 'stability.backward');
    const W = 124.5;
    const e = 280 / W;
    const pct = ((2 * (W / 4 - (W * e) / 12)) / W) * 100;
    expect(it.value!).toBeCloseTo(pct, 6);
    expect(it.limit).toBe(15);
    expect(it.status).toBe('fail');
    expect(it.source.text).toMatch(/ASME B30.5 §5-1.1.2 backward stability \(from memory/);
  });
  it('when the ordinary counterweight is fitted, then backward stability passes', () => {
    const it = findItem(run(outriggerLift()), 'stability.backward');
    // Σw·s = 4 + 16 − 20 − 60 = −60 t·m, W = 69.5 t, CG 0.863 m: pair = 2 (W/4 − W·0.863/12)
    const W = 69.5;
    const pct = ((2 * (W / 4 - 60 / 12)) / W) * 100;
    expect(it.value!).toBeCloseTo(pct, 6);
    expect(it.status).toBe('pass');
  });
  it('when a crawler has its counterweight far back, then its CG against 70% of the backward fulcrum fails', () => {
    const l = heavyCounterweight();
    l.crane.type = 'mobile_crawler';
    delete l.crane.outriggers;
    l.crane.tracks = { length: q(6, 'm'), shoeWidth: q(1, 'm'), gauge: q(4, 'm') };
    const it = findItem(run(l), 'stability.backward');
    // least favourable: boom over the side, fulcrum the far track centreline at 2 m
    expect(it.value!).toBeCloseTo((280 / 124.5 / 2) * 100, 6);
    expect(it.limit).toBe(70);
    expect(it.status).toBe('fail');
  });

  it('when the unloaded crane is balanced about its rear outrigger line, then the ratio is 163.5 ÷ 70 and held against the site minimum', () => {
    // Boom at 8 m with its counterweight over an outrigger line (3 m from the axis), moments about
    // that line: past it only the 70 t counterweight at 4 m, 70 × 1 = 70 t·m overturning; inside
    // it upper works 20 × (3 − 1) + carrier 30 × 3 + boom 4 × (3 + 4) + block 0.5 × (3 + 8)
    // = 40 + 90 + 28 + 5.5 = 163.5 t·m resisting → 2.3357 (towards a corner the counterweight
    // stays inside both lines: 4 cos 45° = 2.83 m < 3 m)
    const it = findItem(run(heavyCounterweight()), 'stability.backward-ratio');
    expect(it.value!).toBeCloseTo(163.5 / 70, 9);
    expect(it.limit).toBe(1.5);
    expect(it.status).toBe('pass');
    const strict = findItem(
      run(heavyCounterweight(), { minStabilityRatio: 2.5 }),
      'stability.backward-ratio',
    );
    expect(strict.limit).toBe(2.5);
    expect(strict.status).toBe('fail');
  });
  it('when the site sets its own backward minimum, then the outrigger share is held against it', () => {
    // the ordinary counterweight leaves 2 (W/4 − 60/12) / W = 35.6% on the boom side
    const it = findItem(run(outriggerLift(), { backwardBoomSideSupportPct: 40 }), 'stability.backward');
    expect(it.limit).toBe(40);
    expect(it.status).toBe('fail');
    expect(it.source.text).toMatch(/site policy: backward stability, outriggers 40%/);
  });
  it('when a gantry stands unloaded with its legs inclined 10°, then its backstay still pulls W′·tan β·l ÷ d', () => {
    // pass-gantry-a-frame: legs 10 m spread 6 m → frame height √(10² − 3²) = 9.539 m, inclined 10°:
    // apex 1.6565 m ahead of the feet, 9.394 m up; anchor 8 m behind the feet → backstay length
    // l = √(9.6565² + 9.394²) = 13.472 m; W′ = block 0.3 t + half the 2 t frame = 1.3 t;
    // moments about the feet: T · d · h ÷ l = W′ · x → T = 1.3 t × tan 10° × 13.472 ÷ 8 = 0.386 t
    const it = findItem(run(example('pass-gantry-a-frame.json')), 'stability.backward');
    const h = Math.sqrt(91);
    const x = h * Math.sin((10 * Math.PI) / 180);
    const y = h * Math.cos((10 * Math.PI) / 180);
    const l = Math.hypot(8 + x, y);
    expect(it.value!).toBeCloseTo((1.3 * 1000 * G * x * l) / (8 * y), 6);
    expect(it.value! / (1000 * G)).toBeCloseTo(0.386, 3);
    expect(it.status).toBe('pass');
  });
  it('when a gantry’s legs stand vertical, then unloaded nothing holds it from falling backward: fail', () => {
    const l = example('pass-gantry-a-frame.json');
    l.crane.gantry!.legInclination = q(0, 'deg');
    const it = findItem(run(l), 'stability.backward');
    expect(it.value).toBe(0);
    expect(it.status).toBe('fail');
    expect(it.message).toMatch(/a backstay cannot push/);
    expect(it.source.text).toMatch(/common practice, no source/);
  });
});
