// Turns a page of the overlay PDF into a carrier: what was drawn on it becomes a Form XObject
// (identity matrix, the page's MediaBox as BBox, the drawing's own resources), the page
// itself keeps only a /Resources entry /CPStamp naming that form and no content. qpdf copies
// the carrier with its form and fonts into the return; the return's incremental update then
// paints /CPStamp on the original page and leaves the carrier out of the page tree.
import { PDFArray, PDFContentStream, PDFName, PDFRef, type PDFPage } from 'pdf-lib';

export const CARRIER_FORM = 'CPStamp';

export function carrierPage(page: PDFPage) {
  const ctx = page.doc.context;
  const contents = page.node.Contents();
  const refs = contents instanceof PDFArray ? contents.asArray() : contents ? [contents] : [];
  // Everything drawn on a page made with addPage goes into its one content stream.
  if (refs.length !== 1 || !(refs[0] instanceof PDFRef))
    throw new Error(`an overlay page has ${refs.length} content streams, expected one`);
  const ref = refs[0];
  const stream = ctx.lookup(ref);
  if (!(stream instanceof PDFContentStream))
    throw new Error('the overlay page content is not a content stream');
  const media = page.getMediaBox();
  stream.dict.set(PDFName.of('Type'), PDFName.of('XObject'));
  stream.dict.set(PDFName.of('Subtype'), PDFName.of('Form'));
  stream.dict.set(
    PDFName.of('BBox'),
    ctx.obj([media.x, media.y, media.x + media.width, media.y + media.height]),
  );
  stream.dict.set(PDFName.of('Resources'), page.node.Resources() ?? ctx.obj({}));
  page.node.set(PDFName.of('Resources'), ctx.obj({ XObject: { [CARRIER_FORM]: ref } }));
  page.node.set(PDFName.of('Contents'), ctx.obj([]));
}
