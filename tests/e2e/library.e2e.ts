// The fleet library in the browser: a contractor pastes a chart, sees the preview name the bad
// cell, fixes it and saves a configuration; then picks a library configuration in the editor
// and finds the crane fields filled and read-only. Screenshots land in test-output/screenshots/.
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  close,
  describeViolations,
  launch,
  screenshot,
  screenshotOnFailure,
  seriousViolations,
  signedIn,
  unique,
} from './support/browser';
import { apiAs } from './support/api';
import { liftPlanPdf } from './support/pdf';

let browser: Browser;
screenshotOnFailure();
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => close(browser));

describe('fleet library', () => {
  it('when a pasted chart has a bad cell, then the preview names it, and once fixed the configuration is saved', async () => {
    const { page } = await signedIn(browser, 'contractor');
    await page.goto('/library');
    await page.getByRole('heading', { level: 1, name: 'Fleet library' }).waitFor();
    await page.getByRole('link', { name: 'BW-07' }).waitFor();
    await screenshot(page, 'library-fleet');
    let violations = await seriousViolations(page);
    expect(violations, describeViolations(violations)).toEqual([]);
    await page.getByRole('link', { name: 'BW-07' }).click();
    await page.getByRole('button', { name: '+ New configuration' }).click();
    const paste = page.getByLabel('Paste the chart cells');
    await paste.fill('radius (m) / boom (m) / capacity (t)\t20\t30\n4\t40\t33\n6\tabc\t25\n8\t20\t18');
    await page.getByRole('button', { name: 'Read the pasted cells' }).click();
    const errors = page.getByRole('alert').filter({ hasText: 'error' });
    await errors.waitFor();
    expect(await errors.textContent()).toContain('B3: "abc" is not a number');
    expect(await page.locator('td[data-ref="B3"]').textContent()).toContain('✕ error');
    await screenshot(page, 'library-import-preview');
    violations = await seriousViolations(page);
    expect(violations, describeViolations(violations)).toEqual([]);
    await paste.fill('radius (m) / boom (m) / capacity (t)\t20\t30\n4\t40\t33\n6\t30\t25\n8\t20\t18');
    await page.getByRole('button', { name: 'Read the pasted cells' }).click();
    await page.getByRole('button', { name: 'Use this chart' }).click();
    await page.getByLabel(/Configuration name/).fill(unique('E2E main boom'));
    await page.getByLabel('Document title').fill('Demo chart (invented)');
    await page.getByRole('button', { name: 'Save the configuration' }).click();
    await page.getByRole('heading', { name: /^Version 1/ }).waitFor();
    await page.getByRole('img', { name: 'Rated capacity against radius' }).waitFor();
    await page
      .getByLabel("Manufacturer's document (PDF)")
      .setInputFiles(await liftPlanPdf('chart.pdf', 2, 'Demo chart'));
    await page.getByRole('button', { name: 'Attach the PDF' }).click();
    await page.getByRole('link', { name: 'open the PDF (2 pages)' }).waitFor();
    await screenshot(page, 'library-configuration');
    violations = await seriousViolations(page);
    expect(violations, describeViolations(violations)).toEqual([]);
  });

  it('when the planner picks from the library in the editor, then the crane fields fill and are read-only', async () => {
    const api = await apiAs('contractor');
    const sites = (await (await api.get('/api/sites')).json()) as { items: { id: string }[] };
    const created = await api.post('/api/packages', {
      data: { title: unique('E2E library pick'), siteId: sites.items[0].id, plannedLiftDate: null },
    });
    const id = ((await created.json()) as { package: { id: string } }).package.id;
    await api.dispose();
    const { page } = await signedIn(browser, 'contractor');
    await page.goto(`/packages/${id}/edit?step=crane`);
    await page.getByRole('button', { name: 'Pick from the fleet library' }).click();
    await page.getByLabel('Fleet number, make or model').fill('BW-07');
    await page.getByLabel('Planned radius').fill('12');
    const list = page.getByRole('list', { name: 'Configurations to pick' });
    await list
      .getByText(/rates .* t at that radius/)
      .first()
      .waitFor();
    await list.getByRole('button', { name: 'Use this' }).first().click();
    await page.getByText('From the fleet library:').waitFor();
    const name = page.getByLabel('Crane (make, model, fleet number)');
    await expect.poll(() => name.inputValue()).toMatch(/^BW-07 — Kestrel/);
    expect(await name.isDisabled()).toBe(true);
    expect(await page.getByLabel('Boom length', { exact: true }).isDisabled()).toBe(false);
    await screenshot(page, 'library-pick-step');
    const violations = await seriousViolations(page);
    expect(violations, describeViolations(violations)).toEqual([]);
    await page.getByRole('button', { name: 'Detach a copy to edit' }).click();
    await page.getByText('Detached copy of').waitFor();
    expect(await name.isDisabled()).toBe(false);
  });
});
