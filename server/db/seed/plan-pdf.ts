// Draws an invented contractor's lift plan as a PDF (pdf-lib, Lato embedded), so the demo
// queue has real documents to page through, mark up and stamp.
import { PDFDocument, rgb, type PDFFont, type PDFPage } from 'pdf-lib';
import { embedLato } from '../../modules/returns/text-pdf';

export interface PlanSection {
  heading: string;
  rows: Array<[string, string]>;
}

export interface PlanPdfData {
  contractor: string;
  reference: string;
  title: string;
  site: string;
  plannedDate: string;
  revision: number;
  preparedBy: string;
  sections: PlanSection[];
  sketch?: { boomLengthM: number; boomAngleDeg: number; radiusM: number; counterweightArmM: number };
}

const INK = rgb(0.1, 0.12, 0.16);
const MUTED = rgb(0.38, 0.4, 0.45);
const RULE = rgb(0.75, 0.76, 0.78);

export async function drawPlanPdf(data: PlanPdfData): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  // Lato subset through fontkit: embedding the whole .woff gives fonts PDF readers reject.
  const { regular, bold } = await embedLato(doc);
  doc.setTitle(`${data.reference} ${data.title} — lift plan rev ${data.revision}`);
  doc.setAuthor(data.contractor);
  doc.setProducer('demo data');

  const pages: PDFPage[] = [];
  let page = doc.addPage([595.28, 841.89]);
  pages.push(page);
  let y = header(page, data, bold, regular);

  for (const section of data.sections) {
    const needed = 28 + section.rows.length * 16;
    if (y - needed < 80) {
      page = doc.addPage([595.28, 841.89]);
      pages.push(page);
      y = header(page, data, bold, regular);
    }
    page.drawText(section.heading, { x: 48, y, size: 12, font: bold, color: INK });
    y -= 6;
    page.drawLine({ start: { x: 48, y }, end: { x: 547, y }, thickness: 0.6, color: RULE });
    y -= 16;
    for (const [label, value] of section.rows) {
      page.drawText(label, { x: 56, y, size: 9.5, font: regular, color: MUTED });
      page.drawText(value, { x: 300, y, size: 9.5, font: bold, color: INK });
      y -= 16;
    }
    y -= 12;
  }

  if (data.sketch) {
    page = doc.addPage([595.28, 841.89]);
    pages.push(page);
    y = header(page, data, bold, regular);
    page.drawText('Crane side view (not to scale for construction)', {
      x: 48,
      y,
      size: 12,
      font: bold,
      color: INK,
    });
    drawSketch(page, data.sketch, regular, y - 30);
  }

  pages.forEach((p, i) => {
    p.drawText(`${data.reference} rev ${data.revision}   page ${i + 1} of ${pages.length}`, {
      x: 48,
      y: 36,
      size: 8,
      font: regular,
      color: MUTED,
    });
  });
  return doc.save({ useObjectStreams: false });
}

function header(page: PDFPage, data: PlanPdfData, bold: PDFFont, regular: PDFFont): number {
  const top = 841.89 - 56;
  page.drawText(data.contractor.toUpperCase(), { x: 48, y: top, size: 9, font: bold, color: MUTED });
  page.drawText('LIFT PLAN', { x: 470, y: top, size: 9, font: bold, color: MUTED });
  page.drawText(`${data.reference}  ${data.title}`, { x: 48, y: top - 22, size: 15, font: bold, color: INK });
  page.drawText(
    `${data.site}   ·   planned ${data.plannedDate}   ·   revision ${data.revision}   ·   prepared by ${data.preparedBy}`,
    {
      x: 48,
      y: top - 40,
      size: 9,
      font: regular,
      color: MUTED,
    },
  );
  page.drawLine({ start: { x: 48, y: top - 50 }, end: { x: 547, y: top - 50 }, thickness: 1.2, color: INK });
  return top - 76;
}

function drawSketch(page: PDFPage, s: NonNullable<PlanPdfData['sketch']>, font: PDFFont, top: number) {
  const scale = Math.min(8, 380 / Math.max(s.radiusM + s.counterweightArmM + 4, 10));
  const groundY = top - 380;
  const pivotX = 120 + s.counterweightArmM * scale;
  const pivotY = groundY + 3 * scale;
  const angle = (s.boomAngleDeg * Math.PI) / 180;
  const tipX = pivotX + Math.cos(angle) * s.boomLengthM * scale;
  const tipY = pivotY + Math.sin(angle) * s.boomLengthM * scale;
  page.drawLine({ start: { x: 60, y: groundY }, end: { x: 540, y: groundY }, thickness: 1, color: INK });
  page.drawRectangle({
    x: pivotX - 3 * scale,
    y: groundY,
    width: 7 * scale,
    height: 2.2 * scale,
    borderColor: INK,
    borderWidth: 1,
  });
  page.drawRectangle({
    x: pivotX - s.counterweightArmM * scale - scale,
    y: pivotY - scale,
    width: 2 * scale,
    height: 2 * scale,
    color: MUTED,
  });
  page.drawLine({ start: { x: pivotX, y: pivotY }, end: { x: tipX, y: tipY }, thickness: 3, color: INK });
  page.drawLine({
    start: { x: tipX, y: tipY },
    end: { x: tipX, y: groundY + 2 * scale },
    thickness: 0.8,
    color: INK,
    dashArray: [4, 3],
  });
  page.drawRectangle({
    x: tipX - scale,
    y: groundY + scale,
    width: 2 * scale,
    height: scale,
    borderColor: INK,
    borderWidth: 1,
  });
  page.drawText(`radius ${s.radiusM.toFixed(1)} m`, {
    x: (pivotX + tipX) / 2 - 20,
    y: groundY - 16,
    size: 9,
    font,
  });
  page.drawText(`boom ${s.boomLengthM.toFixed(1)} m at ${s.boomAngleDeg.toFixed(0)}°`, {
    x: (pivotX + tipX) / 2 + 10,
    y: (pivotY + tipY) / 2,
    size: 9,
    font,
  });
}
