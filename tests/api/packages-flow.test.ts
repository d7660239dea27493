// The contractor's submission over the API: drafts, uploads, submit, and their refusals.
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkRunJobId } from '@server/lib/queues';
import { UploadedFile } from '@server/modules/files/file.entity';
import { startTestApp, signedIn, type TestApp } from '../support/app';
import { makeWorld } from '../support/factories';
import { makeEncryptedPdf, makePdf, truncate } from '../support/pdfs';
import { storedObjects } from '../support/s3';

const example = JSON.parse(fs.readFileSync('shared/engineering/examples/pass-outriggers.json', 'utf8'));

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ UPLOAD_MAX_BYTES: 200_000, UPLOAD_MAX_PAGES: 5 });
});
afterAll(async () => t.close());

async function newDraft() {
  const w = await makeWorld(t.ctx.dataSource);
  const agent = await signedIn(t.app, w.plannerA.email);
  const res = await agent
    .post('/api/packages')
    .send({ title: 'Set clarifier drive', siteId: w.site.id, plannedLiftDate: '2027-03-14' });
  expect(res.status).toBe(201);
  return { w, agent, pkg: res.body };
}

async function fileCount(revisionId: string) {
  return t.ctx.dataSource.getRepository(UploadedFile).countBy({ revisionId });
}

function filesStored(revisionId: string): Promise<string[]> {
  return storedObjects(t.ctx.config, `revisions/${revisionId}/`);
}

describe('drafts', () => {
  it('when a contractor starts a package, then it is a draft with revision 1 and a site reference', async () => {
    const { w, pkg } = await newDraft();
    expect(pkg.package.status).toBe('draft');
    expect(pkg.package.reference).toBe(`${w.site.code}-0001`);
    expect(pkg.current).toMatchObject({ number: 1, state: 'draft', inputs: {} });
    expect(pkg.events.map((e: { action: string }) => e.action)).toContain('package.created');
  });

  it('when a reviewer tries to start a package, then 403', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const agent = await signedIn(t.app, w.reviewer.email);
    expect((await agent.post('/api/packages').send({ title: 'Nope', siteId: w.site.id })).status).toBe(403);
  });

  it('when the title is too short or the date malformed, then 400 names both fields', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const agent = await signedIn(t.app, w.plannerA.email);
    const res = await agent
      .post('/api/packages')
      .send({ title: 'x', siteId: w.site.id, plannedLiftDate: '14/03/2027' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual(
      expect.arrayContaining([
        { path: 'title', message: 'Title must be at least 3 characters' },
        { path: 'plannedLiftDate', message: 'Planned lift date must be a date (YYYY-MM-DD)' },
      ]),
    );
  });

  it('when a draft is saved, then the inputs come back; a stale copy gets 409 and loses nothing', async () => {
    const { agent, pkg } = await newDraft();
    const first = await agent
      .put(`/api/packages/${pkg.package.id}/draft`)
      .send({ inputs: { load: { weight: { value: 9, unit: 't' } } }, baseUpdatedAt: pkg.current.updatedAt });
    expect(first.status).toBe(200);
    expect(first.body.current.inputs).toEqual({ load: { weight: { value: 9, unit: 't' } } });
    const stale = await agent
      .put(`/api/packages/${pkg.package.id}/draft`)
      .send({ inputs: { other: true }, baseUpdatedAt: pkg.current.updatedAt });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_draft');
    const after = await agent.get(`/api/packages/${pkg.package.id}`);
    expect(after.body.current.inputs).toEqual({ load: { weight: { value: 9, unit: 't' } } });
  });

  it('when a package is duplicated, then a new draft carries the same inputs', async () => {
    const { agent, pkg } = await newDraft();
    await agent.put(`/api/packages/${pkg.package.id}/draft`).send({ inputs: example });
    const copy = await agent.post(`/api/packages/${pkg.package.id}/duplicate`);
    expect(copy.status).toBe(201);
    expect(copy.body.package.id).not.toBe(pkg.package.id);
    expect(copy.body.package.title).toBe('Set clarifier drive (copy)');
    expect(copy.body.current.inputs).toEqual(example);
  });

  it("when another organisation's contractor touches the draft, then every route answers 404", async () => {
    const { w, pkg } = await newDraft();
    const other = await signedIn(t.app, w.plannerB.email);
    const id = pkg.package.id;
    expect((await other.get(`/api/packages/${id}`)).status).toBe(404);
    expect((await other.put(`/api/packages/${id}/draft`).send({ inputs: {} })).status).toBe(404);
    expect((await other.post(`/api/packages/${id}/submit`)).status).toBe(404);
    expect((await other.post(`/api/packages/${id}/duplicate`)).status).toBe(404);
    const pdf = await makePdf();
    expect(
      (
        await other
          .post(`/api/packages/${id}/files`)
          .field('kind', 'lift_plan')
          .attach('file', Buffer.from(pdf), 'plan.pdf')
      ).status,
    ).toBe(404);
  });
});

describe('uploads', () => {
  it('when a real PDF is uploaded, then its sha-256, size and pages are recorded and it can be read back', async () => {
    const { agent, pkg } = await newDraft();
    const pdf = await makePdf(3);
    const res = await agent
      .post(`/api/packages/${pkg.package.id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', Buffer.from(pdf), 'plan.pdf');
    expect(res.status).toBe(201);
    const { createHash } = await import('node:crypto');
    expect(res.body).toMatchObject({
      kind: 'lift_plan',
      originalName: 'plan.pdf',
      pages: 3,
      sizeBytes: pdf.byteLength,
      sha256: createHash('sha256').update(pdf).digest('hex'),
    });
    const back = await agent.get(`/api/packages/${pkg.package.id}/files/${res.body.id}`).buffer(true);
    expect(back.status).toBe(200);
    expect(back.headers['content-type']).toBe('application/pdf');
    expect(Buffer.compare(back.body, Buffer.from(pdf))).toBe(0);
  });

  describe('downloads', () => {
    // Random text on each page (it does not deflate), so the file is well over the 1024 bytes
    // a first range asks for and every slice differs from its neighbours.
    async function uploaded() {
      const { agent, pkg } = await newDraft();
      const pdf = Buffer.from(await makePdf(5, randomBytes(1500).toString('hex')));
      const res = await agent
        .post(`/api/packages/${pkg.package.id}/files`)
        .field('kind', 'lift_plan')
        .attach('file', pdf, 'plan.pdf');
      expect(res.status).toBe(201);
      expect(pdf.byteLength).toBeGreaterThan(4096);
      return { agent, pkg, pdf, url: `/api/packages/${pkg.package.id}/files/${res.body.id}`, body: res.body };
    }

    it('when no Range is sent, then 200 with the whole file, its length, byte ranges offered and the sha-256 as ETag', async () => {
      const { agent, pdf, url, body } = await uploaded();
      const res = await agent.get(url).buffer(true);
      expect(res.status).toBe(200);
      expect(res.headers['accept-ranges']).toBe('bytes');
      expect(res.headers['content-length']).toBe(String(pdf.byteLength));
      expect(res.headers['content-range']).toBeUndefined();
      expect(res.headers.etag).toBe(`"${body.sha256}"`);
      expect(res.headers['x-content-sha256']).toBe(body.sha256);
      expect(res.headers['content-disposition']).toBe('inline; filename="plan.pdf"');
      expect(Buffer.compare(res.body, pdf)).toBe(0);
    });

    it('when Range asks for bytes 0-1023, then 206 with exactly the first 1024 bytes and their Content-Range', async () => {
      const { agent, pdf, url } = await uploaded();
      const res = await agent.get(url).set('Range', 'bytes=0-1023').buffer(true);
      expect(res.status).toBe(206);
      expect(res.headers['content-range']).toBe(`bytes 0-1023/${pdf.byteLength}`);
      expect(res.headers['content-length']).toBe('1024');
      expect(res.headers['content-type']).toBe('application/pdf');
      expect(res.body.byteLength).toBe(1024);
      expect(Buffer.compare(res.body, pdf.subarray(0, 1024))).toBe(0);
    });

    it('when Range asks for a middle slice, then 206 with those bytes', async () => {
      const { agent, pdf, url } = await uploaded();
      const res = await agent.get(url).set('Range', 'bytes=1000-2999').buffer(true);
      expect(res.status).toBe(206);
      expect(res.headers['content-range']).toBe(`bytes 1000-2999/${pdf.byteLength}`);
      expect(Buffer.compare(res.body, pdf.subarray(1000, 3000))).toBe(0);
    });

    it('when Range asks for the last 500 bytes (a suffix range), then 206 with the tail of the file', async () => {
      const { agent, pdf, url } = await uploaded();
      const res = await agent.get(url).set('Range', 'bytes=-500').buffer(true);
      expect(res.status).toBe(206);
      const size = pdf.byteLength;
      expect(res.headers['content-range']).toBe(`bytes ${size - 500}-${size - 1}/${size}`);
      expect(res.headers['content-length']).toBe('500');
      expect(Buffer.compare(res.body, pdf.subarray(size - 500))).toBe(0);
    });

    it('when Range starts past the end, then 416 with Content-Range bytes */size and a JSON error', async () => {
      const { agent, pdf, url } = await uploaded();
      const res = await agent.get(url).set('Range', `bytes=${pdf.byteLength + 10}-`);
      expect(res.status).toBe(416);
      expect(res.headers['content-range']).toBe(`bytes */${pdf.byteLength}`);
      expect(res.headers['content-type']).toMatch(/^application\/json/);
      expect(res.body.error.code).toBe('range_not_satisfiable');
      expect(res.body.error.message).toContain(`${pdf.byteLength} bytes`);
    });

    it('when If-Range names another copy, then the Range is ignored and the whole file comes back', async () => {
      const { agent, pdf, url } = await uploaded();
      const res = await agent
        .get(url)
        .set('Range', 'bytes=0-9')
        .set('If-Range', '"not-this-copy"')
        .buffer(true);
      expect(res.status).toBe(200);
      expect(Buffer.compare(res.body, pdf)).toBe(0);
    });

    it('when If-None-Match carries the ETag, then 304 with no body', async () => {
      const { agent, url, body } = await uploaded();
      const res = await agent.get(url).set('If-None-Match', `"${body.sha256}"`);
      expect(res.status).toBe(304);
    });

    it('when the stored bytes are gone, then 404 as JSON, not a PDF header over an error', async () => {
      const { agent, pkg, url, body } = await uploaded();
      await t.ctx.storage.delete(`revisions/${pkg.current.id}/${body.id}.pdf`);
      const res = await agent.get(url);
      expect(res.status).toBe(404);
      expect(res.headers['content-type']).toMatch(/^application\/json/);
      expect(res.headers['content-disposition']).toBeUndefined();
      expect(res.body.error.message).toBe('No such file.');
    });

    it("when another organisation's contractor asks for a range, then 404 as before", async () => {
      const { url } = await uploaded();
      const w = await makeWorld(t.ctx.dataSource);
      const other = await signedIn(t.app, w.plannerB.email);
      expect((await other.get(url).set('Range', 'bytes=0-1023')).status).toBe(404);
    });

    it('when gzip is accepted, then a JSON route is gzip-encoded and the PDF download is not', async () => {
      const { agent, pkg, pdf, url } = await uploaded();
      await agent.put(`/api/packages/${pkg.package.id}/draft`).send({ inputs: example });
      const json = await agent.get(`/api/packages/${pkg.package.id}`).set('Accept-Encoding', 'gzip');
      expect(json.status).toBe(200);
      expect(json.headers['content-encoding']).toBe('gzip');
      expect(json.headers.vary).toMatch(/Accept-Encoding/);
      expect(json.body.current.inputs).toEqual(example);
      const file = await agent.get(url).set('Accept-Encoding', 'gzip').buffer(true);
      expect(file.status).toBe(200);
      expect(file.headers['content-encoding']).toBeUndefined();
      expect(file.headers['content-length']).toBe(String(pdf.byteLength));
      expect(Buffer.compare(file.body, pdf)).toBe(0);
      const part = await agent
        .get(url)
        .set('Accept-Encoding', 'gzip')
        .set('Range', 'bytes=0-1023')
        .buffer(true);
      expect(part.status).toBe(206);
      expect(part.headers['content-encoding']).toBeUndefined();
      expect(Buffer.compare(part.body, pdf.subarray(0, 1024))).toBe(0);
    });
  });

  it('when a second lift plan is uploaded, then it replaces the first on disk and in the database', async () => {
    const { agent, pkg } = await newDraft();
    const a = await agent
      .post(`/api/packages/${pkg.package.id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', Buffer.from(await makePdf(1)), 'a.pdf');
    const b = await agent
      .post(`/api/packages/${pkg.package.id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', Buffer.from(await makePdf(2)), 'b.pdf');
    expect(b.status).toBe(201);
    expect(await fileCount(pkg.current.id)).toBe(1);
    expect(await filesStored(pkg.current.id)).toEqual([`${b.body.id}.pdf`]);
    expect(a.body.id).not.toBe(b.body.id);
  });

  const refusals: Array<
    [string, () => Promise<{ bytes: Uint8Array; name: string }>, number, string, RegExp]
  > = [
    [
      'a text file named .pdf',
      async () => ({ bytes: new TextEncoder().encode('hello, not a pdf'), name: 'plan.pdf' }),
      415,
      'not_pdf',
      /%PDF-/,
    ],
    [
      'an empty file',
      async () => ({ bytes: new Uint8Array(), name: 'plan.pdf' }),
      400,
      'empty_file',
      /empty/,
    ],
    [
      'a truncated PDF',
      async () => ({ bytes: truncate(await makePdf(2)), name: 'plan.pdf' }),
      400,
      'truncated_pdf',
      /%%EOF/,
    ],
    [
      'an encrypted PDF',
      async () => ({ bytes: await makeEncryptedPdf(), name: 'plan.pdf' }),
      400,
      'encrypted_pdf',
      /password/,
    ],
    [
      'a PDF over the page limit',
      async () => ({ bytes: await makePdf(6), name: 'plan.pdf' }),
      400,
      'too_many_pages',
      /limit is 5/,
    ],
    [
      'a PDF over the size limit',
      async () => ({ bytes: new Uint8Array(250_000).fill(32), name: 'plan.pdf' }),
      413,
      'file_too_large',
      /0\.2 MB/,
    ],
    [
      'a file name with folder parts',
      async () => ({ bytes: await makePdf(1), name: '../../etc/plan.pdf' }),
      400,
      'bad_file_name',
      /folder parts/,
    ],
  ];
  for (const [what, make, status, code, message] of refusals) {
    it(`when ${what} is uploaded, then ${status} ${code} and nothing is stored`, async () => {
      const { agent, pkg } = await newDraft();
      const { bytes, name } = await make();
      const res = await agent
        .post(`/api/packages/${pkg.package.id}/files`)
        .field('kind', 'lift_plan')
        .attach('file', Buffer.from(bytes), {
          // form-data keeps folder parts only when the name is given as a file path.
          ...(name.includes('/') ? { filepath: name } : { filename: name }),
          contentType: 'application/pdf',
        } as { filename: string; contentType: string });
      expect(res.status).toBe(status);
      expect(res.body.error.code).toBe(code);
      expect(res.body.error.message).toMatch(message);
      expect(res.body.error.fields[0].path).toBe('file');
      expect(await fileCount(pkg.current.id)).toBe(0);
      expect(await filesStored(pkg.current.id)).toEqual([]);
    });
  }
});

describe('submit', () => {
  it('when the lift data is incomplete, then 400 names the fields under inputs and nothing freezes', async () => {
    const { agent, pkg } = await newDraft();
    await agent
      .put(`/api/packages/${pkg.package.id}/draft`)
      .send({ inputs: { ...example, crane: { ...example.crane, boomLength: { value: -3, unit: 'm' } } } });
    const res = await agent.post(`/api/packages/${pkg.package.id}/submit`);
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual(
      expect.arrayContaining([expect.objectContaining({ path: 'inputs.crane.boomLength.value' })]),
    );
    expect((await agent.get(`/api/packages/${pkg.package.id}`)).body.current.state).toBe('draft');
  });

  it('when no lift plan is uploaded, then 400 lift_plan_missing', async () => {
    const { agent, pkg } = await newDraft();
    await agent.put(`/api/packages/${pkg.package.id}/draft`).send({ inputs: example });
    const res = await agent.post(`/api/packages/${pkg.package.id}/submit`);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('lift_plan_missing');
  });

  it('when submitted twice, then the revision freezes once, one job is queued, and later changes get 409', async () => {
    const { agent, pkg } = await newDraft();
    const id = pkg.package.id;
    await agent.put(`/api/packages/${id}/draft`).send({ inputs: example });
    await agent
      .post(`/api/packages/${id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', Buffer.from(await makePdf()), 'plan.pdf');
    const [a, b] = await Promise.all([
      agent.post(`/api/packages/${id}/submit`),
      agent.post(`/api/packages/${id}/submit`),
    ]);
    expect([a.status, b.status].sort()).toEqual([202, 409]);
    const ok = a.status === 202 ? a : b;
    expect(ok.body.package.status).toBe('checking');
    expect(ok.body.current).toMatchObject({ state: 'submitted', check: { status: 'queued' } });
    const job = await t.ctx.queues.checkRun.getJob(checkRunJobId(ok.body.current.id));
    expect(job?.data).toEqual({ revisionId: ok.body.current.id });
    const again = await agent.put(`/api/packages/${id}/draft`).send({ inputs: {} });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_submitted');
    const upload = await agent
      .post(`/api/packages/${id}/files`)
      .field('kind', 'supporting')
      .attach('file', Buffer.from(await makePdf()), 'extra.pdf');
    expect(upload.status).toBe(409);
    await job?.remove();
  });

  it('when the reviewer opens the submitted package, then it is in the queue', async () => {
    const { w, agent, pkg } = await newDraft();
    const id = pkg.package.id;
    await agent.put(`/api/packages/${id}/draft`).send({ inputs: example });
    await agent
      .post(`/api/packages/${id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', Buffer.from(await makePdf()), 'plan.pdf');
    const sub = await agent.post(`/api/packages/${id}/submit`);
    const reviewer = await signedIn(t.app, w.reviewer.email);
    expect((await reviewer.get('/api/packages')).body.items.map((p: { id: string }) => p.id)).toContain(id);
    await (await t.ctx.queues.checkRun.getJob(checkRunJobId(sub.body.current.id)))?.remove();
  });
});

describe('calculations', () => {
  it('when a valid lift is posted, then the engine answers without storing anything', async () => {
    const { agent } = await newDraft();
    const res = await agent.post('/api/calculations').send({ input: example, units: 'imperial' });
    expect(res.status).toBe(200);
    expect(res.body.resultVersion).toBe(2);
    expect(res.body.checks.map((c: { id: string }) => c.id)).toEqual(
      expect.arrayContaining(['gross-load', 'capacity', 'stability', 'power-line']),
    );
    expect(res.body.units).toBe('imperial');
  });

  it('when the lift has a negative weight and an unknown unit, then 400 names both fields', async () => {
    const { agent } = await newDraft();
    const bad = {
      ...example,
      load: { ...example.load, weight: { value: -1, unit: 't' } },
      crane: { ...example.crane, radius: { value: 12, unit: 'furlong' } },
    };
    const res = await agent.post('/api/calculations').send({ input: bad });
    expect(res.status).toBe(400);
    const paths = res.body.error.fields.map((f: { path: string }) => f.path);
    expect(paths).toEqual(expect.arrayContaining(['input.load.weight.value', 'input.crane.radius.unit']));
  });

  it('when not signed in, then 401; the schema is JSON Schema of the lift', async () => {
    expect((await supertest(t.app).post('/api/calculations').send({ input: example })).status).toBe(401);
    const { agent } = await newDraft();
    const schema = await agent.get('/api/calculations/schema');
    expect(schema.status).toBe(200);
    expect(Object.keys(schema.body.properties)).toEqual(
      expect.arrayContaining(['crane', 'chart', 'load', 'stated']),
    );
  });
});
