// The return's structure after qpdf has copied the pages into one file: two small incremental
// updates written at the end of that file, never touching the bytes before it.
// - assembleReturn: each original page paints its overlay form (named by the overlay's index
//   page, overlay-carrier.ts) after its own content (wrapped in q … Q so a graphics state it
//   leaves behind cannot leak into the overlay), the index page leaves the page tree, and the
//   document information is written.
// - signReturn: the desk's signature (PAdES baseline B, /ETSI.CAdES.detached) as a visible
//   signature field over the stamp block's verification rows; the digest of the byte ranges is
//   streamed from disk with Node's sha-256 and the CMS is written into the placeholder in place.
import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { open, stat } from 'node:fs/promises';
import type { Signer } from '../../lib/pdf-tools/signer';
import {
  appendIncrement,
  Raw,
  readXrefState,
  serialise,
  textString,
  type NewObject,
  type PdfValue,
  type XrefState,
} from '../../lib/pdf-tools/incremental';
import {
  dictOf,
  inherited,
  readStructure,
  resolve,
  trailerOf,
  type QDict,
  type QValue,
} from '../../lib/pdf-tools/qpdf';
import { CARRIER_FORM } from './overlay-carrier';

export interface DocumentInfo {
  title: string;
  subject: string;
  author: string;
  keywords: string;
  date: Date;
  /** The file identifier (hex), unique to the return. */
  id: string;
}

export interface Assembled {
  xref: XrefState;
  rootRef: string;
  catalog: QDict;
  infoRef: string;
  id: QValue | undefined;
  firstPageRef: string;
  firstPage: { [key: string]: PdfValue };
  firstPageAnnots: PdfValue[];
}

/** D:YYYYMMDDHHmmSSZ */
export function pdfDateString(d: Date): string {
  const p = (n: number, w = 2) => String(n).padStart(w, '0');
  return `D:${p(d.getUTCFullYear(), 4)}${p(d.getUTCMonth() + 1)}${p(d.getUTCDate())}${p(d.getUTCHours())}${p(
    d.getUTCMinutes(),
  )}${p(d.getUTCSeconds())}Z`;
}

const ref = (n: number) => `${n} 0 R`;

function asDict(v: QValue | undefined): QDict {
  return v && typeof v === 'object' && !Array.isArray(v) ? (v as QDict) : {};
}

export async function assembleReturn(
  file: string,
  originalCount: number,
  /** 1 when the overlay's first page after the index is a cover sheet that goes before the plan. */
  cover: number,
  info: DocumentInfo,
): Promise<Assembled> {
  const s = await readStructure(file);
  const trailer = trailerOf(s);
  const rootRef = String(trailer['/Root']);
  // Nothing from the upload may act in or draw over the return: the originals' document
  // actions, JavaScript, attached files and form (AcroForm, XFA) are left out of the catalog.
  const catalog = { ...(dictOf(s, rootRef) ?? {}) };
  for (const key of ['/OpenAction', '/AA', '/AcroForm']) delete catalog[key];
  const names = asDict(resolve(s, catalog['/Names']));
  if (catalog['/Names'] !== undefined) {
    const kept = { ...names };
    for (const key of ['/JavaScript', '/EmbeddedFiles']) delete kept[key];
    catalog['/Names'] = kept;
  }
  const pagesRef = String(catalog['/Pages']);
  const pagesDict = dictOf(s, pagesRef) ?? {};
  const pageRefs = s.pages.map((p) => p.object);
  if (pageRefs.length < originalCount + 1) throw new Error('the combined file lacks the overlay index page');
  const indexRes = asDict(resolve(s, dictOf(s, pageRefs[originalCount])?.['/Resources']));
  const forms = asDict(resolve(s, indexRes['/XObject']));
  let next = Number(trailer['/Size'] ?? s.maxObjectId + 1);
  const objects: NewObject[] = [];
  const add = (dict: NewObject['dict'], stream?: Buffer) => {
    const num = next++;
    objects.push({ num, dict, stream });
    return ref(num);
  };
  const open = add({}, Buffer.from('q\n', 'latin1'));
  const closers = new Map<string, string>();
  let firstPage: Assembled['firstPage'] = {};
  const firstPageAnnots: PdfValue[] = [];

  for (let i = 0; i < originalCount; i++) {
    const pageRef = pageRefs[i];
    const page = dictOf(s, pageRef) ?? {};
    const form = forms[`/${CARRIER_FORM}${i}`];
    if (typeof form !== 'string') throw new Error(`the overlay of page ${i + 1} is missing`);
    const resources = { ...asDict(inherited(s, pageRef, '/Resources')) };
    const xobjects = { ...asDict(resolve(s, resources['/XObject'])) };
    let name = CARRIER_FORM;
    for (let k = 1; xobjects[`/${name}`] !== undefined; k++) name = `${CARRIER_FORM}${k}`;
    xobjects[`/${name}`] = form;
    resources['/XObject'] = xobjects;
    let close = closers.get(name);
    if (!close) {
      close = add({}, Buffer.from(`\nQ\nq /${name} Do Q\n`, 'latin1'));
      closers.set(name, close);
    }
    const own = s.pages[i].contents;
    // The page's content only: its annotations (comments, stamps, links, attachments,
    // widgets) and page actions are not carried.
    const { '/Annots': _annots, '/AA': _aa, ...pageRest } = page;
    const dict: { [key: string]: PdfValue } = {
      ...pageRest,
      '/Contents': [open, ...own, close],
      '/Resources': resources,
    };
    // Inherited boxes and rotation travel with the page, since its place in the tree changes.
    for (const key of ['/MediaBox', '/CropBox', '/Rotate']) {
      const v = inherited(s, pageRef, key);
      if (v !== undefined) dict[key] = v;
    }
    dict['/Parent'] = pagesRef;
    if (i === 0) firstPage = dict;
    objects.push({ num: Number(pageRef.split(' ')[0]), dict });
  }
  const covers = pageRefs.slice(originalCount + 1, originalCount + 1 + cover);
  const kept = [...covers, ...pageRefs.slice(0, originalCount), ...pageRefs.slice(originalCount + 1 + cover)];
  // qpdf writes a flat page tree; pages under another node are re-parented to the root above.
  // The cover sheet carries the stamp block, so the signature's widget goes on it: its whole
  // dictionary is written, as the first original's is.
  for (const p of [...covers, ...kept.slice(cover + originalCount)]) {
    const d = dictOf(s, p) ?? {};
    const isCover = covers.includes(p);
    if (d['/Parent'] !== pagesRef || isCover) {
      const dict: { [key: string]: PdfValue } = { ...d, '/Parent': pagesRef };
      for (const key of ['/MediaBox', '/CropBox', '/Rotate', '/Resources']) {
        const v = inherited(s, p, key);
        if (v !== undefined) dict[key] = v;
      }
      if (isCover) firstPage = dict;
      objects.push({ num: Number(p.split(' ')[0]), dict });
    }
  }
  objects.push({ num: Number(rootRef.split(' ')[0]), dict: catalog as { [key: string]: PdfValue } });
  objects.push({
    num: Number(pagesRef.split(' ')[0]),
    dict: { ...pagesDict, '/Kids': kept, '/Count': kept.length },
  });
  const date = new Raw(textString(pdfDateString(info.date)));
  const infoRef = add({
    '/Title': new Raw(textString(info.title)),
    '/Subject': new Raw(textString(info.subject)),
    '/Author': new Raw(textString(info.author)),
    '/Keywords': new Raw(textString(info.keywords)),
    '/Creator': new Raw(textString('Counterpoise')),
    '/Producer': new Raw(textString('Counterpoise stamped return (qpdf, pdf-lib)')),
    '/CreationDate': date,
    '/ModDate': date,
  });
  const id: QValue = [`b:${info.id}`, `b:${info.id}`];
  const xrefBefore = await readXrefState(file, next);
  const written = await appendIncrement(
    file,
    xrefBefore,
    objects,
    {
      '/Root': rootRef,
      '/Info': infoRef,
      '/ID': id,
    },
    true,
  );
  return {
    xref: written.state,
    rootRef,
    catalog,
    infoRef,
    id,
    firstPageRef: kept[0],
    firstPage,
    firstPageAnnots,
  };
}

export interface SignatureField {
  /** In the first page's user space. */
  rect: [number, number, number, number];
  name: string;
  reason: string;
  date: Date;
}

/** Room left in the placeholder beyond the signer's measured signature size. */
const SIGNATURE_SLACK = 64;
const BYTE_RANGE_PLACEHOLDER = '[0 0000000000 0000000000 0000000000]';

function feed(file: string, start: number, length: number, sinks: Array<(chunk: Buffer) => void>) {
  return new Promise<void>((resolveRead, reject) => {
    if (length === 0) return resolveRead();
    const rs = createReadStream(file, { start, end: start + length - 1, highWaterMark: 1 << 20 });
    rs.on('data', (chunk) => sinks.forEach((sink) => sink(chunk as Buffer)));
    rs.on('end', () => resolveRead());
    rs.on('error', reject);
  });
}

/**
 * Sign the return. Returns the sha-256 of the signed file: the one read of the document feeds
 * both the signature's digest and the file's, which continues over the signature and the short
 * tail after it once they are known.
 */
export async function signReturn(
  file: string,
  a: Assembled,
  field: SignatureField,
  signer: Signer,
): Promise<string> {
  const SIGNATURE_BYTES = signer.signatureSize + SIGNATURE_SLACK;
  let next = a.xref.size;
  const sigNum = next++;
  const widgetNum = next++;
  const apNum = next++;
  const sigDict: { [key: string]: PdfValue } = {
    '/Type': '/Sig',
    '/Filter': '/Adobe.PPKLite',
    '/SubFilter': '/ETSI.CAdES.detached',
    '/ByteRange': new Raw(BYTE_RANGE_PLACEHOLDER),
    '/Contents': new Raw(`<${'0'.repeat(SIGNATURE_BYTES * 2)}>`),
    '/M': new Raw(textString(pdfDateString(field.date))),
    '/Name': new Raw(textString(signer.subject)),
    '/Reason': new Raw(textString(field.reason)),
  };
  const [x1, y1, x2, y2] = field.rect;
  const objects: NewObject[] = [
    { num: sigNum, dict: sigDict },
    {
      num: widgetNum,
      dict: {
        '/Type': '/Annot',
        '/Subtype': '/Widget',
        '/FT': '/Sig',
        '/T': new Raw(textString(field.name)),
        '/V': ref(sigNum),
        '/F': 132,
        '/P': a.firstPageRef,
        '/Rect': [x1, y1, x2, y2],
        '/AP': { '/N': ref(apNum) },
      },
    },
    {
      // The field shows what the stamp block already draws beneath it: its own look is empty.
      num: apNum,
      dict: {
        '/Type': '/XObject',
        '/Subtype': '/Form',
        '/BBox': [0, 0, Math.max(x2 - x1, 0), Math.max(y2 - y1, 0)],
      },
      stream: Buffer.alloc(0),
    },
    {
      num: Number(a.firstPageRef.split(' ')[0]),
      dict: { ...a.firstPage, '/Annots': [...a.firstPageAnnots, ref(widgetNum)] },
    },
  ];
  const acro = { ...asDict(a.catalog['/AcroForm'] as QValue) };
  const fields = Array.isArray(acro['/Fields']) ? (acro['/Fields'] as PdfValue[]) : [];
  objects.push({
    num: Number(a.rootRef.split(' ')[0]),
    dict: { ...a.catalog, '/AcroForm': { ...acro, '/Fields': [...fields, ref(widgetNum)], '/SigFlags': 3 } },
  });
  const written = await appendIncrement(file, a.xref, objects, {
    '/Root': a.rootRef,
    '/Info': a.infoRef,
    ...(a.id !== undefined ? { '/ID': a.id as PdfValue } : {}),
  });
  const dictText = serialise(sigDict);
  const dictAt = written.dictOffsets.get(sigNum)!;
  const contentsAt = dictAt + dictText.indexOf('/Contents <') + '/Contents '.length;
  const byteRangeAt = dictAt + dictText.indexOf(BYTE_RANGE_PLACEHOLDER);
  const contentsEnd = contentsAt + SIGNATURE_BYTES * 2 + 2;
  const { size: length } = await stat(file);
  const br = `[0 ${contentsAt} ${contentsEnd} ${length - contentsEnd}]`;
  if (br.length > BYTE_RANGE_PLACEHOLDER.length)
    throw new Error('the return is too large for its byte range');
  const fh = await open(file, 'r+');
  try {
    await fh.write(
      Buffer.from(br.padEnd(BYTE_RANGE_PLACEHOLDER.length, ' '), 'latin1'),
      0,
      undefined,
      byteRangeAt,
    );
    const ranges = createHash('sha256');
    const whole = createHash('sha256');
    await feed(file, 0, contentsAt, [(c) => ranges.update(c), (c) => whole.update(c)]);
    const tail: Buffer[] = [];
    await feed(file, contentsEnd, length - contentsEnd, [(c) => ranges.update(c), (c) => tail.push(c)]);
    const cms = await signer.sign(ranges.digest());
    if (cms.length > SIGNATURE_BYTES)
      throw new Error(`the signature needs ${cms.length} bytes, more than the ${SIGNATURE_BYTES} reserved`);
    const hex = cms.toString('hex').toUpperCase();
    await fh.write(Buffer.from(hex, 'latin1'), 0, undefined, contentsAt + 1);
    whole.update(Buffer.from(`<${hex.padEnd(SIGNATURE_BYTES * 2, '0')}>`, 'latin1'));
    for (const c of tail) whole.update(c);
    return whole.digest('hex');
  } finally {
    await fh.close();
  }
}
