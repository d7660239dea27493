// PDFs for the browser tests: lift plans made with pdf-lib, and the text and page count of a
// downloaded stamped return read back with Debian's pdftotext / pdfinfo (poppler-utils).
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { PDFDocument, rgb, StandardFonts } from 'pdf-lib';

export async function liftPlanPdf(name: string, pages: number, heading: string): Promise<string> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  for (let i = 0; i < pages; i++) {
    const page = doc.addPage([842, 595]);
    page.drawText(`${heading} — sheet ${i + 1} of ${pages}`, { x: 48, y: 540, size: 18, font });
    page.drawRectangle({
      x: 48,
      y: 80,
      width: 746,
      height: 420,
      borderWidth: 1,
      borderColor: rgb(0.2, 0.2, 0.2),
    });
    page.drawText('Crane position, load path and exclusion zone', { x: 64, y: 470, size: 11, font });
  }
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'counterpoise-pdf-')), name);
  fs.writeFileSync(file, await doc.save());
  return file;
}

export function pdfText(bytes: Uint8Array, page?: number): string {
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'counterpoise-read-')), 'in.pdf');
  fs.writeFileSync(file, bytes);
  const range = page ? ['-f', String(page), '-l', String(page)] : [];
  return execFileSync('/usr/bin/pdftotext', ['-layout', ...range, file, '-'], { encoding: 'utf8' });
}

export function pdfPages(bytes: Uint8Array): number {
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'counterpoise-read-')), 'in.pdf');
  fs.writeFileSync(file, bytes);
  const info = execFileSync('/usr/bin/pdfinfo', [file], { encoding: 'utf8' });
  return Number(/^Pages:\s+(\d+)/m.exec(info)?.[1] ?? NaN);
}
