// Checks an upload's bytes before anything is stored: a real PDF (header and end-of-file
// marker, not the name or the browser's MIME type), not empty, not encrypted, within the
// page limit. Each refusal names the rule and the limit.
import { PDFDocument } from 'pdf-lib';
import { unsafeTextReason } from '@shared/schemas/safe-text';
import { AppError } from '../../lib/app-error';

const HEADER = Buffer.from('%PDF-');
const EOF_MARK = Buffer.from('%%EOF');

export function checkFileName(name: string): string {
  // multer runs with preservePath so that a name with folders reaches us and is refused.
  if (!name || name.length > 255) {
    throw new AppError(400, 'bad_file_name', 'The file name must be 1 to 255 characters long.', [
      { path: 'file', message: 'file name must be 1 to 255 characters' },
    ]);
  }
  const unsafe = unsafeTextReason(name);
  if (unsafe) {
    throw new AppError(400, 'bad_file_name', `The file name ${unsafe}.`, [
      { path: 'file', message: `file name ${unsafe}` },
    ]);
  }
  // eslint-disable-next-line no-control-regex -- control characters are exactly what is refused
  if (/[/\\]|\.\.|[\u0000-\u001f]/.test(name)) {
    throw new AppError(
      400,
      'bad_file_name',
      `The file name "${name}" contains folder parts or control characters; upload the file under a plain name.`,
      [{ path: 'file', message: 'file name must not contain /, \\, .. or control characters' }],
    );
  }
  return name;
}

export async function inspectPdf(
  bytes: Uint8Array,
  limits: { maxPages: number },
): Promise<{ pages: number }> {
  const buf = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const field = (message: string) => [{ path: 'file', message }];
  if (buf.length === 0)
    throw new AppError(400, 'empty_file', 'The file is empty (0 bytes).', field('file is empty'));
  if (buf.subarray(0, 1024).indexOf(HEADER) === -1) {
    throw new AppError(
      415,
      'not_pdf',
      'The file is not a PDF: it does not start with a %PDF- header.',
      field('file must be a PDF'),
    );
  }
  if (buf.subarray(Math.max(0, buf.length - 1024)).indexOf(EOF_MARK) === -1) {
    throw new AppError(
      400,
      'truncated_pdf',
      'The PDF is incomplete: its end-of-file marker (%%EOF) is missing. Upload the whole file again.',
      field('PDF is truncated'),
    );
  }
  let doc: PDFDocument;
  try {
    doc = await PDFDocument.load(bytes, {
      ignoreEncryption: true,
      updateMetadata: false,
      throwOnInvalidObject: false,
    });
  } catch (error) {
    throw new AppError(
      400,
      'truncated_pdf',
      `The PDF cannot be read: ${(error as Error).message.slice(0, 200)}`,
      field('PDF cannot be read'),
    );
  }
  if (doc.isEncrypted) {
    throw new AppError(
      400,
      'encrypted_pdf',
      'The PDF is encrypted or password-protected. Upload a copy without a password.',
      field('PDF must not be encrypted'),
    );
  }
  let pages: number;
  try {
    // A file with a PDF header but no catalog (or no page tree) throws here.
    pages = doc.getPageCount();
  } catch (error) {
    throw new AppError(
      422,
      'unreadable_pdf',
      `The file starts like a PDF but has no readable catalog or page tree: ${(error as Error).message.slice(0, 200)}`,
      field('PDF has no catalog or page tree'),
    );
  }
  if (pages < 1) throw new AppError(400, 'truncated_pdf', 'The PDF has no pages.', field('PDF has no pages'));
  if (pages > limits.maxPages) {
    throw new AppError(
      400,
      'too_many_pages',
      `The PDF has ${pages} pages; the limit is ${limits.maxPages}. Split it into several files.`,
      field(`PDF must have at most ${limits.maxPages} pages`),
    );
  }
  return { pages };
}
