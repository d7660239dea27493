// Every main page, as its person sees it, at a desktop and a tablet width: axe-core finds no
// serious or critical violation, and a screenshot of each lands in test-output/screenshots/
// for a person to look at. Pages of the demo scenario are found by what they are (a package
// assigned to Dev Marsh, a stamped return), not by their order.
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  close,
  describeViolations,
  DESKTOP,
  env,
  launch,
  PEOPLE,
  query,
  screenshot,
  screenshotOnFailure,
  seriousViolations,
  signedIn,
  TABLET,
  unique,
  WAIT,
  type Person,
} from './support/browser';
import { apiAs } from './support/api';
import { internalWords } from '../support/internal-words';

let browser: Browser;
const contexts = new Map<Person | 'anyone', { context: BrowserContext; page: Page }>();
const ids: Record<string, string> = {};

screenshotOnFailure();
beforeAll(async () => {
  browser = await launch();
  const [withEngineer] = await query<{ id: string }>(
    `SELECT p.id FROM lift_packages p JOIN users u ON u.id = p.assigned_engineer_id
      WHERE u.email = $1 AND p.status = 'with_engineer' ORDER BY p.reference LIMIT 1`,
    [PEOPLE.engineer],
  );
  const [returned] = await query<{ id: string; code: string }>(
    `SELECT p.id, r.verification_code AS code FROM lift_packages p
       JOIN organisations o ON o.id = p.contractor_organisation_id
       JOIN users u ON u.organisation_id = o.id AND u.email = $1
       JOIN stamped_returns r ON r.package_id = p.id AND r.state = 'ready'
      WHERE p.status = 'returned' ORDER BY p.reference LIMIT 1`,
    [PEOPLE.contractor],
  );
  const [site] = await query<{ id: string }>(`SELECT id FROM sites ORDER BY code LIMIT 1`);
  // The contractor's draft: a new one, so the editor opens on an empty first step.
  const api = await apiAs('contractor');
  const sites = (await (await api.get('/api/sites')).json()) as { items: { id: string }[] };
  const created = await api.post('/api/packages', {
    data: { title: unique('E2E pages draft'), siteId: sites.items[0].id, plannedLiftDate: null },
  });
  ids.draft = ((await created.json()) as { package: { id: string } }).package.id;
  await api.dispose();
  Object.assign(ids, {
    withEngineer: withEngineer.id,
    returned: returned.id,
    code: returned.code,
    site: site.id,
  });
});
afterAll(async () => {
  for (const { context } of contexts.values()) await context.close();
  await close(browser);
});

async function pageFor(person: Person | 'anyone'): Promise<Page> {
  let entry = contexts.get(person);
  if (!entry) {
    if (person === 'anyone') {
      const context = await browser.newContext({ baseURL: env().baseUrl, viewport: DESKTOP });
      context.setDefaultTimeout(WAIT.ui);
      entry = { context, page: await context.newPage() };
    } else {
      entry = await signedIn(browser, person);
    }
    contexts.set(person, entry);
  }
  return entry.page;
}

type MainPage = {
  name: string;
  person: Person | 'anyone';
  path: () => string;
  /** What shows once the page has its data. */
  ready: (page: Page) => Locator;
};

const PAGES: MainPage[] = [
  {
    name: 'sign-in',
    person: 'anyone',
    path: () => '/sign-in',
    ready: (p) => p.getByRole('button', { name: 'Sign in', exact: true }),
  },
  {
    name: 'contractor-desk',
    person: 'contractor',
    path: () => '/packages',
    ready: (p) => p.getByRole('row').nth(1),
  },
  {
    name: 'new-package',
    person: 'contractor',
    path: () => '/packages/new',
    ready: (p) => p.getByLabel('Lift title'),
  },
  {
    name: 'editor',
    person: 'contractor',
    path: () => `/packages/${ids.draft}/edit`,
    ready: (p) => p.getByRole('heading', { name: '1. Crane and configuration' }),
  },
  {
    name: 'editor-chart',
    person: 'contractor',
    path: () => `/packages/${ids.draft}/edit?step=chart`,
    ready: (p) => p.getByRole('table', { name: 'Chart rows' }),
  },
  {
    name: 'package',
    person: 'contractor',
    path: () => `/packages/${ids.returned}`,
    ready: (p) => p.getByRole('link', { name: /Open the stamped PDF/ }).first(),
  },
  {
    name: 'queue',
    person: 'reviewer',
    path: () => '/queue',
    ready: (p) => p.getByRole('row').nth(1),
  },
  {
    name: 'package-reviewer',
    person: 'reviewer',
    path: () => `/packages/${ids.withEngineer}`,
    ready: (p) => p.getByRole('region', { name: 'Package summary' }),
  },
  {
    name: 'assigned',
    person: 'engineer',
    path: () => '/assigned',
    ready: (p) => p.getByRole('row').nth(1),
  },
  {
    name: 'review-workspace',
    person: 'engineer',
    path: () => `/packages/${ids.withEngineer}/review`,
    ready: (p) => p.getByRole('region', { name: 'Page view' }).locator('canvas').first(),
  },
  {
    name: 'admin',
    person: 'admin',
    path: () => '/admin',
    ready: (p) => p.getByRole('heading', { level: 1 }),
  },
  {
    name: 'admin-organisations',
    person: 'admin',
    path: () => '/admin/organisations',
    ready: (p) => p.getByRole('row').nth(1),
  },
  {
    name: 'admin-sites',
    person: 'admin',
    path: () => '/admin/sites',
    ready: (p) => p.getByRole('row').nth(1),
  },
  {
    name: 'admin-site-policy',
    person: 'admin',
    path: () => `/admin/sites/${ids.site}/policy`,
    ready: (p) => p.getByRole('button', { name: /save/i }).first(),
  },
  {
    name: 'admin-people',
    person: 'admin',
    path: () => '/admin/people',
    ready: (p) => p.getByRole('row').nth(1),
  },
  {
    name: 'admin-mail',
    person: 'admin',
    path: () => '/admin/mail',
    ready: (p) => p.getByRole('heading', { level: 1 }),
  },
  {
    name: 'profile',
    person: 'contractor',
    path: () => '/profile',
    ready: (p) => p.getByRole('heading', { level: 1 }),
  },
  {
    name: 'verify',
    person: 'anyone',
    path: () => `/verify/${ids.code}`,
    ready: (p) => p.getByRole('heading', { level: 1, name: /This is the current revision|Superseded/ }),
  },
];

async function settle(page: Page, ready: Locator) {
  await ready.waitFor();
  // Loading placeholders gone, fonts in: what a person looks at, not a frame in between.
  await page
    .getByText(/^(Loading|Opening)\b/)
    .first()
    .waitFor({ state: 'hidden' });
  await page.evaluate(() => document.fonts.ready.then(() => undefined));
}

describe('every main page: accessibility and screenshots', () => {
  for (const main of PAGES) {
    it(`when ${main.name} is open at desktop and tablet widths, then axe finds nothing serious or critical and the page shows no code names`, async () => {
      const page = await pageFor(main.person);
      for (const size of [DESKTOP, TABLET]) {
        await page.setViewportSize(size);
        await page.goto(main.path());
        await settle(page, main.ready(page));
        const violations = await seriousViolations(page);
        await screenshot(page, main.name);
        expect(violations, `${main.name} at ${size.width}px:\n${describeViolations(violations)}`).toEqual([]);
      }
      // What the page says, in words: no code names, ids or raw validation text.
      expect(internalWords(await page.locator('body').innerText()), main.name).toEqual([]);
    });
  }

  it("when the workspace's checks, findings and decision tabs are open, then each reads in words and axe finds nothing serious or critical", async () => {
    const page = await pageFor('engineer');
    await page.setViewportSize(DESKTOP);
    await page.goto(`/packages/${ids.withEngineer}/review`);
    await settle(page, page.getByRole('region', { name: 'Page view' }).locator('canvas').first());
    for (const name of [/^Checks/, /^Findings/, /^Decision/]) {
      await page.getByRole('tab', { name }).click();
      const panel = page.getByRole('tabpanel', { name });
      await panel.waitFor();
      const violations = await seriousViolations(page);
      expect(violations, `${String(name)}:\n${describeViolations(violations)}`).toEqual([]);
      expect(internalWords(await panel.innerText()), String(name)).toEqual([]);
    }
  });

  it('when the demo desk has sent its e-mails, then each reads in words', async () => {
    const mail = await query<{ subject: string; text_body: string }>(
      `SELECT subject, text_body FROM caught_mail`,
    );
    expect(mail.length).toBeGreaterThan(0);
    for (const m of mail) expect(internalWords(`${m.subject}\n${m.text_body}`), m.subject).toEqual([]);
  });
});
