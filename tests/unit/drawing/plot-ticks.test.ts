// Tick values for the plots come from d3-scale's nice ticks: round numbers of 1, 2 or 5 × 10^n,
// inside the range, and the side view's grid is square (the same step on both axes).
import { scaleLinear } from 'd3-scale';
import { describe, expect, it } from 'vitest';
import { niceStep, niceTicks, squareGrid } from '@shared/drawing/plot-ticks';

describe('plot ticks', () => {
  it('when a radius axis runs 0 to 38 m, then the ticks are every 5 m from 0 to 35', () => {
    expect(niceTicks(0, 38)).toEqual([0, 5, 10, 15, 20, 25, 30, 35]);
    expect(niceTicks(0, 38)).toEqual(scaleLinear().domain([0, 38]).ticks(6));
  });

  it('when a capacity axis runs 0 to 0.9 t, then the ticks step by 0.2 without float noise', () => {
    expect(niceTicks(0, 0.9)).toEqual([0, 0.2, 0.4, 0.6, 0.8]);
    expect(niceStep(0, 0.9)).toBe(0.2);
    expect(niceTicks(0, 0.9, 10)).toEqual([0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9]);
  });

  it('when the range is empty, then one tick at its start is given rather than an endless loop', () => {
    expect(niceTicks(3, 3)).toEqual([3]);
    expect(niceStep(3, 3)).toBe(1);
  });

  it('when a side view spans -9.5 to 41 ft across and 120 ft up, then both axes step alike', () => {
    const g = squareGrid(-9.5, 41, 120);
    expect(g.step).toBe(5);
    expect(g.x[0]).toBe(-5);
    expect(g.x.at(-1)).toBe(40);
    expect(g.y[0]).toBe(0);
    expect(g.y.at(-1)).toBe(120);
    for (let i = 1; i < g.y.length; i++) expect(g.y[i] - g.y[i - 1]).toBeCloseTo(g.step, 12);
  });
});
