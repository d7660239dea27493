// The calculation sheet appended to the stamped return: A4 pages in Lato for people on paper
// who were not in the review. The decision first, the caution on the first page, then the
// inputs as submitted, every check, the discrepancies and findings, the critical-lift triggers,
// the fixes, and the crane's side view. The layout and each section live in sheet/; the
// header's "page n of m" is drawn by the caller once the total is known.
import type { PDFDocument, PDFPage } from 'pdf-lib';
import type { StampInput } from './stamp-input';
import type { Fonts } from './text-pdf';
import { buildSheet } from './sheet/build';

export { drawSheetHeader } from './sheet/header';
export { asEntered } from './sheet/read-inputs';

/** Lay out the calculation sheet on new A4 pages at the end of `doc`; returns those pages. */
export function buildCalculationSheet(doc: PDFDocument, fonts: Fonts, input: StampInput): PDFPage[] {
  return buildSheet(doc, fonts, input);
}
