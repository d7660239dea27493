// The return carries the originals' page content only: an upload whose page 1 holds an opaque
// "ACCEPTED" annotation, JavaScript (document open action, names tree, page action, a link),
// an attached file and a form field gives a return in which none of it is reachable from the
// document (read with qpdf's JSON), and whose page 1 renders the same with and without
// annotations (pdftoppm).
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { PDFDocument, PDFName, PDFString, StandardFonts } from 'pdf-lib';
import { afterAll, describe, expect, it } from 'vitest';
import { buildStampedReturn } from '../../server/modules/returns/stamp-pdf';
import { stampInput } from './stamp-fixtures';

const dir = mkdtempSync(path.join(tmpdir(), 'cp-active-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function forgedPlan(): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.HelveticaBold);
  const page = doc.addPage([595, 842]);
  page.drawText('Lift plan: set the drive unit', { x: 50, y: 780, size: 14, font });
  const ctx = doc.context;
  // An opaque stamp annotation whose appearance reads ACCEPTED, over the stamp block's corner.
  const ap = ctx.stream('0 0.6 0 rg 0 0 260 170 re f BT /F 36 Tf 1 1 1 rg 20 70 Td (ACCEPTED) Tj ET', {
    Type: 'XObject',
    Subtype: 'Form',
    BBox: [0, 0, 260, 170],
    Resources: { Font: { F: font.ref } },
  });
  const js = (code: string) => ctx.obj({ S: 'JavaScript', JS: PDFString.of(code) });
  const stampAnnot = ctx.register(
    ctx.obj({
      Type: 'Annot',
      Subtype: 'Stamp',
      Rect: [320, 660, 580, 830],
      F: 4,
      AP: { N: ctx.register(ap) },
    }),
  );
  const link = ctx.register(
    ctx.obj({ Type: 'Annot', Subtype: 'Link', Rect: [50, 770, 300, 800], A: js('app.alert("link")') }),
  );
  const widget = ctx.register(
    ctx.obj({
      Type: 'Annot',
      Subtype: 'Widget',
      FT: 'Tx',
      T: PDFString.of('approved'),
      Rect: [50, 50, 200, 80],
    }),
  );
  page.node.set(PDFName.of('Annots'), ctx.obj([stampAnnot, link, widget]));
  page.node.set(PDFName.of('AA'), ctx.obj({ O: js('app.alert("page open")') }));
  const attachment = ctx.register(ctx.stream('not for the return', { Type: 'EmbeddedFile' }));
  const catalog = doc.catalog;
  catalog.set(PDFName.of('OpenAction'), js('app.alert("open")'));
  catalog.set(PDFName.of('AA'), ctx.obj({ WC: js('app.alert("close")') }));
  catalog.set(
    PDFName.of('Names'),
    ctx.obj({
      JavaScript: { Names: [PDFString.of('run'), ctx.register(js('app.alert("names")'))] },
      EmbeddedFiles: {
        Names: [
          PDFString.of('a.txt'),
          ctx.obj({ Type: 'Filespec', F: PDFString.of('a.txt'), EF: { F: attachment } }),
        ],
      },
    }),
  );
  catalog.set(PDFName.of('AcroForm'), ctx.obj({ Fields: [widget], XFA: PDFString.of('<xdp/>') }));
  return doc.save({ useObjectStreams: false });
}

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

/** Every object reachable from the trailer of `file`, as qpdf reads them. */
function reachable(file: string): Array<{ [k: string]: Json }> {
  // spawns: qpdf
  const json = JSON.parse(execFileSync('qpdf', ['--json=2', '--json-key=qpdf', file], { encoding: 'utf8' }));
  const objects = json.qpdf[1] as Record<string, { value?: Json; stream?: { dict: Json } }>;
  const seen = new Set<string>();
  const dicts: Array<{ [k: string]: Json }> = [];
  const walk = (v: Json) => {
    if (typeof v === 'string' && /^\d+ \d+ R$/.test(v)) {
      if (seen.has(v)) return;
      seen.add(v);
      const o = objects[`obj:${v}`];
      if (o) walk(o.value !== undefined ? o.value : (o.stream?.dict ?? null));
    } else if (Array.isArray(v)) v.forEach(walk);
    else if (v && typeof v === 'object') {
      dicts.push(v);
      Object.values(v).forEach(walk);
    }
  };
  walk(objects.trailer.value as Json);
  return dicts;
}

function render(file: string, hide: boolean): string {
  const prefix = path.join(dir, `page-${hide ? 'hidden' : 'shown'}`);
  // spawns: pdftoppm
  execFileSync('pdftoppm', [
    ...(hide ? ['-hide-annotations'] : []),
    '-r',
    '50',
    '-f',
    '1',
    '-l',
    '1',
    file,
    prefix,
  ]);
  const out = readdirSync(dir).find((f) => f.startsWith(path.basename(prefix)));
  return createHash('sha256')
    .update(readFileSync(path.join(dir, out!)))
    .digest('hex');
}

describe('active content from the upload', () => {
  it('when the upload carries an ACCEPTED annotation, JavaScript, a form and an attachment, then the return carries none of it', async () => {
    const base = await stampInput();
    const plan = await forgedPlan();
    const input = { ...base, documents: [{ ...base.documents[0], bytes: plan }, base.documents[1]] };
    const file = path.join(dir, 'return.pdf');
    writeFileSync(file, await buildStampedReturn(input));

    const dicts = reachable(file);
    const keys = new Set(dicts.flatMap((d) => Object.keys(d)));
    for (const key of ['/AA', '/OpenAction', '/JS', '/JavaScript', '/EmbeddedFiles', '/AcroForm', '/XFA'])
      expect(keys.has(key), key).toBe(false);
    expect(dicts.some((d) => d['/Type'] === '/Annot')).toBe(false);
    // pdf-lib gives the sheet's pages an empty /Annots; no page has an annotation in it.
    expect(dicts.filter((d) => Array.isArray(d['/Annots']) && d['/Annots'].length > 0)).toEqual([]);
    // The forged page's own content is still there.
    // spawns: pdftotext
    const text = execFileSync('pdftotext', ['-f', '1', '-l', '1', file, '-'], { encoding: 'utf8' });
    expect(text).toContain('Lift plan: set the drive unit');
    expect(text).not.toContain('ACCEPTED');
    expect(render(file, false)).toBe(render(file, true));
  });
});
