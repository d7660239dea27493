// What every browser test shares: Debian's Chromium launched through playwright-core (never
// a downloaded browser), people signed in through the sign-in page, the app's database for
// facts a person would read elsewhere (the fake outbox), axe-core and screenshots.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import axe from 'axe-core';
import pg from 'pg';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { afterEach, inject } from 'vitest';
import { DEMO_PASSWORD } from '@server/db/seed/demo-accounts';

export const PEOPLE = {
  contractor: 'lena.brisk@brackwater-lifting.example',
  reviewer: 'rhea.okafor@tamsin-ridge.example',
  engineer: 'dev.marsh@tamsin-ridge.example',
  admin: 'admin@tamsin-ridge.example',
} as const;
export type Person = keyof typeof PEOPLE;

export const DESKTOP = { width: 1440, height: 900 };
export const TABLET = { width: 1024, height: 768 };

/** Bounded waits: long enough for a 2-core machine under load, short enough to fail a run. */
export const WAIT = { ui: 20_000, job: 90_000 };

export const env = () => inject('e2e');

let userDataDir: string | null = null;
const openPages = new Set<Page>();

/** On a failed test, a screenshot of every page still open, to see what the person saw. */
export function screenshotOnFailure() {
  afterEach(async (context) => {
    if (context.task.result?.state !== 'fail') return;
    const dir = path.join(process.cwd(), 'test-output', 'failures');
    fs.mkdirSync(dir, { recursive: true });
    const name = context.task.name.replace(/[^a-z0-9]+/gi, '-').slice(0, 60);
    let n = 0;
    for (const page of openPages) {
      n += 1;
      await page.screenshot({ path: path.join(dir, `${name}-${n}.png`) }).catch(() => undefined);
      process.stdout.write(`[e2e] failed at ${page.url()} (screenshot ${name}-${n}.png)\n`);
    }
  });
}

export async function launch(): Promise<Browser> {
  userDataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'counterpoise-chromium-'));
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    // playwright-core gives each launch a fresh profile of its own; the folder below keeps
    // Chromium's crash and cache files out of the home directory.
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
      `--disk-cache-dir=${path.join(userDataDir, 'cache')}`,
    ],
  });
}

export async function close(browser: Browser | undefined) {
  await browser?.close();
  if (userDataDir) fs.rmSync(userDataDir, { recursive: true, force: true });
  userDataDir = null;
}

/** A fresh context (its own cookies) with the person signed in through the sign-in page. */
export async function signedIn(
  browser: Browser,
  person: Person,
  viewport = DESKTOP,
): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ baseURL: env().baseUrl, viewport, acceptDownloads: true });
  context.setDefaultTimeout(WAIT.ui);
  const page = await context.newPage();
  openPages.add(page);
  page.once('close', () => openPages.delete(page));
  await signIn(page, person);
  return { context, page };
}

export async function signIn(page: Page, person: Person) {
  await page.goto('/sign-in');
  await page.getByLabel('Work e-mail').fill(PEOPLE[person]);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.getByRole('navigation', { name: 'Main' }).waitFor();
}

/** One query against the app's own database (the embedded PostgreSQL of the started app). */
export async function query<T extends pg.QueryResultRow>(sql: string, params: unknown[] = []): Promise<T[]> {
  const client = new pg.Client({ connectionString: env().databaseUrl });
  await client.connect();
  try {
    return (await client.query<T>(sql, params)).rows;
  } finally {
    await client.end();
  }
}

/** Polls until fn returns a truthy value, or fails with what it was waiting for. */
export async function eventually<T>(
  what: string,
  fn: () => Promise<T | null | undefined | false>,
  timeout = WAIT.job,
) {
  const until = Date.now() + timeout;
  let last: unknown = null;
  for (;;) {
    try {
      const value = await fn();
      if (value) return value;
    } catch (error) {
      last = error;
    }
    if (Date.now() > until)
      throw new Error(
        `timed out after ${timeout / 1000} s waiting for ${what}${last ? `: ${String(last)}` : ''}`,
      );
    await new Promise((resolve) => setTimeout(resolve, 500));
  }
}

export type CaughtMail = { subject: string; envelope_to: string[]; text_body: string };

/** The fake SMTP outbox: the mail caught for this address whose subject contains the text. */
export function mailTo(address: string, subjectContains: string) {
  return eventually(`an e-mail to ${address} about “${subjectContains}”`, async () => {
    const rows = await query<CaughtMail>(
      `SELECT subject, envelope_to, text_body FROM caught_mail
        WHERE $1 = ANY(envelope_to) AND position($2 in subject) > 0 ORDER BY received_at DESC`,
      [address, subjectContains],
    );
    return rows[0];
  });
}

export type AxeViolation = { id: string; impact: string | null; help: string; nodes: { target: string[] }[] };

/** axe-core on the page as it is now; returns the serious and critical violations. */
export async function seriousViolations(page: Page): Promise<AxeViolation[]> {
  await page.evaluate(axe.source);
  const result = await page.evaluate(async () => {
    const w = window as unknown as {
      axe: { run: (ctx: Document, opts: object) => Promise<{ violations: AxeViolation[] }> };
    };
    const r = await w.axe.run(document, { resultTypes: ['violations'] });
    return r.violations.map((v) => ({
      id: v.id,
      impact: v.impact,
      help: v.help,
      nodes: v.nodes.slice(0, 5).map((n) => ({ target: n.target })),
    }));
  });
  return result.filter((v) => v.impact === 'serious' || v.impact === 'critical');
}

export function describeViolations(violations: AxeViolation[]): string {
  return violations
    .map((v) => `${v.impact} ${v.id}: ${v.help} — ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)
    .join('\n');
}

const SHOTS = path.join(process.cwd(), 'test-output', 'screenshots');

export async function screenshot(page: Page, name: string) {
  fs.mkdirSync(SHOTS, { recursive: true });
  const size = page.viewportSize();
  await page.screenshot({ path: path.join(SHOTS, `${name}-${size?.width ?? 0}.png`), fullPage: false });
}

export const unique = (label: string) =>
  `${label} ${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
