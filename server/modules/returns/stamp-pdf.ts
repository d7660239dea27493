// The stamped return as a pure function: the package's PDFs, the engineer's markups, the
// decision and the calculation in; the bytes of one new PDF out. No database and no files
// other than the Lato fonts from node_modules, and no clock: the PDF's dates come from
// stamp.issuedAt, so the same input gives the same pages and text.
//
// What it holds, in order:
// 1. every page of every document, copied (the uploaded bytes are only read), with that
//    page's markups burned in as vector drawing;
// 2. on the first page, the stamp block (draw-stamp-block.ts);
// 3. the calculation sheet on A4 pages (calc-sheet-pdf.ts);
// and on every page a "REF rev N — page n of m" footer.
//
// Coordinates: markup geometry is in PDF points in the page's unrotated space, measured from
// the lower-left corner of its visible box (CropBox, else MediaBox), as the review viewer
// stores it; a box that does not start at 0,0 is handled by offsetting by its origin.
// Rotated pages (/Rotate 90, 180, 270): markups stay at their stored unrotated positions
// (they are in the same space as the page's content), while text, pin numbers, the stamp
// block and the footer are drawn upright and placed as the page is displayed
// (page-frame-pdf.ts).
import { PDFDocument } from 'pdf-lib';
import { buildCalculationSheet, drawSheetHeader } from './calc-sheet-pdf';
import { drawMarkups } from './draw-markups';
import { drawFooter, drawStampBlock } from './draw-stamp-block';
import { frameOf, inDisplayFrame, isolateOriginalContent } from './page-frame-pdf';
import { embedLato } from './text-pdf';
import type { StampInput } from './stamp-input';

export type { StampInput } from './stamp-input';

export class StampInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'StampInputError';
  }
}

function pdfDate(iso: string): Date {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? new Date(0) : d;
}

export async function buildStampedReturn(input: StampInput): Promise<Uint8Array> {
  const { stamp } = input;
  if (input.documents.length === 0) throw new StampInputError('The return needs at least one PDF document.');
  const issued = pdfDate(stamp.issuedAt);
  const out = await PDFDocument.create({ updateMetadata: false });
  out.setTitle(`${stamp.reference} rev ${stamp.revision} — stamped return`);
  out.setSubject(stamp.title);
  out.setAuthor(stamp.engineer);
  out.setCreator('Counterpoise');
  out.setProducer('Counterpoise stamped return (pdf-lib)');
  out.setKeywords([stamp.reference, `revision ${stamp.revision}`, stamp.verificationCode]);
  out.setCreationDate(issued);
  out.setModificationDate(issued);
  const fonts = await embedLato(out);

  // 1. The original pages with their markups.
  let first = true;
  for (const doc of input.documents) {
    let src: PDFDocument;
    try {
      src = await PDFDocument.load(doc.bytes, { updateMetadata: false });
    } catch (err) {
      throw new StampInputError(
        `${doc.name} could not be read as a PDF (${err instanceof Error ? err.message : String(err)}).`,
      );
    }
    const copies = await out.copyPages(src, src.getPageIndices());
    copies.forEach((page, i) => {
      out.addPage(page);
      isolateOriginalContent(page);
      const frame = frameOf(page);
      const marks = input.markups.filter((m) => m.fileId === doc.fileId && m.pageNumber === i + 1);
      inDisplayFrame(page, frame, () => {
        drawMarkups(page, frame, marks, fonts);
        if (first) drawStampBlock(page, frame, fonts, stamp);
      });
      first = false;
    });
  }
  const originalCount = out.getPageCount();

  // 2. The calculation sheet.
  buildCalculationSheet(out, fonts, input);

  // 3. Page numbers now that the total is known.
  const total = out.getPageCount();
  out.getPages().forEach((page, i) => {
    const footer = `${stamp.reference} rev ${stamp.revision} — page ${i + 1} of ${total}`;
    const frame = frameOf(page);
    inDisplayFrame(page, frame, () => {
      if (i >= originalCount) drawSheetHeader(page, fonts, input, i + 1, total);
      drawFooter(page, frame, fonts, footer);
    });
  });

  return out.save({ useObjectStreams: false });
}
