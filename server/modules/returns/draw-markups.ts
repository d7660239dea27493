// Burns the engineer's markups into a page of the return as vector drawing, in their colour,
// at their stored coordinates: outlines for rectangles, ellipses and clouds (a scalloped
// outline of arcs), an arrow with a filled head, free text, and numbered pins (a filled disc
// with the number in white). A markup a finding is tied to carries the finding's number ("F3")
// in its label. Text wraps inside its box (the stored width, else 220 pt, never past the page's
// margins) and is kept on the page, and so is every label: the layout is shared with the
// workspace (shared/drawing/text-layout.ts). Called inside the page's display frame (page-frame-pdf.ts).
import type { PDFPage } from 'pdf-lib';
import { MARKUP_COLOURS, type MarkupColour } from '@shared/schemas/reviews';
import type { MarkupKind } from '@shared/vocabulary/markups';
import { markupToDisplay, type PageFrame } from './page-frame-pdf';
import { drawText, hexColour, safeText, WHITE, widthOf, type Fonts } from './text-pdf';
import { layoutLabel, layoutTextBox } from '@shared/drawing/text-layout';
import { cloudPath } from '@shared/drawing/cloud-path';

export interface MarkupToDraw {
  kind: MarkupKind;
  geometry: Record<string, number>;
  colour: MarkupColour;
  text: string | null;
  number: number | null;
  /** The numbers of the findings tied to this markup, as the calculation sheet lists them ("F3"). */
  findings?: string[];
}

const STROKE = 1.6;
const PIN_RADIUS = 8;
const HEAD_LENGTH = 11;
const HEAD_HALF_WIDTH = 4.5;

const num = (g: Record<string, number>, k: string, dflt = 0) =>
  typeof g[k] === 'number' && Number.isFinite(g[k]) ? g[k] : dflt;

/** A stored box as a box in the display frame (a quarter turn swaps width and height). */
function boxInFrame(f: PageFrame, g: Record<string, number>) {
  const x = num(g, 'x');
  const y = num(g, 'y');
  const w = Math.max(num(g, 'width', 1), 1);
  const h = Math.max(num(g, 'height', 1), 1);
  const [u1, v1] = markupToDisplay(f, x, y);
  const [u2, v2] = markupToDisplay(f, x + w, y + h);
  return {
    x: Math.min(u1, u2),
    y: Math.min(v1, v2),
    width: Math.abs(u2 - u1),
    height: Math.abs(v2 - v1),
  };
}

/** A label on its white backing, kept on the page (layoutLabel). */
function drawLabel(
  page: PDFPage,
  f: PageFrame,
  fonts: Fonts,
  text: string,
  x: number,
  y: number,
  colour: ReturnType<typeof hexColour>,
  below?: number,
) {
  const block = layoutLabel(safeText(text, fonts.bold), { x, y }, f, measureBold(fonts), below);
  if (block.lines.length === 0 || (block.lines.length === 1 && block.lines[0] === '')) return;
  const { lines, lineHeight: lh, size } = block;
  page.drawRectangle({
    x: block.x - 2,
    y: block.y - (lines.length - 1) * lh - 2.5,
    width: block.width + 4,
    height: lines.length * lh + 2,
    color: WHITE,
    opacity: 0.85,
  });
  lines.forEach((line, i) =>
    drawText(page, line, { x: block.x, y: block.y - i * lh, size, font: fonts.bold, color: colour }),
  );
}

const measureBold = (fonts: Fonts) => (t: string, size: number) => widthOf(t, fonts.bold, size);

/** A text markup, wrapped inside its box and kept on the page (layoutTextBox, as the workspace draws it). */
function drawTextBox(
  page: PDFPage,
  f: PageFrame,
  fonts: Fonts,
  m: MarkupToDraw,
  colour: ReturnType<typeof hexColour>,
) {
  const g = m.geometry;
  const [x, y] = markupToDisplay(f, num(g, 'x'), num(g, 'y'));
  const width = typeof g.width === 'number' && g.width > 0 ? g.width : undefined;
  const block = layoutTextBox(
    { x, y, fontSize: num(g, 'fontSize', 11), width },
    safeText(m.text ?? '', fonts.bold, true),
    f,
    measureBold(fonts),
  );
  block.lines.forEach((line, i) =>
    drawText(page, line, {
      x: block.x,
      y: block.y - i * block.lineHeight,
      size: block.size,
      font: fonts.bold,
      color: colour,
    }),
  );
  return block;
}

/** Draw one page's markups. Must run inside inDisplayFrame for that page. */
export function drawMarkups(page: PDFPage, frame: PageFrame, markups: MarkupToDraw[], fonts: Fonts) {
  for (const m of markups) {
    const colour = hexColour(MARKUP_COLOURS[m.colour] ?? MARKUP_COLOURS.rust);
    const g = m.geometry;
    const tag = m.findings?.length ? m.findings.join(' ') : null;
    const typed = m.kind !== 'text' && m.text && m.text.trim() ? m.text.trim() : null;
    const note = tag && typed ? `${tag} · ${typed}` : (tag ?? typed);
    switch (m.kind) {
      case 'rectangle': {
        const b = boxInFrame(frame, g);
        page.drawRectangle({ ...b, borderColor: colour, borderWidth: STROKE });
        if (note) drawLabel(page, frame, fonts, note, b.x, b.y + b.height + 4, colour, b.y - 12);
        break;
      }
      case 'ellipse': {
        const b = boxInFrame(frame, g);
        page.drawEllipse({
          x: b.x + b.width / 2,
          y: b.y + b.height / 2,
          xScale: b.width / 2,
          yScale: b.height / 2,
          borderColor: colour,
          borderWidth: STROKE,
        });
        if (note) drawLabel(page, frame, fonts, note, b.x, b.y + b.height + 4, colour, b.y - 12);
        break;
      }
      case 'cloud': {
        const b = boxInFrame(frame, g);
        // drawSvgPath puts the path's origin at (x, y) with its y axis pointing down.
        page.drawSvgPath(cloudPath(b.width, b.height), {
          x: b.x,
          y: b.y + b.height,
          borderColor: colour,
          borderWidth: STROKE,
        });
        if (note) drawLabel(page, frame, fonts, note, b.x, b.y + b.height + 14, colour, b.y - 20);
        break;
      }
      case 'arrow': {
        const [x1, y1] = markupToDisplay(frame, num(g, 'x1'), num(g, 'y1'));
        const [x2, y2] = markupToDisplay(frame, num(g, 'x2'), num(g, 'y2'));
        const len = Math.hypot(x2 - x1, y2 - y1);
        if (len < 0.5) break;
        const ux = (x2 - x1) / len;
        const uy = (y2 - y1) / len;
        const head = Math.min(HEAD_LENGTH, len * 0.6);
        const bx = x2 - ux * head;
        const by = y2 - uy * head;
        page.drawLine({
          start: { x: x1, y: y1 },
          end: { x: bx + ux * 0.5, y: by + uy * 0.5 },
          thickness: STROKE,
          color: colour,
          lineCap: 1,
        });
        const hw = (HEAD_HALF_WIDTH * head) / HEAD_LENGTH;
        const p = (x: number, y: number) => `${x.toFixed(2)} ${(-y).toFixed(2)}`;
        page.drawSvgPath(
          `M${p(x2, y2)} L${p(bx - uy * hw, by + ux * hw)} L${p(bx + uy * hw, by - ux * hw)} Z`,
          { x: 0, y: 0, color: colour },
        );
        if (note) drawLabel(page, frame, fonts, note, x1 + 3, y1 + (uy > 0 ? -10 : 5), colour);
        break;
      }
      case 'text': {
        const block = drawTextBox(page, frame, fonts, m, colour);
        if (tag) drawLabel(page, frame, fonts, tag, block.x, block.y + block.size + 2, colour);
        break;
      }
      case 'pin': {
        const [x, y] = markupToDisplay(frame, num(g, 'x'), num(g, 'y'));
        page.drawCircle({ x, y, size: PIN_RADIUS, color: colour, borderColor: WHITE, borderWidth: 1 });
        const label = m.number != null ? String(m.number) : '';
        const size = label.length > 2 ? 7 : 9;
        const w = widthOf(label, fonts.black, size);
        drawText(page, label, { x: x - w / 2, y: y - size * 0.35, size, font: fonts.black, color: WHITE });
        if (note) drawLabel(page, frame, fonts, note, x + PIN_RADIUS + 3, y + 3, colour);
        break;
      }
    }
  }
}
