// The contractor's documents step, in a real browser: a PDF with comments, a stamp, JavaScript
// and a form field is uploaded, and the step says under the file, in words, what the stamped
// return will leave out. Screenshot: test-output/screenshots/documents-not-carried-1440.png.
import type { APIRequestContext, Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeActivePdf } from '../support/big-pdfs';
import { apiAs } from './support/api';
import { close, launch, screenshot, screenshotOnFailure, signedIn, unique, WAIT } from './support/browser';

let browser: Browser;
let contractor: APIRequestContext;

screenshotOnFailure();
beforeAll(async () => {
  browser = await launch();
  contractor = await apiAs('contractor');
});
afterAll(async () => {
  await contractor?.dispose();
  await close(browser);
});

describe('the documents step', () => {
  it('when a PDF with comments, a stamp, a script and a form field is uploaded, then the step says what the stamped return leaves out', async () => {
    const sites = (await (await contractor.get('/api/sites')).json()) as { items: { id: string }[] };
    const created = await contractor.post('/api/packages', {
      data: { title: unique('E2E marked-up plan'), siteId: sites.items[0].id, plannedLiftDate: null },
    });
    expect(created.status()).toBe(201);
    const id = ((await created.json()) as { package: { id: string } }).package.id;

    const { page } = await signedIn(browser, 'contractor');
    await page.goto(`/packages/${id}/edit?step=documents`);
    const uploaded = page.waitForResponse(
      (r) => /\/api\/packages\/[^/]+\/files$/.test(r.url()) && r.request().method() === 'POST',
      { timeout: WAIT.job },
    );
    await page.getByLabel('Choose the lift plan PDF').setInputFiles({
      name: 'plan-with-comments.pdf',
      mimeType: 'application/pdf',
      buffer: Buffer.from(await makeActivePdf()),
    });
    expect((await uploaded).status()).toBe(201);
    const note = page.getByRole('note', { name: 'Left out of the stamped return: plan-with-comments.pdf' });
    await note.waitFor();
    expect(await note.textContent()).toBe(
      'Found in this PDF and left out of the stamped return: 3 comments on page 1, 1 stamp on page 2, JavaScript and 1 form field on page 1. The return carries each page’s printed content only: flatten anything meant to stay into the page (print it to a new PDF) and upload that copy.',
    );
    await screenshot(page, 'documents-not-carried');
  });
});
