// The crane seen from the side for the calculation sheet, drawn to scale as vector from the
// inputs: ground, outriggers or tracks and carrier, the tipping line, the upper works and
// counterweight, the boom at its angle to the load at its radius, and the two moment arms
// about the tipping line, labelled. Greys, hatching and dashes only, so it prints in
// greyscale. Mobile cranes only: a gantry's frame and backstay are described in words.
import { rgb, type PDFPage } from 'pdf-lib';
import { formatQuantity, sig3, toDisplay } from '@shared/engineering/format';
import type { LiftResult, UnitSystem } from '@shared/engineering/types';
import {
  drawText,
  INK,
  INK_SOFT,
  RULE,
  safeText,
  WHITE,
  widthOf,
  wrapText,
  type Face,
  type Fonts,
} from './text-pdf';
import { squareGrid } from '@shared/drawing/plot-ticks';
import { sideViewScene, sideViewUnavailableReason } from '@shared/drawing/side-view';

export const SIDE_VIEW_HEIGHT = 430;
const TIPPING = rgb(0.25, 0.25, 0.25);
const GRID = rgb(0.93, 0.92, 0.89);

export { sideViewUnavailableReason };

function label(
  page: PDFPage,
  font: Face,
  text: string,
  x: number,
  y: number,
  size: number,
  align: 'left' | 'centre' | 'right' = 'left',
  halo = true,
) {
  const t = safeText(text, font);
  const w = widthOf(t, font, size);
  const lx = align === 'centre' ? x - w / 2 : align === 'right' ? x - w : x;
  if (halo) page.drawRectangle({ x: lx - 1.5, y: y - 2, width: w + 3, height: size + 2.5, color: WHITE });
  drawText(page, t, { x: lx, y, size, font, color: INK });
}

/** A dimension's label above its line, or beside its right end when the line is too short. */
function dimLabel(
  queue: (...args: Parameters<typeof label>) => void,
  page: PDFPage,
  font: Face,
  text: string,
  x1: number,
  x2: number,
  y: number,
) {
  const w = widthOf(safeText(text, font), font, 7.5);
  const lo = Math.min(x1, x2);
  const hi = Math.max(x1, x2);
  if (w + 8 <= hi - lo) queue(page, font, text, (lo + hi) / 2, y + 4, 7.5, 'centre');
  else queue(page, font, text, hi + 8, y - 2.5, 7.5, 'left');
}

function dimension(page: PDFPage, x1: number, x2: number, y: number) {
  page.drawLine({ start: { x: x1, y }, end: { x: x2, y }, thickness: 0.9, color: INK });
  const dir = Math.sign(x2 - x1) || 1;
  for (const [x, d] of [
    [x1, dir],
    [x2, -dir],
  ] as const) {
    page.drawSvgPath(`M${x} ${-y} L${x + 6 * d} ${-(y + 2.6)} L${x + 6 * d} ${-(y - 2.6)} Z`, {
      x: 0,
      y: 0,
      color: INK,
    });
  }
}

/** Draw the side view into `box` (page coordinates, y up). Check sideViewUnavailableReason first. */
export function drawSideView(
  page: PDFPage,
  fonts: Fonts,
  box: { x: number; y: number; width: number; height: number },
  inputs: unknown,
  result: LiftResult,
  system: UnitSystem,
) {
  const f = result.figures;
  const scene = sideViewScene(inputs, result);
  if (!scene) return;
  const { fulcrum, angle, radius, pivotOffset, pivotHeight, tipX, tipY, cw, cwWeight } = scene;
  const { loadLength, loadHeight, xMin, xMax, yMax, boomLength } = scene;

  const M = { left: 38, right: 10, top: 14, bottom: 78 };
  const pw = box.width - M.left - M.right;
  const ph = box.height - M.top - M.bottom;
  const scale = Math.min(pw / (xMax - xMin), ph / yMax);
  const X = (s: number) => box.x + M.left + (s - xMin) * scale;
  const ground = box.y + M.bottom;
  const Y = (h: number) => ground + h * scale;
  const right = X(xMax);
  const len = (m: number) => formatQuantity(m, 'length', system);
  const { regular, bold } = fonts;
  // Labels go on last, on their white halos, so no line runs through them.
  const queued: Parameters<typeof label>[] = [];
  const queue = (...args: Parameters<typeof label>) => queued.push(args);

  // Grid at round display units, heights labelled.
  const lu = toDisplay(1, 'length', system);
  const grid = squareGrid(xMin * lu.value, xMax * lu.value, yMax * lu.value);
  for (const v of grid.x)
    page.drawLine({
      start: { x: X(v / lu.value), y: ground },
      end: { x: X(v / lu.value), y: Y(yMax) },
      thickness: 0.5,
      color: GRID,
    });
  for (const v of grid.y) {
    page.drawLine({
      start: { x: X(xMin), y: Y(v / lu.value) },
      end: { x: right, y: Y(v / lu.value) },
      thickness: 0.5,
      color: GRID,
    });
    const t = String(Number(v.toPrecision(6)));
    drawText(page, t, {
      x: X(xMin) - 4 - widthOf(t, regular, 6.5),
      y: Y(v / lu.value) - 2.2,
      size: 6.5,
      font: regular,
      color: INK_SOFT,
    });
  }
  drawText(page, `height (${lu.unit})`, { x: box.x, y: Y(yMax) + 3, size: 6.5, font: bold, color: INK_SOFT });

  // Ground with hatching below.
  let hatch = '';
  for (let x = X(xMin); x < right - 6; x += 7)
    hatch += `M${x.toFixed(1)} ${(-ground).toFixed(1)} L${(x + 6).toFixed(1)} ${(-(ground - 6)).toFixed(1)} `;
  page.drawSvgPath(hatch, { x: 0, y: 0, borderColor: RULE, borderWidth: 0.7 });
  page.drawLine({
    start: { x: X(xMin), y: ground },
    end: { x: right, y: ground },
    thickness: 1.4,
    color: INK,
  });

  // Supports, carrier, upper works, counterweight.
  for (const s of [-fulcrum, fulcrum])
    page.drawRectangle({ x: X(s) - 5, y: ground, width: 10, height: 4, color: INK });
  page.drawRectangle({
    x: X(-fulcrum),
    y: Y(0.35),
    width: X(fulcrum) - X(-fulcrum),
    height: Y(pivotHeight * 0.55) - Y(0.35),
    color: WHITE,
    borderColor: INK,
    borderWidth: 1.2,
  });
  if (Y(pivotHeight * 0.55) - Y(0.35) >= 9)
    drawText(page, 'carrier', {
      x: X(-fulcrum) + 4,
      y: Y(0.35) + 2.5,
      size: 6,
      font: regular,
      color: INK_SOFT,
    });
  const upperL = X(-(cw ?? 1.5) - 0.4);
  page.drawRectangle({
    x: upperL,
    y: Y(pivotHeight * 0.55),
    width: X(pivotOffset + 0.6) - upperL,
    height: Y(pivotHeight) - Y(pivotHeight * 0.55),
    color: rgb(0.957, 0.949, 0.929),
    borderColor: INK,
    borderWidth: 1.2,
  });
  if (cw !== null) {
    const cx = X(-cw - 0.7);
    const cy = Y(pivotHeight + 0.4) - 1.3 * scale;
    const cwW = 1.4 * scale;
    const cwH = 1.3 * scale;
    page.drawRectangle({
      x: cx,
      y: cy,
      width: cwW,
      height: cwH,
      color: WHITE,
      borderColor: INK,
      borderWidth: 1.2,
    });
    let d = '';
    for (let t = 3; t < cwW + cwH; t += 3.5) {
      const x1 = cx + Math.max(0, t - cwH);
      const y1 = cy + Math.min(t, cwH);
      const x2 = cx + Math.min(t, cwW);
      const y2 = cy + Math.max(0, t - cwW);
      d += `M${x1.toFixed(1)} ${(-y1).toFixed(1)} L${x2.toFixed(1)} ${(-y2).toFixed(1)} `;
    }
    page.drawSvgPath(d, { x: 0, y: 0, borderColor: INK, borderWidth: 0.8 });
    if (cwWeight !== null)
      queue(
        page,
        regular,
        `counterweight ${formatQuantity(cwWeight, 'weight', system)}`,
        cx,
        cy + cwH + 4,
        7,
        'left',
      );
  }

  // Centre of rotation and tipping line.
  page.drawLine({
    start: { x: X(0), y: ground - 6 },
    end: { x: X(0), y: Y(pivotHeight) + 26 },
    thickness: 0.8,
    color: INK,
    dashArray: [8, 2.5, 1.5, 2.5],
  });
  queue(page, regular, 'centre of rotation', X(0) - 3, Y(pivotHeight) + 23, 6.5, 'right');
  page.drawLine({
    start: { x: X(fulcrum), y: ground - 60 },
    end: { x: X(fulcrum), y: Y(pivotHeight) + 44 },
    thickness: 1.4,
    color: TIPPING,
    dashArray: [5, 2.5],
  });
  page.drawSvgPath(`M${X(fulcrum)} ${-ground} l-5 8 h10 Z`, { x: 0, y: 0, color: INK });
  queue(page, bold, 'tipping line', X(fulcrum) + 3, Y(pivotHeight) + 40, 7, 'left');

  // Boom, hoist line, load.
  page.drawLine({
    start: { x: X(pivotOffset), y: Y(pivotHeight) },
    end: { x: X(tipX), y: Y(tipY) },
    thickness: 4.5,
    color: INK,
    lineCap: 1,
  });
  page.drawLine({
    start: { x: X(pivotOffset), y: Y(pivotHeight) },
    end: { x: X(tipX), y: Y(tipY) },
    thickness: 1.2,
    color: WHITE,
    dashArray: [3.5, 3.5],
  });
  page.drawCircle({
    x: X(pivotOffset),
    y: Y(pivotHeight),
    size: 3,
    color: WHITE,
    borderColor: INK,
    borderWidth: 1.2,
  });
  page.drawLine({
    start: { x: X(radius), y: Y(tipY) },
    end: { x: X(radius), y: Y(loadHeight + 0.3) },
    thickness: 1,
    color: INK,
  });
  const lx = X(radius - loadLength / 2);
  const ly = Y(0.3);
  const lw = loadLength * scale;
  const lh = loadHeight * scale;
  page.drawRectangle({
    x: lx,
    y: ly,
    width: lw,
    height: lh,
    color: WHITE,
    borderColor: INK,
    borderWidth: 1.2,
  });
  page.drawSvgPath(`M${lx} ${-ly} L${lx + lw} ${-(ly + lh)} M${lx} ${-(ly + lh)} L${lx + lw} ${-ly}`, {
    x: 0,
    y: 0,
    borderColor: INK,
    borderWidth: 0.6,
  });
  queue(
    page,
    bold,
    `gross load ${formatQuantity(f.grossLoad, 'weight', system)}`,
    X(radius),
    ly + lh + 6,
    7.5,
    X(radius) > right - 60 ? 'right' : 'centre',
  );
  queue(page, regular, `boom ${len(boomLength)} at ${sig3(angle)}°`, X(tipX) - 6, Y(tipY) - 2, 7, 'right');

  // Moment arms below the ground.
  const d1 = ground - 24;
  const d2 = ground - 48;
  dimension(page, X(fulcrum), X(radius), d1);
  page.drawLine({
    start: { x: X(radius), y: ground },
    end: { x: X(radius), y: d1 - 5 },
    thickness: 0.5,
    color: INK,
  });
  dimLabel(
    queue,
    page,
    bold,
    `load arm ${len(radius - fulcrum)} beyond the tipping line`,
    X(fulcrum),
    X(radius),
    d1,
  );
  if (cw !== null) {
    dimension(page, X(-cw), X(fulcrum), d2);
    page.drawLine({
      start: { x: X(-cw), y: Y(pivotHeight) },
      end: { x: X(-cw), y: d2 - 5 },
      thickness: 0.5,
      color: INK,
      dashArray: [2, 2],
    });
    dimLabel(
      queue,
      page,
      bold,
      `counterweight arm ${len(cw + fulcrum)} behind the tipping line`,
      X(-cw),
      X(fulcrum),
      d2,
    );
  }
  for (const args of queued) label(...args);
  const caption = `To scale in the plane of the boom over the support line nearest the load; grid ${Number(grid.step.toPrecision(6))} ${lu.unit}.${
    f.overturningMoment !== null
      ? ` Overturning ${formatQuantity(f.overturningMoment, 'moment', system)} against resisting ${formatQuantity(f.resistingMoment, 'moment', system)}${f.stabilityRatio !== null ? `, ratio ${sig3(f.stabilityRatio)} (site minimum ${sig3(result.policy.minStabilityRatio)})` : ''}.`
      : ''
  }`;
  const lines = wrapText(caption, regular, 7, box.width);
  lines.forEach((t, i) =>
    drawText(page, t, {
      x: box.x,
      y: box.y + 4 + (lines.length - 1 - i) * 9,
      size: 7,
      font: regular,
      color: INK_SOFT,
    }),
  );
}
