// The stamp block on the first page of the return (or on the cover sheet when page 1 has no
// room; stamp-placement.ts decides where): a compact white panel (230 × 150 pt) that reads over drawings — the decision in large type with its shape,
// package reference, revision and title, engineer of record, reviewer, decision and issue
// dates, the conditions and any override reason (cut short with a pointer to the calculation
// sheet's page; an override makes the block taller), the
// verification code with a QR code of the verification address drawn as vector squares,
// and the caution. Also the small "REF rev N — page n of m" footer every page carries.
import { concatTransformationMatrix, popGraphicsState, pushGraphicsState, type PDFPage } from 'pdf-lib';
import QRCode from 'qrcode';
import { DECISION_LABELS } from '@shared/schemas/common';
import type { PageFrame } from './page-frame-pdf';
import type { StampInput } from './stamp-input';
import {
  drawStatusShape,
  drawText,
  fitText,
  GRAPHITE,
  INK,
  INK_SOFT,
  RULE,
  tradeDate,
  widthOf,
  WHITE,
  wrapText,
  type Fonts,
  type StatusKey,
} from './text-pdf';
import { SHORT_CAUTION } from '@shared/vocabulary/cautions';
import { STAMP_EDGE, STAMP_SIZE } from '@shared/drawing/stamp-outline';

export const STAMP_WIDTH = STAMP_SIZE.width;
export const STAMP_HEIGHT = STAMP_SIZE.height;
export { SHORT_CAUTION };

export type DecisionKey = 'accepted' | 'accepted_as_noted' | 'revise_and_resubmit' | 'rejected';

/** The decision's shape borrows the check-status family so it reads the same in greyscale. */
export const DECISION_SHAPES: Record<DecisionKey, StatusKey> = {
  accepted: 'pass',
  accepted_as_noted: 'pass',
  revise_and_resubmit: 'caution',
  rejected: 'fail',
};

/** What the stamp block prints: the return's stamp data but the site and contractor. */
export type StampBlockData = Omit<StampInput['stamp'], 'site' | 'contractor'>;

/** The QR code of `text` as one SVG path of module-high runs, in module units (y down). */
export function qrPath(text: string): { path: string; size: number } {
  const qr = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const n = qr.modules.size;
  const dark = (r: number, c: number) => Boolean(qr.modules.data[r * n + c]);
  let path = '';
  for (let r = 0; r < n; r++) {
    let c = 0;
    while (c < n) {
      if (!dark(r, c)) {
        c++;
        continue;
      }
      const start = c;
      while (c < n && dark(r, c)) c++;
      path += `M${start} ${r} H${c} V${r + 1} H${start} Z `;
    }
  }
  return { path: path.trim(), size: n };
}

/**
 * Conditions cut to `maxLines`, the last line ending with a pointer to the calculation sheet's
 * first page, where they print in full.
 */
function conditionLines(
  text: string,
  fonts: Fonts,
  size: number,
  width: number,
  maxLines: number,
  sheetPage: number,
) {
  const lines = wrapText(text, fonts.regular, size, width);
  if (lines.length <= maxLines) return lines;
  const tail = `… see calculation sheet, page ${sheetPage}`;
  let last = lines[maxLines - 1];
  while (last.length > 0 && widthOf(last + tail, fonts.regular, size) > width) last = last.slice(0, -1);
  return [...lines.slice(0, maxLines - 1), last.trimEnd() + tail];
}

/** A box in the display frame. */
export interface FrameBox {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** The block's size on a page: taller by any override lines, scaled down only on a page too small for it. */
export interface StampBlockLayout {
  /** Unscaled size. */
  W: number;
  H: number;
  /** Scale (1 but on a tiny page). */
  k: number;
  /** Size on the page. */
  width: number;
  height: number;
  overrideLines: string[];
  /** The return's page number of the calculation sheet's first page. */
  sheetPage: number;
}

export function stampBlockLayout(
  frame: Pick<PageFrame, 'width' | 'height'>,
  fonts: Fonts,
  s: StampBlockData,
  sheetPage: number,
): StampBlockLayout {
  const W = STAMP_WIDTH;
  const fullW = W - 14;
  // An override of what stood against an acceptance prints under the conditions: the block
  // grows by its lines (two at most here; in full on the calculation sheet).
  const reason = s.overrideReason?.trim();
  const overrideLines = reason ? conditionLines(`${reason}`, fonts, 6.3, fullW - 38, 2, sheetPage) : [];
  const H = STAMP_HEIGHT + (overrideLines.length ? overrideLines.length * 7.4 + 3 : 0);
  const margin = Math.min(STAMP_EDGE, frame.width * 0.04, frame.height * 0.04);
  const k = Math.min(1, (frame.width - 2 * margin) / W, (frame.height - 2 * margin) / H);
  return { W, H, k, width: W * k, height: H * k, overrideLines, sheetPage };
}

/**
 * Draw the stamp block with its lower-left corner at `at` (display frame); must run inside the
 * page's display frame. Returns the box of its verification rows in the display frame: the
 * return's visible signature field goes there.
 */
export function drawStampBlock(
  page: PDFPage,
  fonts: Fonts,
  s: StampBlockData,
  layout: StampBlockLayout,
  at: { x: number; y: number },
): FrameBox {
  const { W, H, k, overrideLines, sheetPage } = layout;
  const pad = 7;
  const fullW = W - 2 * pad;
  const ox = at.x;
  const oy = at.y;
  page.pushOperators(pushGraphicsState(), concatTransformationMatrix(k, 0, 0, k, ox, oy));

  const band = 15;
  page.drawRectangle({ x: 0, y: 0, width: W, height: H, color: WHITE, borderColor: INK, borderWidth: 1.4 });
  page.drawRectangle({ x: 0, y: H - band, width: W, height: band, color: GRAPHITE });
  drawText(page, 'REVIEW STAMP', {
    x: pad,
    y: H - band + 4.6,
    size: 6.5,
    font: fonts.black,
    color: WHITE,
  });
  const issued = `issued ${tradeDate(s.issuedAt, s.timeZone)}`;
  drawText(page, issued, {
    x: W - pad - widthOf(issued, fonts.bold, 6.5),
    y: H - band + 4.6,
    size: 6.5,
    font: fonts.bold,
    color: WHITE,
  });

  // QR code, top right under the band.
  const qrSide = 58;
  const qrX = W - pad - qrSide;
  const qrTop = H - band - 5;
  const qr = qrPath(s.verificationUrl);
  page.drawSvgPath(qr.path, { x: qrX, y: qrTop, scale: qrSide / qr.size, color: INK });

  // Left column: decision and who/when.
  const colW = qrX - pad - 6;
  const label = DECISION_LABELS[s.decision] ?? s.decision;
  let dSize = 15;
  while (dSize > 9 && widthOf(label, fonts.black, dSize) > colW - 22) dSize -= 0.5;
  let y = H - band - 19;
  drawStatusShape(page, DECISION_SHAPES[s.decision] ?? 'caution', pad, y - 1.5, 13);
  drawText(page, fitText(label, fonts.black, dSize, colW - 17), {
    x: pad + 17,
    y,
    size: dSize,
    font: fonts.black,
    color: INK,
  });
  y -= 13;
  drawText(page, fitText(`${s.reference} · revision ${s.revision}`, fonts.bold, 7.5, colW), {
    x: pad,
    y,
    size: 7.5,
    font: fonts.bold,
    color: INK,
  });
  y -= 9;
  drawText(page, fitText(s.title, fonts.regular, 6.5, colW), {
    x: pad,
    y,
    size: 6.5,
    font: fonts.regular,
    color: INK,
  });
  const rows: [string, string][] = [
    ['Engineer of record', s.engineer],
    ['Reviewer', s.reviewer],
    ['Decided', tradeDate(s.decidedAt, s.timeZone)],
  ];
  y -= 3;
  for (const [k2, v] of rows) {
    y -= 9;
    drawText(page, k2, { x: pad, y, size: 6, font: fonts.regular, color: INK_SOFT });
    drawText(page, fitText(v, fonts.bold, 6.5, colW - 58), {
      x: pad + 58,
      y,
      size: 6.5,
      font: fonts.bold,
      color: INK,
    });
  }

  // Full width: conditions, any override, verification code, caution.
  y = Math.min(y, qrTop - qrSide) - 6;
  page.drawLine({ start: { x: pad, y: y + 4 }, end: { x: W - pad, y: y + 4 }, thickness: 0.6, color: RULE });
  y -= 4;
  drawText(page, 'Conditions', { x: pad, y, size: 6, font: fonts.bold, color: INK });
  const cond = s.conditions.trim() || 'None.';
  const condLines = conditionLines(cond, fonts, 6.3, fullW - 38, 3, sheetPage);
  condLines.forEach((line, i) =>
    drawText(page, line, { x: pad + 38, y: y - i * 7.4, size: 6.3, font: fonts.regular, color: INK }),
  );
  y -= condLines.length * 7.4 + 3;
  if (overrideLines.length) {
    drawText(page, 'Override', { x: pad, y, size: 6, font: fonts.bold, color: INK });
    overrideLines.forEach((line, i) =>
      drawText(page, line, { x: pad + 38, y: y - i * 7.4, size: 6.3, font: fonts.regular, color: INK }),
    );
    y -= overrideLines.length * 7.4 + 3;
  }
  drawText(page, 'Verify', { x: pad, y, size: 6, font: fonts.bold, color: INK });
  drawText(page, fitText(s.verificationCode, fonts.black, 7.5, fullW - 38), {
    x: pad + 38,
    y,
    size: 7.5,
    font: fonts.black,
    color: INK,
  });
  const verifyTop = y + 8;
  y -= 7;
  const verifyBottom = y - 2.5;
  drawText(page, fitText(s.verificationUrl, fonts.regular, 5.5, fullW - 38), {
    x: pad + 38,
    y,
    size: 5.5,
    font: fonts.regular,
    color: INK_SOFT,
  });
  const caution = wrapText(SHORT_CAUTION, fonts.bold, 5.6, fullW);
  caution.forEach((line, i) =>
    drawText(page, line, {
      x: pad,
      y: 4.5 + (caution.length - 1 - i) * 6.6,
      size: 5.6,
      font: fonts.bold,
      color: INK_SOFT,
    }),
  );
  page.pushOperators(popGraphicsState());
  return {
    x: ox + pad * k,
    y: oy + verifyBottom * k,
    width: fullW * k,
    height: (verifyTop - verifyBottom) * k,
  };
}

/** The footer's type and colours, shared with the footer-only forms (overlay-carrier.ts). */
export const FOOTER = { size: 7, panelOpacity: 0.9, ink: [0.086, 0.098, 0.11] as const };

export interface FooterLayout {
  text: string;
  x: number;
  y: number;
  width: number;
}

/** Where the footer's text goes in the display frame, bottom right. */
export function footerLayout(frame: PageFrame, fonts: Fonts, text: string): FooterLayout {
  const t = fitText(text, fonts.bold, FOOTER.size, frame.width - 24);
  const w = widthOf(t, fonts.bold, FOOTER.size);
  return { text: t, x: frame.width - 14 - w, y: 9, width: w };
}

/** "REF rev N — page n of m", small, bottom right, on a white backing. Inside the display frame. */
export function drawFooter(page: PDFPage, frame: PageFrame, fonts: Fonts, text: string) {
  const size = FOOTER.size;
  const { text: t, x, y, width: w } = footerLayout(frame, fonts, text);
  page.drawRectangle({
    x: x - 3,
    y: y - 2.5,
    width: w + 6,
    height: size + 4,
    color: WHITE,
    opacity: FOOTER.panelOpacity,
  });
  drawText(page, t, { x, y, size, font: fonts.bold, color: INK });
}
