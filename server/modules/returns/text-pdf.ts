// Type, colour and small drawing helpers shared by the stamped return's parts: text made
// safe for the embedded faces (fonts-pdf.ts: Lato, then DejaVu Sans for what Lato lacks), drawn
// run by run in the font that has each character, word wrapping measured with those fonts,
// trade-style dates, and the check-status shapes that keep a status readable in greyscale print.
import { degrees, rgb, type Color, type PDFPage } from 'pdf-lib';
import { wrapLines } from '@shared/drawing/text-layout';
import { CHECK_STATUS_WORDS } from '@shared/vocabulary/check-statuses';
import { GLYPH_BOX, STATUS_GLYPHS, type GlyphTone } from '@shared/drawing/status-glyphs';
import type { Face } from './fonts-pdf';

export { embedFonts, embedLato, type Face, type Fonts } from './fonts-pdf';

const safeCache = new Map<string, Map<string, string>>();

/**
 * Text the face can draw: control characters become spaces (newlines are kept for the caller
 * to split on when asked), a character none of the face's fonts has loses its accent when the
 * bare letter is there, and becomes "?" otherwise. Every character a font has is kept as it is.
 */
export function safeText(text: string, face: Face, keepNewlines = false): string {
  const key = `${face.spec.key}${keepNewlines ? '\n' : ''}`;
  let cache = safeCache.get(key);
  if (!cache) {
    cache = new Map();
    safeCache.set(key, cache);
  }
  const hit = cache.get(text);
  if (hit !== undefined) return hit;
  const { spec } = face;
  let out = '';
  for (const ch of text.normalize('NFC')) {
    const cp = ch.codePointAt(0)!;
    if (ch === '\n' && keepNewlines) {
      out += ch;
      continue;
    }
    if (cp < 0x20 || (cp >= 0x7f && cp < 0xa0) || cp === 0x2028 || cp === 0x2029) {
      out += ' ';
      continue;
    }
    if (spec.pick(cp) >= 0) {
      out += ch;
      continue;
    }
    const bare = ch.normalize('NFD').replace(/\p{M}/gu, '');
    out += bare && [...bare].every((c) => spec.pick(c.codePointAt(0)!) >= 0) ? bare : '?';
  }
  if (cache.size > 20_000) cache.clear();
  cache.set(text, out);
  return out;
}

/** Width of `text` (safe, or plain) at `size`, each run measured in the font that draws it. */
export function widthOf(text: string, face: Face, size: number): number {
  return face.spec.width(text) * size;
}

/**
 * page.drawText for a face: the text made safe, then each run of characters drawn in the font
 * that has them, one after the other on the baseline.
 */
export function drawText(
  page: PDFPage,
  text: string,
  opts: {
    x: number;
    y: number;
    size: number;
    font: Face;
    color?: Color;
    opacity?: number;
    /** Baseline angle in degrees, counter-clockwise on the page (pdf-lib's sense). */
    rotate?: number;
  },
) {
  const { font: face, size } = opts;
  const a = ((opts.rotate ?? 0) * Math.PI) / 180;
  let [x, y] = [opts.x, opts.y];
  for (const run of face.spec.runs(safeText(text, face))) {
    page.drawText(run.text, {
      x,
      y,
      size,
      font: face.font(run.at),
      color: opts.color,
      opacity: opts.opacity,
      ...(opts.rotate ? { rotate: degrees(opts.rotate) } : {}),
    });
    const advance = face.spec.sources[run.at].width(run.text) * size;
    x += advance * Math.cos(a);
    y += advance * Math.sin(a);
  }
}

/** Break text into safe lines no wider than `width`; long words break by character (shared/drawing/text-layout.ts). */
export function wrapText(text: string, font: Face, size: number, width: number): string[] {
  return wrapLines(safeText(text, font, true), width, size, (t, sz) => widthOf(t, font, sz));
}

/** Shorten one line of text to fit `width`, ending in an ellipsis when cut. */
export function fitText(text: string, font: Face, size: number, width: number): string {
  const t = safeText(text, font);
  if (widthOf(t, font, size) <= width) return t;
  const chars = [...t];
  let cut = chars.length;
  while (cut > 0 && widthOf(chars.slice(0, cut).join('').trimEnd() + '…', font, size) > width) cut--;
  return chars.slice(0, cut).join('').trimEnd() + '…';
}

// Dates and status words are declared once in shared/vocabulary.
export { tradeDate, tradeDateTime } from '@shared/vocabulary/dates';

/** Ink and paper: greyscale-safe, the hierarchy carried by weight and size, not hue. */
export const INK = rgb(0.086, 0.098, 0.11); // #16191c
export const INK_SOFT = rgb(0.29, 0.31, 0.333); // #4a4f55
export const RULE = rgb(0.851, 0.835, 0.796); // #d9d5cb
export const RULE_STRONG = rgb(0.561, 0.541, 0.494); // #8f8a7e
export const PAPER_ALT = rgb(0.98, 0.976, 0.965); // #faf9f6
export const GRAPHITE = rgb(0.11, 0.133, 0.149); // #1c2226
export const WHITE = rgb(1, 1, 1);

export function hexColour(hex: string): Color {
  const n = parseInt(hex.replace('#', ''), 16);
  return rgb(((n >> 16) & 255) / 255, ((n >> 8) & 255) / 255, (n & 255) / 255);
}

export type StatusKey = 'pass' | 'caution' | 'fail' | 'not_applicable';
export const STATUS_WORDS: Record<StatusKey, string> = CHECK_STATUS_WORDS;

/**
 * The status shape, the same family as the screens: a tick in a circle (pass), an
 * exclamation in a triangle (caution), a cross in a filled octagon (fail), a dash in a
 * dotted circle (not applicable). (x, y) is the lower-left corner of a `size`-point square.
 */
export function drawStatusShape(page: PDFPage, status: StatusKey, x: number, y: number, size: number) {
  const s = size / GLYPH_BOX;
  const tone = (t: GlyphTone | undefined) =>
    t === undefined ? undefined : t === 'paper' ? WHITE : t === 'soft' ? INK_SOFT : INK;
  for (const part of STATUS_GLYPHS[status]) {
    if (part.kind === 'circle')
      page.drawCircle({
        x: x + part.cx * s,
        y: y + size - part.cy * s,
        size: part.r * s,
        color: tone(part.fill),
        borderColor: tone(part.stroke),
        borderWidth: part.stroke ? (part.width ?? 1) * s : undefined,
        borderDashArray: part.dash ? [part.dash * s, part.dash * s] : undefined,
      });
    else
      page.drawSvgPath(part.d, {
        x,
        y: y + size,
        scale: s,
        color: tone(part.fill),
        borderColor: tone(part.stroke),
        borderWidth: part.stroke ? part.width : undefined,
        borderLineCap: part.stroke ? 1 : undefined,
      });
  }
}
