// The stamped return's PDF builder, read back with pdfjs-dist (text, operator lists) and
// pdftotext: page count, the stamp block's text, page numbers, the calculation sheet's
// checks, markup positions in PDF coordinates, untouched originals and repeatable output.
import { createHash } from 'node:crypto';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { MARKUP_COLOURS } from '@shared/schemas/reviews';
import { buildStampedReturn, type StampInput } from '@server/modules/returns/stamp-pdf';
import { cloudPath } from '@shared/drawing/cloud-path';
import { safeText } from '@server/modules/returns/text-pdf';
import { exampleResult, OFFSET_ORIGIN, OFFSET_RECT, PLAN_ID, RECT, stampInput } from './stamp-fixtures';

type PdfJs = typeof import('pdfjs-dist/legacy/build/pdf.mjs');
let pdfjs: PdfJs;

const ORIGINAL_PAGES = 3; // 2-page lift plan + 1-page drawing

async function open(bytes: Uint8Array) {
  // pdfjs takes ownership of the buffer it is given: hand it a copy.
  return pdfjs.getDocument({ data: new Uint8Array(bytes), verbosity: 0 }).promise;
}

async function pageTexts(bytes: Uint8Array): Promise<string[]> {
  const doc = await open(bytes);
  const out: string[] = [];
  for (let i = 1; i <= doc.numPages; i++) {
    const tc = await (await doc.getPage(i)).getTextContent();
    out.push(tc.items.map((it) => ('str' in it ? it.str : '')).join(' '));
  }
  await doc.destroy();
  return out;
}

type M = [number, number, number, number, number, number];
const mul = (m: M, n: M): M => [
  m[0] * n[0] + m[1] * n[2],
  m[0] * n[1] + m[1] * n[3],
  m[2] * n[0] + m[3] * n[2],
  m[2] * n[1] + m[3] * n[3],
  m[4] * n[0] + m[5] * n[2] + n[4],
  m[4] * n[1] + m[5] * n[3] + n[5],
];

interface PathBox {
  box: [number, number, number, number];
  stroke: string | null;
  fill: string | null;
}

/** Every path on a page as its bounding box in user space, with the colours in force. */
async function pathBoxes(bytes: Uint8Array, pageNumber: number): Promise<PathBox[]> {
  const doc = await open(bytes);
  const page = await doc.getPage(pageNumber);
  const ops = await page.getOperatorList();
  const { OPS } = pdfjs;
  let state = { ctm: [1, 0, 0, 1, 0, 0] as M, stroke: null as string | null, fill: null as string | null };
  const stack: (typeof state)[] = [];
  const out: PathBox[] = [];
  ops.fnArray.forEach((fn, i) => {
    const args = ops.argsArray[i] as unknown[];
    if (fn === OPS.save) stack.push({ ...state });
    else if (fn === OPS.restore) state = stack.pop() ?? state;
    else if (fn === OPS.transform) state.ctm = mul(args as M, state.ctm);
    else if (fn === OPS.setStrokeRGBColor) state.stroke = String(args[0]);
    else if (fn === OPS.setFillRGBColor) state.fill = String(args[0]);
    else if (fn === OPS.constructPath) {
      const mm = args[2] as number[];
      const pts = [
        [mm[0], mm[1]],
        [mm[2], mm[3]],
        [mm[0], mm[3]],
        [mm[2], mm[1]],
      ].map(([x, y]) => [
        x * state.ctm[0] + y * state.ctm[2] + state.ctm[4],
        x * state.ctm[1] + y * state.ctm[3] + state.ctm[5],
      ]);
      const xs = pts.map((p) => p[0]);
      const ys = pts.map((p) => p[1]);
      out.push({
        box: [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)],
        stroke: state.stroke,
        fill: state.fill,
      });
    }
  });
  await doc.destroy();
  return out;
}

const near = (a: number[], b: number[], tol = 0.01) => a.every((v, i) => Math.abs(v - b[i]) <= tol);
const sha = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');

let input: StampInput;
let output: Uint8Array;
let texts: string[];

beforeAll(async () => {
  pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs');
  input = await stampInput();
  output = await buildStampedReturn(input);
  texts = await pageTexts(output);
});

describe('buildStampedReturn', () => {
  it('when a return is built, then it holds every original page followed by the calculation sheet', async () => {
    const sheetPages = texts.filter((t) => t.includes('CALCULATION SHEET')).length;
    expect(sheetPages).toBeGreaterThanOrEqual(1);
    expect(texts).toHaveLength(ORIGINAL_PAGES + sheetPages);
    expect(texts[1]).toContain('Sheet 2 - ground bearing and mats');
    expect(texts[2]).toContain('Rigging drawing RD-07');
    expect(texts.slice(ORIGINAL_PAGES).every((t) => t.includes('CALCULATION SHEET'))).toBe(true);
  });

  it('when the first page is read, then the stamp shows the decision, reference, revision, code, dates and caution', () => {
    const first = texts[0];
    expect(first).toContain('Accepted as noted');
    expect(first).toContain('NGW-LP-0142');
    expect(first).toContain('revision 2');
    expect(first).toContain('CP7K-Q2MX-94TD-R8VA');
    expect(first).toContain('Dr Imogen Reyes-Whitfield');
    expect(first).toContain('14 Mar 2027');
    expect(first).toContain('15 Mar 2027');
    expect(first).toContain('see calculation sheet');
    const layout = execFileSync('/usr/bin/pdftotext', ['-layout', '-f', '1', '-l', '1', '-', '-'], {
      input: Buffer.from(output),
    }).toString();
    expect(layout.replace(/\s+/g, ' ')).toContain(
      "Checks arithmetic and consistency only; does not replace the manufacturer's chart, a qualified person or local codes.",
    );
  });

  it('when any page is read, then it carries "REF rev N — page n of m"', () => {
    const m = texts.length;
    texts.forEach((t, i) => expect(t).toContain(`NGW-LP-0142 rev 2 — page ${i + 1} of ${m}`));
  });

  it('when the calculation sheet is read, then every check appears with its label and status word', () => {
    const sheet = execFileSync(
      '/usr/bin/pdftotext',
      ['-layout', '-f', String(ORIGINAL_PAGES + 1), '-', '-'],
      {
        input: Buffer.from(output),
      },
    ).toString();
    const words = { pass: 'PASS', caution: 'CAUTION', fail: 'FAIL', not_applicable: 'N/A' } as const;
    for (const c of input.calculation.result!.checks) {
      const line = sheet.split('\n').find((l) => l.includes(c.label) && l.includes(words[c.status]));
      expect(line, `${c.label} with ${words[c.status]}`).toBeDefined();
    }
    expect(sheet).toContain('Accepted as noted');
    expect(sheet).toContain('Checks arithmetic and consistency only');
    expect(sheet).toContain('Gross load');
    expect(sheet).toContain('DIFFERS');
    expect(sheet).toContain('Revised gross load 10.4 t on sheet 2.');
    expect(sheet).toContain('load arm');
  });

  it('when the caution is looked for, then it is on the first page of the calculation sheet', () => {
    expect(texts[ORIGINAL_PAGES]).toContain('Checks arithmetic and consistency only');
    expect(texts[ORIGINAL_PAGES]).toContain('Accepted as noted');
  });

  it('when a rectangle markup is stored, then a stroked path with its corners and colour is on its page', async () => {
    const boxes = await pathBoxes(output, 1);
    const want = [RECT.x, RECT.y, RECT.x + RECT.width, RECT.y + RECT.height];
    const hit = boxes.find((b) => near(b.box, want));
    expect(hit, JSON.stringify(boxes.slice(0, 5))).toBeDefined();
    expect(hit!.stroke).toBe(MARKUP_COLOURS.rust);
  });

  it("when a page's MediaBox does not start at 0,0, then its markup is offset by the box origin", async () => {
    const boxes = await pathBoxes(output, 2);
    const want = [
      OFFSET_ORIGIN.x + OFFSET_RECT.x,
      OFFSET_ORIGIN.y + OFFSET_RECT.y,
      OFFSET_ORIGIN.x + OFFSET_RECT.x + OFFSET_RECT.width,
      OFFSET_ORIGIN.y + OFFSET_RECT.y + OFFSET_RECT.height,
    ];
    const hit = boxes.find((b) => near(b.box, want));
    expect(hit, JSON.stringify(boxes.slice(0, 5))).toBeDefined();
    expect(hit!.stroke).toBe(MARKUP_COLOURS.cobalt);
  });

  it('when ellipse, cloud, arrow and pin markups are stored, then each is drawn in its colour where stored', async () => {
    const boxes = await pathBoxes(output, 1);
    const find = (colour: string, pred: (b: PathBox) => boolean) =>
      boxes.find((b) => (b.stroke === colour || b.fill === colour) && pred(b));
    // Ellipse inside its box, touching all four sides.
    expect(find(MARKUP_COLOURS.cobalt, (b) => near(b.box, [320, 520, 440, 580], 0.5))).toBeDefined();
    // Cloud: scallops bulge a little outside the stored box.
    const cloud = find(
      MARKUP_COLOURS.verdigris,
      (b) => b.box[0] < 60 && b.box[0] > 40 && b.box[2] > 260 && b.box[2] < 280 && b.box[3] > 270,
    );
    expect(cloud).toBeDefined();
    // Arrow head: a filled triangle whose box contains the tip (420, 330).
    const head = find(
      MARKUP_COLOURS.graphite,
      (b) =>
        b.fill === MARKUP_COLOURS.graphite && b.box[0] <= 420.5 && b.box[3] >= 329.5 && b.box[3] <= 330.5,
    );
    expect(head).toBeDefined();
    // Pin: a disc of radius 8 centred on (460, 405).
    expect(find(MARKUP_COLOURS.rust, (b) => near(b.box, [452, 397, 468, 413], 0.6))).toBeDefined();
    // The stamp's caution and the pin number are text; the free-text markup prints as typed
    // (pdfjs gives each run of one font as its own item, hence the spaces squeezed).
    expect(texts[0].replace(/\s+/g, ' ')).toContain('Check sling angle ≥ 60° — see finding 1');
  });

  it('when the return is built, then the uploaded PDFs are byte for byte unchanged', async () => {
    const fresh = await stampInput();
    const before = fresh.documents.map((d) => sha(d.bytes!));
    await buildStampedReturn(fresh);
    expect(fresh.documents.map((d) => sha(d.bytes!))).toEqual(before);
  });

  it('when the same input is built twice, then the page count, the text and the bytes are the same', async () => {
    const again = await buildStampedReturn(await stampInput());
    const againTexts = await pageTexts(again);
    expect(againTexts).toHaveLength(texts.length);
    expect(againTexts).toEqual(texts);
    expect(sha(again)).toBe(sha(output));
  });

  it('when the PDF dates are read, then they are the issue time, not the clock', async () => {
    const doc = await open(output);
    const meta = await doc.getMetadata();
    await doc.destroy();
    const info = meta.info as Record<string, string>;
    expect(info.CreationDate).toMatch(/^D:20270315080500/);
    expect(info.ModDate).toMatch(/^D:20270315080500/);
  });

  it('when conditions are long and text holds characters Lato lacks, then they print as typed and the stamp points to the sheet', async () => {
    const long = await stampInput({
      conditions: 'Σ ≤ 5 t → ✓ ' + 'Mats and exclusion zone as marked up; '.repeat(60),
      title: 'Überprüfung — ≈ ünïcödé 中文 title',
    });
    const bytes = await buildStampedReturn(long);
    const t = await pageTexts(bytes);
    expect(t[0]).toContain('see calculation sheet');
    expect(t[0]).not.toContain('Mats and exclusion zone as marked up; '.repeat(6).trim());
    const sheet = t.slice(ORIGINAL_PAGES).join(' ');
    const flat = sheet.replace(/\s+/g, ' ');
    expect(flat).toContain('Σ ≤ 5 t → ✓ Mats');
    expect(flat).not.toContain('sum <=');
    // Characters no embedded font has (CJK here) still become "?".
    expect(flat).toContain('Überprüfung — ≈ ünïcödé ?? title');
    expect(t.every((p, i) => p.includes(`page ${i + 1} of ${t.length}`))).toBe(true);
  });

  it('when the decision is Rejected with imperial units and no findings, then the words change accordingly', async () => {
    const base = await stampInput({ decision: 'rejected', conditions: '' });
    const { inputs, result } = exampleResult('fail-stability', 'imperial');
    base.calculation = { inputs, result, units: 'imperial', findings: [], acceptedFigures: [] };
    const t = await pageTexts(await buildStampedReturn(base));
    expect(t[0]).toContain('Rejected');
    const sheet = t.slice(ORIGINAL_PAGES).join(' ');
    expect(sheet).toContain('FAIL');
    expect(sheet).toContain('No findings were raised on this revision.');
    expect(sheet).toMatch(/\d kip/);
  });

  it('when the lift is a gantry, then the side view is explained in words rather than drawn', async () => {
    const base = await stampInput();
    const { inputs, result } = exampleResult('pass-gantry-a-frame');
    base.calculation = { ...base.calculation, inputs, result };
    const sheet = (await pageTexts(await buildStampedReturn(base))).slice(ORIGINAL_PAGES).join(' ');
    expect(sheet).toContain('Not drawn for a gantry or A-frame');
    expect(sheet).not.toContain('load arm');
  });

  it('when there is no calculation result, then the sheet says so and still numbers its pages', async () => {
    const base = await stampInput();
    base.calculation = { ...base.calculation, result: null };
    const t = await pageTexts(await buildStampedReturn(base));
    expect(t.slice(ORIGINAL_PAGES).join(' ')).toContain('No calculation result is stored for this revision');
    expect(t[t.length - 1]).toContain(`page ${t.length} of ${t.length}`);
  });

  it('when a markup names a page or file that is not in the package, then it is left out and the rest are drawn', async () => {
    const base = await stampInput();
    base.markups.push(
      { ...base.markups[0], pageNumber: 99 },
      { ...base.markups[0], fileId: '33333333-3333-4333-8333-333333333333' },
    );
    const boxes = await pathBoxes(await buildStampedReturn(base), 1);
    const want = [RECT.x, RECT.y, RECT.x + RECT.width, RECT.y + RECT.height];
    expect(boxes.filter((b) => near(b.box, want))).toHaveLength(1);
  });

  it('when a document is not a PDF, then the build fails naming the file', async () => {
    const base = await stampInput();
    base.documents[1] = { ...base.documents[1], bytes: new TextEncoder().encode('not a pdf at all') };
    await expect(buildStampedReturn(base)).rejects.toThrow(/rigging-drawing\.pdf/);
  });

  it('when the first page is rendered, then the rectangle markup shows rust on its edge and not inside', () => {
    const dir = mkdtempSync(join(tmpdir(), 'stamp-'));
    try {
      writeFileSync(join(dir, 'out.pdf'), output);
      execFileSync('/usr/bin/pdftoppm', [
        '-r',
        '72',
        '-f',
        '1',
        '-l',
        '1',
        join(dir, 'out.pdf'),
        join(dir, 'p'),
      ]);
      const ppmFile = readdirSync(dir).find((f) => f.endsWith('.ppm'))!;
      const ppm = readFileSync(join(dir, ppmFile));
      const header = ppm.subarray(0, 20).toString('latin1').split(/\s+/);
      const [w, h] = [Number(header[1]), Number(header[2])];
      const offset = ppm.length - w * h * 3;
      const pixel = (x: number, yUp: number) => {
        const row = Math.round(h - yUp - 1);
        const i = offset + (row * w + Math.round(x)) * 3;
        return [ppm[i], ppm[i + 1], ppm[i + 2]];
      };
      const rust = [0xb3, 0x40, 0x1a];
      const edge = pixel(RECT.x + RECT.width / 2, RECT.y);
      const inside = pixel(RECT.x + RECT.width / 2, RECT.y + RECT.height / 2 + 7);
      expect(edge.every((v, i) => Math.abs(v - rust[i]) < 60)).toBe(true);
      expect(inside.every((v) => v > 200)).toBe(true);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('when a cloud path is made, then it is closed scallops of arcs', () => {
    const d = cloudPath(200, 90);
    expect(d.startsWith('M0 0')).toBe(true);
    expect(d.endsWith('Z')).toBe(true);
    expect((d.match(/A/g) ?? []).length).toBeGreaterThanOrEqual(8);
  });

  it('when text is made safe, then only characters no embedded font has are replaced', async () => {
    const { PDFDocument } = await import('pdf-lib');
    const { embedFonts } = await import('@server/modules/returns/text-pdf');
    const fonts = embedFonts(await PDFDocument.create());
    expect(safeText('Gross load 10.4 t — 82% of 16.0 t × 1.2', fonts.regular)).toBe(
      'Gross load 10.4 t — 82% of 16.0 t × 1.2',
    );
    expect(safeText('a ≤ b\tc 中', fonts.regular)).toBe('a ≤ b c ?');
    expect(safeText('≥ ✓ ✗ − θ ² – Łódź', fonts.black)).toBe('≥ ✓ ✗ − θ ² – Łódź');
    expect(PLAN_ID).toMatch(/^[0-9a-f-]{36}$/);
  });
});
