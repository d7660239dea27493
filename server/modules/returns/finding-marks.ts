// Ties the findings of the calculation sheet to the markups drawn on the pages: each finding is
// numbered as the sheet lists it ("F3"), a markup carries the numbers of the findings tied to it,
// and a finding names the page of the return and the markup it is tied to, in words.
import { MARKUP_KIND_LABELS, type MarkupKind } from '@shared/vocabulary/markups';

interface FileLike {
  id: string;
  pages: number;
  originalName: string;
}
interface MarkupLike {
  id: string;
  fileId: string;
  pageNumber: number;
  kind: MarkupKind;
  number: number | null;
}
interface FindingLike {
  markupId: string | null;
}

export const findingLabel = (index: number) => `F${index + 1}`;

/** The page of the return a page of one of the documents becomes (documents in the files' order). */
export function returnPage(files: FileLike[], fileId: string, pageNumber: number): number | null {
  let before = 0;
  for (const f of files) {
    if (f.id === fileId) return before + pageNumber;
    before += f.pages;
  }
  return null;
}

/** The labels of the findings tied to each markup, in the sheet's order. */
export function findingsByMarkup(findings: FindingLike[]): Map<string, string[]> {
  const out = new Map<string, string[]>();
  findings.forEach((f, i) => {
    if (!f.markupId) return;
    out.set(f.markupId, [...(out.get(f.markupId) ?? []), findingLabel(i)]);
  });
  return out;
}

/** The page of the return (without a cover sheet) a finding's markup is on. */
export function markupReturnPage(files: FileLike[], markups: MarkupLike[], markupId: string | null) {
  const mk = markupId ? markups.find((m) => m.id === markupId) : undefined;
  return mk ? returnPage(files, mk.fileId, mk.pageNumber) : null;
}

/** "Page 3 of the return (plan.pdf, page 1), cloud marked F2": where a finding's markup is. */
export function markupPlace(
  files: FileLike[],
  markups: MarkupLike[],
  markupId: string | null,
  label: string,
): string | null {
  const mk = markupId ? markups.find((m) => m.id === markupId) : undefined;
  if (!mk) return null;
  const file = files.find((f) => f.id === mk.fileId);
  const page = returnPage(files, mk.fileId, mk.pageNumber);
  const kind = MARKUP_KIND_LABELS[mk.kind].toLowerCase();
  const pin = mk.kind === 'pin' && mk.number != null ? ` ${mk.number}` : '';
  const where = page
    ? `Page ${page} of the return${file ? ` (${file.originalName}, page ${mk.pageNumber})` : ''}`
    : `Page ${mk.pageNumber}`;
  return `${where}, ${kind}${pin} marked ${label}`;
}
