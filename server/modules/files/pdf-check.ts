// Checks an upload's bytes before anything is stored: a real PDF (header and end-of-file
// marker, not the name or the browser's MIME type), not empty, not encrypted, within the
// page limit, and whole enough for the stamped return to be made from it (qpdf --check: no
// damaged object streams or cross-reference table, every page's content readable) — refused
// here, naming the file, rather than when the return is stamped. Each refusal names the rule.
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { PDFDocument } from 'pdf-lib';
import { unsafeTextReason } from '@shared/schemas/safe-text';
import { AppError } from '../../lib/app-error';
import { checkDocument } from '../../lib/pdf-tools/qpdf';

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

/** qpdf's problems in a person's words: which page cannot be read, or that the structure is damaged. */
function problemWords(problems: string[]): string[] {
  const pages = new Set<string>();
  let structure = false;
  for (const line of problems) {
    const page = /page (\d+):.*content stream/i.exec(line);
    if (page) pages.add(`page ${page[1]} cannot be read (its content is damaged)`);
    else if (
      /ERROR|unable to find|object stream|cross-reference|xref|trailer|decoding stream data/i.test(line)
    )
      structure = true;
  }
  // A damaged page's stream also shows as a decoding warning: the page says it better.
  if (pages.size) return [...pages];
  if (structure)
    return ['its internal structure is damaged (the objects that hold its pages cannot be read)'];
  return ['its structure has errors that cannot be repaired'];
}

/**
 * 422 `unsanitisable_pdf` when qpdf finds errors (not mere warnings it repairs): the stamped
 * return copies the pages with qpdf, and a page that cannot be read would fail or print blank.
 */
async function requireSanitisable(bytes: Uint8Array, name: string): Promise<void> {
  const dir = await mkdtemp(path.join(tmpdir(), 'upload-check-'));
  const file = path.join(dir, 'upload.pdf');
  try {
    await writeFile(file, bytes);
    const check = await checkDocument(file);
    if (check.ok) return;
    const why = problemWords(check.problems).join('; ');
    throw new AppError(
      422,
      'unsanitisable_pdf',
      `The file “${name}” cannot be made into a stamped return: ${why}. Open it in a PDF program, save or print it as a new PDF, and upload that copy.`,
      [{ path: 'file', message: `file “${name}” cannot be made into a stamped return: ${why}` }],
    );
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

export async function inspectPdf(
  bytes: Uint8Array,
  limits: { maxPages: number },
  /** The uploaded file's name, for the messages. */
  name = 'upload.pdf',
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
    // Damaged object streams often stop pdf-lib too: qpdf says what is wrong in plainer terms.
    await requireSanitisable(bytes, name);
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
    await requireSanitisable(bytes, name);
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
  await requireSanitisable(bytes, name);
  return { pages };
}
