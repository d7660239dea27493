// The scene helpers worked by hand: 45° hatching clipped to a box and the outward arrowheads of a
// dimension line.
import { describe, expect, it } from 'vitest';
import { arrowHeads, box, hatch } from '@shared/drawing/scene';

describe('scene helpers', () => {
  it('when a 10 × 10 box is hatched falling every 5 from the origin, then x − y = −5, 0, 5 cross it', () => {
    // x − y = ±10 only touch a corner and are left out
    expect(hatch(0, 0, 10, 10, 'falling', 5)).toEqual([
      [
        [0, 5],
        [5, 10],
      ],
      [
        [0, 0],
        [10, 10],
      ],
      [
        [5, 0],
        [10, 5],
      ],
    ]);
  });

  it('when the box is hatched rising, then x + y = 5, 10, 15 cross it from its top edge down to the left', () => {
    expect(hatch(0, 0, 10, 10, 'rising', 5)).toEqual([
      [
        [5, 0],
        [0, 5],
      ],
      [
        [10, 0],
        [0, 10],
      ],
      [
        [10, 5],
        [5, 10],
      ],
    ]);
  });

  it('when the hatch is phased through a point, then its lines pass through it and step along x from it', () => {
    // a ground strip 40 wide and 6 deep at y = 100, lines starting at its left end every 7
    const segments = hatch(20, 100, 40, 6, 'falling', 7, [20, 100]);
    expect(segments[0]).toEqual([
      [20, 100],
      [26, 106],
    ]);
    expect(segments.map(([a]) => a[0])).toEqual([20, 27, 34, 41, 48, 55]);
    // the last is cut at the strip's right edge
    expect(segments[5][1]).toEqual([60, 105]);
  });

  it('when a dimension runs 0 to 10 along x, then both heads point outwards with their tips past the ends', () => {
    const [start, end] = arrowHeads([0, 0], [10, 0], { length: 4, half: 2, overshoot: 1 });
    expect(start).toEqual([
      [-1, 0],
      [3, -2],
      [3, 2],
    ]);
    expect(end).toEqual([
      [11, 0],
      [7, 2],
      [7, -2],
    ]);
  });

  it('when a box is asked for, then its corners run clockwise from the top-left (y down)', () => {
    expect(box(1, 2, 3, 4)).toEqual([
      [1, 2],
      [4, 2],
      [4, 6],
      [1, 6],
    ]);
  });
});
