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
