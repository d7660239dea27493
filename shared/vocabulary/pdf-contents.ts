// The upload step's sentence on what a PDF carries besides its pages' printed content: the
// stamped return carries page content only (comments, stamps, shapes, attachments, form
// fields, links, scripts, actions and embedded files are left out), so the contractor
// flattens whatever is meant to stay before uploading. The API sends it as `notCarried`.
import type { AnnotationKind, PdfContents } from '@shared/schemas/packages';

const NOUNS: Record<AnnotationKind, [string, string]> = {
  comment: ['comment', 'comments'],
  stamp: ['stamp', 'stamps'],
  shape: ['drawn shape', 'drawn shapes'],
  attachment: ['attached file', 'attached files'],
  widget: ['form field box', 'form field boxes'],
  link: ['link', 'links'],
  media: ['sound or video', 'sounds or videos'],
  other: ['other mark', 'other marks'],
};

const count = (n: number, [one, many]: [string, string]) => `${n} ${n === 1 ? one : many}`;

/** "page 1", "pages 1 and 4", "pages 1, 2 and 4", "pages 1, 2, 3, 4, 5 and 7 more". */
export function pageList(pages: number[]): string {
  const sorted = [...new Set(pages)].sort((a, b) => a - b);
  if (sorted.length === 1) return `page ${sorted[0]}`;
  const shown = sorted.slice(0, 5);
  const more = sorted.length - shown.length;
  if (more > 0) return `pages ${shown.join(', ')} and ${more} more`;
  return `pages ${shown.slice(0, -1).join(', ')} and ${shown[shown.length - 1]}`;
}

function joinWords(parts: string[]): string {
  return parts.length < 2
    ? (parts[0] ?? '')
    : `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}

/** Each thing found, in words, or [] when the PDF carries page content only. */
function notCarriedItems(c: PdfContents): string[] {
  const items: string[] = [];
  const kinds = [...new Set(c.annotations.map((a) => a.kind))];
  for (const kind of kinds) {
    // Form field boxes are said with the fields they belong to.
    if (kind === 'widget' && c.formFields > 0) continue;
    const of = c.annotations.filter((a) => a.kind === kind);
    const n = of.reduce((sum, a) => sum + a.count, 0);
    items.push(`${count(n, NOUNS[kind])} on ${pageList(of.map((a) => a.page))}`);
  }
  if (c.javascript > 0)
    items.push(c.javascript === 1 ? 'JavaScript' : `JavaScript (${c.javascript} scripts)`);
  if (c.actions > 0) items.push(count(c.actions, ['action run on opening', 'actions run on opening']));
  if (c.embeddedFiles > 0) items.push(count(c.embeddedFiles, ['embedded file', 'embedded files']));
  if (c.formFields > 0) {
    const pages = c.annotations.filter((a) => a.kind === 'widget').map((a) => a.page);
    items.push(
      `${count(c.formFields, ['form field', 'form fields'])}${pages.length ? ` on ${pageList(pages)}` : ''}`,
    );
  }
  if (c.xfa) items.push('an XFA form');
  return items;
}

/** The whole sentence, or null when nothing would be left out. */
export function notCarriedWords(c: PdfContents | null): string | null {
  if (!c) return null;
  const items = notCarriedItems(c);
  if (!items.length) return null;
  return (
    `Found in this PDF and left out of the stamped return: ${joinWords(items)}. ` +
    'The return carries each page’s printed content only: flatten anything meant to stay into the page (print it to a new PDF) and upload that copy.'
  );
}
