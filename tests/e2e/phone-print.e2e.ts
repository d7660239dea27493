// Site staff on a phone (390 px; here the site's coordinator): the package page of a returned package and its stamped
// return's panel fit the screen (no sideways scroll; the conditions readable), the menu folds
// into a bar. On paper: the package page prints without the rail, the menu or any control,
// and keeps the caution (print media, and a PDF printed by Chromium read back by pdftotext).
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { close, launch, PEOPLE, query, screenshot, screenshotOnFailure, signedIn } from './support/browser';
import { pdfPages, pdfText } from './support/pdf';

const PHONE = { width: 390, height: 844 };
let browser: Browser;
let returned: { id: string; reference: string; conditions: string | null };

screenshotOnFailure();
beforeAll(async () => {
  browser = await launch();
  [returned] = await query<{ id: string; reference: string; conditions: string | null }>(
    `SELECT p.id, p.reference, d.conditions FROM lift_packages p
       JOIN decisions d ON d.package_id = p.id
       JOIN site_members sm ON sm.site_id = p.site_id
       JOIN users u ON u.id = sm.user_id AND u.email = $1
      WHERE p.status = 'returned' AND d.conditions <> ''
      ORDER BY p.reference LIMIT 1`,
    [PEOPLE.reviewer],
  );
});
afterAll(async () => close(browser));

/** Elements wider than the screen that make the page scroll sideways. */
function overflow() {
  const width = document.documentElement.clientWidth;
  const wide: string[] = [];
  for (const el of Array.from(document.querySelectorAll<HTMLElement>('body *'))) {
    const r = el.getBoundingClientRect();
    if (r.width === 0) continue;
    if (r.right > width + 1) {
      // Inside a box that scrolls on its own it does not move the page.
      let p = el.parentElement;
      let scrolls = false;
      while (p) {
        const o = getComputedStyle(p).overflowX;
        if (o === 'auto' || o === 'scroll' || o === 'hidden') scrolls = true;
        p = p.parentElement;
      }
      if (!scrolls)
        wide.push(
          `${el.tagName.toLowerCase()}.${el.className.split(' ').slice(0, 3).join('.')} → ${Math.round(r.right)} px`,
        );
    }
  }
  return { scroll: document.documentElement.scrollWidth, width, wide: wide.slice(0, 8) };
}

describe('phone and print', () => {
  it('when a returned package opens on a phone, then nothing scrolls sideways and the conditions are readable', async () => {
    const { page, context } = await signedIn(browser, 'reviewer');
    await page.setViewportSize(PHONE);
    await page.goto(`/packages/${returned.id}`);
    await page
      .getByRole('link', { name: /Open the stamped PDF/ })
      .first()
      .waitFor();
    await page.evaluate(() => document.fonts.ready.then(() => undefined));
    const measured = await page.evaluate(overflow);
    expect(measured.wide, JSON.stringify(measured)).toEqual([]);
    expect(measured.scroll).toBeLessThanOrEqual(measured.width);
    if (returned.conditions) {
      const first = returned.conditions.split(/\s+/).slice(0, 4).join(' ');
      await expect(page.getByText(first, { exact: false }).first().isVisible()).resolves.toBe(true);
    }
    // The rail is a bar with a menu.
    await expect(page.getByRole('navigation', { name: 'Main' }).count()).resolves.toBe(0);
    await page.getByRole('button', { name: 'Menu' }).click();
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link').first().waitFor();
    await screenshot(page, 'package-phone-menu');
    await page.getByRole('button', { name: 'Close menu' }).click();
    await screenshot(page, 'package-phone');
    await context.close();
  });

  it('when the package page is printed, then only its content and the caution are on paper', async () => {
    const { page, context } = await signedIn(browser, 'reviewer');
    await page.goto(`/packages/${returned.id}`);
    await page
      .getByRole('link', { name: /Open the stamped PDF/ })
      .first()
      .waitFor();
    await page.emulateMedia({ media: 'print' });
    await expect(page.getByRole('navigation', { name: 'Main' }).isVisible()).resolves.toBe(false);
    await expect(page.getByRole('button', { name: 'Sign out' }).isVisible()).resolves.toBe(false);
    await expect(page.getByRole('link', { name: 'Open pages' }).isVisible()).resolves.toBe(false);
    await screenshot(page, 'package-print');
    const pdf = await page.pdf({ format: 'A4', printBackground: true });
    const text = pdfText(pdf).replace(/\s+/g, ' ');
    expect(text).toContain(returned.reference);
    expect(text).toContain('Caution.');
    expect(text).not.toContain('Sign out');
    expect(text).not.toContain('Skip to content');
    expect(pdfPages(pdf)).toBeGreaterThanOrEqual(1);
    await context.close();
  });
});
