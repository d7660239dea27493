// Every step of the contractor's editor, filled with a two-crane lift with slings, hardware and
// stated figures (so the rigging, leg, hardware and crane tables have rows): axe finds nothing
// serious or critical, and the step reads in words (no code names or raw validation text).
import fs from 'node:fs';
import path from 'node:path';
import type { APIRequestContext, Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { STEPS } from '@shared/catalogue/lift-fields';
import {
  close,
  describeViolations,
  DESKTOP,
  launch,
  screenshot,
  screenshotOnFailure,
  seriousViolations,
  signedIn,
  unique,
} from './support/browser';
import { apiAs } from './support/api';
import { internalWords } from '../support/internal-words';

const EXAMPLES = path.join(process.cwd(), 'shared', 'engineering', 'examples');
const example = (name: string) =>
  JSON.parse(fs.readFileSync(path.join(EXAMPLES, `${name}.json`), 'utf8')) as Record<string, unknown>;

let browser: Browser;
let contractor: APIRequestContext;
let draftId = '';

screenshotOnFailure();
beforeAll(async () => {
  browser = await launch();
  contractor = await apiAs('contractor');
  const sites = (await (await contractor.get('/api/sites')).json()) as { items: { id: string }[] };
  const created = await contractor.post('/api/packages', {
    data: { title: unique('E2E editor steps'), siteId: sites.items[0].id, plannedLiftDate: null },
  });
  draftId = ((await created.json()) as { package: { id: string } }).package.id;
  const { title: _title, ...inputs }: Record<string, unknown> = {
    ...example('caution-two-cranes'),
    stated: example('caution-discrepancies').stated,
  };
  const saved = await contractor.put(`/api/packages/${draftId}/draft`, { data: { inputs } });
  expect(saved.status(), await saved.text()).toBe(200);
});
afterAll(async () => {
  await contractor?.dispose();
  await close(browser);
});

describe('the editor, step by step', () => {
  it('when each step of a filled two-crane lift is open, then axe finds nothing serious or critical and the step reads in words', async () => {
    const { page, context } = await signedIn(browser, 'contractor');
    await page.setViewportSize(DESKTOP);
    const problems: string[] = [];
    for (const [i, step] of STEPS.entries()) {
      await page.goto(`/packages/${draftId}/edit?step=${step.id}`);
      await page.getByRole('heading', { name: `${i + 1}. ${step.title}` }).waitFor();
      await page.evaluate(() => document.fonts.ready.then(() => undefined));
      await screenshot(page, `editor-step-${step.id}`);
      const violations = await seriousViolations(page);
      if (violations.length) problems.push(`${step.id}:\n${describeViolations(violations)}`);
      const leaks = internalWords(await page.locator('main').innerText());
      if (leaks.length) problems.push(`${step.id}: ${leaks.join(', ')}`);
    }
    expect(problems.join('\n')).toBe('');
    await context.close();
  });
});
