// "Issue stamped return" first shows page 1 as it will print (the stamp block, a markup with its
// finding's number, the footer), drawn by pdf.js from the preview the API builds with the same
// builder; nothing is issued until the coordinator confirms. Screenshot of the dialog at 1440 px.
import type { APIRequestContext, Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '@server/db/seed/demo-accounts';
import {
  close,
  eventually,
  launch,
  screenshot,
  screenshotOnFailure,
  signedIn,
  unique,
  WAIT,
} from './support/browser';
import { apiAs, assign, engineerId, planFileId, submittedPackage } from './support/api';

let browser: Browser;
let contractor: APIRequestContext;
let reviewer: APIRequestContext;
let engineer: APIRequestContext;
const TITLE = unique('E2E issue preview');
const CONDITIONS = 'Exclusion zone fenced at 12 m from the crane; trial lift of 300 mm first.';

screenshotOnFailure();
beforeAll(async () => {
  browser = await launch();
  [contractor, reviewer, engineer] = await Promise.all([
    apiAs('contractor'),
    apiAs('reviewer'),
    apiAs('engineer'),
  ]);
});
afterAll(async () => {
  await Promise.all([contractor?.dispose(), reviewer?.dispose(), engineer?.dispose()]);
  await close(browser);
});

describe('the preview before issuing', () => {
  it('when the coordinator chooses to issue, then page 1 as it will print is shown and the return is issued only on confirmation', async () => {
    const pkg = await submittedPackage(contractor, TITLE, 2);
    await assign(reviewer, [pkg.id], await engineerId(reviewer, 'Dev Marsh'));
    const fileId = await planFileId(engineer, pkg.id);
    const cloud = await engineer.post(`/api/packages/${pkg.id}/markups`, {
      data: { fileId, pageNumber: 1, kind: 'cloud', geometry: { x: 90, y: 360, width: 200, height: 110 } },
    });
    expect(cloud.status()).toBe(201);
    const markupId = ((await cloud.json()) as { id: string }).id;
    const finding = await engineer.post(`/api/packages/${pkg.id}/findings`, {
      data: {
        text: 'Show the mats under the front outriggers.',
        severity: 'minor',
        markupId,
        fileId,
        pageNumber: 1,
      },
    });
    expect(finding.status()).toBe(201);
    const version = (
      (await (await engineer.get(`/api/packages/${pkg.id}`)).json()) as { package: { version: number } }
    ).package.version;
    const decided = await engineer.post(`/api/packages/${pkg.id}/decision`, {
      data: {
        decision: 'accepted_as_noted',
        conditions: CONDITIONS,
        password: DEMO_PASSWORD,
        baseVersion: version,
      },
    });
    expect(decided.status()).toBe(200);

    const desk = await signedIn(browser, 'reviewer');
    const page = desk.page;
    await page.goto(`/packages/${pkg.id}`);
    await page.getByRole('button', { name: 'Issue stamped return' }).click();
    const dialog = page.getByRole('dialog', { name: 'Check the stamped return before issuing' });
    const confirm = dialog.getByRole('button', { name: 'Issue as shown' });
    await expect.poll(() => confirm.isEnabled(), { timeout: WAIT.job }).toBe(true);
    // The canvas holds a drawn page: many pixels that are not white.
    const drawn = await dialog.locator('canvas').evaluate((canvas: HTMLCanvasElement) => {
      const ctx = canvas.getContext('2d')!;
      const { data } = ctx.getImageData(0, 0, canvas.width, canvas.height);
      let ink = 0;
      for (let i = 0; i < data.length; i += 16) if (data[i] < 200 || data[i + 1] < 200) ink += 1;
      return { width: canvas.width, height: canvas.height, ink };
    });
    expect(drawn.width).toBeGreaterThan(500);
    expect(drawn.height).toBeGreaterThan(300);
    expect(drawn.ink).toBeGreaterThan(2000);
    // Nothing is issued yet.
    const before = (await (await reviewer.get(`/api/packages/${pkg.id}/returns`)).json()) as {
      items: unknown[];
    };
    expect(before.items).toEqual([]);
    await screenshot(page, 'issue-preview-dialog');

    await confirm.click();
    const link = page
      .getByRole('region', { name: 'Stamped return' })
      .getByRole('link', { name: /^\/verify\// });
    await link.waitFor({ timeout: WAIT.job });
    await eventually(
      'one stamped return',
      async () => {
        const list = (await (await reviewer.get(`/api/packages/${pkg.id}/returns`)).json()) as {
          items: unknown[];
        };
        return list.items.length === 1 ? true : undefined;
      },
      WAIT.ui,
    );
    await desk.context.close();
  });
});
