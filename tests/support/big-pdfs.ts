// PDFs for the streamed-upload tests, written to disk as they are made (never whole in
// memory): a large scan-like page (one uncompressed greyscale image of random noise), and a
// compression bomb (a page whose Flate content stream unpacks to far more than its size).
import { randomBytes } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { once } from 'node:events';
import { createDeflate, deflateSync } from 'node:zlib';
import { PDFDocument, PDFName, PDFString } from 'pdf-lib';

/** Writes a PDF object by object, keeping the offsets for the cross-reference table. */
class PdfWriter {
  private offset = 0;
  private readonly offsets: number[] = [];
  private readonly out;
  constructor(file: string) {
    this.out = createWriteStream(file);
  }
  async write(chunk: Buffer | string) {
    const b = typeof chunk === 'string' ? Buffer.from(chunk, 'latin1') : chunk;
    this.offset += b.length;
    if (!this.out.write(b)) await once(this.out, 'drain');
  }
  async object(body: string) {
    this.offsets.push(this.offset);
    await this.write(`${this.offsets.length} 0 obj\n${body}\nendobj\n`);
  }
  /** A stream object whose data comes from `data` (chunks), of `length` bytes. */
  async stream(dict: string, length: number, data: AsyncIterable<Buffer>) {
    this.offsets.push(this.offset);
    await this.write(`${this.offsets.length} 0 obj\n<< ${dict} /Length ${length} >>\nstream\n`);
    for await (const chunk of data) await this.write(chunk);
    await this.write('\nendstream\nendobj\n');
  }
  async end() {
    const xref = this.offset;
    const rows = this.offsets.map((o) => `${String(o).padStart(10, '0')} 00000 n \n`).join('');
    await this.write(
      `xref\n0 ${this.offsets.length + 1}\n0000000000 65535 f \n${rows}` +
        `trailer\n<< /Size ${this.offsets.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`,
    );
    this.out.end();
    await once(this.out, 'finish');
  }
}

async function* noise(total: number) {
  for (let left = total; left > 0; left -= 1 << 20) yield randomBytes(Math.min(left, 1 << 20));
}

/** One A4 page showing a greyscale image of about `bytes` of random noise, uncompressed. */
export async function writeNoisePdf(file: string, bytes: number) {
  const width = 10_000;
  const height = Math.ceil(bytes / width);
  const w = new PdfWriter(file);
  await w.write('%PDF-1.7\n%\xe2\xe3\xcf\xd3\n');
  await w.object('<< /Type /Catalog /Pages 2 0 R >>');
  await w.object('<< /Type /Pages /Kids [3 0 R] /Count 1 >>');
  await w.object(
    '<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Contents 4 0 R /Resources << /XObject << /Im0 5 0 R >> >> >>',
  );
  const content = Buffer.from('q 595 0 0 842 0 0 cm /Im0 Do Q\n');
  await w.stream(
    '',
    content.length,
    (async function* () {
      yield content;
    })(),
  );
  await w.stream(
    `/Type /XObject /Subtype /Image /Width ${width} /Height ${height} /ColorSpace /DeviceGray /BitsPerComponent 8`,
    width * height,
    noise(width * height),
  );
  await w.end();
}

/** Deflates `total` zero bytes as a stream of chunks (about 1 kB out per MB in). */
async function deflatedZeros(total: number): Promise<Buffer[]> {
  const deflate = createDeflate({ level: 9 });
  const out: Buffer[] = [];
  deflate.on('data', (c: Buffer) => out.push(c));
  const zeros = Buffer.alloc(1 << 20);
  for (let left = total; left > 0; left -= zeros.length) {
    if (!deflate.write(left >= zeros.length ? zeros : zeros.subarray(0, left))) await once(deflate, 'drain');
  }
  deflate.end();
  await once(deflate, 'end');
  return out;
}

/**
 * One page whose Flate content stream unpacks to `inflated` bytes (1 GiB is about 1 MB of
 * file). `wrap` packs it once more: 'flate' (Flate twice: a few kB of file) or 'hex'
 * (ASCIIHex over the Flate, a filter the check unpacks through qpdf rather than zlib).
 */
export async function writeBombPdf(file: string, inflated: number, wrap?: 'flate' | 'hex') {
  let data = await deflatedZeros(inflated);
  let filter = '/Filter /FlateDecode';
  if (wrap === 'flate') {
    data = [deflateSync(Buffer.concat(data))];
    filter = '/Filter [/FlateDecode /FlateDecode]';
  } else if (wrap === 'hex') {
    data = [Buffer.from(`${Buffer.concat(data).toString('hex')}>`)];
    filter = '/Filter [/ASCIIHexDecode /FlateDecode]';
  }
  const length = data.reduce((n, c) => n + c.length, 0);
  const w = new PdfWriter(file);
  await w.write('%PDF-1.7\n%\xe2\xe3\xcf\xd3\n');
  await w.object('<< /Type /Catalog /Pages 2 0 R >>');
  await w.object('<< /Type /Pages /Kids [3 0 R] /Count 1 >>');
  await w.object('<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Contents 4 0 R >>');
  await w.stream(
    filter,
    length,
    (async function* () {
      yield* data;
    })(),
  );
  await w.end();
}

/**
 * A two-page plan carrying what the stamped return leaves out: three comments on page 1, a
 * stamp on page 2, JavaScript run on opening and one text form field on page 1.
 */
export async function makeActivePdf(): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const [p1, p2] = [doc.addPage([595, 842]), doc.addPage([595, 842])];
  p1.drawText('Lift plan with comments', { x: 50, y: 780, size: 14 });
  const annot = (subtype: string, y: number) =>
    doc.context.register(
      doc.context.obj({
        Type: 'Annot',
        Subtype: subtype,
        Rect: [50, y, 70, y + 20],
        Contents: PDFString.of('Check the outrigger mat'),
      }),
    );
  p1.node.set(
    PDFName.of('Annots'),
    doc.context.obj([annot('Text', 700), annot('Text', 650), annot('FreeText', 600)]),
  );
  p2.node.set(PDFName.of('Annots'), doc.context.obj([annot('Stamp', 700)]));
  doc.catalog.set(
    PDFName.of('OpenAction'),
    doc.context.register(doc.context.obj({ S: 'JavaScript', JS: PDFString.of('app.alert("hello")') })),
  );
  doc.getForm().createTextField('crane.operator').addToPage(p1, { x: 50, y: 500, width: 200, height: 20 });
  return doc.save({ useObjectStreams: false });
}
