// The stamped return's type: Lato from @fontsource/lato (its latin file, then its latin-ext
// file) and, for what Lato lacks (≤ ≥ ≠ ≈ → √ Σ θ ✓ ✗ and other symbols, Greek,
// sub- and superscripts), DejaVu Sans from @fontsource/dejavu-sans. Each character is drawn in
// the first of them that has it (a "face" is that list for one weight). Every font file is read,
// unwrapped from WOFF and parsed once per process; a return embeds a file, subset, only when its
// text first needs a character from it, so a return written all in Lato carries Lato alone.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { inflateSync } from 'node:zlib';
import fontkit, { type Font as FontkitFont } from '@pdf-lib/fontkit';
import { CustomFontSubsetEmbedder, PDFFont, type PDFDocument } from 'pdf-lib';

const require = createRequire(import.meta.url);

/**
 * A WOFF 1.0 file unwrapped into the plain TrueType (sfnt) font it carries (W3C WOFF 1.0,
 * section 5: the same tables, each zlib-compressed or stored). fontkit reads a WOFF font by
 * inflating a table again on every access — once per glyph for `glyf` — which made embedding
 * the fonts most of a return's fixed cost; the unwrapped font is read directly. Tables named in
 * `drop` are left out.
 */
export function woffToSfnt(woff: Uint8Array, drop: ReadonlySet<string> = new Set()): Uint8Array {
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
    if (drop.has(src.toString('latin1', e, e + 4))) continue;
    const raw = src.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(raw) : raw;
    if (data.length !== origLength) throw new Error('a WOFF table does not inflate to its stated length');
    tables.push({ tag: src.readUInt32BE(e), checksum: src.readUInt32BE(e + 16), data });
  }
  const pad = (n: number) => (n + 3) & ~3;
  const n = tables.length;
  let size = 12 + 16 * n;
  for (const t of tables) size += pad(t.data.length);
  const out = Buffer.alloc(size);
  const log2 = Math.floor(Math.log2(n));
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(n, 4);
  out.writeUInt16BE(16 << log2, 6);
  out.writeUInt16BE(log2, 8);
  out.writeUInt16BE(n * 16 - (16 << log2), 10);
  let at = 12 + 16 * n;
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

// pdf-lib draws glyphs at their advance widths and ignores the positions fontkit's layout works
// out, so the glyph-positioning table (kerning, mark placement) is only cost: it is not loaded.
const UNUSED_TABLES: ReadonlySet<string> = new Set(['GPOS']);
// The fallback draws single characters Lato lacks (symbols, Greek, sub- and superscripts), which
// need no substitution either; without DejaVu's substitution tables its first layout costs
// ~0.1 s less (scripts that need shaping, such as Arabic, print unjoined: pdf-lib has no
// right-to-left support in any case).
const FALLBACK_UNUSED_TABLES: ReadonlySet<string> = new Set(['GPOS', 'GSUB', 'GDEF']);

/** One font file, read once per process: its TrueType bytes, fontkit's reading, its characters. */
export class FontSource {
  readonly bytes: Uint8Array;
  readonly font: FontkitFont;
  readonly chars: Set<number>;
  private readonly widths = new Map<string, number>();

  constructor(
    /** The fixed name it is embedded under, so two builds write the same fonts. */
    readonly name: string,
    woffFile: string,
    drop: ReadonlySet<string>,
  ) {
    this.bytes = woffToSfnt(new Uint8Array(readFileSync(require.resolve(woffFile))), drop);
    this.font = fontkit.create(this.bytes);
    this.chars = new Set(this.font.characterSet);
  }

  /**
   * Width of `text` at size 1 as pdf-lib measures and draws it: the advance widths of the glyphs
   * fontkit's layout gives (no kerning). Layout is the slowest part of drawing a sheet, so
   * widths are kept per process.
   */
  width(text: string): number {
    let w = this.widths.get(text);
    if (w === undefined) {
      w = 0;
      for (const g of this.font.layout(text).glyphs) w += g.advanceWidth;
      w /= this.font.unitsPerEm;
      if (this.widths.size > 50_000) this.widths.clear();
      this.widths.set(text, w);
    }
    return w;
  }
}

const sources = new Map<string, FontSource>();
function source(name: string, woffFile: string, fallback: boolean): FontSource {
  let s = sources.get(name);
  if (!s) {
    s = new FontSource(name, woffFile, fallback ? FALLBACK_UNUSED_TABLES : UNUSED_TABLES);
    sources.set(name, s);
  }
  return s;
}

type Weight = 400 | 700 | 900;
const lato = (part: 'latin' | 'latin-ext', w: Weight) =>
  `@fontsource/lato/files/lato-${part}-${w}-normal.woff`;
// @fontsource/dejavu-sans's "latin" files are the whole font (6,000+ glyphs); it has no 900.
const dejavu = (w: 400 | 700) => `@fontsource/dejavu-sans/files/dejavu-sans-latin-${w}-normal.woff`;

const FACE_FILES: Record<keyof Fonts, Array<[name: string, file: string]>> = {
  regular: [
    ['CPLato-Regular', lato('latin', 400)],
    ['CPLatoExt-Regular', lato('latin-ext', 400)],
    ['CPDejaVu-Regular', dejavu(400)],
  ],
  bold: [
    ['CPLato-Bold', lato('latin', 700)],
    ['CPLatoExt-Bold', lato('latin-ext', 700)],
    ['CPDejaVu-Bold', dejavu(700)],
  ],
  black: [
    ['CPLato-Black', lato('latin', 900)],
    ['CPLatoExt-Black', lato('latin-ext', 900)],
    ['CPDejaVu-Bold', dejavu(700)],
  ],
};

/** A face's fonts in order of preference, per process: what it can draw and how wide. */
export class FaceSpec {
  private readonly widths = new Map<string, number>();

  constructor(
    readonly key: string,
    readonly sources: FontSource[],
  ) {}

  /** The first of the face's fonts that has the character, -1 when none has it. */
  pick(cp: number): number {
    for (let i = 0; i < this.sources.length; i++) if (this.sources[i].chars.has(cp)) return i;
    return -1;
  }

  /** `text` (already safe) cut into runs, each drawn by one font: the first that has its characters. */
  runs(text: string): Array<{ at: number; text: string }> {
    const out: Array<{ at: number; text: string }> = [];
    for (const ch of text) {
      const at = Math.max(0, this.pick(ch.codePointAt(0)!));
      const last = out[out.length - 1];
      if (last && last.at === at) last.text += ch;
      else out.push({ at, text: ch });
    }
    return out;
  }

  /** Width at size 1 with the font each run is drawn in. */
  width(text: string): number {
    let w = this.widths.get(text);
    if (w === undefined) {
      w = 0;
      for (const r of this.runs(text)) w += this.sources[r.at].width(r.text);
      if (this.widths.size > 50_000) this.widths.clear();
      this.widths.set(text, w);
    }
    return w;
  }
}

const specs = new Map<keyof Fonts, FaceSpec>();
function faceSpec(key: keyof Fonts): FaceSpec {
  let s = specs.get(key);
  if (!s) {
    s = new FaceSpec(
      key,
      // the last file of each face is DejaVu, the fallback
      FACE_FILES[key].map(([name, file], i, all) => source(name, file, i === all.length - 1)),
    );
    specs.set(key, s);
  }
  return s;
}

type SubsetEmbedder = new (font: FontkitFont, data: Uint8Array, name?: string) => CustomFontSubsetEmbedder;

/**
 * Embed `src` into `doc`, subset, as doc.embedFont(bytes, { subset: true, customName }) does.
 * pdf-lib 1.17.1's embedFont is async only because it awaits fontkit.create; building the
 * embedder here from the process's parsed font keeps drawing synchronous (a font is embedded
 * when text first needs it) and lets every return share fontkit's parsed glyphs. The font goes
 * on the document's list, which save() embeds, as embedFont does.
 */
function embedSubset(doc: PDFDocument, src: FontSource): PDFFont {
  const embedder = new (CustomFontSubsetEmbedder as unknown as SubsetEmbedder)(src.font, src.bytes, src.name);
  const font = PDFFont.of(doc.context.nextRef(), doc, embedder);
  (doc as unknown as { fonts: PDFFont[] }).fonts.push(font);
  return font;
}

/** A face in one document: its process-wide spec and the fonts embedded so far. */
export class Face {
  constructor(
    readonly spec: FaceSpec,
    private readonly doc: PDFDocument,
    private readonly embedded: Map<string, PDFFont>,
  ) {}

  /** The document's font for the face's `at`-th file, embedded the first time it is asked for. */
  font(at: number): PDFFont {
    const src = this.spec.sources[at];
    let f = this.embedded.get(src.name);
    if (!f) {
      f = embedSubset(this.doc, src);
      this.embedded.set(src.name, f);
    }
    return f;
  }
}

export interface Fonts {
  regular: Face;
  bold: Face;
  black: Face;
}

/** The three faces of a return (regular, bold, black); each font file is embedded on first use. */
export function embedFonts(doc: PDFDocument): Fonts {
  const embedded = new Map<string, PDFFont>();
  const face = (key: keyof Fonts) => new Face(faceSpec(key), doc, embedded);
  return { regular: face('regular'), bold: face('bold'), black: face('black') };
}

/**
 * The three Lato weights as plain pdf-lib fonts (latin file only), for PDFs drawn with
 * pdf-lib's own drawText: the demo plans of the seed.
 */
export async function embedLato(doc: PDFDocument): Promise<Record<keyof Fonts, PDFFont>> {
  doc.registerFontkit(fontkit);
  const embed = (key: keyof Fonts) => {
    const [name, file] = FACE_FILES[key][0];
    return doc.embedFont(source(name, file, false).bytes, { subset: true, customName: name });
  };
  // One after the other so the object numbers come out the same on every build.
  const regular = await embed('regular');
  const bold = await embed('bold');
  const black = await embed('black');
  return { regular, bold, black };
}
