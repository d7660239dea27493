// The side view laid out as a figure, checked by hand on a simple crane: a 10 m boom whose foot is
// 1 m ahead of rotation and 2 m up, at the angle whose cosine is 0.6 (sine 0.8), so its tip is at
// 1 + 10 × 0.6 = 7 m out and 2 + 10 × 0.8 = 10 m up; the load (2 m long, 1 m high) hangs at the
// 7 m radius; the tipping line is 3 m ahead; the counterweight 4 m behind rotation.
//   Extent: behind = max(3, 4 + 1.2) = 5.2, so x from −5.2 − 1.5 = −6.7 to max(7 + 1, 7) + 1.5
//   = 9.5 m (16.2 m); heights to 10 + 1.5 = 11.5 m.
import { describe, expect, it } from 'vitest';
import type { Point, Shape, TextMetrics } from '@shared/drawing/scene';
import { sideViewFigure, type SideViewRole } from '@shared/drawing/side-view-figure';
import { PAPER_SIDE_VIEW, SCREEN_SIDE_VIEW, SCREEN_SIDE_VIEW_SIZE } from '@shared/drawing/side-view-layouts';
import { exampleResult } from '../stamp-fixtures';

type S = Shape<SideViewRole>;
const m = (value: number) => ({ value, unit: 'm' });

function simpleCrane() {
  const { inputs, result } = exampleResult('pass-outriggers');
  const crane = inputs.crane as Record<string, unknown>;
  const simple = {
    ...inputs,
    crane: {
      ...crane,
      boomLength: m(10),
      pivotOffset: m(1),
      pivotHeight: m(2),
      counterweight: { weight: { value: 10, unit: 't' }, cgBehindRotation: m(4) },
    },
    load: { ...(inputs.load as object), length: m(2), height: m(1) },
  };
  const figures = {
    ...result.figures,
    boomAngleDeg: (Math.atan2(8, 6) * 180) / Math.PI,
    radius: 7,
    tipping: { slewDeg: 180, edge: 'front', distanceAlongBoom: 3 },
  };
  return { inputs: simple, result: { ...result, figures } };
}

const lines = (shapes: S[], role: SideViewRole, width: number) =>
  shapes.filter(
    (s): s is Extract<S, { kind: 'line' }> =>
      s.kind === 'line' && s.stroke.role === role && s.stroke.width === width,
  );
const texts = (shapes: S[]) => shapes.filter((s): s is Extract<S, { kind: 'text' }> => s.kind === 'text');
const text = (shapes: S[], start: string) => texts(shapes).find((t) => t.text.startsWith(start))!;
const close = (a: Point, b: Point) => {
  expect(a[0]).toBeCloseTo(b[0], 6);
  expect(a[1]).toBeCloseTo(b[1], 6);
};

describe('side view figure, screen layout', () => {
  // 680 × 470 with margins 54, 16, 16, 110: plot 610 × 344, ground at y = 16 + 344 = 360. The
  // height governs: 344 / 11.5 = 29.913 px per metre (the width would allow 610 / 16.2 = 37.65).
  const k = 344 / 11.5;
  const X = (s: number) => 54 + (s + 6.7) * k;
  const Y = (h: number) => 360 - h * k;
  const { inputs, result } = simpleCrane();
  const figure = sideViewFigure(inputs, result, 'metric', SCREEN_SIDE_VIEW, SCREEN_SIDE_VIEW_SIZE)!;

  it('when a simple crane is drawn, then the boom runs from its foot to foot + L·(cos, sin) at scale', () => {
    expect(figure.width).toBe(680);
    expect(figure.height).toBe(470);
    const [boom] = lines(figure.shapes, 'ink', SCREEN_SIDE_VIEW.boom.width);
    close(boom.from, [X(1), Y(2)]);
    close(boom.to, [X(7), Y(10)]);
    // 10 m at scale, 0.6 of it across and 0.8 of it up (y runs down)
    close(boom.to, [boom.from[0] + 10 * k * 0.6, boom.from[1] - 10 * k * 0.8]);
    expect(boom.stroke.cap).toBe('round');
  });

  it('when a simple crane is drawn, then the hook hangs below the tip to the load at the radius', () => {
    const [hoist] = lines(figure.shapes, 'ink', SCREEN_SIDE_VIEW.hoist.width).filter(
      (l) => l.from[0] === l.to[0] && Math.abs(l.from[0] - X(7)) < 1e-9,
    );
    close(hoist.from, [X(7), Y(10)]);
    // load top at 1 + 0.3 m (it is drawn 0.3 m off the ground), the screen leaves a 0.3 m gap
    close(hoist.to, [X(7), Y(1.6)]);
    const load = figure.shapes.find(
      (s): s is Extract<S, { kind: 'polygon' }> =>
        s.kind === 'polygon' && s.fill === 'paper' && s.points[0][0] === X(6),
    )!;
    expect(load.points).toEqual([
      [X(6), Y(1.3)],
      [X(8), Y(1.3)],
      [X(8), Y(0.3)],
      [X(6), Y(0.3)],
    ]);
  });

  it('when a simple crane is drawn, then the tipping line stands 3 m ahead and the arms are dimensioned below the ground', () => {
    const [tipping] = lines(figure.shapes, 'tipping', SCREEN_SIDE_VIEW.tippingLine.width);
    close(tipping.from, [X(3), 360 + 84]);
    close(tipping.to, [X(3), Y(2 + 4.5)]);
    const dims = figure.shapes.filter((s): s is Extract<S, { kind: 'dimension' }> => s.kind === 'dimension');
    expect(dims).toHaveLength(2);
    close(dims[0].from, [X(3), 408]);
    close(dims[0].to, [X(7), 408]);
    close(dims[1].from, [X(-4), 436]);
    close(dims[1].to, [X(3), 436]);
    // arrowheads point outwards, tips 1.05 past the ends
    close(dims[0].heads[0][0], [X(3) - 1.05, 408]);
    close(dims[0].heads[1][0], [X(7) + 1.05, 408]);
    const loadArm = text(figure.shapes, 'load arm');
    expect(loadArm.text).toBe('load arm 4.00 m beyond the tipping line');
    expect(loadArm.anchor).toBe('middle');
    close(loadArm.at, [(X(3) + X(7)) / 2, 403]);
    expect(text(figure.shapes, 'counterweight arm').text).toBe('counterweight arm 7.00 m behind it');
    expect(text(figure.shapes, 'boom').text).toBe('boom 10.0 m at 53.1°');
    expect(figure.summary).toBe(
      'Side view to scale: tipping line 3.00 m from the centre of rotation, load arm 4.00 m beyond it, counterweight arm 7.00 m behind it',
    );
  });

  it('when a simple crane is drawn, then the supports sit on the ground either side of rotation', () => {
    const supports = figure.shapes.filter(
      (s): s is Extract<S, { kind: 'polygon' }> => s.kind === 'polygon' && s.fill === 'ink',
    );
    expect(supports.map((s) => s.points[0])).toEqual([
      [X(-3) - 6, 355],
      [X(3) - 6, 355],
    ]);
  });

  it('when the labels are painted, then they come after every line so nothing crosses them', () => {
    const firstLabel = figure.shapes.findIndex((s) => s.kind === 'text' && s.role === 'label');
    const lastLine = figure.shapes.findLastIndex((s) => s.kind !== 'text');
    expect(firstLabel).toBeGreaterThan(lastLine);
    // the caption is for the page under the figure, not inside it
    expect(figure.caption).toMatch(/^Drawn to scale in the plane of the boom/);
    expect(texts(figure.shapes).some((t) => t.text === figure.caption)).toBe(false);
  });
});

describe('side view figure, paper layout', () => {
  // 500 × 430 with margins 38, 10, 14, 78: plot 452 × 338, ground at y = 14 + 338 = 352. Here the
  // width governs: 452 / 16.2 = 27.901 pt per metre (the height would allow 338 / 11.5 = 29.39).
  const k = 452 / 16.2;
  const X = (s: number) => 38 + (s + 6.7) * k;
  const Y = (h: number) => 352 - h * k;
  const { inputs, result } = simpleCrane();
  // Every character half its size wide: the load arm's label (39 characters at 7.5 pt, 146 pt) is
  // wider than its 4 m arm (111.6 pt), the counterweight arm's (48, 180 pt) fits its 7 m (195.3 pt).
  const metrics: TextMetrics = {
    width: (t, size) => t.length * size * 0.5,
    wrap: (t) => [t.slice(0, 40), t.slice(40)],
  };
  const figure = sideViewFigure(
    inputs,
    result,
    'metric',
    PAPER_SIDE_VIEW,
    { width: 500, height: 430 },
    metrics,
  )!;

  it('when the width governs the scale, then the boom and grid are at 452 / 16.2 pt per metre', () => {
    const [boom] = lines(figure.shapes, 'ink', PAPER_SIDE_VIEW.boom.width);
    close(boom.from, [X(1), Y(2)]);
    close(boom.to, [X(7), Y(10)]);
    // the grid covers the drawing's extent only: up to 11.5 m, out to 9.5 m
    const grid = lines(figure.shapes, 'grid', PAPER_SIDE_VIEW.gridWidth);
    const vertical = grid.filter((l) => l.from[0] === l.to[0]);
    for (const l of vertical) {
      expect(l.from[1]).toBeCloseTo(Y(11.5), 6);
      expect(l.to[1]).toBe(352);
    }
    // 2 m squares: −6, −4 … 8 across
    expect(vertical.map((l) => Number(((l.from[0] - 38) / k - 6.7).toFixed(6)))).toEqual([
      -6, -4, -2, 0, 2, 4, 6, 8,
    ]);
  });

  it('when a dimension is too short for its label, then the label goes past its right end', () => {
    const loadArm = text(figure.shapes, 'load arm');
    expect(loadArm.anchor).toBe('start');
    close(loadArm.at, [X(7) + 8, 352 + 24 + 2.5]);
    const cwArm = text(figure.shapes, 'counterweight arm');
    expect(cwArm.text).toBe('counterweight arm 7.00 m behind the tipping line');
    expect(cwArm.anchor).toBe('middle');
    close(cwArm.at, [(X(-4) + X(3)) / 2, 352 + 48 - 4]);
  });

  it('when the caption is inside the figure, then its wrapped lines sit at the foot of the box', () => {
    const caption = texts(figure.shapes).filter((t) => t.role === 'axis' && t.at[1] > 400);
    expect(caption.map((t) => t.text)).toEqual([figure.caption.slice(0, 40), figure.caption.slice(40)]);
    expect(caption.map((t) => t.at)).toEqual([
      [0, 430 - 4 - 9],
      [0, 430 - 4],
    ]);
    expect(figure.caption).toMatch(/; grid 2 m\./);
    expect(texts(figure.shapes).every((t) => t.role === 'axis' || t.halo)).toBe(true);
  });
});
