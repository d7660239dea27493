// The made-up packages the benchmarks stamp: a vector lift plan of N pages, and a ~95 MB
// 60-page scanned one (random-noise images, so nothing compresses). Used by bench:stamp and
// bench:queues; each writes them once into its temporary folder.
import { randomBytes } from 'node:crypto';
import { deflateSync } from 'node:zlib';
import { PDFDocument, PDFName, rgb, StandardFonts } from 'pdf-lib';

export async function vectorPackage(pages: number): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  for (let p = 0; p < pages; p++) {
    const page = doc.addPage([841.89, 595.28]);
    page.drawText(`Lift plan sheet ${p + 1}`, { x: 40, y: 560, size: 14, font });
    for (let i = 0; i < 120; i++)
      page.drawLine({
        start: { x: 40 + ((i * 37) % 700), y: 40 + ((i * 53) % 480) },
        end: { x: 60 + ((i * 91) % 700), y: 60 + ((i * 29) % 480) },
        thickness: 0.5,
        color: rgb(0.2, 0.2, 0.2),
      });
    for (let i = 0; i < 30; i++)
      page.drawText(`Note ${i}: rigging and exclusion zone detail`, {
        x: 50,
        y: 500 - i * 14,
        size: 8,
        font,
      });
  }
  return doc.save();
}

/**
 * 60 pages, each one 800×660 RGB image of random bytes (~1.58 MB): Flate-encoded as scans
 * usually are, which for noise leaves them as large as they were.
 */
export async function scannedPackage(): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const w = 800;
  const h = 660;
  for (let p = 0; p < 60; p++) {
    const img = doc.context.stream(deflateSync(randomBytes(w * h * 3), { level: 1 }), {
      Filter: 'FlateDecode',
      Type: 'XObject',
      Subtype: 'Image',
      Width: w,
      Height: h,
      ColorSpace: 'DeviceRGB',
      BitsPerComponent: 8,
    });
    const ref = doc.context.register(img);
    const page = doc.addPage([595.28, 841.89]);
    page.node.setXObject(PDFName.of('Scan'), ref);
    const contentRef = doc.context.register(doc.context.stream('q 595.28 0 0 841.89 0 0 cm /Scan Do Q', {}));
    page.node.addContentStream(contentRef);
  }
  return doc.save();
}
