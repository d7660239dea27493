// The preview before issuing: page 1 of the stamped return as it will print for the decision on
// record, from the same builder, for the site's coordinators only; nothing stored, nothing signed.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PREVIEW_CODE } from '@server/modules/returns/preview';
import { signedIn, startTestApp, TEST_PASSWORD, type TestApp } from '../support/app';
import { makeWorld } from '../support/factories';
import { desk, pdftotext, submitted } from '../support/review-desk';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

const flat = (text: string) => text.replace(/\s+/g, ' ');

function pageCount(bytes: Buffer): number {
  const file = path.join(os.tmpdir(), `preview-${Date.now()}-${Math.random()}.pdf`);
  fs.writeFileSync(file, bytes);
  try {
    return Number(execFileSync('qpdf', ['--show-npages', file], { encoding: 'utf8' }).trim());
  } finally {
    fs.rmSync(file, { force: true });
  }
}

describe('the preview of the stamped return', () => {
  it('when a decision is recorded, then the coordinator gets page 1 as it will print, and nothing is stored or signed', async () => {
    const d = await desk(t);
    const p = await submitted(t, d.w, d.contractor);
    await d.reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: d.w.engineer.id });
    const early = await d.reviewer.get(`/api/packages/${p.id}/returns/preview`);
    expect(early.status).toBe(409);

    const version = (await d.engineer.get(`/api/packages/${p.id}`)).body.package.version;
    const decided = await d.engineer.post(`/api/packages/${p.id}/decision`).send({
      decision: 'accepted_as_noted',
      conditions: 'Keep the exclusion zone fenced during the lift.',
      password: TEST_PASSWORD,
      baseVersion: version,
    });
    expect(decided.status).toBe(200);

    const res = await d.reviewer.get(`/api/packages/${p.id}/returns/preview`).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['cache-control']).toBe('no-store');
    const pdf = res.body as Buffer;
    expect(pageCount(pdf)).toBe(1);
    const text = flat(await pdftotext(pdf));
    expect(text).toContain('Accepted as noted');
    expect(text).toContain('Keep the exclusion zone fenced during the lift.');
    expect(text).toContain('Test lift plan — page 1');
    expect(text).toContain(PREVIEW_CODE);
    // The plan has 2 pages and the sheet follows: the footer counts the whole return.
    expect(text).toMatch(/rev 1 — page 1 of [3-9]/);
    expect(pdf.includes(Buffer.from('/ByteRange'))).toBe(false);
    const stored = await t.ctx.dataSource.query(
      `SELECT count(*)::int AS n FROM stamped_returns WHERE package_id = $1`,
      [p.id],
    );
    expect(stored[0].n).toBe(0);

    // Only coordinators, and only on their own desk.
    expect((await d.engineer.get(`/api/packages/${p.id}/returns/preview`)).status).toBe(403);
    expect((await d.contractor.get(`/api/packages/${p.id}/returns/preview`)).status).toBe(403);
    const other = await makeWorld(t.ctx.dataSource);
    const outsider = await signedIn(t.app, other.reviewer.email);
    expect((await outsider.get(`/api/packages/${p.id}/returns/preview`)).status).toBe(404);
  }, 60_000);
});
