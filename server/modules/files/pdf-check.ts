// Checks an upload before it is recorded: a real PDF (header and end-of-file marker, not the
// name or the browser's MIME type), not empty, not encrypted, within the page limit, within
// the decompression budget (a compression bomb is refused, not unpacked), and whole enough for
// the stamped return to be made from it (qpdf --check: no damaged object streams or
// cross-reference table, every page's content readable) — refused here, naming the file,
// rather than when the return is stamped. Each refusal names the rule. The file is read from
// its working copy on disk: the header and trailer here (2 kB), the rest in a process of its
// own (inspect-process.ts, with a time limit), so the API's memory and event loop stay free.
import { fork } from 'node:child_process';
import { mkdir, mkdtemp, open, rm } from 'node:fs/promises';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import path from 'node:path';
import type { PdfContents } from '@shared/schemas/packages';
import type { Config } from '../../config';
import { unsafeTextReason } from '@shared/schemas/safe-text';
import { AppError } from '../../lib/app-error';
import { logger } from '../../lib/logger';
import type { Inspection } from './pdf-inspect';

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

function unsanitisable(name: string, problems: string[]): AppError {
  const why = problemWords(problems).join('; ');
  return new AppError(
    422,
    'unsanitisable_pdf',
    `The file “${name}” cannot be made into a stamped return: ${why}. Open it in a PDF program, save or print it as a new PDF, and upload that copy.`,
    [{ path: 'file', message: `file “${name}” cannot be made into a stamped return: ${why}` }],
  );
}

export interface UploadLimits {
  maxPages: number;
  /** What all the file's compressed streams may unpack to together: this, or 8 × the file's size if larger. */
  decodeMaxBytes: number;
  /** How long the check may take before the upload is refused. */
  checkSeconds: number;
  /** Where the check's scratch files go (the data folder's work/uploads). */
  workDir: string;
}

type UploadSettings = Pick<
  Config,
  'DATA_DIR' | 'UPLOAD_MAX_PAGES' | 'UPLOAD_DECODE_MAX_BYTES' | 'UPLOAD_CHECK_SECONDS'
>;

/** Where uploads being received and checked are kept on disk: the data folder's work/uploads. */
export function uploadWorkDir(config: Pick<Config, 'DATA_DIR'>): string {
  return path.join(config.DATA_DIR, 'work', 'uploads');
}

export function uploadLimits(config: UploadSettings): UploadLimits {
  return {
    maxPages: config.UPLOAD_MAX_PAGES,
    decodeMaxBytes: config.UPLOAD_DECODE_MAX_BYTES,
    checkSeconds: config.UPLOAD_CHECK_SECONDS,
    workDir: uploadWorkDir(config),
  };
}

/** The first and last kilobyte of the file (the header and the end-of-file marker live there). */
async function ends(file: string, size: number): Promise<{ head: Buffer; tail: Buffer }> {
  const fh = await open(file, 'r');
  try {
    const head = Buffer.alloc(Math.min(1024, size));
    await fh.read(head, 0, head.length, 0);
    const tail = Buffer.alloc(Math.min(1024, size));
    await fh.read(tail, 0, tail.length, Math.max(0, size - tail.length));
    return { head, tail };
  } finally {
    await fh.close();
  }
}

const INSPECT_ENTRY = fileURLToPath(new URL('./inspect-process.ts', import.meta.url));

// Checks run one per core at most; more uploads finishing at once wait their turn (each
// check's qpdf may use a few hundred MB on a large file, and the machine is shared).
const CHECKS_AT_ONCE = Math.max(1, availableParallelism());
let running = 0;
const waiting: Array<() => void> = [];

async function inTurn<T>(run: () => Promise<T>): Promise<T> {
  if (running >= CHECKS_AT_ONCE) await new Promise<void>((go) => waiting.push(go));
  running++;
  try {
    return await run();
  } finally {
    running--;
    waiting.shift()?.();
  }
}

type Outcome =
  Inspection | { ok: false; refusal: 'timeout' } | { ok: false; refusal: 'stopped'; reason: string };

/**
 * Runs the check in its own process group (the node process and the qpdf it runs), killed
 * whole when it runs past `seconds`. A process that dies without answering (out of memory on
 * the file) is `stopped`; an error inside the check is a fault of ours and rejects.
 */
function inspectInProcess(file: string, options: object, seconds: number): Promise<Outcome> {
  return new Promise((resolve, reject) => {
    // spawns: node (the check's entry, through tsx's loader like the API itself)
    const child = fork(INSPECT_ENTRY, [file, JSON.stringify(options)], {
      execArgv: ['--import', 'tsx', '--max-old-space-size=512'],
      stdio: ['ignore', 'ignore', 'pipe', 'ipc'],
      detached: true,
    });
    let answer: (Inspection | { ok: false; refusal: 'failed'; message: string }) | null = null;
    let timedOut = false;
    let stderr = '';
    child.stderr?.on('data', (chunk: Buffer) => {
      if (stderr.length < 4000) stderr += chunk.toString('utf8');
    });
    const timer = setTimeout(() => {
      timedOut = true;
      try {
        process.kill(-child.pid!, 'SIGKILL');
      } catch {
        child.kill('SIGKILL');
      }
    }, seconds * 1000);
    child.on('message', (m) => {
      answer = m as typeof answer;
    });
    child.on('error', (error) => {
      clearTimeout(timer);
      reject(error);
    });
    child.on('exit', (code, signal) => {
      clearTimeout(timer);
      const a = answer as typeof answer;
      if (a && (a.ok || a.refusal !== 'failed')) return resolve(a as Inspection);
      if (a) return reject(new Error(`the PDF check failed: ${a.message}`));
      if (timedOut) return resolve({ ok: false, refusal: 'timeout' });
      resolve({ ok: false, refusal: 'stopped', reason: `${signal ?? code}: ${stderr.slice(-500)}` });
    });
  });
}

export async function inspectPdf(
  upload: { workFile: string; size: number },
  limits: UploadLimits,
  /** The uploaded file's name, for the messages. */
  name = 'upload.pdf',
): Promise<{ pages: number; contents: PdfContents }> {
  const field = (message: string) => [{ path: 'file', message }];
  if (upload.size === 0)
    throw new AppError(400, 'empty_file', 'The file is empty (0 bytes).', field('file is empty'));
  const { head, tail } = await ends(upload.workFile, upload.size);
  if (head.indexOf(HEADER) === -1) {
    throw new AppError(
      415,
      'not_pdf',
      'The file is not a PDF: it does not start with a %PDF- header.',
      field('file must be a PDF'),
    );
  }
  if (tail.indexOf(EOF_MARK) === -1) {
    throw new AppError(
      400,
      'truncated_pdf',
      'The PDF is incomplete: its end-of-file marker (%%EOF) is missing. Upload the whole file again.',
      field('PDF is truncated'),
    );
  }
  const decodeBudget = Math.max(limits.decodeMaxBytes, 8 * upload.size);
  const result = await inTurn(async () => {
    // Made and removed here: a check killed at its time limit cannot remove it itself.
    await mkdir(limits.workDir, { recursive: true });
    const scratch = await mkdtemp(path.join(limits.workDir, 'inspect-'));
    try {
      return await inspectInProcess(
        upload.workFile,
        { maxPages: limits.maxPages, decodeBudget, scratch },
        limits.checkSeconds,
      );
    } finally {
      await rm(scratch, { recursive: true, force: true });
    }
  });
  if (!result.ok && result.refusal === 'timeout') {
    throw new AppError(
      422,
      'pdf_check_timeout',
      `The file “${name}” took longer than ${limits.checkSeconds} s to check, the desk’s limit. Save or print it as a new PDF (flattened, without layers) and upload that copy.`,
      field(`file “${name}” must be checked within ${limits.checkSeconds} s`),
    );
  }
  if (result.ok) return { pages: result.pages, contents: result.contents };
  switch (result.refusal) {
    case 'stopped':
      logger.warn({ name, reason: result.reason }, 'the PDF check stopped without an answer');
      throw new AppError(
        422,
        'pdf_check_failed',
        `The file “${name}” could not be checked: reading it took more memory than the desk allows for one file. Save or print it as a new PDF and upload that copy.`,
        field(`file “${name}” could not be checked`),
      );
    case 'encrypted':
      throw new AppError(
        400,
        'encrypted_pdf',
        'The PDF is encrypted or password-protected. Upload a copy without a password.',
        field('PDF must not be encrypted'),
      );
    case 'no_pages':
      throw new AppError(400, 'truncated_pdf', 'The PDF has no pages.', field('PDF has no pages'));
    case 'too_many_pages':
      throw new AppError(
        400,
        'too_many_pages',
        `The PDF has ${result.pages} pages; the limit is ${limits.maxPages}. Split it into several files.`,
        field(`PDF must have at most ${limits.maxPages} pages`),
      );
    case 'unsanitisable':
      throw unsanitisable(name, result.problems);
    case 'unreadable':
      throw new AppError(
        422,
        'unreadable_pdf',
        `The file “${name}” starts like a PDF but has no readable catalog or page tree.`,
        field('PDF has no catalog or page tree'),
      );
    case 'decode_budget': {
      const mb = Math.round(result.budget / 1024 / 1024);
      const where = result.page ? ` (on page ${result.page})` : '';
      throw new AppError(
        422,
        'decompression_limit',
        `The file “${name}” unpacks to more than ${mb} MB${where}, the desk’s limit for a file of its size: it looks like a compression bomb, not a drawing. Save or print it as a new PDF and upload that copy.`,
        field(`file “${name}” must unpack to at most ${mb} MB`),
      );
    }
  }
}
