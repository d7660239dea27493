// The stamp block's outline in the review workspace (issue 12 item 7): on page 1 of the plan at
// the size it prints, where the desk would put it (inside the drawing's border frame here, since
// the frame's lines fill the corners); the engineer drags it to an empty area and the placement
// is stored in page points; a drop over the plan's own text is refused in words and the outline
// goes back. Screenshots at 1440 px.
import type { APIRequestContext, Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { close, launch, screenshot, screenshotOnFailure, signedIn, unique, WAIT } from './support/browser';
import { apiAs, assign, engineerId, submittedPackage } from './support/api';

let browser: Browser;
let contractor: APIRequestContext;
let reviewer: APIRequestContext;
let engineer: APIRequestContext;
const TITLE = unique('E2E stamp placement');

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

type View = { placement: { x: number; y: number } | null; lands: { on: string; how?: string } };

describe('placing the stamp in the workspace', () => {
  it('when the engineer drags the outline to an empty area, then it is stored there; over the plan text it is refused', async () => {
    const pkg = await submittedPackage(contractor, TITLE, 2);
    await assign(reviewer, [pkg.id], await engineerId(reviewer, 'Dev Marsh'));
    const desk = await signedIn(browser, 'engineer');
    const page = desk.page;
    await page.goto(`/packages/${pkg.id}/review`);
    const outline = page.getByTestId('stamp-outline');
    await outline.waitFor({ timeout: WAIT.job });
    expect(await outline.getAttribute('data-on')).toBe('page');
    expect(await outline.textContent()).toContain('chosen by the desk');
    await page.getByText('Page 1 of 2').first().waitFor({ timeout: WAIT.job });
    await page.waitForTimeout(500);
    await screenshot(page, 'stamp-outline-desk-choice');

    const sheet = (await page.locator('[data-page="1"]').first().boundingBox())!;
    const box = (await outline.boundingBox())!;
    const s = box.width / 230;
    // The plan (842 × 595 pt, landscape) is empty between its text and the frame's lower edge.
    const target = { x: 420, y: 130 };
    const to = { x: sheet.x + target.x * s, y: sheet.y + (595 - target.y - 150) * s };
    const grip = { x: box.x + 20, y: box.y + box.height - 12 };
    const saved = page.waitForResponse(
      (r) => r.url().endsWith('/stamp-placement') && r.request().method() === 'PUT',
    );
    await page.mouse.move(grip.x, grip.y);
    await page.mouse.down();
    await page.mouse.move(grip.x + (to.x - box.x) / 2, grip.y + (to.y - box.y) / 2, { steps: 5 });
    await page.mouse.move(grip.x + (to.x - box.x), grip.y + (to.y - box.y), { steps: 5 });
    await page.mouse.up();
    expect((await saved).status()).toBe(200);
    await expect.poll(() => outline.getAttribute('data-how'), { timeout: WAIT.ui }).toBe('placed');
    const stored = (await (await engineer.get(`/api/packages/${pkg.id}/stamp-placement`)).json()) as View;
    expect(stored.placement!.x).toBeCloseTo(target.x, -1);
    expect(stored.placement!.y).toBeCloseTo(target.y, -1);
    await screenshot(page, 'stamp-outline-placed');

    // Onto the title at the top left: refused, in words, and the outline stays where it was.
    const now = (await outline.boundingBox())!;
    const title = { x: sheet.x + 40 * s, y: sheet.y + 20 * s };
    const refused = page.waitForResponse(
      (r) => r.url().endsWith('/stamp-placement') && r.request().method() === 'PUT',
    );
    await page.mouse.move(now.x + 20, now.y + 20);
    await page.mouse.down();
    await page.mouse.move(title.x + 20, title.y + 20, { steps: 8 });
    await page.mouse.up();
    expect((await refused).status()).toBe(422);
    await expect.poll(() => page.getByRole('alert').filter({ hasText: 'would cover' }).count()).toBe(1);
    expect((await outline.boundingBox())!.x).toBeCloseTo(now.x, 0);
    await screenshot(page, 'stamp-outline-refused');
    await desk.context.close();
  });
});
