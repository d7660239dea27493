// The stamped return: the package's PDFs, the engineer's markups, the decision and the
// calculation in; one new PDF file out, built at the cost of a copy. No database, and no
// clock: the PDF's dates come from stamp.issuedAt, so the same input gives the same bytes.
//
// How it is built (DEVELOPERS.md, "The stamped return"):
// 1. qpdf reads each document's page boxes (qpdf --json, no stream data). A damaged
//    document is refused with qpdf's message.
// 2. pdf-lib draws only what the desk adds, in a small "overlay" PDF: one Form XObject per
//    original page (markups, the stamp block on the first page, the footer), all named by one
//    index page (overlay-carrier.ts; a footer-only page costs one small form, no page), then
//    the calculation sheet's pages. The stamp block goes where page 1 has nothing under it
//    (stamp-placement.ts: page 1 rendered by pdftoppm; the engineer's placement, else the
//    nearest free spot to a corner), else on a cover sheet that comes before the plan.
// 3. qpdf copies the original pages, the index page and the sheet into one file
//    (--stream-data=preserve: every original content and image stream byte for byte).
// 4. An incremental update (pdf-tools/incremental.ts) gives each original page a /Contents
//    array [q, its own streams, Q + its form's Do], drops the index page from the page tree
//    and writes the document information.
// 5. With a signer, a second incremental update adds the signature (signature dictionary,
//    visible field over the stamp block's verification rows, /AcroForm), the digest of the
//    byte ranges is streamed from disk with Node's sha-256, and the CMS from pdf-tools/signer.ts
//    is written into the placeholder in place.
//
// Coordinates: markup geometry is in PDF points in the page's unrotated space, measured from
// the lower-left corner of its visible box (CropBox, else MediaBox), as the review viewer
// stores it; a box that does not start at 0,0 is handled by offsetting by its origin.
// Rotated pages (/Rotate 90, 180, 270): markups stay at their stored unrotated positions
// (they are in the same space as the page's content), while text, pin numbers, the stamp
// block and the footer are drawn upright and placed as the page is displayed
// (page-frame-pdf.ts). The overlay's Form XObject has the identity matrix and the page's
// MediaBox as its BBox, so it draws in the original page's own user space.
import { createHash } from 'node:crypto';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { PDFDocument, PDFName, PDFNumber, type PDFPage } from 'pdf-lib';
import type { Signer } from '../../lib/pdf-tools/signer';
import { sha256OfFile } from '../../lib/storage';
import { concatenate, QpdfError } from '../../lib/pdf-tools/qpdf';
import { buildCalculationSheet, drawSheetHeader } from './calc-sheet-pdf';
import { drawMarkups } from './draw-markups';
import {
  drawFooter,
  drawStampBlock,
  footerLayout,
  stampBlockLayout,
  type FrameBox,
} from './draw-stamp-block';
import { COVER_HEADING, drawCoverSheet } from './cover-sheet';
import { chooseStampSpot, deskReserved, type StampSpot } from './stamp-placement';
import type { PageInk } from '../../lib/pdf-tools/page-ink';
import {
  firstPageInk,
  frameFromBoxes,
  originalPages,
  StampInputError,
  type Box,
  type OriginalPage,
} from './original-pages';
import { displayToUser, frameOf, inDisplayFrame, type PageFrame } from './page-frame-pdf';
import { FooterForms, indexPage, pageForm } from './overlay-carrier';
import { assembleReturn, signReturn, type SignatureField } from './return-structure';
import { embedFonts } from './fonts-pdf';
import type { StampInput } from './stamp-input';

export type { StampInput } from './stamp-input';

export { StampInputError };

function pdfDate(iso: string): Date {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? new Date(0) : d;
}

/** A box in the display frame as a rectangle in the page's user space. */
function userRect(frame: PageFrame, b: FrameBox): Box {
  const [a, bb, c, d, e, f] = displayToUser(frame);
  const pts = [
    [b.x, b.y],
    [b.x + b.width, b.y],
    [b.x, b.y + b.height],
    [b.x + b.width, b.y + b.height],
  ].map(([x, y]) => [a * x + c * y + e, bb * x + d * y + f]);
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  return [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)];
}

/** The findings' "Page 3 of the return" read one page on when a cover sheet comes first. */
function withCover(input: StampInput): StampInput {
  const findings = input.calculation.findings.map((f) =>
    f.markup && f.markupPage != null
      ? {
          ...f,
          markup: f.markup.replace(
            `Page ${f.markupPage} of the return`,
            `Page ${f.markupPage + 1} of the return`,
          ),
        }
      : f,
  );
  return { ...input, calculation: { ...input.calculation, findings } };
}

/**
 * The overlay PDF: an index page naming one form per original page (overlay-carrier.ts), then
 * the cover sheet when the stamp goes there, then the calculation sheet. Pages with markups or
 * the stamp block are drawn on scratch pages; pages with only the footer get a footer form
 * without a page, so the cost follows the markups, not the page count.
 */
async function buildOverlay(input: StampInput, originals: OriginalPage[][], ink: PageInk | null) {
  const { stamp } = input;
  const out = await PDFDocument.create({ updateMetadata: false });
  const fonts = embedFonts(out);
  const originalCount = originals.reduce((n, pages) => n + pages.length, 0);
  // Page 1 of the plan: where the stamp block goes (stamp-placement.ts).
  const firstFrame = frameFromBoxes(originals[0][0]);
  const firstMarks = input.markups.filter(
    (m) => m.fileId === input.documents[0].fileId && m.pageNumber === 1,
  );
  const sheetPageOnPlan = originalCount + 1;
  const layout = stampBlockLayout(firstFrame, fonts, stamp, sheetPageOnPlan);
  const footerBox = footerLayout(firstFrame, fonts, footerTextFor(stamp, originalCount, originalCount + 9));
  const spot = chooseStampSpot({
    ink,
    page: firstFrame,
    size: { width: layout.width, height: layout.height },
    placed: input.placement ?? null,
    reserved: deskReserved(firstFrame, firstMarks, footerBox.x),
  });
  const cover = spot.on === 'cover' ? 1 : 0;
  let field: { rect: Box } | null = null;
  type Slot = { o: OriginalPage; frame: PageFrame; page: PDFPage | null };
  const slots: Slot[] = [];
  input.documents.forEach((doc, d) => {
    originals[d].forEach((o, i) => {
      const marks = input.markups.filter((m) => m.fileId === doc.fileId && m.pageNumber === i + 1);
      const first = slots.length === 0;
      if (!first && marks.length === 0) {
        slots.push({ o, frame: frameFromBoxes(o), page: null });
        return;
      }
      const page = out.addPage([o.media[2] - o.media[0], o.media[3] - o.media[1]]);
      page.setMediaBox(o.media[0], o.media[1], o.media[2] - o.media[0], o.media[3] - o.media[1]);
      if (o.crop) page.setCropBox(o.crop[0], o.crop[1], o.crop[2] - o.crop[0], o.crop[3] - o.crop[1]);
      if (o.rotate) page.node.set(PDFName.of('Rotate'), PDFNumber.of(o.rotate));
      const frame = frameOf(page);
      inDisplayFrame(page, frame, () => {
        drawMarkups(page, frame, marks, fonts);
        if (first && spot.on === 'page')
          field = { rect: userRect(frame, drawStampBlock(page, fonts, stamp, layout, spot.rect)) };
      });
      slots.push({ o, frame, page });
    });
  });
  const scratchCount = out.getPageCount();
  const coverPage =
    spot.on === 'cover' ? drawCoverSheet(out, fonts, stamp, spot.why, originalCount + 2) : null;
  if (coverPage) {
    const f = coverPage.field;
    field = { rect: [f.x, f.y, f.x + f.width, f.y + f.height] };
  }
  const sheet = buildCalculationSheet(out, fonts, cover ? withCover(input) : input);
  const total = cover + originalCount + sheet.length;
  const footerText = (n: number) => footerTextFor(stamp, n, total);
  const footers = new FooterForms(out, fonts.bold);
  const forms = slots.map(({ o, frame, page }, i) => {
    if (!page) return footers.form(o.media, frame, footerLayout(frame, fonts, footerText(cover + i + 1)));
    // The footer goes inside the same display-frame group as the markups.
    inDisplayFrame(page, frame, () => drawFooter(page, frame, fonts, footerText(cover + i + 1)));
    return pageForm(page);
  });
  const added = [
    ...(coverPage ? [{ page: coverPage.page, n: 1, heading: COVER_HEADING }] : []),
    ...sheet.map((page, k) => ({ page, n: cover + originalCount + k + 1, heading: undefined })),
  ];
  for (const { page, n, heading } of added) {
    const frame = frameOf(page);
    inDisplayFrame(page, frame, () => {
      drawSheetHeader(page, fonts, input, n, total, heading);
      drawFooter(page, frame, fonts, footerText(n));
    });
  }
  for (let k = 0; k < scratchCount; k++) out.removePage(0);
  indexPage(out, forms);
  const bytes = await out.save({ useObjectStreams: false, objectsPerTick: Infinity });
  return { bytes, originalCount, total, cover, spot, field: field as { rect: Box } | null };
}

const footerTextFor = (stamp: StampInput['stamp'], n: number, total: number) =>
  `${stamp.reference} rev ${stamp.revision} — page ${n} of ${total}`;

export interface BuildOptions {
  /** Sign the return (PAdES baseline B) as its last incremental update. */
  signer?: Signer | null;
  /** Folder for the intermediate files (the system's temporary folder by default). */
  workDir?: string;
}

export interface BuiltReturn {
  pages: number;
  /** SHA-256 of the signing certificate, when signed. */
  signingCertificateSha256: string | null;
  /** sha-256 of the finished file. */
  sha256: string;
  /** Size of what the desk adds (overlays, fonts and the calculation sheet) before combining. */
  overlayBytes: number;
  /** Where the stamp block went: on page 1 (placed or a corner, its display-frame rectangle) or a cover sheet. */
  stampSpot: StampSpot;
}

/** Build the return into `outFile`. The documents are only read. */
export async function buildStampedReturnFile(
  input: StampInput,
  outFile: string,
  options: BuildOptions = {},
): Promise<BuiltReturn> {
  const { stamp } = input;
  if (input.documents.length === 0) throw new StampInputError('The return needs at least one PDF document.');
  const work = await mkdtemp(path.join(options.workDir ?? tmpdir(), 'cp-stamp-'));
  try {
    const files: string[] = [];
    for (const [i, doc] of input.documents.entries()) {
      if (doc.file) files.push(doc.file);
      else {
        const f = path.join(work, `doc-${i}.pdf`);
        await writeFile(f, doc.bytes ?? new Uint8Array());
        files.push(f);
      }
    }
    const originals: OriginalPage[][] = [];
    for (const [i, doc] of input.documents.entries()) originals.push(await originalPages(files[i], doc.name));
    const ink = await firstPageInk(files[0], originals[0][0], work);
    const overlay = await buildOverlay(input, originals, ink);
    const overlayFile = path.join(work, 'overlay.pdf');
    await writeFile(overlayFile, overlay.bytes);
    try {
      await concatenate([...files.map((file) => ({ file })), { file: overlayFile }], outFile);
    } catch (err) {
      if (err instanceof QpdfError)
        throw new StampInputError(`The package could not be combined (${err.message}).`);
      throw err;
    }
    const issued = pdfDate(stamp.issuedAt);
    const assembled = await assembleReturn(outFile, overlay.originalCount, overlay.cover, {
      title: `${stamp.reference} rev ${stamp.revision} — stamped return`,
      subject: stamp.title,
      author: stamp.engineer,
      keywords: [stamp.reference, `revision ${stamp.revision}`, stamp.verificationCode].join(' '),
      date: issued,
      // Unique to the return, and the same when the same return is built again.
      id: createHash('md5')
        .update([stamp.reference, stamp.revision, stamp.verificationCode, stamp.issuedAt].join('\n'))
        .digest('hex'),
    });
    let fingerprint: string | null = null;
    let digest: string | null = null;
    if (options.signer) {
      const field: SignatureField = {
        rect: overlay.field?.rect ?? [0, 0, 0, 0],
        name: `Desk signature ${stamp.reference} rev ${stamp.revision}`,
        reason: `Stamped return: ${stamp.reference} revision ${stamp.revision}, verification code ${stamp.verificationCode}`,
        date: issued,
      };
      digest = await signReturn(outFile, assembled, field, options.signer);
      fingerprint = options.signer.fingerprint;
    }
    return {
      sha256: digest ?? (await sha256OfFile(outFile)),
      pages: overlay.total,
      signingCertificateSha256: fingerprint,
      overlayBytes: overlay.bytes.length,
      stampSpot: overlay.spot,
    };
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}

/** The same, in memory: for tests and small packages. */
export async function buildStampedReturn(input: StampInput, options: BuildOptions = {}): Promise<Uint8Array> {
  const work = await mkdtemp(path.join(options.workDir ?? tmpdir(), 'cp-return-'));
  try {
    const out = path.join(work, 'return.pdf');
    await buildStampedReturnFile(input, out, { ...options, workDir: work });
    return new Uint8Array(await readFile(out));
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}
