// Issue 12 items 7 and 8: the stamp block covers nothing of the plan. Plans are made here with
// pdf-lib; the return is read back with pdftotext -bbox (the plan's words before and after, the
// stamp's own words) and pdftoppm (every dark pixel of the plan's page is still dark in the
// return, so no white panel lies over any of it). A full page takes a cover sheet; a placed
// stamp lands where placed; text markups wrap inside their box; labels stay on the page.
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { PDFDocument, StandardFonts } from 'pdf-lib';
import { buildStampedReturnFile, type StampInput } from '@server/modules/returns/stamp-pdf';
import { STAMP_SIZE } from '@shared/drawing/stamp-outline';
import { loadSigner, type Signer } from '@server/lib/pdf-tools/signer';
import { PLAN_ID, stampInput } from './stamp-fixtures';

const work = mkdtempSync(join(tmpdir(), 'stamp-placement-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const A4: [number, number] = [595.28, 841.89];

interface Word {
  page: number;
  xMin: number;
  yMin: number;
  xMax: number;
  yMax: number;
  text: string;
}

/** Every word pdftotext finds, in points from the page's top-left. */
function words(file: string, first?: number, last?: number): Word[] {
  const range = first ? ['-f', String(first), '-l', String(last ?? first)] : [];
  // spawns: pdftotext
  const xml = execFileSync('pdftotext', ['-bbox', ...range, file, '-'], { encoding: 'utf8' });
  const out: Word[] = [];
  let page = (first ?? 1) - 1;
  for (const line of xml.split('\n')) {
    if (/<page /.test(line)) page++;
    const w = /<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/.exec(
      line,
    );
    if (w) out.push({ page, xMin: +w[1], yMin: +w[2], xMax: +w[3], yMax: +w[4], text: w[5] });
  }
  return out;
}

/** A page rendered in grey, one pixel per point, no anti-aliasing. */
function render(file: string, page: number): { cols: number; rows: number; px: Buffer } {
  const root = join(work, `r-${Math.random().toString(36).slice(2)}`);
  // spawns: pdftoppm
  execFileSync('pdftoppm', [
    '-f',
    String(page),
    '-l',
    String(page),
    '-singlefile',
    '-gray',
    '-r',
    '72',
    '-aa',
    'no',
    '-aaVector',
    'no',
    file,
    root,
  ]);
  const buf = readFileSync(`${root}.pgm`);
  const head = buf.subarray(0, 40).toString('latin1');
  const m = /^P5\s+(\d+)\s+(\d+)\s+255\s/.exec(head)!;
  return { cols: +m[1], rows: +m[2], px: buf.subarray(m[0].length) };
}

/** Dark pixels of the plan's page that are no longer dark on the return's page. */
function hiddenPixels(plan: string, planPage: number, ret: string, retPage: number): number {
  const a = render(plan, planPage);
  const b = render(ret, retPage);
  expect([b.cols, b.rows]).toEqual([a.cols, a.rows]);
  let hidden = 0;
  for (let i = 0; i < a.px.length; i++) if (a.px[i] < 128 && b.px[i] > 200) hidden++;
  return hidden;
}

/** A one-page A4 plan with the given lines of text (x, y of the baseline, size 10). */
async function plan(lines: Array<[string, number, number]>, pages = 1): Promise<string> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  for (let p = 0; p < pages; p++) {
    const page = doc.addPage(A4);
    for (const [text, x, y] of lines)
      page.drawText(p ? `Sheet ${p + 1} ${text}` : text, { x, y, size: 10, font });
  }
  const file = join(work, `plan-${Math.random().toString(36).slice(2)}.pdf`);
  writeFileSync(file, await doc.save());
  return file;
}

async function build(planFile: string, change: (i: StampInput) => void = () => {}, signer?: Signer) {
  const input = await stampInput();
  input.documents = [{ fileId: PLAN_ID, name: 'plan.pdf', file: planFile }];
  input.markups = [];
  change(input);
  const out = join(work, `return-${Math.random().toString(36).slice(2)}.pdf`);
  const built = await buildStampedReturnFile(input, out, { signer });
  return { out, built, input };
}

const key = (w: Word) => `${w.text}@${w.xMin.toFixed(1)},${w.yMin.toFixed(1)}`;
const within = (w: Word, r: { x0: number; y0: number; x1: number; y1: number }) =>
  w.xMin >= r.x0 - 0.5 && w.xMax <= r.x1 + 0.5 && w.yMin >= r.y0 - 0.5 && w.yMax <= r.y1 + 0.5;
const meets = (w: Word, r: { x0: number; y0: number; x1: number; y1: number }) =>
  w.xMin < r.x1 && w.xMax > r.x0 && w.yMin < r.y1 && w.yMax > r.y0;

/** Text near three corners of the page and across the middle: only the bottom left is free. */
const THREE_CORNERS: Array<[string, number, number]> = [
  ['Title block: Northgate clarifier drive, sheet L-101', 330, 800],
  ['Revision table rev A issued for review', 330, 700],
  ['Project north arrow and scale bar 1:200', 40, 800],
  ['Crane pad detail with timber mats', 40, 690],
  ['Rigging schedule: four legs, 13 t shackles', 330, 240],
  ['Notes: exclusion zone fenced before lifting', 330, 120],
  ['Crane position and load path across the middle of the sheet', 60, 450],
];

describe('stamp placement', () => {
  it('when three corners carry text, then the stamp lands in the empty one and page 1 keeps every plan word', async () => {
    const planFile = await plan(THREE_CORNERS);
    const { out, built } = await build(planFile);
    expect(built.stampSpot).toMatchObject({ on: 'page', how: 'bottom-left' });
    const before = words(planFile, 1);
    const after = words(out, 1);
    const afterKeys = new Set(after.map(key));
    expect(before.length).toBeGreaterThan(30);
    for (const w of before) expect(afterKeys.has(key(w)), w.text).toBe(true);
    // The stamp's words sit in the bottom-left quarter, and none of the plan's words under the block.
    const title = after.find((w) => w.text === 'REVIEW')!;
    expect(title.xMin).toBeLessThan(A4[0] / 2);
    expect(title.yMin).toBeGreaterThan(A4[1] / 2);
    const rect = built.stampSpot.on === 'page' ? built.stampSpot.rect : null;
    const block = {
      x0: rect!.x,
      x1: rect!.x + rect!.width,
      y0: A4[1] - rect!.y - rect!.height,
      y1: A4[1] - rect!.y,
    };
    expect(within(title, block)).toBe(true);
    for (const w of before) expect(meets(w, block), w.text).toBe(false);
    expect(hiddenPixels(planFile, 1, out, 1)).toBe(0);
  });

  it('when page 1 is full of text, then a cover sheet carries the stamp and the plan follows intact on page 2', async () => {
    const full: Array<[string, number, number]> = [];
    for (let y = 820; y > 40; y -= 14) {
      full.push(['Dense general arrangement notes fill this page', 20, y]);
      full.push(['from edge to edge in two columns of notes', 300, y]);
    }
    const planFile = await plan(full, 2);
    const { out, built } = await build(planFile, (i) => {
      i.calculation.findings = [
        {
          ...i.calculation.findings[0],
          label: 'F1',
          markup: 'Page 2 of the return (plan.pdf, page 2), cloud marked F1',
          markupPage: 2,
        },
      ];
    });
    const roomy = await build(await plan(THREE_CORNERS, 2));
    expect(built.stampSpot).toEqual({ on: 'cover', why: 'page 1 had no free corner' });
    expect(built.pages).toBe(roomy.built.pages + 1);
    // spawns: pdfinfo
    expect(execFileSync('pdfinfo', [out], { encoding: 'utf8' })).toMatch(
      new RegExp(`Pages:\\s+${built.pages}\\b`),
    );
    const cover = words(out, 1)
      .map((w) => w.text)
      .join(' ');
    expect(cover).toContain('Stamp on the cover sheet: page 1 had no free corner.');
    expect(cover).toContain('REVIEW STAMP');
    expect(cover).toMatch(/page 1 of \d+/);
    const before = words(planFile, 1).map(key);
    const page2 = words(out, 2);
    expect(new Set(page2.map(key))).toEqual(
      new Set([...before, ...page2.filter((w) => w.yMin > 820).map(key)]),
    );
    expect(page2.some((w) => w.text === 'REVIEW')).toBe(false);
    expect(hiddenPixels(planFile, 1, out, 2)).toBe(0);
    // The findings name the pages as the return now numbers them.
    // spawns: pdftotext
    const sheetText = execFileSync('pdftotext', ['-f', '4', out, '-'], { encoding: 'utf8' }).replace(
      /\s+/g,
      ' ',
    );
    expect(sheetText).toContain('Page 3 of the return (plan.pdf, page 2), cloud marked F1');
    // The plan's second page is page 3, untouched but its footer.
    expect(
      words(out, 3)
        .filter((w) => w.yMin < 820)
        .map(key),
    ).toEqual(words(planFile, 2).map(key));
  });

  it('when the stamp is on a cover sheet and the return is signed, then the signature is valid and its field is on the cover', async () => {
    const full: Array<[string, number, number]> = [];
    for (let y = 820; y > 40; y -= 14)
      full.push(
        ['Notes across the whole width of the sheet, edge to edge, every line', 20, y],
        ['more notes in the second column', 380, y],
      );
    const signer = await loadSigner({ DATA_DIR: join(work, 'data') });
    const { out, built } = await build(await plan(full), () => {}, signer);
    expect(built.stampSpot.on).toBe('cover');
    // spawns: pdfsig
    const report = spawnSync('pdfsig', [out], { encoding: 'utf8' }).stdout;
    expect(report).toContain('Signature is Valid');
    expect(report).toContain('Total document signed');
    // spawns: qpdf
    const json = JSON.parse(
      execFileSync('qpdf', ['--json=2', out], { encoding: 'utf8', maxBuffer: 1 << 28 }),
    );
    const objects = json.qpdf[1] as Record<string, { value?: Record<string, unknown> }>;
    const widget = Object.values(objects).find((o) => o.value?.['/FT'] === '/Sig')!.value!;
    const pages = (json.pages as Array<{ object: string }>).map((p) => p.object);
    expect(widget['/P']).toBe(pages[0]);
  });

  it('when the engineer placed the stamp, then it lands where placed', async () => {
    const planFile = await plan(THREE_CORNERS);
    const at = { x: 60, y: 260 };
    const { out, built } = await build(planFile, (i) => (i.placement = at));
    expect(built.stampSpot).toEqual({ on: 'page', how: 'placed', rect: { ...at, ...STAMP_SIZE } });
    const title = words(out, 1).find((w) => w.text === 'REVIEW')!;
    // "REVIEW STAMP" starts 7 pt in from the block's left edge, in its top band.
    expect(title.xMin).toBeCloseTo(at.x + 7, 0);
    expect(title.yMin).toBeGreaterThan(A4[1] - at.y - STAMP_SIZE.height);
    expect(title.yMax).toBeLessThan(A4[1] - at.y - STAMP_SIZE.height + 15);
    expect(hiddenPixels(planFile, 1, out, 1)).toBe(0);
  });

  it('when a placed stamp would cover plan text, then it is not put there but in a free corner', async () => {
    const planFile = await plan(THREE_CORNERS);
    const { out, built } = await build(planFile, (i) => (i.placement = { x: 40, y: 380 }));
    expect(built.stampSpot).toMatchObject({ on: 'page', how: 'bottom-left' });
    expect(hiddenPixels(planFile, 1, out, 1)).toBe(0);
  });

  it('when a text markup sits in the empty corner, then none of its words is under the stamp', async () => {
    const planFile = await plan(THREE_CORNERS);
    const text = 'Mats under every outrigger to be checked against the ground report before the lift';
    const { out, built } = await build(planFile, (i) => {
      i.markups = [
        {
          fileId: PLAN_ID,
          pageNumber: 1,
          kind: 'text',
          geometry: { x: 30, y: 160, fontSize: 12 },
          colour: 'rust',
          text,
          number: null,
        },
      ];
    });
    expect(built.stampSpot.on).toBe('page');
    const r = built.stampSpot.on === 'page' ? built.stampSpot.rect : { x: 0, y: 0, width: 0, height: 0 };
    const block = { x0: r.x, x1: r.x + r.width, y0: A4[1] - r.y - r.height, y1: A4[1] - r.y };
    const marked = words(out, 1).filter(
      (w) => text.split(' ').includes(w.text) && w.xMin < 300 && w.yMin > 842 - 200,
    );
    expect(marked.length).toBeGreaterThan(8);
    for (const w of marked) expect(meets(w, block), w.text).toBe(false);
  });

  it('when page 1 carries a markup in the empty corner, then the stamp does not cover the markup', async () => {
    const planFile = await plan(THREE_CORNERS);
    const { built } = await build(planFile, (i) => {
      i.markups = [
        {
          fileId: PLAN_ID,
          pageNumber: 1,
          kind: 'rectangle',
          geometry: { x: 40, y: 60, width: 120, height: 80 },
          colour: 'rust',
          text: null,
          number: null,
        },
      ];
    });
    // The bottom left corner is the markup's: the block slides into room elsewhere, clear of it.
    expect(built.stampSpot.on).toBe('page');
    const r = built.stampSpot.on === 'page' ? built.stampSpot.rect : { x: 0, y: 0, width: 0, height: 0 };
    expect(built.stampSpot).not.toMatchObject({ how: 'bottom-left', rect: { x: 18, y: 24 } });
    const clear = r.x >= 160 || r.y >= 140 + 18 || r.x + r.width <= 40 || r.y + r.height <= 60;
    expect(clear).toBe(true);
  });
});

describe('markup text in the return', () => {
  const LONG_WORD = 'Outriggerpadbearingpressurerecheckedagainstthegeotechnicalreport';

  it('when a text markup is long and near the right edge, then its lines wrap inside the 220 pt box and stay on the page', async () => {
    const planFile = await plan(THREE_CORNERS);
    const text = `Confirm the mat size under the front outrigger before the lift ${LONG_WORD} and sign off on site.`;
    const { out } = await build(planFile, (i) => {
      i.markups = [
        {
          fileId: PLAN_ID,
          pageNumber: 1,
          kind: 'text',
          geometry: { x: 480, y: 560, fontSize: 11 },
          colour: 'rust',
          text,
          number: null,
        },
      ];
    });
    // The plan's own words on these lines end left of x 340; the markup cannot start left of 369.
    const mine = words(out, 1).filter((w) => w.yMin > 842 - 600 && w.yMin < 842 - 300 && w.xMin >= 340);
    const left = Math.min(...mine.map((w) => w.xMin));
    const right = Math.max(...mine.map((w) => w.xMax));
    expect(mine.map((w) => w.text).join(' ')).toContain('Confirm the mat size');
    // The long word is broken over lines, none wider than the box.
    expect(
      mine.filter((w) => LONG_WORD.startsWith(w.text) || LONG_WORD.includes(w.text)).length,
    ).toBeGreaterThan(1);
    expect(right - left).toBeLessThanOrEqual(220.5);
    expect(right).toBeLessThanOrEqual(A4[0] - 6 + 0.5);
    expect(left).toBeGreaterThanOrEqual(6);
  });

  it('when a box markup near the top right corner has a long label, then the label stays on the page', async () => {
    const planFile = await plan(THREE_CORNERS);
    const label = 'Check the crane mats under the corner of the slab here and the edge distance';
    const { out } = await build(planFile, (i) => {
      i.markups = [
        {
          fileId: PLAN_ID,
          pageNumber: 1,
          kind: 'rectangle',
          geometry: { x: 545, y: 815, width: 45, height: 24 },
          colour: 'cobalt',
          text: label,
          number: null,
        },
        {
          fileId: PLAN_ID,
          pageNumber: 1,
          kind: 'cloud',
          geometry: { x: 2, y: 700, width: 40, height: 140 },
          colour: 'rust',
          text: 'Left edge cloud label that is long',
          number: null,
        },
      ];
    });
    const all = words(out, 1);
    // No room above the box at the top edge: its label goes under it, clear of the box.
    expect(all.find((x) => x.text === 'Check')!.yMin).toBeGreaterThan(A4[1] - 815);
    for (const word of ['Check', 'edge', 'distance', 'Left', 'cloud']) {
      const w = all.find((x) => x.text === word)!;
      expect(w, word).toBeTruthy();
      expect(w.xMin, word).toBeGreaterThanOrEqual(5.5);
      expect(w.xMax, word).toBeLessThanOrEqual(A4[0] - 5.5);
      expect(w.yMin, word).toBeGreaterThanOrEqual(5.5);
      expect(w.yMax, word).toBeLessThanOrEqual(A4[1] - 5.5);
    }
  });
});
