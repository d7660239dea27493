// The calculation sheet's layout: a cursor that flows down A4 pages, page breaks that repeat a
// table's header, wrapped paragraphs, headings, tables and label/value pairs. Sections draw
// only through these; the sheet's "page n of m" header is drawn later (header.ts).
import { PageSizes, type Color, type PDFDocument, type PDFPage } from 'pdf-lib';
import {
  drawStatusShape,
  drawText,
  fitText,
  GRAPHITE,
  INK,
  INK_SOFT,
  PAPER_ALT,
  RULE,
  RULE_STRONG,
  WHITE,
  wrapText,
  type Face,
  type Fonts,
  type StatusKey,
} from '../text-pdf';

export const [PAGE_W, PAGE_H] = PageSizes.A4;
export const LEFT = 44;
export const RIGHT = PAGE_W - 44;
export const WIDTH = RIGHT - LEFT;
export const TOP = PAGE_H - 74;
export const BOTTOM = 40;

/** A flow of content down A4 pages. */
export class Flow {
  page!: PDFPage;
  y = TOP;
  readonly pages: PDFPage[] = [];
  /** Called after a page break inside a table, to repeat its header. */
  onBreak: (() => void) | null = null;

  constructor(
    readonly doc: PDFDocument,
    readonly fonts: Fonts,
  ) {
    this.newPage();
  }

  newPage() {
    this.page = this.doc.addPage([PAGE_W, PAGE_H]);
    this.pages.push(this.page);
    this.y = TOP;
  }

  /** Make room for `h` points; a new page when they do not fit. */
  need(h: number) {
    if (this.y - h < BOTTOM) this.breakPage();
  }

  /** A new page, with the header of the table being drawn repeated. */
  breakPage() {
    this.newPage();
    this.onBreak?.();
  }

  text(t: string, x: number, y: number, size: number, font: Face, color: Color = INK) {
    drawText(this.page, t, { x, y, size, font, color });
  }

  /** A wrapped paragraph at the cursor. */
  para(t: string, opts: { size?: number; font?: Face; color?: Color; indent?: number; gap?: number } = {}) {
    const size = opts.size ?? 8.5;
    const font = opts.font ?? this.fonts.regular;
    const indent = opts.indent ?? 0;
    const lh = size * 1.35;
    for (const line of wrapText(t, font, size, WIDTH - indent)) {
      this.need(lh);
      this.y -= lh;
      this.text(line, LEFT + indent, this.y + size * 0.28, size, font, opts.color ?? INK);
    }
    this.y -= opts.gap ?? 4;
  }

  /** A section heading: a short heavy bar, the title, and a hairline; kept with what follows. */
  heading(title: string, keep = 60) {
    this.need(30 + keep);
    this.y -= 14;
    this.page.drawRectangle({ x: LEFT, y: this.y, width: 22, height: 2.6, color: GRAPHITE });
    this.y -= 13;
    this.text(title, LEFT, this.y, 11.5, this.fonts.black);
    this.y -= 5;
    this.page.drawLine({
      start: { x: LEFT, y: this.y },
      end: { x: RIGHT, y: this.y },
      thickness: 0.6,
      color: RULE_STRONG,
    });
    this.y -= 4;
  }

  subheading(title: string) {
    this.need(26);
    this.y -= 13;
    this.text(title.toUpperCase(), LEFT, this.y, 7.5, this.fonts.black, INK_SOFT);
    this.y -= 4;
  }
}

// ---------- tables ----------

export interface Col {
  title: string;
  width: number;
}
export interface Cell {
  text: string;
  bold?: boolean;
  status?: StatusKey;
  soft?: boolean;
}
export interface Row {
  cells: Cell[];
  /** A line under the cells from `from` column to the right edge (e.g. the formula). */
  note?: { text: string; from: number };
  indent?: number;
  shade?: boolean;
}

const CELL_PAD = 3;
const T_SIZE = 7.6;
const T_LH = T_SIZE * 1.3;
const NOTE_SIZE = 7;
const NOTE_LH = NOTE_SIZE * 1.3;

interface RowShape {
  row: Row;
  cols: Col[];
  wrapped: string[][];
  noteLines: string[];
  noteX: number;
}

function pieceHeight(cellLines: number, noteLines: number) {
  return cellLines * T_LH + noteLines * NOTE_LH + 2 * CELL_PAD + (noteLines ? 1 : 0);
}

/** Lines [a, b) of a row's cells and [na, nb) of its note at the cursor, then the rule under them. */
function drawRowPiece(flow: Flow, s: RowShape, [a, b]: [number, number], [na, nb]: [number, number]) {
  const { fonts } = flow;
  const { row, cols } = s;
  const cellH = (b - a) * T_LH;
  const h = pieceHeight(b - a, nb - na);
  if (row.shade)
    flow.page.drawRectangle({ x: LEFT, y: flow.y - h, width: WIDTH, height: h, color: PAPER_ALT });
  let x = LEFT;
  row.cells.forEach((cell, i) => {
    const font = cell.bold ? fonts.bold : fonts.regular;
    let cx = x + CELL_PAD + (i === 0 ? (row.indent ?? 0) : 0);
    if (cell.status) {
      if (a === 0) drawStatusShape(flow.page, cell.status, cx, flow.y - CELL_PAD - T_LH + 0.8, 9);
      cx += 12;
    }
    s.wrapped[i]
      .slice(a, b)
      .forEach((line, j) =>
        flow.text(
          line,
          cx,
          flow.y - CELL_PAD - (j + 1) * T_LH + 2.4,
          T_SIZE,
          font,
          cell.soft ? INK_SOFT : INK,
        ),
      );
    x += cols[i].width;
  });
  s.noteLines
    .slice(na, nb)
    .forEach((line, j) =>
      flow.text(
        line,
        s.noteX + CELL_PAD,
        flow.y - CELL_PAD - cellH - (j + 1) * NOTE_LH + 2.6,
        NOTE_SIZE,
        fonts.regular,
        INK_SOFT,
      ),
    );
  flow.y -= h;
  flow.page.drawLine({
    start: { x: LEFT, y: flow.y },
    end: { x: RIGHT, y: flow.y },
    thickness: 0.4,
    color: RULE,
  });
}

export function table(flow: Flow, cols: Col[], rows: Row[]) {
  const { fonts } = flow;
  const drawHeader = () => {
    flow.need(16);
    flow.page.drawRectangle({ x: LEFT, y: flow.y - 13, width: WIDTH, height: 13, color: GRAPHITE });
    let x = LEFT;
    for (const c of cols) {
      flow.text(
        fitText(c.title, fonts.bold, 7, c.width - 2 * CELL_PAD),
        x + CELL_PAD,
        flow.y - 9.3,
        7,
        fonts.bold,
        WHITE,
      );
      x += c.width;
    }
    flow.y -= 13;
  };
  drawHeader();
  flow.onBreak = drawHeader;
  for (const row of rows) {
    const wrapped = row.cells.map((cell, i) => {
      const font = cell.bold ? fonts.bold : fonts.regular;
      const inset = (cell.status ? 12 : 0) + (i === 0 ? (row.indent ?? 0) : 0);
      return wrapText(cell.text, font, T_SIZE, cols[i].width - 2 * CELL_PAD - inset);
    });
    let noteLines: string[] = [];
    let noteX = LEFT;
    if (row.note && row.note.text) {
      noteX = LEFT + cols.slice(0, row.note.from).reduce((a, c) => a + c.width, 0);
      noteLines = wrapText(row.note.text, fonts.regular, NOTE_SIZE, RIGHT - noteX - 2 * CELL_PAD);
    }
    const shape: RowShape = { row, cols, wrapped, noteLines, noteX };
    const n = Math.max(1, ...wrapped.map((l) => l.length));
    const full = pieceHeight(n, noteLines.length);
    if (full <= TOP - BOTTOM - 20) {
      flow.need(full);
      drawRowPiece(flow, shape, [0, n], [0, noteLines.length]);
      continue;
    }
    // A row taller than a page (a long finding or response): as many of its lines as fit on
    // each page, the table's header repeated above the rest, so nothing runs off the page.
    let a = 0;
    let na = 0;
    while (a < n || na < noteLines.length) {
      let room = flow.y - BOTTOM - 2 * CELL_PAD - 1;
      const b = Math.min(n, a + Math.max(0, Math.floor(room / T_LH)));
      room -= (b - a) * T_LH;
      const nb = b < n ? na : Math.min(noteLines.length, na + Math.max(0, Math.floor(room / NOTE_LH)));
      if (b > a || nb > na) drawRowPiece(flow, shape, [a, b], [na, nb]);
      a = b;
      na = nb;
      if (a < n || na < noteLines.length) flow.breakPage();
    }
  }
  flow.onBreak = null;
  flow.y -= 6;
}

/** Label/value pairs, two pairs to a line. */
export function pairs(flow: Flow, items: [string, string][]) {
  const { fonts } = flow;
  const half = WIDTH / 2;
  const labelW = 88;
  const size = 7.8;
  const lh = size * 1.32;
  for (let i = 0; i < items.length; i += 2) {
    const line = items.slice(i, i + 2).map(([k, v]) => ({
      k: wrapText(k, fonts.regular, size, labelW - 6),
      v: wrapText(v, fonts.bold, size, half - labelW - 8),
    }));
    const n = Math.max(...line.map((p) => Math.max(p.k.length, p.v.length)));
    // A value longer than a page goes on over the next (rarely: a long entered text).
    const perPage = Math.floor((TOP - BOTTOM - 3) / lh);
    for (let from = 0; from < n; from += perPage) {
      const m = Math.min(perPage, n - from);
      flow.need(m * lh + 3);
      line.forEach((p, j) => {
        const x = LEFT + j * half;
        const at = (r: number) => flow.y - (r + 1) * lh + 2;
        p.k.slice(from, from + m).forEach((t, r) => flow.text(t, x, at(r), size, fonts.regular, INK_SOFT));
        p.v.slice(from, from + m).forEach((t, r) => flow.text(t, x + labelW, at(r), size, fonts.bold));
      });
      flow.y -= m * lh + 3;
    }
  }
  flow.y -= 2;
}
