// PDFs for upload tests, made with pdf-lib: a good one, an encrypted one (a real /Encrypt
// entry in the trailer), and helpers to cut or pad bytes.
import { PDFDocument, PDFName, PDFString, StandardFonts } from 'pdf-lib';

export async function makePdf(pages = 1, text = 'Test lift plan'): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  for (let i = 0; i < pages; i++)
    doc.addPage([595, 842]).drawText(`${text} — page ${i + 1}`, { x: 50, y: 780, size: 14, font });
  return doc.save();
}

export async function makeEncryptedPdf(): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.addPage([595, 842]);
  const encrypt = doc.context.obj({
    Filter: PDFName.of('Standard'),
    V: 1,
    R: 2,
    O: PDFString.of('0123456789abcdef0123456789abcdef'),
    U: PDFString.of('fedcba9876543210fedcba9876543210'),
    P: -3904,
  });
  doc.context.trailerInfo.Encrypt = doc.context.register(encrypt);
  return doc.save({ useObjectStreams: false });
}

export function truncate(bytes: Uint8Array, keep = 0.6): Uint8Array {
  return bytes.slice(0, Math.floor(bytes.byteLength * keep));
}

/** Overwrite `count` bytes from `start` with "A": zlib data that no longer inflates. */
function spoil(bytes: Uint8Array, start: number, count: number): Uint8Array {
  const out = bytes.slice();
  for (let i = start; i < start + count && i < out.length; i++) out[i] = 0x41;
  return out;
}

/** The offset of the first data byte of the first stream after `marker` in the file's text. */
function streamDataAfter(text: string, marker: number): number {
  const at = text.indexOf('stream', marker);
  return at + 'stream'.length + (text[at + 6] === '\r' ? 2 : 1);
}

/**
 * PDFs the stamped return cannot be made from, each with a header, a catalog and %%EOF:
 * 'object-streams' — the object stream that holds the catalog and page tree does not inflate;
 * 'page-content' — page 1's content stream does not inflate (pdf-lib still reads the file);
 * 'repairable' — only the cross-reference offset is wrong, which readers (and qpdf) repair.
 */
export async function makeBrokenPdf(
  kind: 'object-streams' | 'page-content' | 'repairable',
): Promise<Uint8Array> {
  const good = await makePdf(2, 'Damaged plan');
  if (kind === 'object-streams') {
    const text = Buffer.from(good).toString('latin1');
    return spoil(good, streamDataAfter(text, text.indexOf('/Type /ObjStm')) + 2, 40);
  }
  const doc = await PDFDocument.load(good);
  const flat = await doc.save({ useObjectStreams: false });
  const text = Buffer.from(flat).toString('latin1');
  if (kind === 'page-content') {
    const contents = /\/Contents \[? ?(\d+) 0 R/.exec(text)!;
    const object = text.indexOf(`\n${contents[1]} 0 obj`);
    return spoil(flat, streamDataAfter(text, object) + 2, 16);
  }
  const startxref = text.lastIndexOf('startxref');
  const offset = /startxref\s+(\d+)/.exec(text.slice(startxref))![1];
  const wrong = String(Number(offset) - 7).padStart(offset.length, '0');
  return new Uint8Array(
    Buffer.from(text.slice(0, startxref) + text.slice(startxref).replace(offset, wrong), 'latin1'),
  );
}
