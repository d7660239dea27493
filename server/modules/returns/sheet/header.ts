// The calculation sheet's page header (reference, revision, decision, "page n of m"), drawn by
// the stamped return once the total page count is known.
import type { PDFPage } from 'pdf-lib';
import { DECISION_LABELS } from '@shared/schemas/common';
import { tradeDate } from '@shared/vocabulary/dates';
import type { StampInput } from '../stamp-input';
import { drawText, fitText, GRAPHITE, INK, INK_SOFT, widthOf, type Fonts } from '../text-pdf';
import { LEFT, PAGE_H, RIGHT, WIDTH } from './layout';

export function drawSheetHeader(
  page: PDFPage,
  fonts: Fonts,
  input: StampInput,
  n: number,
  total: number,
  /** The cover sheet (cover-sheet.ts) names itself. */
  heading = 'CALCULATION SHEET · STAMPED RETURN',
) {
  const { stamp } = input;
  const top = PAGE_H - 30;
  page.drawRectangle({ x: LEFT, y: top + 8, width: WIDTH, height: 3, color: GRAPHITE });
  drawText(page, heading, {
    x: LEFT,
    y: top - 4,
    size: 7,
    font: fonts.black,
    color: INK_SOFT,
  });
  const ref = `${stamp.reference} · revision ${stamp.revision}`;
  drawText(page, fitText(ref, fonts.black, 12, WIDTH - 130), {
    x: LEFT,
    y: top - 19,
    size: 12,
    font: fonts.black,
    color: INK,
  });
  drawText(page, fitText(stamp.title, fonts.regular, 8, WIDTH - 130), {
    x: LEFT,
    y: top - 31,
    size: 8,
    font: fonts.regular,
    color: INK,
  });
  const pg = `page ${n} of ${total}`;
  drawText(page, pg, {
    x: RIGHT - widthOf(pg, fonts.black, 10),
    y: top - 19,
    size: 10,
    font: fonts.black,
    color: INK,
  });
  const dl = `${DECISION_LABELS[stamp.decision]} · ${tradeDate(stamp.issuedAt, stamp.timeZone)}`;
  drawText(page, fitText(dl, fonts.bold, 7.5, 125), {
    x: RIGHT - Math.min(125, widthOf(dl, fonts.bold, 7.5)),
    y: top - 31,
    size: 7.5,
    font: fonts.bold,
    color: INK_SOFT,
  });
  page.drawLine({
    start: { x: LEFT, y: top - 38 },
    end: { x: RIGHT, y: top - 38 },
    thickness: 0.8,
    color: INK,
  });
}
