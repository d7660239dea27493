// The four flows of the product brief, one package carried through them as the people do
// it: the contractor submits (form with a pasted chart, PDF upload, live check), the
// coordinator assigns, the engineer marks up and asks for a revision, the coordinator
// returns it stamped, the contractor answers and resubmits, the engineer accepts, the
// coordinator returns it again, and anyone on site verifies the code. The tests of this
// file run in order and share the package; each asserts what its person would check.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateLift } from '@shared/engineering/evaluate';
import { formatQuantity } from '@shared/engineering/format';
import { LiftInput } from '@shared/schemas/lift-input';
import {
  close,
  env,
  launch,
  mailTo,
  PEOPLE,
  screenshot,
  screenshotOnFailure,
  signedIn,
  unique,
  WAIT,
} from './support/browser';
import { liftPlanPdf, pdfPages, pdfText } from './support/pdf';
import { internalWords } from '../support/internal-words';
import { DEMO_PASSWORD } from '@server/db/seed/demo-accounts';

const TITLE = unique('E2E set feed pump skid');
const CHART = [
  ['Radius (m)', 'Boom (m)', 'Capacity (t)'],
  ['8', '30.5', '28'],
  ['10', '30.5', '22.5'],
  ['12', '30.5', '18.2'],
  ['14', '30.5', '15.1'],
];
const FINDING = 'Show the mat layout under the front outriggers and the ground report it relies on.';
const CONDITIONS = 'Resubmit with the mat layout drawing; keep the exclusion zone at 1.5 times the radius.';
const ANSWER = 'Mat layout added as sheet 3; ground report GR-114 applies.';
const OVERRIDE =
  'Answer read against sheet 3 and ground report GR-114: the mats suffice; the finding stays open for the site file.';

/** The lift as the contractor types it, in the schema's own form (for the engine's expectation). */
function liftAsTyped(loadWeight: number) {
  return {
    schemaVersion: 1,
    crane: {
      type: 'mobile_outriggers',
      name: 'Brackwater BL-80 all-terrain',
      boomLength: { value: 30.5, unit: 'm' },
      radius: { value: 12, unit: 'm' },
    },
    chart: {
      name: 'BL-80, 20 t counterweight, outriggers fully extended, 360°',
      rows: CHART.slice(1).map(([radius, boom, capacity]) => ({
        radius: { value: Number(radius), unit: 'm' },
        boomLength: { value: Number(boom), unit: 'm' },
        capacity: { value: Number(capacity), unit: 't' },
      })),
    },
    load: { description: 'Feed pump skid', weight: { value: loadWeight, unit: 't' } },
    hookBlock: { weight: { value: 0.45, unit: 't' } },
    loadLineAllowance: { value: 0.05, unit: 't' },
    stated: { grossLoad: { value: 10, unit: 't' } },
  };
}

/** The figures the engine computes for the lift, as a person with these units reads them. */
function expected(loadWeight: number, units: 'metric' | 'imperial' = 'metric') {
  const input = LiftInput.parse(liftAsTyped(loadWeight));
  const result = evaluateLift(input, null, { units });
  return {
    gross: formatQuantity(result.figures.grossLoad, 'weight', units),
    capacity: formatQuantity(result.figures.chartCapacity, 'weight', units),
  };
}

let browser: Browser;
const state: {
  packageId?: string;
  reference?: string;
  firstCode?: string;
  finalCode?: string;
} = {};

screenshotOnFailure();
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await close(browser);
});

async function fillQuantity(page: Page, label: string, value: string, unit?: string) {
  const field = page.getByLabel(label, { exact: true });
  await field.fill(value);
  if (unit) await page.getByLabel(`Unit of ${label}`, { exact: true }).selectOption(unit);
}

async function nextStep(page: Page, title: string) {
  await page.getByRole('button', { name: `${title} ›` }).click();
  await page.getByRole('heading', { level: 2, name: new RegExp(`^\\d+\\. ${title}$`) }).waitFor();
}

/** The figure beside a label in the live check's list of figures. */
function liveFigure(page: Page, label: string) {
  return page
    .getByRole('complementary', { name: 'Live check' })
    .locator('dt', { hasText: label })
    .locator('xpath=following-sibling::dd[1]');
}

async function submitRevision(page: Page, revision: number) {
  await page
    .getByRole('navigation', { name: 'Steps' })
    .getByRole('button', { name: /Review and submit/ })
    .click();
  await page.getByRole('button', { name: `Submit revision ${revision}…` }).click();
  const confirm = page.getByRole('alertdialog', { name: `Submit revision ${revision}?` });
  await confirm.getByRole('button', { name: `Submit and freeze revision ${revision}` }).click();
  await page.waitForURL(/\/packages\/[0-9a-f-]+$/);
}

async function uploadPlan(page: Page, file: string, name: string) {
  await page
    .getByRole('navigation', { name: 'Steps' })
    .getByRole('button', { name: /Documents/ })
    .click();
  const uploaded = page.waitForResponse(
    (r) => /\/api\/packages\/[^/]+\/files$/.test(r.url()) && r.request().method() === 'POST',
    { timeout: WAIT.job },
  );
  await page.getByLabel('Choose the lift plan PDF').setInputFiles(file);
  expect((await uploaded).status()).toBe(201);
  await page.getByRole('link', { name }).waitFor();
}

async function packageStatus(page: Page) {
  return page.getByRole('region', { name: 'Package summary' }).locator('header');
}

describe('the four flows, in a real browser', () => {
  it('when the contractor fills the form with a pasted chart, uploads the plan and submits, then the check runs and the coordinator is told', async () => {
    const { context, page } = await signedIn(browser, 'contractor');
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: /packages/i })
      .first()
      .click();
    await page
      .getByRole('link', { name: /New lift package/ })
      .first()
      .click();

    await page.getByLabel('Lift title').fill(TITLE);
    const site = page.getByLabel('Site');
    const refinery = await site.locator('option', { hasText: 'Tamsin Ridge Refinery' }).getAttribute('value');
    await site.selectOption(refinery!);
    const liftDate = new Date(Date.now() + 21 * 86_400_000).toISOString().slice(0, 10);
    await page.getByLabel(/Planned lift date/).fill(liftDate);
    await page.getByRole('button', { name: 'Create and enter the lift data' }).click();
    await page.waitForURL(/\/packages\/[0-9a-f-]+\/edit/);
    state.packageId = /\/packages\/([0-9a-f-]+)\/edit/.exec(page.url())![1];

    // 1. Crane and configuration
    await page.getByRole('heading', { level: 2, name: '1. Crane and configuration' }).waitFor();
    await page
      .getByLabel('Crane type', { exact: true })
      .selectOption({ label: 'Mobile crane on outriggers' });
    await page.getByLabel('Crane (make, model, fleet number)').fill('Brackwater BL-80 all-terrain');
    await fillQuantity(page, 'Boom length', '30.5', 'm');
    await fillQuantity(page, 'Radius', '12', 'm');

    // 2. Chart rows: pasted from a spreadsheet, header row with units
    await nextStep(page, 'Chart rows');
    await page
      .getByLabel('Chart (configuration, counterweight, support)')
      .fill('BL-80, 20 t counterweight, outriggers fully extended, 360°');
    const pasteBox = page.getByLabel(/Paste from a spreadsheet/);
    await pasteBox.focus();
    await pasteBox.evaluate(
      (el, text) => {
        const data = new DataTransfer();
        data.setData('text/plain', text);
        el.dispatchEvent(
          new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }),
        );
      },
      CHART.map((row) => row.join('\t')).join('\n'),
    );
    await page.getByRole('status').filter({ hasText: '4 rows added; the header row was read' }).waitFor();
    const chartTable = page.getByRole('table', { name: 'Chart rows' });
    await expect(chartTable.getByLabel('Row 3 rated capacity (t)').inputValue()).resolves.toBe('18.2');
    await expect(chartTable.getByLabel('Row 4 radius (m)').inputValue()).resolves.toBe('14');

    // 3. Load and rigging
    await nextStep(page, 'Load and rigging');
    await page.getByLabel('Load description').fill('Feed pump skid');
    await fillQuantity(page, 'Load weight', '9.5', 't');
    await fillQuantity(page, 'Hook block weight', '0.45', 't');
    await fillQuantity(page, 'Load line allowance', '0.05', 't');

    // The live check beside the form shows what the engine computes for the same lift.
    const want = expected(9.5);
    await expect
      .poll(() => liveFigure(page, 'Gross load').textContent(), { timeout: WAIT.ui })
      .toBe(want.gross);
    await expect(liveFigure(page, 'Chart capacity').textContent()).resolves.toBe(want.capacity);

    // 7. Stated figures (skipping the steps this lift does not need)
    await page
      .getByRole('navigation', { name: 'Steps' })
      .getByRole('button', { name: /Stated figures/ })
      .click();
    await fillQuantity(page, 'Gross load', '10', 't');

    // 8. Documents
    const plan = await liftPlanPdf('bl80-lift-plan-rev1.pdf', 2, 'Feed pump skid lift plan, revision 1');
    await uploadPlan(page, plan, 'bl80-lift-plan-rev1.pdf');

    await submitRevision(page, 1);
    const heading = await packageStatus(page);
    await heading.getByText('Ready for review').waitFor({ timeout: WAIT.job });
    state.reference = (await heading.locator('p.font-mono').textContent())!.trim();
    expect(state.reference).toMatch(/\S+/);
    // The check that ran on the server agrees with the live check.
    await expect(page.getByText(want.gross).first().isVisible()).resolves.toBe(true);

    const mail = await mailTo(PEOPLE.reviewer, `${state.reference} rev 1 submitted for review`);
    expect(mail.text_body).toContain(TITLE);
    await context.close();
  });

  it('when the coordinator filters the queue and assigns Dev Marsh, then the engineer is told by e-mail', async () => {
    expect(state.packageId, 'the submission flow made the package').toBeTruthy();
    const { context, page } = await signedIn(browser, 'reviewer');
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: /queue/i })
      .first()
      .click();
    await page.getByRole('group', { name: 'More filters' }).getByLabel('Engineer').selectOption('none');
    await page.waitForURL(/engineerId=none/);
    const search = page.getByRole('searchbox');
    await search.fill(TITLE);
    await search.press('Enter');
    const row = page.getByRole('row').filter({ hasText: TITLE });
    await row.waitFor();
    await expect(page.getByRole('row').filter({ hasText: 'E2E set feed pump skid' }).count()).resolves.toBe(
      1,
    );

    await row.getByRole('checkbox', { name: `Select ${state.reference}` }).check();
    const bar = page.getByRole('region', { name: 'Selected packages' });
    await bar.getByText('1 package selected').waitFor();
    const engineer = bar.getByLabel('Assign to');
    const dev = await engineer.locator('option', { hasText: 'Dev Marsh' }).getAttribute('value');
    await engineer.selectOption(dev!);
    await bar.getByRole('button', { name: 'Assign', exact: true }).click();
    await bar.getByText(/Dev Marsh, PE is now the engineer of record for 1 package/).waitFor();

    const mail = await mailTo(PEOPLE.engineer, `${state.reference} assigned to you for review`);
    expect(mail.text_body).toContain('Rhea Okafor');
    await context.close();
  });

  it('when the engineer marks up a page, writes a finding and asks for a revision, then the coordinator issues the stamped return', async () => {
    expect(state.reference, 'the earlier flows ran').toBeTruthy();
    const engineer = await signedIn(browser, 'engineer');
    const page = engineer.page;
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: /assigned/i })
      .first()
      .click();
    await page.getByRole('row').filter({ hasText: TITLE }).click();
    await page.getByRole('link', { name: 'Open review workspace' }).click();
    await page.waitForURL(/\/review$/);
    await page.getByText('Page 1 of 2').waitFor({ timeout: WAIT.job });

    // Draw a box with the mouse on page 1.
    await page.getByRole('toolbar', { name: 'Markup tools' }).getByRole('button', { name: /Box/ }).click();
    const layer = page.getByRole('group', { name: 'Markups on page 1' });
    await layer.waitFor();
    const box = (await layer.boundingBox())!;
    const saved = page.waitForResponse(
      (r) => r.url().endsWith('/markups') && r.request().method() === 'POST',
    );
    await page.mouse.move(box.x + box.width * 0.2, box.y + box.height * 0.3);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width * 0.4, box.y + box.height * 0.45, { steps: 8 });
    await page.mouse.move(box.x + box.width * 0.55, box.y + box.height * 0.55, { steps: 8 });
    await page.mouse.up();
    expect((await saved).status()).toBe(201);
    await layer.getByRole('button', { name: 'Box, page 1' }).waitFor();

    // The finding, tied to the box.
    await page.getByRole('tab', { name: /Findings/ }).click();
    await page.getByRole('textbox', { name: 'New finding' }).fill(FINDING);
    await page.getByRole('button', { name: 'Tie to Box, page 1' }).click();
    await page.getByRole('radio', { name: 'Major' }).check();
    await page.getByRole('button', { name: 'Add the finding' }).click();
    await page.getByRole('tabpanel').getByRole('listitem').filter({ hasText: FINDING }).waitFor();

    // The decision with conditions.
    await page.getByRole('tab', { name: /Decision/ }).click();
    await page.getByRole('radio', { name: /Revise and resubmit/ }).check();
    await page.getByLabel(/^Conditions/).fill(CONDITIONS);
    await page.getByRole('button', { name: 'Record the decision' }).click();
    // Confirmed with the engineer's password; Revise and resubmit is not gated.
    const confirm = page.getByRole('dialog', { name: 'Confirm: Revise and resubmit' });
    await confirm.getByLabel(/^Your password/).fill(DEMO_PASSWORD);
    await confirm.getByRole('button', { name: 'Record Revise and resubmit' }).click();
    await page.getByRole('status').filter({ hasText: 'Recorded: Revise and resubmit' }).waitFor();
    await engineer.context.close();

    const reviewer = await signedIn(browser, 'reviewer');
    await reviewer.page.goto(`/packages/${state.packageId}`);
    await reviewer.page.getByRole('button', { name: 'Issue stamped return' }).click();
    await reviewer.page.getByRole('button', { name: 'Issue as shown' }).click({ timeout: WAIT.job });
    const link = reviewer.page
      .getByRole('region', { name: 'Stamped return' })
      .getByRole('link', { name: /^\/verify\// });
    await link.waitFor({ timeout: WAIT.job });
    state.firstCode = (await link.textContent())!.replace('/verify/', '').trim();
    await reviewer.context.close();

    const mail = await mailTo(PEOPLE.contractor, `${state.reference} rev 1: Revise and resubmit`);
    expect(mail.text_body).toContain(CONDITIONS);
  });

  it('when the contractor answers the finding and resubmits a revision 2, then the engineer sees the difference and accepts, and the return is stamped', async () => {
    expect(state.firstCode, 'the first return was issued').toBeTruthy();
    const contractor = await signedIn(browser, 'contractor');
    let page = contractor.page;
    await page.goto(`/packages/${state.packageId}`);
    const panel = page.getByRole('region', { name: /Revision 1 came back: Revise and resubmit/ });
    await panel.waitFor();
    await panel.getByText(CONDITIONS).waitFor();
    await panel.getByText(FINDING).waitFor();
    await panel.getByLabel('Your answer').fill(ANSWER);
    await panel.getByRole('button', { name: 'Send answer' }).click();
    await panel.getByRole('button', { name: 'Change the answer' }).waitFor();
    await panel.getByRole('button', { name: 'Start revision 2' }).click();
    await page.waitForURL(/\/edit/);
    await page
      .getByText(/revision 2/)
      .first()
      .waitFor();

    await page
      .getByRole('navigation', { name: 'Steps' })
      .getByRole('button', { name: /Load and rigging/ })
      .click();
    await fillQuantity(page, 'Load weight', '9.8');
    const want = expected(9.8);
    await expect
      .poll(() => liveFigure(page, 'Gross load').textContent(), { timeout: WAIT.ui })
      .toBe(want.gross);
    const plan = await liftPlanPdf('bl80-lift-plan-rev2.pdf', 3, 'Feed pump skid lift plan, revision 2');
    await uploadPlan(page, plan, 'bl80-lift-plan-rev2.pdf');
    await submitRevision(page, 2);
    await (
      await packageStatus(page)
    )
      .getByText(/With engineer|Ready for review/)
      .waitFor({ timeout: WAIT.job });
    await contractor.context.close();

    const engineer = await signedIn(browser, 'engineer');
    page = engineer.page;
    await page.goto(`/packages/${state.packageId}/review`);
    await page.getByText('Page 1 of 3').waitFor({ timeout: WAIT.job });
    await page.getByRole('tab', { name: /Since revision 1/ }).click();
    const difference = page.getByRole('tabpanel', { name: /Since revision 1/ });
    // The input that changed, as the contractor typed it, and the gross load it moved, in the
    // engineer's own units (Dev Marsh reads ft/lb/kip).
    const changed = difference.getByRole('row').filter({ hasText: '9.8 t' });
    await changed.waitFor({ timeout: WAIT.job });
    await expect(changed.textContent()).resolves.toContain('9.5 t');
    const gross = difference.getByRole('row').filter({ hasText: 'Gross load' });
    await expect(gross.textContent()).resolves.toContain(expected(9.5, 'imperial').gross);
    await expect(gross.textContent()).resolves.toContain(expected(9.8, 'imperial').gross);
    await page.getByRole('tab', { name: /Findings/ }).click();
    await page.getByText(ANSWER).first().waitFor();
    await page.getByRole('tab', { name: /Decision/ }).click();
    await page.getByRole('radio', { name: /^Accepted\b(?! as noted)/ }).check();
    await page.getByRole('button', { name: 'Record the decision' }).click();
    // The Major finding is answered but not closed: it stands against Accepted, in words, and
    // Accepted goes ahead only with the override reason and the password.
    const gate = page.getByRole('dialog', { name: 'Accepted over what stands against it' });
    await gate.getByTestId('decision-blockers').getByText('Major finding not closed').waitFor();
    await expect(gate.getByTestId('decision-blockers').textContent()).resolves.toContain(FINDING);
    await gate.getByLabel(/^Override reason/).fill(OVERRIDE);
    await gate.getByLabel(/^Your password/).fill(DEMO_PASSWORD);
    await screenshot(page, 'decision-gate');
    await gate.getByRole('button', { name: 'Override and record Accepted' }).click();
    await page.getByRole('status').filter({ hasText: 'Recorded: Accepted' }).waitFor();
    await engineer.context.close();

    const reviewer = await signedIn(browser, 'reviewer');
    await reviewer.page.goto(`/packages/${state.packageId}`);
    await reviewer.page.getByRole('button', { name: 'Issue stamped return' }).click();
    await reviewer.page.getByRole('button', { name: 'Issue as shown' }).click({ timeout: WAIT.job });
    const second = reviewer.page
      .getByRole('region', { name: 'Stamped return' })
      .getByRole('listitem')
      .filter({ hasText: 'Revision 2' })
      .getByRole('link', { name: /^\/verify\// });
    await second.waitFor({ timeout: WAIT.job });
    state.finalCode = (await second.textContent())!.replace('/verify/', '').trim();
    expect(state.finalCode).not.toBe(state.firstCode);
    await reviewer.context.close();
    await mailTo(PEOPLE.contractor, `${state.reference} rev 2: Accepted`);
  });

  it('when the contractor downloads the stamped PDF, then it carries the decision and the code, and anyone can verify it', async () => {
    expect(state.finalCode, 'the final return was issued').toBeTruthy();
    const { context, page } = await signedIn(browser, 'contractor');
    await page.goto(`/packages/${state.packageId}`);
    const latest = page
      .getByRole('region', { name: 'Stamped return' })
      .getByRole('listitem')
      .filter({ hasText: 'Revision 2' });
    const open = latest.getByRole('link', { name: /Open the stamped PDF/ });
    await open.waitFor();
    const shownPages = Number(/\((\d+) pages?\)/.exec((await open.textContent()) ?? '')?.[1]);
    const response = await page.request.get((await open.getAttribute('href'))!);
    expect(response.status()).toBe(200);
    expect(response.headers()['content-type']).toContain('application/pdf');
    const bytes = new Uint8Array(await response.body());
    const first = pdfText(bytes, 1);
    expect(first).toContain('Accepted');
    expect(first).toContain(state.finalCode!);
    expect(first).toContain(state.reference!);
    // The override prints on the stamp (cut short) and in full on the calculation sheet.
    expect(first).toContain('Override');
    expect(pdfText(bytes).replace(/\s+/g, ' ')).toContain(OVERRIDE);
    const pages = pdfPages(bytes);
    // The three plan pages and at least one page of calculation sheet.
    expect(pages).toBeGreaterThanOrEqual(4);
    expect(pages).toBe(shownPages);
    // Every page of the return in words: no code names, ids or raw validation text.
    expect(internalWords(pdfText(bytes))).toEqual([]);
    await context.close();

    // Anyone on site, not signed in.
    const site = await browser.newContext({ baseURL: env().baseUrl });
    const phone = await site.newPage();
    await phone.goto(`/verify/${state.finalCode}`);
    await phone.getByRole('heading', { level: 1, name: 'This is the current revision — Accepted' }).waitFor();
    await phone.goto(`/verify/${state.firstCode}`);
    await phone
      .getByRole('heading', { level: 1, name: /Superseded by revision 2 — do not lift to this plan/ })
      .waitFor();
    await site.close();
  });
});
