// Type, colour and small drawing helpers shared by the stamped return's parts: Lato embedded
// from @fontsource/lato's .woff files (the .woff2 files embed without error but render
// invisible), text made safe for the embedded glyph set, word wrapping measured with the
// font, trade-style dates, and the check-status shapes that keep a status readable in
// greyscale print.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { inflateSync } from 'node:zlib';
import fontkit from '@pdf-lib/fontkit';
import { rgb, type Color, type PDFDocument, type PDFFont, type PDFPage } from 'pdf-lib';
import { CHECK_STATUS_WORDS } from '@shared/vocabulary/check-statuses';
import { GLYPH_BOX, STATUS_GLYPHS, type GlyphTone } from '@shared/drawing/status-glyphs';

export interface Fonts {
  regular: PDFFont;
  bold: PDFFont;
  black: PDFFont;
}

const require = createRequire(import.meta.url);
const fontCache = new Map<string, Uint8Array>();

/**
 * A WOFF 1.0 file unwrapped into the plain TrueType (sfnt) font it carries (W3C WOFF 1.0,
 * section 5: the same tables, each zlib-compressed or stored). fontkit reads a WOFF font by
 * inflating a table again on every access — once per glyph for `glyf` — which made embedding
 * the fonts most of a return's fixed cost; the unwrapped font is read directly.
 */
export function woffToSfnt(woff: Uint8Array): Uint8Array {
  const src = Buffer.from(woff.buffer, woff.byteOffset, woff.byteLength);
  if (src.toString('latin1', 0, 4) !== 'wOFF') throw new Error('not a WOFF 1.0 font');
  const flavor = src.readUInt32BE(4);
  const numTables = src.readUInt16BE(12);
  const tables: Array<{ tag: number; checksum: number; data: Buffer }> = [];
  for (let i = 0; i < numTables; i++) {
    const e = 44 + i * 20;
    const offset = src.readUInt32BE(e + 4);
    const compLength = src.readUInt32BE(e + 8);
    const origLength = src.readUInt32BE(e + 12);
    const raw = src.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(raw) : raw;
    if (data.length !== origLength) throw new Error('a WOFF table does not inflate to its stated length');
    tables.push({ tag: src.readUInt32BE(e), checksum: src.readUInt32BE(e + 16), data });
  }
  const pad = (n: number) => (n + 3) & ~3;
  let size = 12 + 16 * numTables;
  for (const t of tables) size += pad(t.data.length);
  const out = Buffer.alloc(size);
  const log2 = Math.floor(Math.log2(numTables));
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(16 << log2, 6);
  out.writeUInt16BE(log2, 8);
  out.writeUInt16BE(numTables * 16 - (16 << log2), 10);
  let at = 12 + 16 * numTables;
  tables.forEach((t, i) => {
    const r = 12 + 16 * i;
    out.writeUInt32BE(t.tag, r);
    out.writeUInt32BE(t.checksum, r + 4);
    out.writeUInt32BE(at, r + 8);
    out.writeUInt32BE(t.data.length, r + 12);
    t.data.copy(out, at);
    at += pad(t.data.length);
  });
  return new Uint8Array(out.buffer, out.byteOffset, out.byteLength);
}

/** Lato's TrueType bytes, unwrapped from @fontsource/lato's .woff once per process. */
function latoBytes(weight: 400 | 700 | 900): Uint8Array {
  const key = `lato-latin-${weight}-normal.woff`;
  let bytes = fontCache.get(key);
  if (!bytes) {
    bytes = woffToSfnt(new Uint8Array(readFileSync(require.resolve(`@fontsource/lato/files/${key}`))));
    fontCache.set(key, bytes);
  }
  return bytes;
}

/** Embed the three Lato weights, subset, with fixed names so two builds write the same fonts. */
export async function embedLato(doc: PDFDocument): Promise<Fonts> {
  doc.registerFontkit(fontkit);
  const embed = (weight: 400 | 700 | 900, name: string) =>
    doc.embedFont(latoBytes(weight), { subset: true, customName: name });
  // One after the other so the object numbers come out the same on every build.
  const regular = await embed(400, 'CPLato-Regular');
  const bold = await embed(700, 'CPLato-Bold');
  const black = await embed(900, 'CPLato-Black');
  return { regular, bold, black };
}

// Characters the Latin subset of Lato lacks but people type into findings and conditions.
const REPLACEMENTS: Record<string, string> = {
  '≤': '<=',
  '≥': '>=',
  '≠': '!=',
  '≈': '~',
  '→': '->',
  '←': '<-',
  '⇒': '=>',
  '√': 'sqrt',
  '∑': 'sum',
  Σ: 'sum',
  Δ: 'delta',
  δ: 'delta',
  π: 'pi',
  ρ: 'rho',
  ₓ: '_x',
  ᵧ: '_y',
  θ: 'theta',
  α: 'alpha',
  β: 'beta',
  γ: 'gamma',
  μ: 'u',
  Ω: 'ohm',
  '∞': 'infinity',
  '✓': 'yes',
  '✔': 'yes',
  '✗': 'x',
  '✘': 'x',
  '³': '3',
  '⁴': '4',
  '•': '-',
};

const charsetCache = new WeakMap<PDFFont, Set<number>>();
function charset(font: PDFFont): Set<number> {
  let s = charsetCache.get(font);
  if (!s) {
    s = new Set(font.getCharacterSet());
    charsetCache.set(font, s);
  }
  return s;
}

/**
 * Text the font can draw: control characters become spaces (newlines are kept for the
 * caller to split on), known symbols become words, accented letters the subset lacks lose
 * their accent, anything else becomes "?". drawText never meets a glyph it cannot show.
 */
export function safeText(text: string, font: PDFFont, keepNewlines = false): string {
  const set = charset(font);
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
    if (set.has(cp)) {
      out += ch;
      continue;
    }
    const rep = REPLACEMENTS[ch];
    if (rep !== undefined) {
      out += rep;
      continue;
    }
    const bare = ch.normalize('NFD').replace(/\p{M}/gu, '');
    out += bare && [...bare].every((c) => set.has(c.codePointAt(0)!)) ? bare : '?';
  }
  return out;
}

// Measuring runs fontkit's layout, the slowest part of drawing a sheet: widths at size 1 are
// kept per font name (the embedded names are fixed, so every return shares them), per process.
const widthCache = new Map<string, Map<string, number>>();

export function widthOf(text: string, font: PDFFont, size: number): number {
  let widths = widthCache.get(font.name);
  if (!widths) {
    widths = new Map();
    widthCache.set(font.name, widths);
  }
  let w = widths.get(text);
  if (w === undefined) {
    w = font.widthOfTextAtSize(text, 1);
    if (widths.size > 50_000) widths.clear();
    widths.set(text, w);
  }
  return w * size;
}

/** Break text (already safe) into lines no wider than `width`; long words break by character. */
export function wrapText(text: string, font: PDFFont, size: number, width: number): string[] {
  const lines: string[] = [];
  for (const para of safeText(text, font, true).split('\n')) {
    const words = para.split(/ +/).filter((w) => w.length > 0);
    if (words.length === 0) {
      lines.push('');
      continue;
    }
    let line = '';
    for (let word of words) {
      const candidate = line ? `${line} ${word}` : word;
      if (widthOf(candidate, font, size) <= width) {
        line = candidate;
        continue;
      }
      if (line) lines.push(line);
      line = '';
      while (widthOf(word, font, size) > width) {
        let cut = word.length - 1;
        while (cut > 1 && widthOf(word.slice(0, cut), font, size) > width) cut--;
        lines.push(word.slice(0, cut));
        word = word.slice(cut);
      }
      line = word;
    }
    lines.push(line);
  }
  return lines;
}

/** Shorten one line of text to fit `width`, ending in an ellipsis when cut. */
export function fitText(text: string, font: PDFFont, size: number, width: number): string {
  const t = safeText(text, font);
  if (widthOf(t, font, size) <= width) return t;
  let cut = t.length;
  while (cut > 0 && widthOf(t.slice(0, cut).trimEnd() + '…', font, size) > width) cut--;
  return t.slice(0, cut).trimEnd() + '…';
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
