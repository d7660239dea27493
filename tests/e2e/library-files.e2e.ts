// The fleet library's chart files in the browser: a contractor chooses an .xlsx made here (a formula
// among its cells) and a CSV with a duplicate radius; the preview shows how each cell was read, the
// header's units, the formula's stored value and the error by cell; nothing is stored until the
// chart is accepted. Then the contractor opens a demo package built from the library and follows
// its crane to the configuration page, which plots the package's lift point.
// Screenshots land in test-output/screenshots/.
import ExcelJS from 'exceljs';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  close,
  describeViolations,
  launch,
  query,
  screenshot,
  screenshotOnFailure,
  seriousViolations,
  signedIn,
  unique,
} from './support/browser';
import { apiAs } from './support/api';

let browser: Browser;
screenshotOnFailure();
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => close(browser));

async function chartWorkbook(): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet('Main boom');
  ws.addRow(['radius (m) / boom (m) / capacity (t)', 18, 30, 42]);
  ws.addRow([6, 62, 55, null]);
  ws.addRow([8, 48, { formula: 'B3*0.9', result: 43.2 }, 38]);
  ws.addRow([10, 39, 35.5, 31]);
  ws.addRow([12, 32, 29.4, 26]);
  ws.addRow([14, null, 24.6, 22]);
  return Buffer.from(await wb.xlsx.writeBuffer());
}

/** Rows of the contractor's configurations named so (what is stored, read from the app's database). */
const configurationsNamed = (name: string) =>
  query<{ n: number }>(`SELECT count(*)::int AS n FROM library_configurations WHERE name = $1`, [name]);

describe('fleet library files', () => {
  it('when an .xlsx and a CSV are chosen, then the preview shows each cell, the units and the problems by cell, and nothing is stored until accepted', async () => {
    const name = unique('E2E crawler chart from a workbook');
    const { page } = await signedIn(browser, 'contractor');
    await page.goto('/library');
    await page.getByRole('link', { name: 'BW-12' }).click();
    await page.getByRole('button', { name: '+ New configuration' }).click();
    const file = page.getByLabel('Or choose a CSV or .xlsx file');

    // A CSV with radius 8 m listed twice: the error names the cell and the one before it.
    await file.setInputFiles({
      name: 'bw12-duplicate.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from('radius (m) / boom (m) / capacity (t),18,30\n6,62,55\n8,48,43\n8,47,42\n'),
    });
    await page.getByRole('button', { name: 'Read the file' }).click();
    const errors = page.getByRole('alert').filter({ hasText: 'error' });
    await errors.waitFor();
    expect(await errors.textContent()).toContain('A4: duplicate radius 8: A3 lists it already');
    expect(await page.locator('td[data-ref="A4"]').textContent()).toContain('✕ error');
    expect(await page.getByRole('button', { name: 'Use this chart' }).isDisabled()).toBe(true);
    // beside the save button: no chart is accepted yet, and how to accept one
    expect(await page.getByTestId('chart-not-accepted').textContent()).toContain('No chart accepted yet');
    await page.getByText('Units read:').evaluate((el) => el.scrollIntoView({ block: 'start' }));
    await screenshot(page, 'library-import-csv-error');

    await file.setInputFiles({
      name: 'bw12-main-boom.xlsx',
      mimeType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
      buffer: await chartWorkbook(),
    });
    await page.getByRole('button', { name: 'Read the file' }).click();
    // The CSV's preview read the same units header: wait for what only the workbook's preview says.
    await page.getByText('C3: holds a formula; its stored value 43.2 was read').waitFor();
    await page.getByText('radius in m (from A1); boom in m (from A1); capacity in t (from A1)').waitFor();
    expect(await page.getByRole('alert').filter({ hasText: 'error' }).count()).toBe(0);
    expect(await page.getByText('C3: holds a formula; its stored value 43.2 was read').count()).toBe(1);
    const formulaCell = page.locator('td[data-ref="C3"]');
    expect(await formulaCell.textContent()).toContain('43.2 t');
    expect(await formulaCell.textContent()).toContain('! check');
    expect(await page.locator('td[data-ref="D2"]').textContent()).toContain('blank');
    expect(await page.getByText('· 13 rated cells').count()).toBe(1);
    await page.getByText('Units read:').evaluate((el) => el.scrollIntoView({ block: 'start' }));
    await screenshot(page, 'library-import-xlsx-preview');
    let violations = await seriousViolations(page);
    expect(violations, describeViolations(violations)).toEqual([]);
    expect((await configurationsNamed(name))[0].n).toBe(0);

    await page.getByRole('button', { name: 'Use this chart' }).click();
    expect(await page.getByTestId('chart-not-accepted').count()).toBe(0);
    await page.getByLabel(/Configuration name/).fill(name);
    await page.getByLabel('Document title').fill('Demo chart (invented)');
    expect((await configurationsNamed(name))[0].n).toBe(0);
    await page.getByRole('button', { name: 'Save the configuration' }).click();
    await page.getByRole('heading', { name: /^Version 1/ }).waitFor();
    await page.getByRole('img', { name: 'Rated capacity against radius' }).waitFor();
    expect((await configurationsNamed(name))[0].n).toBe(1);
    const table = page.getByRole('table', { name: 'Load chart, version 1' });
    expect(await table.textContent()).toContain('43.2');
    violations = await seriousViolations(page);
    expect(violations, describeViolations(violations)).toEqual([]);
  });

  it('when the contractor follows a demo package’s library crane, then the configuration page shows the version it uses with its lift point', async () => {
    const api = await apiAs('contractor');
    const list = (await (await api.get('/api/packages?q=air%20cooler')).json()) as {
      items: { id: string; reference: string; title: string }[];
    };
    await api.dispose();
    const pkg = list.items.find((p) => p.title === 'Set air cooler fan deck, bay 4');
    expect(pkg, 'the demo package built from the library').toBeDefined();
    const { page } = await signedIn(browser, 'contractor');
    await page.goto(`/packages/${pkg!.id}`);
    const panel = page.getByRole('region', { name: 'Cranes from the fleet library' });
    expect(await panel.textContent()).toContain(
      "✓ Chart verified against the manufacturer's document by Dev Marsh, PE",
    );
    await panel.getByRole('link', { name: /BW-07 — Kestrel AT-60/ }).click();
    await page.waitForURL(/\/library\/configurations\/[0-9a-f-]+\?package=/);
    const note = page.getByTestId('from-package');
    await note.getByText(/its crane uses version 1\./).waitFor();
    const capacity = page
      .getByRole('figure')
      .filter({ has: page.getByRole('img', { name: 'Rated capacity against radius' }) });
    await capacity.getByTestId('plot-mark').first().waitFor();
    expect(await capacity.getByTestId('plot-mark').textContent()).toMatch(
      new RegExp(`^${pkg!.reference}: [0-9.]+ t at 12 m$`),
    );
    expect(await page.getByRole('button', { name: /Version 1/ }).textContent()).toContain(
      `used by ${pkg!.reference}`,
    );
    await capacity.scrollIntoViewIfNeeded();
    await screenshot(page, 'library-configuration-from-package');
    const violations = await seriousViolations(page);
    expect(violations, describeViolations(violations)).toEqual([]);
  });
});
