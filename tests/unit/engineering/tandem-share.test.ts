// Defect 1: in a lift with two cranes each crane is checked for its own share, not the whole load.
// Share A = W · d_B / (d_A + d_B), hoist lines plumb (read, load-sharing articles; REFERENCES.md).
// Hand-worked: 10 t load, lead crane's pick 4 m from the CG, the other's 6 m → lead share 6 t;
// its gross load 6 t + 0.5 t block = 6.5 t against 24 t at 10 m → 27.08%.
import { describe, expect, it } from 'vitest';
import { findItem, G, outriggerLift, q, run } from './support';

describe('tandem lift entered in the version 1 form', () => {
  it('when two cranes share the load, then the lead crane is checked for its share only', () => {
    const l = outriggerLift();
    l.tandem = {
      cranes: [
        { name: 'Lead', pickPointDistance: q(4, 'm'), chartCapacity: q(24, 't'), ownHookWeight: q(0.5, 't') },
        { name: 'Tail', pickPointDistance: q(6, 'm'), chartCapacity: q(8, 't'), ownHookWeight: q(0.3, 't') },
      ],
    };
    const r = run(l);
    expect(r.figures.grossLoad).toBeCloseTo(6.5 * 1000 * G, 6);
    expect(findItem(r, 'capacity.use').value!).toBeCloseTo((6.5 / 24) * 100, 9);
  });
});
