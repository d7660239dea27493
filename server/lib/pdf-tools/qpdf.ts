// Debian's qpdf, for the parts of the stamped return that must not touch the originals'
// bytes: reading a document's structure (qpdf --json, no stream data) and copying pages of
// several files into one (qpdf --pages with --stream-data=preserve, so every content and
// image stream is carried over byte for byte, never decoded or re-encoded). qpdf reads and
// writes files on disk and streams them, so the Node process never holds a package in memory.
import { execFile } from 'node:child_process';

/** qpdf refused a document: its own message, without the program's noise. */
export class QpdfError extends Error {
  constructor(
    message: string,
    readonly file: string,
  ) {
    super(message);
    this.name = 'QpdfError';
  }
}

/** A value of qpdf's JSON version 2: names "/X", references "N 0 R", strings "u:…" or "b:hex". */
export type QValue = null | boolean | number | string | QValue[] | { [key: string]: QValue };
export type QDict = { [key: string]: QValue };

export interface QObject {
  value?: QValue;
  /** `datafile`: where --json-stream-data=file wrote the stream's bytes. */
  stream?: { dict: QDict; datafile?: string };
}

export interface QpdfStructure {
  /** "obj:N 0 R" → object, plus "trailer". */
  objects: Record<string, QObject>;
  pages: Array<{ object: string; contents: string[] }>;
  maxObjectId: number;
}

function run(args: string[], file: string, maxBuffer = 512 * 1024 * 1024): Promise<string> {
  return new Promise((resolve, reject) => {
    execFile('qpdf', args, { maxBuffer, encoding: 'utf8' }, (err, stdout, stderr) => {
      // Exit code 3: qpdf succeeded with warnings (a repaired cross-reference table, say).
      const code =
        err && typeof (err as { code?: unknown }).code === 'number' ? (err as { code: number }).code : 0;
      if (err && code !== 3) {
        const msg = String(stderr || err.message)
          .split('\n')
          .map((l) => l.trim())
          .filter((l) => l && !l.startsWith('qpdf: operation succeeded'))
          .map((l) => l.replace(/^qpdf:\s*/, '').replace(/^WARNING:\s*/, ''))
          .join('; ');
        reject(new QpdfError(msg || `qpdf exited with code ${code}`, file));
        return;
      }
      resolve(stdout);
    });
  });
}

/**
 * qpdf --check: parses every object, decodes every stream it can and each page's content.
 * Exit 0 is clean, 3 is warnings only (qpdf repaired what it found: the stamp reads it the
 * same way), 2 is errors. The problems are qpdf's lines, with the file's path taken out.
 */
export function checkDocument(file: string): Promise<{ ok: boolean; problems: string[] }> {
  return new Promise((resolve, reject) => {
    execFile(
      'qpdf',
      ['--check', '--', file],
      { maxBuffer: 16 * 1024 * 1024, encoding: 'utf8' },
      (err, stdout, stderr) => {
        const code =
          err && typeof (err as { code?: unknown }).code === 'number' ? (err as { code: number }).code : 0;
        if (err && code !== 2 && code !== 3) {
          reject(
            new QpdfError(String(stderr || err.message).trim() || `qpdf exited with code ${code}`, file),
          );
          return;
        }
        const problems = `${stdout}\n${stderr}`
          .split('\n')
          .map((l) => l.split(file).join('').trim())
          .filter((l) => /^(ERROR|WARNING|qpdf):/.test(l) && !/operation succeeded|errors detected$/.test(l));
        resolve({ ok: code !== 2, problems });
      },
    );
  });
}

/** Every object's dictionary (no stream data), the page list and the trailer. */
export async function readStructure(file: string): Promise<QpdfStructure> {
  const out = await run(['--json=2', '--json-key=pages', '--json-key=qpdf', '--', file], file);
  const json = JSON.parse(out) as {
    pages: Array<{ object: string; contents: string[] }>;
    qpdf: [{ maxobjectid: number }, Record<string, QObject>];
  };
  return { objects: json.qpdf[1], pages: json.pages, maxObjectId: json.qpdf[0].maxobjectid };
}

/**
 * Copy `inputs` (each file with an optional page range, qpdf syntax) into `out`, in order.
 * Streams are preserved as they are; non-stream objects go into object streams, which keeps
 * the structure compact. One input gives one output.
 */
export async function concatenate(inputs: Array<{ file: string; range?: string }>, out: string) {
  const pages = inputs.flatMap((i) => (i.range ? [i.file, i.range] : [i.file]));
  await run(
    [
      '--empty',
      '--stream-data=preserve',
      '--object-streams=generate',
      // A fixed /ID here (hashing the whole output for it would be another pass over the
      // package); the return's incremental updates write its own /ID.
      '--static-id',
      // Keep every page's resources as they are: the overlay's index page names forms it does
      // not draw itself, and "auto" would drop them as unreferenced.
      '--remove-unreferenced-resources=no',
      '--pages',
      ...pages,
      '--',
      out,
    ],
    inputs.map((i) => i.file).join(', '),
  );
}

export function objectOf(s: QpdfStructure, ref: string): QObject | undefined {
  return s.objects[`obj:${ref}`];
}

/** The dictionary of `ref` (a stream's dictionary for a stream). */
export function dictOf(s: QpdfStructure, ref: QValue | undefined): QDict | undefined {
  if (typeof ref !== 'string' || !/^\d+ \d+ R$/.test(ref)) return undefined;
  const o = objectOf(s, ref);
  const v = o?.stream?.dict ?? o?.value;
  return v && typeof v === 'object' && !Array.isArray(v) ? (v as QDict) : undefined;
}

/** A value with one level of indirect reference followed. */
export function resolve(s: QpdfStructure, v: QValue | undefined): QValue | undefined {
  if (typeof v === 'string' && /^\d+ \d+ R$/.test(v)) {
    const o = objectOf(s, v);
    return o?.stream ? v : o?.value;
  }
  return v;
}

/** A page attribute, looked up the /Parent chain as PDF inheritance says. */
export function inherited(s: QpdfStructure, pageRef: string, key: string): QValue | undefined {
  let ref: QValue | undefined = pageRef;
  for (let depth = 0; depth < 64 && ref; depth++) {
    const d = dictOf(s, ref);
    if (!d) return undefined;
    if (d[key] !== undefined) return resolve(s, d[key]);
    ref = d['/Parent'];
  }
  return undefined;
}

export function trailerOf(s: QpdfStructure): QDict {
  return (s.objects.trailer?.value ?? {}) as QDict;
}
