// What an uploaded PDF carries besides its pages' content, read from qpdf's JSON (no stream
// data): annotations by kind and page, JavaScript, document and page actions, embedded files,
// form fields and XFA. None of it is carried into the stamped return (return-structure.ts
// drops it), so the upload step tells the contractor (shared/vocabulary/pdf-contents.ts).
import type { AnnotationKind, PdfContents } from '@shared/schemas/packages';
import {
  dictOf,
  resolve,
  trailerOf,
  type QDict,
  type QpdfStructure,
  type QValue,
} from '../../lib/pdf-tools/qpdf';

/** ISO 32000-1 §12.5.6 annotation subtypes, grouped as a contractor would name them. */
const KIND_OF_SUBTYPE: Record<string, AnnotationKind> = {
  '/Text': 'comment',
  '/FreeText': 'comment',
  '/Highlight': 'comment',
  '/Underline': 'comment',
  '/Squiggly': 'comment',
  '/StrikeOut': 'comment',
  '/Caret': 'comment',
  '/Stamp': 'stamp',
  '/Square': 'shape',
  '/Circle': 'shape',
  '/Line': 'shape',
  '/Polygon': 'shape',
  '/PolyLine': 'shape',
  '/Ink': 'shape',
  '/FileAttachment': 'attachment',
  '/Widget': 'widget',
  '/Link': 'link',
  '/Sound': 'media',
  '/Movie': 'media',
  '/Screen': 'media',
  '/RichMedia': 'media',
  '/3D': 'media',
};

function dictAt(s: QpdfStructure, v: QValue | undefined): QDict | undefined {
  const r = resolve(s, v);
  if (typeof r === 'string') return dictOf(s, r);
  return r && typeof r === 'object' && !Array.isArray(r) ? r : undefined;
}

function arrayOf(s: QpdfStructure, v: QValue | undefined): QValue[] {
  const r = resolve(s, v);
  return Array.isArray(r) ? r : [];
}

function isJavaScript(d: QDict | undefined) {
  return d?.['/S'] === '/JavaScript';
}

export interface QpdfDocumentJson {
  acroform?: { fields?: Array<{ fullname?: string; object?: string }> };
  attachments?: Record<string, unknown>;
}

export function pdfContents(s: QpdfStructure, doc: QpdfDocumentJson): PdfContents {
  const counts = new Map<string, { kind: AnnotationKind; page: number; count: number }>();
  let actions = 0;
  s.pages.forEach((page, index) => {
    const dict = dictAt(s, page.object);
    if (dict?.['/AA'] !== undefined) actions++;
    for (const ref of arrayOf(s, dict?.['/Annots'])) {
      const annot = dictAt(s, ref);
      const subtype = annot?.['/Subtype'];
      // A popup belongs to the comment it opens from: counted once, with it.
      if (!annot || subtype === '/Popup') continue;
      const kind = KIND_OF_SUBTYPE[String(subtype)] ?? 'other';
      const key = `${kind}:${index + 1}`;
      const entry = counts.get(key) ?? { kind, page: index + 1, count: 0 };
      entry.count++;
      counts.set(key, entry);
    }
  });
  const catalog = dictAt(s, trailerOf(s)['/Root']);
  for (const key of ['/OpenAction', '/AA'] as const) {
    const value = catalog?.[key];
    if (value === undefined) continue;
    // An /OpenAction that only opens a page view is not an action that runs anything.
    if (key === '/OpenAction' && Array.isArray(resolve(s, value))) continue;
    if (!isJavaScript(dictAt(s, value))) actions++;
  }
  let javascript = 0;
  for (const o of Object.values(s.objects)) {
    const v = o.value;
    if (v && typeof v === 'object' && !Array.isArray(v) && isJavaScript(v as QDict)) javascript++;
  }
  const names = dictAt(s, catalog?.['/Names']);
  if (!javascript && names?.['/JavaScript'] !== undefined) javascript = 1;
  const acroForm = dictAt(s, catalog?.['/AcroForm']);
  const fields = new Set((doc.acroform?.fields ?? []).map((f) => f.fullname ?? f.object ?? ''));
  return {
    annotations: [...counts.values()].sort((a, b) => a.page - b.page || a.kind.localeCompare(b.kind)),
    javascript,
    actions,
    embeddedFiles: Object.keys(doc.attachments ?? {}).length,
    formFields: fields.size,
    xfa: acroForm?.['/XFA'] !== undefined,
  };
}
