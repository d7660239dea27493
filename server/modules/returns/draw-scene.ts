// Paints a figure computed in shared/drawing (see scene.ts) on a pdf-lib page: the figure's y-down
// units become the page's y-up points inside `box`, and each role takes its colour from `colours`.
// Nothing here decides where anything goes.
import { degrees, LineCapStyle, type Color, type PDFPage } from 'pdf-lib';
import type { Point, Scene, Stroke, TextMetrics } from '@shared/drawing/scene';
import { drawText, safeText, WHITE, widthOf, wrapText, type Fonts } from './text-pdf';

/** How the embedded Lato measures and wraps, for figures that keep their labels clear. */
export function pdfMetrics(fonts: Fonts): TextMetrics {
  const font = (bold: boolean) => (bold ? fonts.bold : fonts.regular);
  return {
    width: (text, size, bold) => widthOf(safeText(text, font(bold)), font(bold), size),
    wrap: (text, size, bold, maxWidth) => wrapText(text, font(bold), size, maxWidth),
  };
}

/** Paint `scene` with its top-left corner at the top-left of `box` (page coordinates, y up). */
export function paintScene<R extends string>(
  page: PDFPage,
  fonts: Fonts,
  box: { x: number; y: number },
  scene: Scene<R>,
  colours: Record<R, Color>,
) {
  const top = box.y + scene.height;
  const at = (p: Point) => ({ x: box.x + p[0], y: top - p[1] });
  // drawSvgPath draws y down from its origin, so paths keep the figure's own coordinates.
  const origin = { x: box.x, y: top };
  const path = (points: readonly Point[], close: boolean) =>
    points.map(([x, y], i) => `${i ? 'L' : 'M'}${x} ${y}`).join(' ') + (close ? ' Z' : '');
  const border = (s: Stroke<R> | undefined) =>
    s
      ? {
          borderColor: colours[s.role],
          borderWidth: s.width,
          borderDashArray: s.dash ? [...s.dash] : undefined,
          borderLineCap: s.cap === 'round' ? LineCapStyle.Round : undefined,
        }
      : { borderColor: undefined };
  const line = (from: Point, to: Point, s: Stroke<R>) =>
    page.drawLine({
      start: at(from),
      end: at(to),
      thickness: s.width,
      color: colours[s.role],
      dashArray: s.dash ? [...s.dash] : undefined,
      lineCap: s.cap === 'round' ? LineCapStyle.Round : undefined,
    });

  for (const s of scene.shapes) {
    switch (s.kind) {
      case 'line':
        line(s.from, s.to, s.stroke);
        break;
      case 'polyline':
        page.drawSvgPath(path(s.points, false), { ...origin, ...border(s.stroke), color: undefined });
        break;
      case 'polygon':
        page.drawSvgPath(path(s.points, true), {
          ...origin,
          ...border(s.stroke),
          color: s.fill ? colours[s.fill] : undefined,
        });
        break;
      case 'circle':
        page.drawCircle({
          ...at(s.centre),
          size: s.r,
          color: s.fill ? colours[s.fill] : undefined,
          borderColor: s.stroke ? colours[s.stroke.role] : undefined,
          borderWidth: s.stroke?.width,
        });
        break;
      case 'dimension':
        line(s.from, s.to, s.stroke);
        for (const head of s.heads)
          page.drawSvgPath(path(head, true), { ...origin, color: colours[s.stroke.role] });
        break;
      case 'text': {
        const font = s.bold ? fonts.bold : fonts.regular;
        const t = safeText(s.text, font);
        const w = widthOf(t, font, s.size);
        const shift = s.anchor === 'middle' ? w / 2 : s.anchor === 'end' ? w : 0;
        // The baseline's direction on the page (y up): clockwise on the figure is clockwise here too.
        const a = ((s.rotate ?? 0) * Math.PI) / 180;
        const [ux, uy] = [Math.cos(a), -Math.sin(a)];
        const p = at(s.at);
        const x = p.x - ux * shift;
        const y = p.y - uy * shift;
        const rotate = s.rotate ? degrees(-s.rotate) : undefined;
        if (s.halo)
          page.drawRectangle({
            // 1.5 before the text and 2 below its baseline, measured along and across it
            x: x - 1.5 * ux + 2 * uy,
            y: y - 1.5 * uy - 2 * ux,
            width: w + 3,
            height: s.size + 2.5,
            color: WHITE,
            rotate,
          });
        drawText(page, t, { x, y, size: s.size, font, color: colours[s.role], rotate: -(s.rotate ?? 0) });
        break;
      }
    }
  }
}
