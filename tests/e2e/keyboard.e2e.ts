// The coordinator's queue and the engineer's workspace without a mouse: every step below is
// page.keyboard only, from the search box to an assignment, and from page to page and
// finding to finding. The packages are made through the API; the keys are the subject.
import type { APIRequestContext, Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { close, launch, screenshotOnFailure, signedIn, unique, WAIT } from './support/browser';
import { addFinding, apiAs, assign, engineerId, planFileId, submittedPackage } from './support/api';

let browser: Browser;
let contractor: APIRequestContext;
let reviewer: APIRequestContext;
let engineer: APIRequestContext;
const TAG = unique('E2E keys');
const packages: { id: string; reference: string }[] = [];

screenshotOnFailure();
beforeAll(async () => {
  browser = await launch();
  contractor = await apiAs('contractor');
  reviewer = await apiAs('reviewer');
  engineer = await apiAs('engineer');
  // Two at once: the worker runs two checks side by side.
  packages.push(
    ...(await Promise.all([
      submittedPackage(contractor, `${TAG} valve skid A`),
      submittedPackage(contractor, `${TAG} valve skid B`),
    ])),
  );
});
afterAll(async () => {
  await Promise.all([contractor?.dispose(), reviewer?.dispose(), engineer?.dispose()]);
  await close(browser);
});

/** Tab (or Shift+Tab) until the focused element matches, as a keyboard user would. */
async function tabTo(page: Page, matches: string, backwards = false, limit = 80) {
  for (let i = 0; i < limit; i++) {
    if (await page.evaluate((sel) => document.activeElement?.matches(sel) ?? false, matches)) return;
    await page.keyboard.press(backwards ? 'Shift+Tab' : 'Tab');
  }
  throw new Error(`no element matching ${matches} within ${limit} presses of Tab`);
}

const focusedText = (page: Page) => page.evaluate(() => document.activeElement?.textContent ?? '');

describe('keyboard only', () => {
  it('when the coordinator searches, moves, selects both rows and assigns with keys, then both packages go to the engineer', async () => {
    const { context, page } = await signedIn(browser, 'reviewer');
    await page.goto('/queue');
    await page.getByRole('searchbox').waitFor();
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    await page.keyboard.press('/');
    await expect(page.evaluate(() => document.activeElement?.getAttribute('type'))).resolves.toBe('search');
    await page.keyboard.type(TAG);
    await page.keyboard.press('Enter');
    const rows = page.getByRole('row').filter({ hasText: TAG });
    await expect.poll(() => rows.count(), { timeout: WAIT.ui }).toBe(2);

    // Into the table: the active row takes the focus; j and k (or the arrows) move it.
    await tabTo(page, 'tbody tr');
    const first = await focusedText(page);
    await page.keyboard.press('j');
    const second = await focusedText(page);
    expect(second).not.toBe(first);
    await page.keyboard.press('k');
    await expect(focusedText(page)).resolves.toBe(first);
    await page.keyboard.press('ArrowDown');
    await expect(focusedText(page)).resolves.toBe(second);
    await page.keyboard.press('x');
    await page.keyboard.press('ArrowUp');
    await page.keyboard.press('x');
    const bar = page.getByRole('region', { name: 'Selected packages' });
    await bar.getByText('2 packages selected').waitFor();

    // Back up to the bar above the table, choose the engineer by typing, assign.
    await tabTo(page, '[aria-label="Selected packages"] select', true);
    await page.keyboard.type('Dev');
    await expect(bar.getByLabel('Assign to').locator('option:checked').textContent()).resolves.toMatch(
      /^Dev Marsh/,
    );
    await page.keyboard.press('Tab');
    await expect(focusedText(page)).resolves.toBe('Assign');
    await page.keyboard.press('Enter');
    await bar.getByText(/Dev Marsh, PE is now the engineer of record for 2 packages/).waitFor();
    for (const p of packages)
      await expect(page.getByRole('row').filter({ hasText: p.reference }).textContent()).resolves.toContain(
        'Dev Marsh',
      );

    // Enter on a row opens its package.
    await tabTo(page, 'tbody tr');
    const opened = await focusedText(page);
    await page.keyboard.press('Enter');
    await page.waitForURL(/\/packages\/[0-9a-f-]+$/);
    const reference = packages.find((p) => opened.includes(p.reference))!.reference;
    await page.getByRole('region', { name: 'Package summary' }).getByText(reference).waitFor();
    await context.close();
  });

  it('when the engineer pages through the plan and steps through the findings with keys, then the page and the finding follow', async () => {
    const [pkg] = packages;
    await assign(reviewer, [pkg.id], await engineerId(reviewer, 'Dev Marsh'));
    const fileId = await planFileId(engineer, pkg.id);
    await addFinding(engineer, pkg.id, {
      text: 'Finding on sheet two: state the mat size.',
      severity: 'minor',
      fileId,
      pageNumber: 2,
    });
    await addFinding(engineer, pkg.id, {
      text: 'Finding on sheet three: show the exclusion zone.',
      severity: 'major',
      fileId,
      pageNumber: 3,
    });

    const { context, page } = await signedIn(browser, 'engineer');
    await page.goto(`/packages/${pkg.id}/review`);
    await page.getByText('Page 1 of 3').waitFor({ timeout: WAIT.job });
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());

    await page.keyboard.press('PageDown');
    await page.getByText('Page 2 of 3').waitFor();
    await page.keyboard.press(']');
    await page.getByText('Page 3 of 3').waitFor();
    await page.keyboard.press('PageUp');
    await page.getByText('Page 2 of 3').waitFor();
    await page.keyboard.press('[');
    await page.getByText('Page 1 of 3').waitFor();

    // n opens the next finding, and its page; p goes back.
    await page.keyboard.press('n');
    const current = page.locator('[data-testid="finding"] button[aria-current="true"]');
    await current.filter({ hasText: 'sheet two' }).waitFor();
    await page.getByText('Page 2 of 3').waitFor();
    await page.keyboard.press('n');
    await current.filter({ hasText: 'sheet three' }).waitFor();
    await page.getByText('Page 3 of 3').waitFor();
    await page.keyboard.press('p');
    await current.filter({ hasText: 'sheet two' }).waitFor();
    await page.getByText('Page 2 of 3').waitFor();

    // A markup tool by its number key, and Escape drops it.
    await page.keyboard.press('2');
    const boxTool = page.getByRole('toolbar', { name: 'Markup tools' }).getByRole('button', { name: /Box/ });
    await expect(boxTool.getAttribute('aria-pressed')).resolves.toBe('true');
    await page.keyboard.press('Escape');
    await expect(boxTool.getAttribute('aria-pressed')).resolves.toBe('false');
    await context.close();
  });
});
