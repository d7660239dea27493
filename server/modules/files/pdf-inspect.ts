// The PDF check itself, run in a process of its own (inspect-process.ts) so that neither its
// memory nor its time reaches the API's event loop. On a file already on disk: qpdf reads the
// structure (JSON, each stream's bytes written as they are, undecoded, to a scratch folder),
// then every stream compressed with a general-purpose filter is unpacked and counted against
// the decompression budget (a compression bomb stops at the budget, never at its full size),
// then qpdf --check parses everything (safe now: the budget bounds what it unpacks), and the
// file's annotations, scripts, actions, attachments and form fields are counted.
import { execFile, spawn } from 'node:child_process';
import { createReadStream } from 'node:fs';
import { rm } from 'node:fs/promises';
import path from 'node:path';
import { Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { constants, createInflate } from 'node:zlib';
import type { PdfContents } from '@shared/schemas/packages';
import {
  checkDocument,
  resolve,
  type QObject,
  type QpdfStructure,
  type QValue,
} from '../../lib/pdf-tools/qpdf';
import { pdfContents, type QpdfDocumentJson } from './pdf-contents';

export type Inspection =
  | { ok: true; pages: number; contents: PdfContents }
  | { ok: false; refusal: 'encrypted' | 'no_pages' }
  | { ok: false; refusal: 'too_many_pages'; pages: number }
  | { ok: false; refusal: 'unreadable'; message: string }
  | { ok: false; refusal: 'unsanitisable'; problems: string[] }
  | { ok: false; refusal: 'decode_budget'; budget: number; page: number | null };

export interface InspectOptions {
  maxPages: number;
  /** Bytes all the file's streams may unpack to, together. */
  decodeBudget: number;
  /** An empty folder for the stream bytes qpdf writes out; the caller removes it. */
  scratch: string;
}

const FLATE = new Set(['/FlateDecode', '/Fl']);
// The filters qpdf --check decodes ("generalized"); image codecs (DCT, JPX, CCITT, JBIG2) it leaves alone.
const GENERAL = new Set([
  ...FLATE,
  '/LZWDecode',
  '/LZW',
  '/RunLengthDecode',
  '/RL',
  '/ASCII85Decode',
  '/A85',
  '/ASCIIHexDecode',
  '/AHx',
]);

interface DocumentJson extends QpdfDocumentJson {
  pages: QpdfStructure['pages'];
  encrypt?: { encrypted?: boolean };
  qpdf: [{ maxobjectid: number }, Record<string, QObject>];
}

function readJson(file: string, scratch: string): Promise<{ json?: DocumentJson; error?: string }> {
  const args = [
    '--json=2',
    '--json-key=pages',
    '--json-key=qpdf',
    '--json-key=acroform',
    '--json-key=attachments',
    '--json-key=encrypt',
    '--json-stream-data=file',
    `--json-stream-prefix=${path.join(scratch, 's')}`,
    '--decode-level=none',
    '--',
    file,
  ];
  return new Promise((done) => {
    execFile('qpdf', args, { maxBuffer: 1024 * 1024 * 1024, encoding: 'utf8' }, (err, stdout, stderr) => {
      const code =
        err && typeof (err as { code?: unknown }).code === 'number' ? (err as { code: number }).code : 0;
      if (err && code !== 3)
        done({
          error: String(stderr || err.message)
            .split(file)
            .join(''),
        });
      else done({ json: JSON.parse(stdout) as DocumentJson });
    });
  });
}

class OverBudget extends Error {}

/** A writable that counts what reaches it and fails once `cap` bytes are reached. */
function counter(cap: number) {
  let n = 0;
  const sink = new Writable({
    write(chunk: Buffer, _enc, done) {
      n += chunk.length;
      done(n >= cap ? new OverBudget() : undefined);
    },
  });
  return { sink, count: () => n };
}

/** What `layers` Flate filters unpack the file to, counted up to `cap` (a damaged stream counts what inflated). */
async function inflatedLength(file: string, layers: number, cap: number): Promise<number> {
  const c = counter(cap);
  const inflaters = Array.from({ length: layers }, () =>
    createInflate({ finishFlush: constants.Z_SYNC_FLUSH, chunkSize: 64 * 1024 }),
  );
  await pipeline([createReadStream(file, { highWaterMark: 1 << 20 }), ...inflaters, c.sink]).catch(
    () => undefined,
  );
  return c.count();
}

/** What qpdf decodes one stream to (the filters Node does not unpack), counted up to `cap`. */
function qpdfDecodedLength(file: string, ref: string, cap: number): Promise<number> {
  const [num, gen] = ref.split(' ');
  return new Promise((done) => {
    let n = 0;
    const child = spawn('qpdf', [`--show-object=${num},${gen}`, '--filtered-stream-data', '--', file], {
      stdio: ['ignore', 'pipe', 'ignore'],
    });
    child.stdout.on('data', (chunk: Buffer) => {
      n += chunk.length;
      if (n >= cap) child.kill('SIGKILL');
    });
    child.on('close', () => done(n));
    child.on('error', () => done(n));
  });
}

function filtersOf(s: QpdfStructure, o: QObject): string[] {
  const f: QValue | undefined = resolve(s, o.stream?.dict['/Filter']);
  const list = Array.isArray(f) ? f.map((x) => resolve(s, x)) : [f];
  return list.filter((x): x is string => typeof x === 'string');
}

/** The page whose content or resources name `ref` directly (for the message), or null. */
function pageNaming(json: DocumentJson, ref: string): number | null {
  const page = json.pages.find(
    (p) =>
      p.contents.includes(ref) ||
      (p as { images?: Array<{ object: string }> }).images?.some((i) => i.object === ref),
  );
  return page ? json.pages.indexOf(page) + 1 : null;
}

async function withinDecodeBudget(file: string, json: DocumentJson, s: QpdfStructure, budget: number) {
  let total = 0;
  for (const [key, o] of Object.entries(s.objects)) {
    if (!o.stream) continue;
    const filters = filtersOf(s, o);
    // The filters up to the first image codec: what qpdf --check would unpack.
    const stop = filters.findIndex((f) => !GENERAL.has(f));
    const leading = stop === -1 ? filters : filters.slice(0, stop);
    if (!leading.length) continue;
    const ref = key.replace(/^obj:/, '');
    const left = budget - total + 1;
    total +=
      leading.every((f) => FLATE.has(f)) && o.stream.datafile
        ? await inflatedLength(o.stream.datafile, leading.length, left)
        : await qpdfDecodedLength(file, ref, left);
    if (total > budget) return { ok: false as const, page: pageNaming(json, ref) };
  }
  return { ok: true as const };
}

export async function inspectFile(file: string, opts: InspectOptions): Promise<Inspection> {
  const scratch = opts.scratch;
  try {
    const read = await readJson(file, scratch);
    if (!read.json) {
      if (/invalid password|password/i.test(read.error ?? '')) return { ok: false, refusal: 'encrypted' };
      const check = await checkDocument(file);
      if (!check.ok) return { ok: false, refusal: 'unsanitisable', problems: check.problems };
      return { ok: false, refusal: 'unreadable', message: (read.error ?? '').slice(0, 200) };
    }
    const json = read.json;
    if (json.encrypt?.encrypted) return { ok: false, refusal: 'encrypted' };
    const pages = json.pages.length;
    if (pages < 1) return { ok: false, refusal: 'no_pages' };
    if (pages > opts.maxPages) return { ok: false, refusal: 'too_many_pages', pages };
    const s: QpdfStructure = {
      objects: json.qpdf[1],
      pages: json.pages,
      maxObjectId: json.qpdf[0].maxobjectid,
    };
    const budget = await withinDecodeBudget(file, json, s, opts.decodeBudget);
    if (!budget.ok)
      return { ok: false, refusal: 'decode_budget', budget: opts.decodeBudget, page: budget.page };
    // Unpacked once to count it; the scratch copies are not needed for the parse.
    await rm(scratch, { recursive: true, force: true });
    const check = await checkDocument(file);
    if (!check.ok) return { ok: false, refusal: 'unsanitisable', problems: check.problems };
    return { ok: true, pages, contents: pdfContents(s, json) };
  } finally {
    await rm(scratch, { recursive: true, force: true });
  }
}
