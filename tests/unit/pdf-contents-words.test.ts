// The upload step's sentence on what the stamped return leaves out of a PDF.
import { describe, expect, it } from 'vitest';
import type { PdfContents } from '@shared/schemas/packages';
import { notCarriedWords, pageList } from '@shared/vocabulary/pdf-contents';

const none: PdfContents = {
  annotations: [],
  javascript: 0,
  actions: 0,
  embeddedFiles: 0,
  formFields: 0,
  xfa: false,
};
const TAIL =
  ' The return carries each page’s printed content only: flatten anything meant to stay into the page (print it to a new PDF) and upload that copy.';

describe('what the stamped return leaves out, in words', () => {
  it('when a PDF carries page content only, or was stored before it was inspected, then nothing is said', () => {
    expect(notCarriedWords(none)).toBeNull();
    expect(notCarriedWords(null)).toBeNull();
  });

  it('when pages are listed, then one, two, several and many read as a person writes them', () => {
    expect(pageList([3])).toBe('page 3');
    expect(pageList([4, 1])).toBe('pages 1 and 4');
    expect(pageList([1, 2, 2, 4])).toBe('pages 1, 2 and 4');
    expect(pageList([1, 2, 3, 4, 5, 6, 7, 9])).toBe('pages 1, 2, 3, 4, 5 and 3 more');
  });

  it('when everything is found, then each is named once with counts and pages, form field boxes with their fields', () => {
    const all: PdfContents = {
      annotations: [
        { kind: 'comment', page: 1, count: 2 },
        { kind: 'comment', page: 3, count: 1 },
        { kind: 'shape', page: 2, count: 1 },
        { kind: 'widget', page: 2, count: 2 },
        { kind: 'attachment', page: 4, count: 1 },
      ],
      javascript: 2,
      actions: 1,
      embeddedFiles: 1,
      formFields: 2,
      xfa: true,
    };
    expect(notCarriedWords(all)).toBe(
      'Found in this PDF and left out of the stamped return: 3 comments on pages 1 and 3, 1 drawn shape on page 2, 1 attached file on page 4, JavaScript (2 scripts), 1 action run on opening, 1 embedded file, 2 form fields on page 2 and an XFA form.' +
        TAIL,
    );
  });

  it('when form field boxes have no form behind them, then they are named as boxes', () => {
    expect(notCarriedWords({ ...none, annotations: [{ kind: 'widget', page: 5, count: 1 }] })).toBe(
      'Found in this PDF and left out of the stamped return: 1 form field box on page 5.' + TAIL,
    );
  });
});
