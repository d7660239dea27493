// What the desk adds to each original page travels in the overlay PDF as one Form XObject per
// original page (identity matrix, the page's MediaBox as BBox, its own resources), all named in
// the /Resources of a single "index" page, /CPStamp0 … /CPStamp<n-1>. qpdf copies the index page
// with its forms and fonts into the return; the return's incremental update then paints form i
// on original page i and leaves the index page out of the page tree.
//
// Only a page with something of its own (markups, the stamp block) is drawn on a pdf-lib page
// (a scratch page, removed again once its drawing is a form). A page that carries only the
// footer gets a small form written here directly: the footer's white panel and one line of
// text in the shared bold face's fonts and transparency state, so its cost is a few hundred bytes and
// no page layout.
import {
  PDFArray,
  PDFContentStream,
  PDFDict,
  PDFName,
  PDFRef,
  type PDFDocument,
  type PDFPage,
} from 'pdf-lib';
import { FOOTER, type FooterLayout } from './draw-stamp-block';
import type { Face } from './fonts-pdf';
import { displayToUser, type PageFrame } from './page-frame-pdf';

export const CARRIER_FORM = 'CPStamp';

type Box = [number, number, number, number];

function asForm(dict: PDFDict, media: Box, resources: PDFDict | undefined, doc: PDFDocument) {
  dict.set(PDFName.of('Type'), PDFName.of('XObject'));
  dict.set(PDFName.of('Subtype'), PDFName.of('Form'));
  dict.set(PDFName.of('BBox'), doc.context.obj(media));
  dict.set(PDFName.of('Resources'), resources ?? doc.context.obj({}));
}

/** What was drawn on a scratch page, as a Form XObject in that page's user space. */
export function pageForm(page: PDFPage): PDFRef {
  const ctx = page.doc.context;
  const contents = page.node.Contents();
  const refs = contents instanceof PDFArray ? contents.asArray() : contents ? [contents] : [];
  // Everything drawn on a page made with addPage goes into its one content stream.
  if (refs.length !== 1 || !(refs[0] instanceof PDFRef))
    throw new Error(`an overlay page has ${refs.length} content streams, expected one`);
  const ref = refs[0];
  const stream = ctx.lookup(ref);
  if (!(stream instanceof PDFContentStream))
    throw new Error('the overlay page content is not a content stream');
  const m = page.getMediaBox();
  asForm(stream.dict, [m.x, m.y, m.x + m.width, m.y + m.height], page.node.Resources(), page.doc);
  return ref;
}

const num = (n: number) => String(Math.round(n * 1000) / 1000);

/**
 * Footer-only forms of one return share resources (the footer face's fonts as /F0, /F1…, 0.9
 * opacity): one dictionary per set of fonts the footer text needs, usually Lato bold alone.
 */
export class FooterForms {
  private readonly resources = new Map<string, PDFRef>();
  private gs: PDFRef | null = null;

  constructor(
    private readonly doc: PDFDocument,
    private readonly face: Face,
  ) {}

  private sharedResources(fonts: number[]): PDFRef {
    const key = fonts.join(' ');
    let ref = this.resources.get(key);
    if (!ref) {
      const ctx = this.doc.context;
      this.gs ??= ctx.register(ctx.obj({ Type: 'ExtGState', ca: FOOTER.panelOpacity }));
      const named: Record<string, PDFRef> = {};
      for (const at of fonts) named[`F${at}`] = this.face.font(at).ref;
      ref = ctx.register(ctx.obj({ Font: named, ExtGState: { G: this.gs } }));
      this.resources.set(key, ref);
    }
    return ref;
  }

  /** The footer as drawFooter draws it (its text already safe), as a form for a page with `media` and `frame`. */
  form(media: Box, frame: PageFrame, layout: FooterLayout): PDFRef {
    const ctx = this.doc.context;
    const [a, b, c, d, e, f] = displayToUser(frame);
    const [r, g, bl] = FOOTER.ink;
    const { spec } = this.face;
    let x = layout.x;
    const shows: string[] = [];
    const runs = spec.runs(layout.text);
    for (const run of runs) {
      const hex = this.face.font(run.at).encodeText(run.text).toString();
      shows.push(`/F${run.at} ${FOOTER.size} Tf 1 0 0 1 ${num(x)} ${num(layout.y)} Tm ${hex} Tj`);
      x += spec.sources[run.at].width(run.text) * FOOTER.size;
    }
    const ops = [
      `q ${[a, b, c, d, e, f].map(num).join(' ')} cm`,
      `q /G gs 1 1 1 rg ${num(layout.x - 3)} ${num(layout.y - 2.5)} ${num(layout.width + 6)} ${num(FOOTER.size + 4)} re f Q`,
      `BT ${num(r)} ${num(g)} ${num(bl)} rg ${shows.join(' ')} ET`,
      'Q',
    ].join('\n');
    const stream = ctx.stream(ops, {});
    asForm(stream.dict, media, undefined, this.doc);
    const fonts = [...new Set(runs.map((run) => run.at))].sort((p, q) => p - q);
    stream.dict.set(PDFName.of('Resources'), this.sharedResources(fonts));
    return ctx.register(stream);
  }
}

/** The index page: its resources name form i as /CPStamp<i>; it has no content. */
export function indexPage(doc: PDFDocument, forms: PDFRef[]) {
  const page = doc.insertPage(0, [10, 10]);
  const xobjects: Record<string, PDFRef> = {};
  forms.forEach((ref, i) => (xobjects[`${CARRIER_FORM}${i}`] = ref));
  page.node.set(PDFName.of('Resources'), doc.context.obj({ XObject: xobjects }));
  page.node.set(PDFName.of('Contents'), doc.context.obj([]));
}
