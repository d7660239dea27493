// Review due dates in the coordinator's queue: sorting by "Review due" puts the earliest first
// (the URL and the column header say so), and an overdue review is marked in words. The demo
// desk's packages carry due dates from their submissions (the seed runs the same rule).
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { close, launch, screenshot, screenshotOnFailure, signedIn, WAIT } from './support/browser';

let browser: Browser;

screenshotOnFailure();
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => close(browser));

describe('review due dates in the queue', () => {
  it('when the coordinator sorts by review due, then the earliest come first and overdue ones say so', async () => {
    const { page, context } = await signedIn(browser, 'reviewer');
    await page.goto('/queue');
    const header = page.getByRole('columnheader', { name: /Review due/ });
    await header.waitFor({ timeout: WAIT.ui });
    await header.getByRole('button').click();
    await page.waitForURL(/sort=reviewDue/);
    await expect.poll(() => header.getAttribute('aria-sort')).toBe('ascending');
    // The due dates down the column, read from the "Review due" cell of each row.
    const read = () =>
      page
        .locator('table')
        .first()
        .evaluate((table) => {
          const heads = Array.from(table.querySelectorAll('thead th'));
          const at = heads.findIndex((h) => /Review due/i.test(h.textContent ?? ''));
          return Array.from(table.querySelectorAll('tbody tr')).map((row) => {
            const cell = row.children[at] as HTMLElement | undefined;
            return {
              due: cell?.querySelector('time')?.getAttribute('datetime') ?? null,
              overdue: /Overdue/.test(cell?.textContent ?? ''),
            };
          });
        });
    await expect.poll(async () => (await read()).length, { timeout: WAIT.ui }).toBeGreaterThan(3);
    const rows = await read();
    const dated = rows.map((r) => r.due).filter((d): d is string => d !== null);
    expect(dated).toEqual([...dated].sort());
    // Rows without a due date (never submitted) come last.
    const firstUndated = rows.findIndex((r) => r.due === null);
    if (firstUndated >= 0) expect(rows.slice(firstUndated).every((r) => r.due === null)).toBe(true);
    const today = new Date().toISOString().slice(0, 10);
    expect(rows.some((r) => r.overdue)).toBe(true);
    for (const r of rows.filter((x) => x.overdue)) expect(r.due! < today).toBe(true);
    await screenshot(page, 'queue-review-due');
    await context.close();
  });
});
