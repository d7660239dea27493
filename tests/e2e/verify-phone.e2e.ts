// The verification page on a phone: an acceptance over an open Major finding, recorded in the
// workspace through the decision gate (screenshot at 1440 px), issued, then opened at 390 px
// wide as someone on site would — the conditions and the override reason readable, nothing
// wider than the screen (no sideways scroll). The package is made through the API.
import type { APIRequestContext, Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '@server/db/seed/demo-accounts';
import {
  close,
  env,
  eventually,
  launch,
  screenshot,
  screenshotOnFailure,
  signedIn,
  unique,
  WAIT,
} from './support/browser';
import { addFinding, apiAs, assign, engineerId, submittedPackage } from './support/api';
import { internalWords } from '../support/internal-words';

let browser: Browser;
let contractor: APIRequestContext;
let reviewer: APIRequestContext;
let engineer: APIRequestContext;
const TITLE = unique('E2E phone verify');
const CONDITIONS =
  'Mats of 1.2 m × 6 m under every outrigger; a banksman at the gatehouse road; stop the lift above 9 m/s gusts at the boom tip.';
const OVERRIDE =
  'The Major findings are answered in the method statement rev C (sheet 4 and the ground report GR-114); checked by hand, the lift may go ahead.';

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

describe('verification on a phone', () => {
  it('when an acceptance over open Major findings is issued, then /verify at 390 px shows the conditions and the override reason without sideways scroll', async () => {
    const pkg = await submittedPackage(contractor, TITLE, 2);
    await assign(reviewer, [pkg.id], await engineerId(reviewer, 'Dev Marsh'));
    await addFinding(engineer, pkg.id, {
      text: 'The exclusion zone on sheet 2 does not cover the swing of the counterweight.',
      severity: 'major',
    });
    await addFinding(engineer, pkg.id, {
      text: 'No ground bearing report is attached for the outrigger positions.',
      severity: 'blocking',
    });

    // The engineer decides in the workspace: the gate lists both findings in words.
    const desk = await signedIn(browser, 'engineer');
    const page = desk.page;
    await page.goto(`/packages/${pkg.id}/review`);
    await page.getByRole('tab', { name: /Decision/ }).click();
    await page.getByRole('radio', { name: /Accepted as noted/ }).check();
    await page.getByLabel(/^Conditions/).fill(CONDITIONS);
    await page.getByRole('button', { name: 'Record the decision' }).click();
    const gate = page.getByRole('dialog', { name: 'Accepted as noted over what stands against it' });
    const items = gate.getByTestId('decision-blockers').getByRole('listitem');
    await expect.poll(() => items.count(), { timeout: WAIT.ui }).toBeGreaterThanOrEqual(2);
    const listed = await gate.getByTestId('decision-blockers').innerText();
    expect(listed).toContain('Major finding not closed');
    expect(listed).toContain('Blocking finding not closed');
    expect(internalWords(listed)).toEqual([]);
    // Without a reason it does not go ahead.
    await gate.getByLabel(/^Your password/).fill(DEMO_PASSWORD);
    await gate.getByRole('button', { name: 'Override and record Accepted as noted' }).click();
    await gate.getByText(/Write why the lift may go ahead/).waitFor();
    await gate.getByLabel(/^Override reason/).fill(OVERRIDE);
    await gate.getByLabel(/^Your password/).fill(DEMO_PASSWORD);
    await screenshot(page, 'decision-gate-two-findings');
    await gate.getByRole('button', { name: 'Override and record Accepted as noted' }).click();
    await page.getByRole('status').filter({ hasText: 'Recorded: Accepted as noted' }).waitFor();
    await desk.context.close();

    const issued = await reviewer.post(`/api/packages/${pkg.id}/returns`);
    expect(issued.status()).toBe(202);
    const returnId = ((await issued.json()) as { id: string }).id;
    const code = await eventually(
      'the stamped return to be ready',
      async () => {
        const list = (await (await reviewer.get(`/api/packages/${pkg.id}/returns`)).json()) as {
          items: { id: string; state: string; verificationCode: string }[];
        };
        const ret = list.items.find((r) => r.id === returnId);
        return ret?.state === 'ready' ? ret.verificationCode : undefined;
      },
      WAIT.job,
    );

    // Someone on site, not signed in, on a phone.
    const phone = await browser.newContext({
      baseURL: env().baseUrl,
      viewport: { width: 390, height: 844 },
      deviceScaleFactor: 2,
      isMobile: true,
      hasTouch: true,
    });
    const site = await phone.newPage();
    await site.goto(`/verify/${code}`);
    await site
      .getByRole('heading', { level: 1, name: 'This is the current revision — Accepted as noted' })
      .waitFor({ timeout: WAIT.ui });
    await site.getByText(CONDITIONS).waitFor();
    await site.getByText(OVERRIDE).waitFor();
    await site.evaluate(() => document.fonts.ready.then(() => undefined));
    const widths = await site.evaluate(() => ({
      scroll: document.documentElement.scrollWidth,
      client: document.documentElement.clientWidth,
      wider: [...document.querySelectorAll('body *')]
        .filter((el) => el.getBoundingClientRect().right > document.documentElement.clientWidth + 0.5)
        .map((el) => `${el.tagName.toLowerCase()}.${(el as HTMLElement).className}`.slice(0, 80)),
    }));
    expect(widths.client).toBe(390);
    expect(widths).toEqual({ scroll: 390, client: 390, wider: [] });
    // The text is read at phone size: no line of the conditions or the reason under 16 px.
    const sizes = await site.evaluate(
      (texts) =>
        texts.map((t) => {
          const el = [...document.querySelectorAll('dd span')].find((s) => s.textContent === t);
          return el ? parseFloat(getComputedStyle(el).fontSize) : 0;
        }),
      [CONDITIONS, OVERRIDE],
    );
    expect(Math.min(...sizes)).toBeGreaterThanOrEqual(16);
    await site.screenshot({ path: 'test-output/screenshots/verify-override-390.png', fullPage: true });
    await phone.close();
  });
});
