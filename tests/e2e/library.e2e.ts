// The fleet library in the browser: a contractor pastes a chart, sees the preview name the bad
// cell, fixes it and saves a configuration; then picks a library configuration in the editor
// and finds the crane fields filled and read-only, for crane 2 of a lift with several cranes too;
// the engineer reads each crane's library version in the review workspace's checks tab, verifies
// a chart there, and opens the chart with the package's lift points and working range drawn.
// Screenshots land in test-output/screenshots/.
import fs from 'node:fs';
import type { APIRequestContext, APIResponse, Browser } from 'playwright-core';
import twoCranes from '@shared/engineering/examples/caution-two-cranes.json';
import { fillFromVersion, type LibraryFill } from '@shared/library/to-lift-input';
import type { VersionDetail } from '@shared/schemas/library';
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
  eventually,
  WAIT,
} from './support/browser';
import { apiAs, assign, engineerId } from './support/api';
import { liftPlanPdf } from './support/pdf';

let browser: Browser;
screenshotOnFailure();
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => close(browser));

async function ok<T>(what: string, response: Promise<APIResponse>): Promise<T> {
  const res = await response;
  if (!res.ok()) throw new Error(`${what} answered ${res.status()}: ${await res.text()}`);
  return (await res.json()) as T;
}

const m = (value: number) => ({ value, unit: 'm' as const });
const t = (value: number) => ({ value, unit: 't' as const });

/**
 * A crane of the demo contractor's fleet with one configuration, made for this test (so no other
 * test has verified its chart): an invented 60 t all-terrain, main boom 24.4 and 30.5 m.
 */
async function fleetCrane(api: APIRequestContext, fleetNumber: string, model: string) {
  const crane = await ok<{ id: string }>(
    'crane',
    api.post('/api/library/cranes', {
      data: {
        fleetNumber,
        make: 'Kestrel',
        model,
        type: 'mobile_outriggers',
        fixed: {
          carrier: { weight: t(30), cgRearOfRotation: m(-0.5) },
          upperWorks: { weight: t(22), cgBehindRotation: m(0.8) },
          boom: { weight: t(6), cgFromFoot: m(13) },
          pivotOffset: m(1.2),
          pivotHeight: m(2.8),
          outriggerSpreads: [{ name: 'full', longitudinalSpread: m(7.2), transverseSpread: m(7) }],
        },
      },
    }),
  );
  const config = await ok<{ versions: { id: string }[] }>(
    'configuration',
    api.post(`/api/library/cranes/${crane.id}/configurations`, {
      data: {
        name: 'Main boom, 18 t counterweight, full spread, 360°',
        version: {
          details: {
            workingArea: 'full_circle',
            outriggerSpread: 'full',
            counterweight: { arrangement: '18 t (slabs A–D)', weight: t(18), cgBehindRotation: m(4.2) },
            hookBlock: { name: '4-sheave 50 t block', weight: t(0.45) },
          },
          document: { title: 'Demo chart (invented)', page: '14' },
          chart: {
            units: { radius: 'm', boomLength: 'm', capacity: 't' },
            boomLengths: [24.4, 30.5],
            radii: [8, 10, 12, 14, 16, 18, 20, 22, 24],
            capacities: [
              [30, 28],
              [24, 22.5],
              [19.5, 18.2],
              [16.2, 15.1],
              [13.5, 12.6],
              [11.4, 10.7],
              [9.7, 9.1],
              [null, 7.8],
              [null, 6.6],
            ],
          },
        },
      },
    }),
  );
  return config.versions[0].id;
}

type Crane = { crane: { boomLength?: unknown; radius?: unknown }; hookBlock?: object };
/** The lift input's crane from a library version, keeping the planner's boom length and radius. */
function fromLibrary<T extends Crane>(target: T, fill: LibraryFill): T {
  return {
    ...target,
    crane: { ...fill.crane, boomLength: target.crane.boomLength, radius: target.crane.radius },
    chart: fill.chart,
    hookBlock: { ...target.hookBlock, ...fill.hookBlock },
  };
}

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
    // the preview from its units line down: the error list and the marked cell in one view
    await page.getByText('Units read:').evaluate((el) => el.scrollIntoView({ block: 'start' }));
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

  describe('several cranes', () => {
    const FLEET = `E2E-${Date.now().toString(36)}`;
    let west: string;
    let east: string;
    beforeAll(async () => {
      const api = await apiAs('contractor');
      west = await fleetCrane(api, `${FLEET}W`, 'AT-60 west (e2e, invented)');
      east = await fleetCrane(api, `${FLEET}E`, 'AT-60 east (e2e, invented)');
      await api.dispose();
    });

    it('when crane 2 of a lift with several cranes is picked from the library, then its configuration and chart fill read-only and are saved for slot 1', async () => {
      const api = await apiAs('contractor');
      const sites = (await (await api.get('/api/sites')).json()) as { items: { id: string }[] };
      const { package: pkg } = await ok<{ package: { id: string } }>(
        'create',
        api.post('/api/packages', {
          data: { title: unique('E2E library crane 2'), siteId: sites.items[0].id, plannedLiftDate: null },
        }),
      );
      const { page } = await signedIn(browser, 'contractor');
      await page.goto(`/packages/${pkg.id}/edit?step=cranes`);
      await page.getByRole('button', { name: 'Use several cranes' }).click();
      const crane2 = page.getByRole('region', { name: 'Crane 2', exact: true });
      const picker = crane2.getByRole('region', { name: 'Fleet library, crane 2' });
      await picker.getByRole('button', { name: 'Pick crane 2 from the fleet library' }).click();
      await picker.getByLabel('Fleet number, make or model').fill(`${FLEET}E`);
      const list = picker.getByRole('list', { name: 'Configurations to pick for crane 2' });
      await list.getByText(`${FLEET}E`).waitFor();
      expect(await list.getByRole('listitem').count()).toBe(1);
      await list.getByRole('button', { name: 'Use this' }).click();
      await picker.getByText('From the fleet library:').waitFor();

      const name = crane2.getByLabel('Crane (make, model, fleet number)');
      await expect.poll(() => name.inputValue()).toMatch(new RegExp(`^${FLEET}E — Kestrel AT-60 east`));
      expect(await name.isDisabled()).toBe(true);
      expect(await crane2.getByLabel('Crane type').isDisabled()).toBe(true);
      expect(await crane2.getByLabel('Boom length', { exact: true }).isDisabled()).toBe(false);
      expect(await crane2.getByLabel('Pick point x', { exact: true }).isDisabled()).toBe(false);
      const rows = crane2.getByRole('table', { name: 'Chart rows' });
      expect(await rows.getByRole('row').count()).toBe(1 + 16);
      expect(await rows.getByRole('textbox').first().isDisabled()).toBe(true);
      // crane 2's picker at the top of the window, its filled, read-only fields below it
      await picker.evaluate((el) => el.scrollIntoView({ block: 'start' }));
      await screenshot(page, 'library-pick-crane-2');
      const violations = await seriousViolations(page);
      expect(violations, describeViolations(violations)).toEqual([]);

      // stored: the use for slot 1, and crane 2's configuration in the draft (autosaved)
      const uses = await ok<{ items: { slot: number; version: { id: string } }[] }>(
        'uses',
        api.get(`/api/packages/${pkg.id}/library-uses`),
      );
      expect(uses.items.map((u) => [u.slot, u.version.id])).toEqual([[1, east]]);
      await eventually(
        'crane 2 from the library in the saved draft',
        async () => {
          const detail = await ok<{
            current: { inputs: { multiCrane?: { others: { crane?: { name?: string } }[] } } };
          }>('package', api.get(`/api/packages/${pkg.id}`));
          return detail.current.inputs.multiCrane?.others[0]?.crane?.name?.startsWith(`${FLEET}E`);
        },
        WAIT.ui,
      );

      await picker.getByRole('button', { name: 'Detach a copy to edit' }).click();
      await picker.getByText('Detached copy of').waitFor();
      expect(await name.isDisabled()).toBe(false);
      expect(await rows.getByRole('textbox').first().isDisabled()).toBe(false);
      await api.dispose();
    });

    it('when the engineer opens a two-crane package from the library, then the checks tab names each crane’s version, verifies one there, and its chart plots the lift', async () => {
      const contractor = await apiAs('contractor');
      const [w, e] = await Promise.all(
        [west, east].map((id) => ok<VersionDetail>('version', contractor.get(`/api/library/versions/${id}`))),
      );
      const base = structuredClone(twoCranes);
      const lead = fromLibrary(base, fillFromVersion(w));
      const other = fromLibrary(base.multiCrane.others[0], fillFromVersion(e));
      // crane 2 uses an edited copy: one cell differs from its library version
      const cell = other.chart.rows.find((r) => r.radius.value === 12 && r.boomLength.value === 30.5)!;
      cell.capacity = { ...cell.capacity, value: 17.5 };
      const inputs = { ...lead, multiCrane: { ...base.multiCrane, others: [other] } };

      const sites = await ok<{ items: { id: string; name: string }[] }>(
        'sites',
        contractor.get('/api/sites'),
      );
      const site = sites.items.find((x) => x.name.includes('Refinery')) ?? sites.items[0];
      const title = unique('E2E two library cranes');
      const { package: pkg } = await ok<{ package: { id: string; reference: string } }>(
        'create',
        contractor.post('/api/packages', { data: { title, siteId: site.id, plannedLiftDate: null } }),
      );
      await ok('draft', contractor.put(`/api/packages/${pkg.id}/draft`, { data: { inputs } }));
      await ok(
        'use 1',
        contractor.put(`/api/packages/${pkg.id}/library-uses`, { data: { versionId: west, slot: 0 } }),
      );
      await ok(
        'use 2',
        contractor.put(`/api/packages/${pkg.id}/library-uses`, {
          data: { versionId: east, slot: 1, detached: true },
        }),
      );
      const pdf = await liftPlanPdf(`${pkg.id}.pdf`, 2, title);
      await ok(
        'upload',
        contractor.post(`/api/packages/${pkg.id}/files`, {
          multipart: {
            kind: 'lift_plan',
            file: { name: 'plan.pdf', mimeType: 'application/pdf', buffer: fs.readFileSync(pdf) },
          },
        }),
      );
      await ok('submit', contractor.post(`/api/packages/${pkg.id}/submit`));
      await eventually(
        `${title} to be ready for review`,
        async () =>
          (await ok<{ package: { status: string } }>('package', contractor.get(`/api/packages/${pkg.id}`)))
            .package.status === 'ready_for_review',
      );
      const reviewer = await apiAs('reviewer');
      await assign(reviewer, [pkg.id], await engineerId(reviewer, 'Dev'));
      await Promise.all([contractor.dispose(), reviewer.dispose()]);

      const { page } = await signedIn(browser, 'engineer');
      await page.goto(`/packages/${pkg.id}/review`);
      const panel = page.getByRole('region', { name: 'Cranes from the fleet library' });
      await panel.waitFor();
      const uses = panel.getByTestId('library-use');
      await expect.poll(() => uses.count()).toBe(2);
      expect(await uses.nth(0).textContent()).toMatch(
        new RegExp(
          `^Crane 1: ${FLEET}W — Kestrel AT-60 west .*\\(library version 1\\)Not yet verified by this desk`,
        ),
      );
      expect(await uses.nth(1).textContent()).toContain('(library version 1, detached copy)');
      expect(await uses.nth(1).getByRole('note').textContent()).toMatch(
        /Chart edited from library version 1: 1 cell changed.*30\.51218\.217\.5/,
      );
      const verify = panel.getByRole('form', { name: 'Verify the chart of crane 2' });
      await verify.getByRole('textbox').fill('Every cell against page 14 of the demo chart (invented)');
      await verify.getByRole('button', { name: /Mark the chart verified/ }).click();
      await uses
        .nth(1)
        .getByText(/✓ Chart verified against the manufacturer's document by Dev Marsh/)
        .waitFor();
      expect(await panel.getByRole('form', { name: 'Verify the chart of crane 2' }).count()).toBe(0);
      // crane 1's chart is still the desk's to verify
      expect(await panel.getByRole('form', { name: 'Verify the chart of crane 1' }).count()).toBe(1);
      await screenshot(page, 'review-checks-library');
      let violations = await seriousViolations(page);
      expect(violations, describeViolations(violations)).toEqual([]);

      // the chart of crane 1, opened from the package: its lift point and the hook it needs
      await uses.nth(0).getByRole('link').click();
      await page.waitForURL(new RegExp(`/library/versions/${west}\\?package=${pkg.id}`));
      const capacity = page
        .getByRole('figure')
        .filter({ has: page.getByRole('img', { name: 'Rated capacity against radius' }) });
      await capacity.getByTestId('plot-mark').first().waitFor();
      expect(await capacity.getByTestId('plot-mark').count()).toBe(1);
      expect(await capacity.getByTestId('plot-mark').textContent()).toMatch(
        new RegExp(`^${pkg.reference} crane 1: [0-9.]+ t at 12 m$`),
      );
      const range = page
        .getByRole('figure')
        .filter({ has: page.getByRole('img', { name: 'Working range: hook height against radius' }) });
      // 6 m lift height + 1.4 m load height + 2.5 m rigging height = 9.9 m needed at the hook
      expect(await range.getByTestId('plot-mark').textContent()).toBe(
        `${pkg.reference} crane 1: hook needed 9.9 m`,
      );
      // the allowance is the package's block height and the site's clearance, and can be changed
      const allowance = range.getByLabel('Allowance from boom tip to hook (m)');
      expect(Number(await allowance.inputValue())).toBeGreaterThan(1.4);
      await screenshot(page, 'library-version-from-package');
      await range.evaluate((el) => el.scrollIntoView({ block: 'end' }));
      await screenshot(page, 'library-working-range');
      violations = await seriousViolations(page);
      expect(violations, describeViolations(violations)).toEqual([]);
    });
  });
});
