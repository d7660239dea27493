// A PDF the stamped return cannot be made from is refused at upload, naming the file and what
// is wrong in words, with nothing stored: damaged object streams (the catalog and page tree
// cannot be read) and a page whose content cannot be decoded. A file that readers repair by
// themselves (a wrong cross-reference offset) is taken. PDFs made in the test.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../support/app';
import { internalWords } from '../support/internal-words';
import { makeBrokenPdf } from '../support/pdfs';
import { storedObjects } from '../support/s3';
import { desk } from '../support/review-desk';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

async function draft() {
  const d = await desk(t);
  const created = await d.contractor
    .post('/api/packages')
    .send({ title: 'Damaged plans', siteId: d.w.site.id, plannedLiftDate: '2027-03-14' });
  return { ...d, id: created.body.package.id as string, revisionId: created.body.current.id as string };
}

function storedFiles(revisionId: string): Promise<string[]> {
  return storedObjects(t.ctx.config, `revisions/${revisionId}/`);
}

describe('uploads the stamped return cannot be made from', () => {
  const cases = [
    {
      kind: 'object-streams' as const,
      name: 'crane-plan-damaged-objects.pdf',
      why: 'its internal structure is damaged (the objects that hold its pages cannot be read)',
    },
    {
      kind: 'page-content' as const,
      name: 'crane-plan-damaged-page.pdf',
      why: 'page 1 cannot be read (its content is damaged)',
    },
  ];
  for (const c of cases) {
    it(`when a PDF with ${c.kind === 'object-streams' ? 'damaged object streams' : 'an unreadable page'} is uploaded, then 422 names the file and what is wrong, and nothing is stored`, async () => {
      const d = await draft();
      const res = await d.contractor
        .post(`/api/packages/${d.id}/files`)
        .field('kind', 'lift_plan')
        .attach('file', Buffer.from(await makeBrokenPdf(c.kind)), c.name);
      expect(res.status).toBe(422);
      expect(res.body.error.code).toBe('unsanitisable_pdf');
      expect(res.body.error.message).toBe(
        `The file “${c.name}” cannot be made into a stamped return: ${c.why}. Open it in a PDF program, save or print it as a new PDF, and upload that copy.`,
      );
      expect(res.body.error.fields).toEqual([
        { path: 'file', message: `File “${c.name}” cannot be made into a stamped return: ${c.why}` },
      ]);
      // Words only: no object numbers, no qpdf or zlib wording.
      expect(res.body.error.message).not.toMatch(/\d+ 0 R|object \d|inflate|qpdf|offset/);
      expect(internalWords(res.body.error.message)).toEqual([]);
      const rows = await t.ctx.dataSource.query(`SELECT 1 FROM uploaded_files WHERE revision_id = $1`, [
        d.revisionId,
      ]);
      expect(rows).toEqual([]);
      expect(await storedFiles(d.revisionId)).toEqual([]);
    });
  }

  it('when a PDF only needs its cross-reference table rebuilt, then it is taken', async () => {
    const d = await draft();
    const res = await d.contractor
      .post(`/api/packages/${d.id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', Buffer.from(await makeBrokenPdf('repairable')), 'crane-plan-old-scanner.pdf');
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ originalName: 'crane-plan-old-scanner.pdf', pages: 2 });
  });
});
