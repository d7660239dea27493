// Uploads when things go wrong, and what an upload tells the contractor. The object store
// stops answering (a fake S3 server of this test's own, stopped and started again): the
// upload answers 503 `storage_unavailable`, leaves no row, and the file stored before is
// there again, byte for byte, once the store is back. A stored file whose object is gone
// answers 404 at once. A PDF with comments, a stamp, JavaScript and a form field is taken,
// and the answer says in words what the stamped return will leave out.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fakeS3Env, startFakeS3, type FakeS3 } from '@server/lib/fake-s3';
import type { Config } from '@server/config';
import { freePort } from '../../scripts/lib/services';
import { signedIn, startTestApp, type TestApp } from '../support/app';
import { makeActivePdf } from '../support/big-pdfs';
import { makeWorld } from '../support/factories';
import { makePdf } from '../support/pdfs';

let t: TestApp;
let s3: FakeS3;
let s3Dir: string;
let s3Port: number;

beforeAll(async () => {
  s3Dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cp-s3-outage-'));
  s3Port = await freePort();
  s3 = await startFakeS3({ dir: s3Dir, port: s3Port });
  const env = fakeS3Env(s3.url, 'outage-test');
  t = await startTestApp({
    S3_ENDPOINT: env.S3_ENDPOINT,
    S3_BUCKET: env.S3_BUCKET,
    S3_ACCESS_KEY_ID: env.S3_ACCESS_KEY_ID,
    S3_SECRET_ACCESS_KEY: env.S3_SECRET_ACCESS_KEY,
  } as Partial<Config>);
});

afterAll(async () => {
  await t?.close();
  await s3?.close().catch(() => undefined);
  fs.rmSync(s3Dir, { recursive: true, force: true });
});

async function draft() {
  const w = await makeWorld(t.ctx.dataSource);
  const contractor = await signedIn(t.app, w.plannerA.email);
  const created = await contractor
    .post('/api/packages')
    .send({ title: 'Bad input', siteId: w.site.id, plannedLiftDate: '2027-03-14' });
  return { contractor, id: created.body.package.id as string, revisionId: created.body.current.id as string };
}

const sha = (b: Uint8Array | Buffer) => createHash('sha256').update(b).digest('hex');

describe('uploads when the object store or an object is missing', () => {
  it('when S3 stops answering, then an upload answers 503 storage_unavailable with no row, and the file stored before is intact once S3 is back', async () => {
    const d = await draft();
    const first = Buffer.from(await makePdf(2, 'Stored before the outage'));
    const stored = await d.contractor
      .post(`/api/packages/${d.id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', first, 'plan-before.pdf');
    expect(stored.status).toBe(201);

    await s3.close();
    const started = Date.now();
    const refused = await d.contractor
      .post(`/api/packages/${d.id}/files`)
      .field('kind', 'supporting')
      .attach('file', Buffer.from(await makePdf(1, 'Sent during the outage')), 'drawing-during.pdf');
    process.stdout.write(`upload with S3 stopped answered ${refused.status} in ${Date.now() - started} ms\n`);
    expect(refused.status).toBe(503);
    expect(refused.body.error.code).toBe('storage_unavailable');
    expect(refused.body.error.message).toBe(
      'The file store (S3) is not answering. Try again in a minute; nothing stored was lost.',
    );
    expect(refused.headers['retry-after']).toBe('10');
    const read = await d.contractor.get(`/api/packages/${d.id}/files/${stored.body.id}`);
    expect(read.status).toBe(503);
    expect(read.body.error.code).toBe('storage_unavailable');

    s3 = await startFakeS3({ dir: s3Dir, port: s3Port });
    const rows = await t.ctx.dataSource.query(
      `SELECT original_name FROM uploaded_files WHERE revision_id = $1`,
      [d.revisionId],
    );
    expect(rows).toEqual([{ original_name: 'plan-before.pdf' }]);
    const back = await d.contractor
      .get(`/api/packages/${d.id}/files/${stored.body.id}`)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(back.status).toBe(200);
    expect(sha(back.body as Buffer)).toBe(sha(first));
  }, 60_000);

  it('when a stored file has lost its object, then reading it answers 404 at once', async () => {
    const d = await draft();
    const up = await d.contractor
      .post(`/api/packages/${d.id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', Buffer.from(await makePdf(1)), 'plan.pdf');
    expect(up.status).toBe(201);
    await t.ctx.storage.delete(`revisions/${d.revisionId}/${up.body.id}.pdf`);
    const started = Date.now();
    const res = await d.contractor.get(`/api/packages/${d.id}/files/${up.body.id}`);
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe('No such file.');
    expect(Date.now() - started).toBeLessThan(2000);
  });
});

describe('what an upload carries besides page content', () => {
  it('when a PDF with comments, a stamp, JavaScript and a form field is uploaded, then the answer and the package say in words what the stamped return leaves out', async () => {
    const d = await draft();
    const res = await d.contractor
      .post(`/api/packages/${d.id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', Buffer.from(await makeActivePdf()), 'plan-with-comments.pdf');
    expect(res.status).toBe(201);
    expect(res.body.contents).toEqual({
      annotations: [
        { kind: 'comment', page: 1, count: 3 },
        { kind: 'widget', page: 1, count: 1 },
        { kind: 'stamp', page: 2, count: 1 },
      ],
      javascript: 1,
      actions: 0,
      embeddedFiles: 0,
      formFields: 1,
      xfa: false,
    });
    const words =
      'Found in this PDF and left out of the stamped return: 3 comments on page 1, 1 stamp on page 2, JavaScript and 1 form field on page 1. The return carries each page’s printed content only: flatten anything meant to stay into the page (print it to a new PDF) and upload that copy.';
    expect(res.body.notCarried).toBe(words);
    const detail = await d.contractor.get(`/api/packages/${d.id}`);
    expect(detail.body.current.files[0].notCarried).toBe(words);
  });

  it('when a PDF carries page content only, then nothing is said', async () => {
    const d = await draft();
    const res = await d.contractor
      .post(`/api/packages/${d.id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', Buffer.from(await makePdf(1)), 'plain-plan.pdf');
    expect(res.status).toBe(201);
    expect(res.body.notCarried).toBeNull();
    expect(res.body.contents).toMatchObject({ annotations: [], javascript: 0, formFields: 0 });
  });
});
