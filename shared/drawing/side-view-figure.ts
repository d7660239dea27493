// The crane side view as a figure to paint: the scene in metres (side-view.ts) laid out at one of
// the two sizes (side-view-layouts.ts) as lines, boxes, circles, dimension lines and labels, y
// down from the figure's top-left corner. The package page paints it as SVG and the calculation
// sheet with pdf-lib; each maps the roles to its colours (the tipping line is red on screen,
// grey on paper) and neither computes a coordinate.
import { formatQuantity, sig3, toDisplay } from '@shared/engineering/format';
import type { LiftResult, UnitSystem } from '@shared/engineering/types';
import { squareGrid } from './plot-ticks';
import { arrowHeads, box, hatch, type Point, type Scene, type Shape, type TextMetrics } from './scene';
import type { LabelStyle, Reach, SideViewLayout } from './side-view-layouts';
import { sideViewScene } from './side-view';

/**
 * `ink` outlines and solid parts, `paper` white, `grid` the square grid, `ground` the ground's
 * hatching, `body` the upper works' fill, `tipping` the tipping line and `tippingMark` its
 * triangle, `label` the drawing's labels, `axis` tick labels, axis titles and the caption.
 */
export type SideViewRole =
  'ink' | 'paper' | 'grid' | 'ground' | 'body' | 'tipping' | 'tippingMark' | 'label' | 'axis';

export interface SideViewFigure extends Scene<SideViewRole> {
  /** One sentence for a screen reader. */
  summary: string;
  /** The caption; inside the figure too when the layout places it there. */
  caption: string;
}

type S = Shape<SideViewRole>;

function caption(result: LiftResult, system: UnitSystem, words: 'full' | 'brief', grid: string): string {
  const f = result.figures;
  const q = (v: number | null, kind: 'moment') => formatQuantity(v, kind, system);
  const ratio =
    f.stabilityRatio !== null
      ? `${words === 'full' ? ' —' : ','} ratio ${sig3(f.stabilityRatio)} (site minimum ${sig3(result.policy.minStabilityRatio)})`
      : '';
  if (words === 'full')
    return `Drawn to scale in the plane of the boom, over the support line nearest the load${
      f.overturningMoment !== null
        ? `. Overturning moment ${q(f.overturningMoment, 'moment')} against resisting moment ${q(f.resistingMoment, 'moment')}${ratio}`
        : ''
    }.`;
  return `To scale in the plane of the boom over the support line nearest the load; grid ${grid}.${
    f.overturningMoment !== null
      ? ` Overturning ${q(f.overturningMoment, 'moment')} against resisting ${q(f.resistingMoment, 'moment')}${ratio}.`
      : ''
  }`;
}

/**
 * The side view of `inputs` and `result` laid out by `layout` in a `size` figure, or null when it
 * cannot be drawn (sideViewUnavailableReason says why). `metrics` lets a renderer that can measure
 * its text keep short dimensions' labels clear and wrap the caption inside the figure.
 */
export function sideViewFigure(
  inputs: unknown,
  result: LiftResult,
  system: UnitSystem,
  layout: SideViewLayout,
  size: { width: number; height: number },
  metrics?: TextMetrics,
): SideViewFigure | null {
  const scene = sideViewScene(inputs, result);
  if (!scene) return null;
  const { fulcrum, radius, pivotOffset, pivotHeight: pH, tipX, tipY, cw, cwWeight } = scene;
  const { loadLength, loadHeight, xMin, xMax, yMax, boomLength, angle, loadArm, cwArm } = scene;
  const L = layout;
  const { width: W, height: H } = size;
  const M = L.margin;
  const pw = W - M.left - M.right;
  const ph = H - M.top - M.bottom;
  const scale = Math.min(pw / (xMax - xMin), ph / yMax);
  const X = (s: number) => M.left + (s - xMin) * scale;
  const ground = M.top + ph;
  const Y = (h: number) => ground - h * scale;
  const reach = (r: Reach) => (r.m ?? 0) * scale + (r.u ?? 0);
  const left = X(xMin);
  const right = L.span === 'plot' ? W - M.right : X(xMax);
  const top = L.span === 'plot' ? M.top : Y(yMax);
  const len = (m: number) => formatQuantity(m, 'length', system);
  const weight = (n: number) => formatQuantity(n, 'weight', system);

  const shapes: S[] = [];
  // Labels go on last, over the lines, on their halos.
  const labels: S[] = [];
  const line = (from: Point, to: Point, role: SideViewRole, width: number, dash?: readonly number[]) =>
    shapes.push({ kind: 'line', from, to, stroke: { role, width, dash } });
  const text = (
    to: S[],
    t: string,
    at: Point,
    style: LabelStyle,
    anchor: 'start' | 'middle' | 'end',
    role: SideViewRole = 'label',
  ) =>
    to.push({
      kind: 'text',
      at,
      text: t,
      size: style.size,
      bold: style.bold,
      halo: style.halo,
      anchor,
      role,
    });

  // Square grid at round display units, heights (and distances) labelled.
  const lu = toDisplay(1, 'length', system);
  const grid = squareGrid(xMin * lu.value, xMax * lu.value, yMax * lu.value);
  const tick = (v: number) => String(Number(v.toPrecision(6)));
  for (const v of grid.x) {
    const x = X(v / lu.value);
    line([x, top], [x, ground], 'grid', L.gridWidth);
    if (L.xTicks) text(shapes, tick(v), [x, ground + L.xTicks.dy], L.xTicks, 'middle', 'axis');
  }
  for (const v of grid.y) {
    const y = Y(v / lu.value);
    line([left, y], [right, y], 'grid', L.gridWidth);
    text(shapes, tick(v), [M.left - L.yTicks.dx, y + L.yTicks.dy], L.yTicks, 'end', 'axis');
  }
  const ht = L.heightTitle;
  if (ht.place === 'beside')
    shapes.push({
      kind: 'text',
      at: [ht.x, M.top + ph / 2],
      text: `Height above ground (${lu.unit})`,
      size: ht.size,
      bold: true,
      anchor: 'middle',
      role: 'axis',
      rotate: -90,
    });
  else
    text(shapes, `height (${lu.unit})`, [0, Y(yMax) - ht.dy], { size: ht.size, bold: true }, 'start', 'axis');
  const gridWords = `${tick(grid.step)} ${lu.unit}`;
  if (L.distanceTitle)
    text(
      shapes,
      `Horizontal distance from the centre of rotation (${lu.unit}), one grid square = ${gridWords}`,
      [M.left + pw / 2, H - L.distanceTitle.fromBottom],
      { size: L.distanceTitle.size, bold: true },
      'middle',
      'axis',
    );

  // Ground with hatching below.
  const gh = L.ground.hatch;
  const ghThrough: Point = gh.phase.from === 'origin' ? [gh.phase.at, 0] : [left + gh.phase.at, ground];
  for (const [a, b] of hatch(left, ground, right - left, gh.depth, gh.lean, gh.step, ghThrough))
    line(a, b, 'ground', gh.width);
  line([left, ground], [right, ground], 'ink', L.ground.width);

  // Supports, carrier, upper works, counterweight.
  const outline = { role: 'ink' as const, width: L.outline };
  for (const s of [-fulcrum, fulcrum])
    shapes.push({
      kind: 'polygon',
      points: box(X(s) - L.support.width / 2, ground - L.support.height, L.support.width, L.support.height),
      fill: 'ink',
    });
  const carrierTop = Y(pH * 0.55);
  const carrierH = Y(0.35) - carrierTop;
  shapes.push({
    kind: 'polygon',
    points: box(X(-fulcrum), carrierTop, X(fulcrum) - X(-fulcrum), carrierH),
    fill: 'paper',
    stroke: outline,
  });
  if (L.carrierLabel && carrierH >= L.carrierLabel.minHeight)
    text(shapes, 'carrier', [X(-fulcrum) + 4, Y(0.35) - 2.5], L.carrierLabel, 'start', 'axis');
  const upperL = X(-(cw ?? 1.5) - 0.4);
  shapes.push({
    kind: 'polygon',
    points: box(upperL, Y(pH), X(pivotOffset + 0.6) - upperL, carrierTop - Y(pH)),
    fill: 'body',
    stroke: outline,
  });
  if (cw !== null) {
    const [cx, cy, cwW, cwH] = [X(-cw - 0.7), Y(pH + 0.4), 1.4 * scale, 1.3 * scale];
    const h = L.counterweightHatch;
    const through: Point = h.phase.from === 'origin' ? [h.phase.at, 0] : [cx + h.phase.at, cy + cwH];
    shapes.push({ kind: 'polygon', points: box(cx, cy, cwW, cwH), fill: 'paper' });
    for (const [a, b] of hatch(cx, cy, cwW, cwH, h.lean, h.step, through)) line(a, b, 'ink', h.width);
    shapes.push({ kind: 'polygon', points: box(cx, cy, cwW, cwH), stroke: outline });
    const cl = L.counterweightLabel;
    if (cwWeight !== null)
      text(
        labels,
        `counterweight ${weight(cwWeight)}`,
        [cl.at === 'centre' ? X(-cw) : cx, cy - reach(cl.above)],
        cl,
        cl.at === 'centre' ? 'middle' : 'start',
      );
  }

  // Centre of rotation and tipping line.
  const c = L.centreLine;
  const cTop = Y(pH) - reach(c.above);
  line([X(0), ground + c.below], [X(0), cTop], 'ink', c.width, c.dash);
  text(labels, 'centre of rotation', [X(0) + (c.label.dx ?? 0), cTop + (c.label.dy ?? 0)], c.label, 'end');
  const t = L.tippingLine;
  const tTop = Y(pH) - reach(t.above);
  line([X(fulcrum), ground + t.below], [X(fulcrum), tTop], 'tipping', t.width, t.dash);
  const apex = ground + t.mark.apex;
  shapes.push({
    kind: 'polygon',
    points: [
      [X(fulcrum), apex],
      [X(fulcrum) - t.mark.half, apex + t.mark.depth],
      [X(fulcrum) + t.mark.half, apex + t.mark.depth],
    ],
    fill: 'tippingMark',
  });
  text(labels, 'tipping line', [X(fulcrum) + (t.label.dx ?? 0), tTop + (t.label.dy ?? 0)], t.label, 'start');

  // Boom, hoist line and load.
  const foot: Point = [X(pivotOffset), Y(pH)];
  const tip: Point = [X(tipX), Y(tipY)];
  shapes.push({
    kind: 'line',
    from: foot,
    to: tip,
    stroke: { role: 'ink', width: L.boom.width, cap: 'round' },
  });
  line(foot, tip, 'paper', L.boom.core, L.boom.coreDash);
  shapes.push({ kind: 'circle', centre: foot, r: L.boom.pivotRadius, fill: 'paper', stroke: outline });
  const loadTop = Y(loadHeight + 0.3);
  line([X(radius), Y(tipY)], [X(radius), Y(loadHeight + 0.3 + L.hoist.gap)], 'ink', L.hoist.width);
  const [lx, lw, lh] = [X(radius - loadLength / 2), loadLength * scale, loadHeight * scale];
  shapes.push({ kind: 'polygon', points: box(lx, loadTop, lw, lh), fill: 'paper' });
  const lhs = L.loadHatch;
  if (lhs.kind === 'cross')
    for (const lean of ['falling', 'rising'] as const)
      for (const [a, b] of hatch(lx, loadTop, lw, lh, lean, lhs.step, [0, 0])) line(a, b, 'ink', lhs.width);
  else {
    line([lx, loadTop + lh], [lx + lw, loadTop], 'ink', lhs.width);
    line([lx, loadTop], [lx + lw, loadTop + lh], 'ink', lhs.width);
  }
  shapes.push({ kind: 'polygon', points: box(lx, loadTop, lw, lh), stroke: outline });
  const ll = L.loadLabel;
  text(
    labels,
    `gross load ${weight(result.figures.grossLoad)}`,
    [X(radius), loadTop - ll.above - (tipY - loadHeight) * scale * ll.hoistShare],
    ll,
    ll.endNear !== null && X(radius) > X(xMax) - ll.endNear ? 'end' : 'middle',
  );
  const bl = L.boom.label;
  text(
    labels,
    `boom ${len(boomLength)} at ${sig3(angle)}°`,
    [tip[0] + (bl.dx ?? 0), tip[1] + (bl.dy ?? 0)],
    bl,
    'end',
  );

  // The moment arms, dimensioned below the ground.
  const A = L.arms;
  const arm = (x1: number, x2: number, y: number, words: string) => {
    const from: Point = [x1, y];
    const to: Point = [x2, y];
    shapes.push({
      kind: 'dimension',
      from,
      to,
      stroke: { role: 'ink', width: A.width },
      heads: arrowHeads(from, to, A.arrow),
    });
    const [lo, hi] = [Math.min(x1, x2), Math.max(x1, x2)];
    const long =
      A.label.beside && metrics && metrics.width(words, A.label.size, !!A.label.bold) + 8 > hi - lo;
    if (long && A.label.beside)
      text(labels, words, [hi + A.label.beside.dx, y + A.label.beside.dy], A.label, 'start');
    else text(labels, words, [(lo + hi) / 2, y - (A.label.dy ?? 0)], A.label, 'middle');
  };
  const [d1, d2] = [ground + A.below[0], ground + A.below[1]];
  arm(X(fulcrum), X(radius), d1, `load arm ${len(loadArm)} beyond the tipping line`);
  line([X(radius), ground], [X(radius), d1 + A.extension.past], 'ink', A.extension.width);
  if (cw !== null && cwArm !== null) {
    arm(X(-cw), X(fulcrum), d2, `counterweight arm ${len(cwArm)} ${A.counterweightWords}`);
    line(
      [X(-cw), Y(pH + A.extension.counterweightFrom)],
      [X(-cw), d2 + A.extension.past],
      'ink',
      A.extension.width,
      [2, 2],
    );
  }

  shapes.push(...labels);
  const words = caption(result, system, L.captionWords, gridWords);
  if (L.caption) {
    const { size: cs, lineGap, bottom } = L.caption;
    const lines = metrics ? metrics.wrap(words, cs, false, W) : [words];
    lines.forEach((ln, i) =>
      text(shapes, ln, [0, H - bottom - (lines.length - 1 - i) * lineGap], { size: cs }, 'start', 'axis'),
    );
  }
  return {
    width: W,
    height: H,
    shapes,
    caption: words,
    summary: `Side view to scale: tipping line ${len(fulcrum)} from the centre of rotation, load arm ${len(loadArm)} beyond it${cwArm !== null ? `, counterweight arm ${len(cwArm)} behind it` : ''}`,
  };
}
