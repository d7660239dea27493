// An incremental update (PDF 32000-1 §7.5.6) appended to a file on disk: new versions of a few
// objects, their cross-reference section and a trailer whose /Prev points at the file's last
// one. Nothing before the end of the file is read or rewritten, so the cost does not depend on
// the size of the package. The section is written in the form the file already uses (an
// uncompressed cross-reference stream after a stream, a classic table after a table).
import { open, stat } from 'node:fs/promises';
import { deflateSync } from 'node:zlib';
import type { QValue } from './qpdf';

/** PDF syntax written as it is (an operator string, a prepared hex string). */
export class Raw {
  constructor(readonly text: string) {}
}
export type PdfValue = QValue | Raw | PdfValue[] | { [key: string]: PdfValue };

const REF = /^\d+ \d+ R$/;

function name(n: string): string {
  let out = '/';
  for (const ch of Buffer.from(n.replace(/^\//, ''), 'utf8')) {
    const regular = ch > 0x20 && ch < 0x7f && !'()<>[]{}/%#'.includes(String.fromCharCode(ch));
    out += regular ? String.fromCharCode(ch) : `#${ch.toString(16).padStart(2, '0')}`;
  }
  return out;
}

/** A text string: literal when it is printable ASCII, UTF-16BE with a byte-order mark otherwise. */
export function textString(t: string): string {
  if (/^[\x20-\x7e]*$/.test(t)) return `(${t.replace(/([\\()])/g, '\\$1')})`;
  const utf16 = Buffer.from(t, 'utf16le').swap16();
  return `<FEFF${utf16.toString('hex').toUpperCase()}>`;
}

function num(n: number): string {
  if (Number.isInteger(n)) return String(n);
  return n.toFixed(6).replace(/0+$/, '').replace(/\.$/, '');
}

/** qpdf JSON v2 values and our own back into PDF syntax. */
export function serialise(v: PdfValue): string {
  if (v instanceof Raw) return v.text;
  if (v === null) return 'null';
  if (typeof v === 'boolean') return v ? 'true' : 'false';
  if (typeof v === 'number') return num(v);
  if (typeof v === 'string') {
    if (REF.test(v)) return v;
    if (v.startsWith('/')) return name(v);
    if (v.startsWith('n:')) return name(v.slice(2));
    if (v.startsWith('u:')) return textString(v.slice(2));
    if (v.startsWith('b:')) return `<${v.slice(2)}>`;
    return textString(v);
  }
  if (Array.isArray(v)) return `[${v.map(serialise).join(' ')}]`;
  return `<<${Object.entries(v)
    .map(([k, x]) => `${name(k)} ${serialise(x)}`)
    .join(' ')}>>`;
}

export interface NewObject {
  num: number;
  /** A dictionary, or a dictionary plus stream data. */
  dict: { [key: string]: PdfValue };
  stream?: Buffer;
}

export interface XrefState {
  /** Offset of the last cross-reference section. */
  startxref: number;
  /** The trailer's /Size: the next free object number. */
  size: number;
  /** The last section is a cross-reference stream. */
  xrefStream: boolean;
}

/** Offset of the last cross-reference section and its kind, read from the file's last bytes. */
export async function readXrefState(file: string, size: number): Promise<XrefState> {
  const fh = await open(file, 'r');
  try {
    const { size: length } = await fh.stat();
    const tail = Buffer.alloc(Math.min(2048, length));
    await fh.read(tail, 0, tail.length, length - tail.length);
    const m = /startxref\s+(\d+)\s+%%EOF\s*$/.exec(tail.toString('latin1'));
    if (!m) throw new Error(`${file} has no startxref at its end`);
    const startxref = Number(m[1]);
    const head = Buffer.alloc(16);
    await fh.read(head, 0, 16, startxref);
    return { startxref, size, xrefStream: !head.toString('latin1').startsWith('xref') };
  } finally {
    await fh.close();
  }
}

function objectBytes(o: NewObject): Buffer {
  const dict = { ...o.dict };
  if (o.stream) dict['/Length'] = o.stream.length;
  const head = Buffer.from(`${o.num} 0 obj\n${serialise(dict)}\n`, 'latin1');
  if (!o.stream) return Buffer.concat([head, Buffer.from('endobj\n', 'latin1')]);
  return Buffer.concat([
    head,
    Buffer.from('stream\n', 'latin1'),
    o.stream,
    Buffer.from('\nendstream\nendobj\n', 'latin1'),
  ]);
}

/** Consecutive runs of object numbers, as /Index or classic subsections want them. */
function runs(nums: number[]): Array<[number, number[]]> {
  const sorted = [...nums].sort((a, b) => a - b);
  const out: Array<[number, number[]]> = [];
  for (const n of sorted) {
    const last = out[out.length - 1];
    if (last && last[0] + last[1].length === n) last[1].push(n);
    else out.push([n, [n]]);
  }
  return out;
}

export interface AppendResult {
  state: XrefState;
  /** File offset where each object's "N 0 obj" starts. */
  offsets: Map<number, number>;
  /** File offset of each object's dictionary text. */
  dictOffsets: Map<number, number>;
}

/**
 * Append `objects` as one incremental update. `trailer` holds /Root, /Info, /ID and the like;
 * /Size and /Prev are set here.
 */
export async function appendIncrement(
  file: string,
  prev: XrefState,
  allObjects: NewObject[],
  trailer: { [key: string]: PdfValue },
  /** Put the dictionaries (not streams) into one compressed object stream, after a stream xref. */
  pack = false,
): Promise<AppendResult> {
  let offset = (await stat(file)).size;
  const chunks: Buffer[] = [Buffer.from('\n', 'latin1')];
  offset += 1;
  const offsets = new Map<number, number>();
  const dictOffsets = new Map<number, number>();
  const packed = pack && prev.xrefStream ? allObjects.filter((o) => !o.stream).slice(0, 60_000) : [];
  const objects = allObjects.filter((o) => !packed.includes(o));
  const packedIndex = new Map<number, number>();
  let objStmNum = 0;
  if (packed.length > 0) {
    objStmNum = Math.max(prev.size - 1, ...allObjects.map((o) => o.num)) + 1;
    const bodies = packed.map((o) => Buffer.from(`${serialise(o.dict)}\n`, 'latin1'));
    let header = '';
    let at = 0;
    packed.forEach((o, i) => {
      header += `${o.num} ${at} `;
      at += bodies[i].length;
      packedIndex.set(o.num, i);
    });
    const head = Buffer.from(`${header}\n`, 'latin1');
    objects.push({
      num: objStmNum,
      dict: { '/Type': '/ObjStm', '/N': packed.length, '/First': head.length, '/Filter': '/FlateDecode' },
      stream: deflateSync(Buffer.concat([head, ...bodies])),
    });
  }
  for (const o of objects) {
    const bytes = objectBytes(o);
    offsets.set(o.num, offset);
    dictOffsets.set(o.num, offset + `${o.num} 0 obj\n`.length);
    chunks.push(bytes);
    offset += bytes.length;
  }
  const maxNum = Math.max(prev.size - 1, ...allObjects.map((o) => o.num), objStmNum);
  const xrefOffset = offset;
  let state: XrefState;
  if (prev.xrefStream) {
    const xrefNum = maxNum + 1;
    const size = xrefNum + 1;
    offsets.set(xrefNum, xrefOffset);
    const nums = [...allObjects.map((o) => o.num), ...(objStmNum ? [objStmNum] : []), xrefNum];
    const groups = runs(nums);
    const rows: Buffer[] = [];
    for (const [, group] of groups)
      for (const n of group) {
        const row = Buffer.alloc(8);
        const inStream = packedIndex.get(n);
        if (inStream !== undefined) {
          row[0] = 2;
          row.writeUIntBE(objStmNum, 1, 5);
          row.writeUInt16BE(inStream, 6);
        } else {
          row[0] = 1;
          row.writeUIntBE(offsets.get(n)!, 1, 5);
          row.writeUInt16BE(0, 6);
        }
        rows.push(row);
      }
    const xref = objectBytes({
      num: xrefNum,
      dict: {
        ...trailer,
        '/Type': '/XRef',
        '/Size': size,
        '/Prev': prev.startxref,
        '/W': [1, 5, 2],
        '/Index': groups.flatMap(([start, g]) => [start, g.length]),
      },
      stream: Buffer.concat(rows),
    });
    chunks.push(xref, Buffer.from(`startxref\n${xrefOffset}\n%%EOF\n`, 'latin1'));
    state = { startxref: xrefOffset, size, xrefStream: true };
  } else {
    const size = maxNum + 1;
    let table = 'xref\n';
    for (const [start, group] of runs(objects.map((o) => o.num))) {
      table += `${start} ${group.length}\n`;
      for (const n of group) table += `${String(offsets.get(n)).padStart(10, '0')} 00000 n \n`;
    }
    table += `trailer\n${serialise({ ...trailer, '/Size': size, '/Prev': prev.startxref })}\n`;
    chunks.push(Buffer.from(`${table}startxref\n${xrefOffset}\n%%EOF\n`, 'latin1'));
    state = { startxref: xrefOffset, size, xrefStream: false };
  }
  const fh = await open(file, 'a');
  try {
    await fh.write(Buffer.concat(chunks));
  } finally {
    await fh.close();
  }
  return { state, offsets, dictOffsets };
}
