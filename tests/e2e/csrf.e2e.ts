// Cross-site request forgery from a second origin on 127.0.0.1 (another port: the same site,
// so SameSite=Lax still sends the session cookie). A page there tries the attacks the
// security review made: a text/plain form POST creating a package, a no-cors multipart upload
// and a no-cors duplicate. The desk must refuse each, and nothing may change.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { close, env, launch, PEOPLE, query, screenshotOnFailure, signedIn, unique } from './support/browser';

let browser: Browser;
let evil: http.Server;
let evilOrigin: string;
let attackPage = '';

beforeAll(async () => {
  browser = await launch();
  evil = http.createServer((_req, res) => {
    res.writeHead(200, { 'Content-Type': 'text/html; charset=utf-8' });
    res.end(attackPage);
  });
  await new Promise<void>((resolve) => evil.listen(0, '127.0.0.1', resolve));
  evilOrigin = `http://127.0.0.1:${(evil.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await close(browser);
  await new Promise((r) => evil.close(r));
});
screenshotOnFailure();

const count = async (sql: string, params: unknown[] = []) =>
  Number((await query<{ n: string }>(sql, params))[0].n);

describe('cross-site requests from a second origin', () => {
  it('when a page on another port posts a form, uploads and duplicates with no-cors, then nothing changes', async () => {
    const desk = env().baseUrl;
    expect(new URL(desk).port).not.toBe(new URL(evilOrigin).port);
    const target = await query<{ id: string }>(
      `SELECT p.id FROM lift_packages p
         JOIN users u ON u.organisation_id = p.contractor_organisation_id
        WHERE lower(u.email) = lower($1) AND p.status = 'draft'
        ORDER BY p.created_at LIMIT 1`,
      [PEOPLE.contractor],
    );
    const anyOwn =
      target[0]?.id ??
      (
        await query<{ id: string }>(
          `SELECT p.id FROM lift_packages p JOIN users u ON u.organisation_id = p.contractor_organisation_id
            WHERE lower(u.email) = lower($1) ORDER BY p.created_at LIMIT 1`,
          [PEOPLE.contractor],
        )
      )[0].id;
    const title = unique('Forged lift');
    const sites = await query<{ id: string }>(`SELECT id FROM sites ORDER BY created_at LIMIT 1`);
    attackPage = `<!doctype html><html><body>
      <iframe name="sink"></iframe>
      <form id="f" method="POST" enctype="text/plain" target="sink" action="${desk}/api/packages">
        <input name='{"title":"${title}","siteId":"${sites[0].id}","x":"' value='"}'>
      </form>
      <script>
        window.results = [];
        const done = [];
        document.getElementById('f').submit();
        const fd = new FormData();
        fd.append('kind', 'lift_plan');
        fd.append('file', new Blob(['%PDF-1.4\\n%%EOF\\n'], { type: 'application/pdf' }), 'forged.pdf');
        done.push(fetch('${desk}/api/packages/${anyOwn}/files', { method: 'POST', mode: 'no-cors', credentials: 'include', body: fd }).then(() => 'upload sent', (e) => 'upload ' + e));
        done.push(fetch('${desk}/api/packages/${anyOwn}/duplicate', { method: 'POST', mode: 'no-cors', credentials: 'include' }).then(() => 'duplicate sent', (e) => 'duplicate ' + e));
        done.push(fetch('${desk}/api/packages', { method: 'POST', mode: 'no-cors', credentials: 'include', headers: { 'Content-Type': 'text/plain' }, body: JSON.stringify({ title: '${title}', siteId: '${sites[0].id}' }) }).then(() => 'json-as-text sent', (e) => 'json ' + e));
        Promise.all(done).then((r) => { window.results = r; window.finished = true; });
      </script></body></html>`;

    const before = {
      packages: await count(`SELECT count(*) AS n FROM lift_packages`),
      files: await count(`SELECT count(*) AS n FROM uploaded_files`),
    };
    const { context, page } = await signedIn(browser, 'contractor');
    const attacker = await context.newPage();
    const sent: string[] = [];
    const answers: number[] = [];
    attacker.on('request', (req) => {
      if (req.url().startsWith(`${desk}/api/`)) sent.push(`${req.method()} ${req.url()}`);
    });
    // Chromium reports the answers it can (opaque no-cors answers may not appear).
    attacker.on('response', (res) => {
      if (res.url().startsWith(`${desk}/api/`)) answers.push(res.status());
    });
    await attacker.goto(`${evilOrigin}/`);
    await attacker.waitForFunction(() => (window as unknown as { finished?: boolean }).finished === true);
    await attacker.waitForTimeout(1000);

    // The browser did send the four requests, and every answer seen was a refusal.
    expect(sent.length).toBeGreaterThanOrEqual(4);
    expect(answers.length).toBeGreaterThanOrEqual(1);
    expect(answers.filter((s) => s !== 403)).toEqual([]);
    expect(await count(`SELECT count(*) AS n FROM lift_packages WHERE title = $1`, [title])).toBe(0);
    expect(await count(`SELECT count(*) AS n FROM lift_packages`)).toBe(before.packages);
    expect(await count(`SELECT count(*) AS n FROM uploaded_files`)).toBe(before.files);

    // The same duplicate from the desk's own page goes through: the guard, not a broken
    // request, stopped the forged one.
    const own = await page.evaluate(async (id) => {
      const res = await fetch(`/api/packages/${id}/duplicate`, {
        method: 'POST',
        credentials: 'include',
        headers: { 'X-CSRF-Guard': '1', Accept: 'application/json' },
      });
      return res.status;
    }, anyOwn);
    expect(own).toBeGreaterThanOrEqual(200);
    expect(own).toBeLessThan(300);
    expect(await count(`SELECT count(*) AS n FROM lift_packages`)).toBe(before.packages + 1);
    await context.close();
  });
});
