// Where a page carries anything at all: Debian's pdftoppm (poppler-utils) renders one page,
// as displayed (its CropBox, its /Rotate), in grey at about 1.3 pixels per point for a
// letter page, without anti-aliasing so a hairline is a dark pixel and not a faint one. Every
// pixel darker than near-white counts as ink: text, lines, fills, a scan's marks. The stamp
// builder asks it whether a rectangle of the page is empty before putting the stamp block
// there. Reading the rendering, never the content stream, means text drawn as paths, images
// and scans count the same as text.
import { execFile } from 'node:child_process';
import { readFile, rm } from 'node:fs/promises';
import path from 'node:path';

/** Longer side of the rendering, in pixels. */
const LONG_SIDE = 1000;
/** Grey levels (0–255) at or below this are ink; paper, and a scan's near-white, are not. */
const INK_BELOW = 240;

export interface PageInk {
  /** The page as displayed, in points. */
  width: number;
  height: number;
  cols: number;
  rows: number;
  /** Summed-area table of ink pixels, (cols + 1) × (rows + 1). */
  sums: Uint32Array;
}

export class PageInkError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PageInkError';
  }
}

function parsePgm(buf: Buffer): { cols: number; rows: number; pixels: Buffer } {
  // "P5\n<cols> <rows>\n<max>\n" then one byte per pixel.
  const fields: string[] = [];
  let i = 0;
  while (fields.length < 4 && i < buf.length) {
    while (i < buf.length && /\s/.test(String.fromCharCode(buf[i]))) i++;
    let tok = '';
    while (i < buf.length && !/\s/.test(String.fromCharCode(buf[i]))) tok += String.fromCharCode(buf[i++]);
    fields.push(tok);
  }
  i++;
  const [magic, c, r, max] = fields;
  const cols = Number(c);
  const rows = Number(r);
  if (magic !== 'P5' || Number(max) !== 255 || !(cols > 0) || !(rows > 0) || buf.length < i + cols * rows)
    throw new PageInkError('the page rendering was not a grey image');
  return { cols, rows, pixels: buf.subarray(i, i + cols * rows) };
}

/** Render `pageNumber` of `file` and map its ink. `work` is a folder for the rendering. */
export async function readPageInk(
  file: string,
  pageNumber: number,
  page: { width: number; height: number },
  work: string,
): Promise<PageInk> {
  const root = path.join(work, `ink-${pageNumber}`);
  const args = [
    '-f',
    String(pageNumber),
    '-l',
    String(pageNumber),
    '-singlefile',
    '-gray',
    '-cropbox',
    '-aa',
    'no',
    '-aaVector',
    'no',
    '-scale-to',
    String(LONG_SIDE),
    file,
    root,
  ];
  await new Promise<void>((resolve, reject) => {
    execFile('pdftoppm', args, { timeout: 60_000 }, (err, _stdout, stderr) => {
      if (err) reject(new PageInkError(String(stderr || err.message).trim() || 'pdftoppm failed'));
      else resolve();
    });
  });
  try {
    const { cols, rows, pixels } = parsePgm(await readFile(`${root}.pgm`));
    const sums = new Uint32Array((cols + 1) * (rows + 1));
    for (let r = 0; r < rows; r++) {
      let run = 0;
      for (let c = 0; c < cols; c++) {
        if (pixels[r * cols + c] <= INK_BELOW) run++;
        sums[(r + 1) * (cols + 1) + c + 1] = sums[r * (cols + 1) + c + 1] + run;
      }
    }
    return { width: page.width, height: page.height, cols, rows, sums };
  } finally {
    await rm(`${root}.pgm`, { force: true });
  }
}

/**
 * Ink pixels under a rectangle of the page (display frame: points, origin lower-left, y up),
 * grown by `clearance` points on every side; the part off the page counts as empty.
 */
export function inkUnder(
  ink: PageInk,
  rect: { x: number; y: number; width: number; height: number },
  clearance = 0,
): number {
  const sx = ink.cols / ink.width;
  const sy = ink.rows / ink.height;
  const clamp = (v: number, hi: number) => Math.max(0, Math.min(hi, v));
  const c0 = clamp(Math.floor((rect.x - clearance) * sx), ink.cols);
  const c1 = clamp(Math.ceil((rect.x + rect.width + clearance) * sx), ink.cols);
  const r0 = clamp(Math.floor((ink.height - rect.y - rect.height - clearance) * sy), ink.rows);
  const r1 = clamp(Math.ceil((ink.height - rect.y + clearance) * sy), ink.rows);
  if (c1 <= c0 || r1 <= r0) return 0;
  const w = ink.cols + 1;
  return ink.sums[r1 * w + c1] - ink.sums[r0 * w + c1] - ink.sums[r1 * w + c0] + ink.sums[r0 * w + c0];
}
