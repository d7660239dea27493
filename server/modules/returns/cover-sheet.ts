// The cover sheet added before the plan when page 1 has no free corner for the stamp block
// (stamp-placement.ts): an A4 page like the calculation sheet's, with the stamp block at its top
// right and, beside it, why the stamp is here and that the plan follows as submitted. The stamp
// never covers the plan's content, so when the plan leaves no room the return grows by a page.
import type { PDFDocument, PDFPage } from 'pdf-lib';
import { drawStampBlock, stampBlockLayout, type FrameBox, type StampBlockData } from './draw-stamp-block';
import { LEFT, PAGE_H, PAGE_W, RIGHT } from './sheet/layout';
import { drawText, INK, INK_SOFT, wrapText, type Fonts } from './text-pdf';

export const COVER_HEADING = 'COVER SHEET · STAMPED RETURN';

/** "Stamp on the cover sheet: page 1 had no free corner": the sentence the cover sheet prints first. */
export const coverSentence = (why: string) => `Stamp on the cover sheet: ${why}.`;

export function drawCoverSheet(
  out: PDFDocument,
  fonts: Fonts,
  stamp: StampBlockData,
  why: string,
  sheetPage: number,
): { page: PDFPage; field: FrameBox } {
  const page = out.addPage([PAGE_W, PAGE_H]);
  const frame = { width: PAGE_W, height: PAGE_H };
  const layout = stampBlockLayout(frame, fonts, stamp, sheetPage);
  const top = PAGE_H - 84;
  const field = drawStampBlock(page, fonts, stamp, layout, {
    x: RIGHT - layout.width,
    y: top - layout.height,
  });
  const width = RIGHT - layout.width - 18 - LEFT;
  let y = top - 12;
  for (const line of wrapText(coverSentence(why), fonts.black, 11, width)) {
    drawText(page, line, { x: LEFT, y, size: 11, font: fonts.black, color: INK });
    y -= 14;
  }
  y -= 6;
  const rest =
    `The plan follows on page 2 exactly as submitted, with the engineer's markups drawn over it. ` +
    `The stamp block here belongs to ${stamp.reference} revision ${stamp.revision} and to every page of this return.`;
  for (const line of wrapText(rest, fonts.regular, 8.5, width)) {
    drawText(page, line, { x: LEFT, y, size: 8.5, font: fonts.regular, color: INK_SOFT });
    y -= 11.5;
  }
  return { page, field };
}
