// The built client as the API process serves it: hashed assets cached for a year, index.html
// revalidated on every load, a missing asset a 404 (never index.html), and text compressed.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '@server/app';
import { IMMUTABLE } from '@server/middleware/delivery';
import { startTestApp, type TestApp } from '../support/app';

let t: TestApp;
let dir: string;
let client: supertest.Agent;
// What a Vite build leaves in dist/: index.html naming hashed chunks under assets/.
const chunk = `export const rows = [${Array.from({ length: 400 }, (_, i) => `"row ${i}"`).join(',')}];\n`;

beforeAll(async () => {
  t = await startTestApp();
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cp-client-'));
  fs.mkdirSync(path.join(dir, 'assets'));
  fs.writeFileSync(
    path.join(dir, 'index.html'),
    '<!doctype html><script type="module" src="/assets/index-B4x9Qz1k.js"></script>',
  );
  fs.writeFileSync(path.join(dir, 'assets', 'index-B4x9Qz1k.js'), chunk);
  fs.writeFileSync(path.join(dir, 'favicon.svg'), '<svg xmlns="http://www.w3.org/2000/svg"/>');
  client = supertest.agent(createApp(t.ctx, { clientDir: dir }));
});
afterAll(async () => {
  fs.rmSync(dir, { recursive: true, force: true });
  await t.close();
});

describe('the built client', () => {
  it('when a hashed asset is fetched, then it is cached for a year as immutable and gzip-encoded', async () => {
    const res = await client.get('/assets/index-B4x9Qz1k.js').set('Accept-Encoding', 'gzip');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe(IMMUTABLE);
    expect(IMMUTABLE).toBe('public, max-age=31536000, immutable');
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.text).toBe(chunk);
  });

  it('when index.html is loaded at / or a client route or by name, then it is revalidated every time', async () => {
    for (const url of ['/', '/packages/3f0c1c9e-0000-4000-8000-000000000000', '/index.html']) {
      const res = await client.get(url);
      expect(res.status, url).toBe(200);
      expect(res.headers['content-type'], url).toMatch(/^text\/html/);
      expect(res.headers['cache-control'], url).toBe('no-cache');
    }
  });

  it('when an asset that is not in the build is asked for, then 404, not index.html', async () => {
    const res = await client.get('/assets/index-OLDHASH1.js');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/^application\/json/);
    expect(res.headers['cache-control']).toBeUndefined();
  });

  it('when another file of the build is fetched, then it keeps the short cache', async () => {
    const res = await client.get('/favicon.svg');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('public, max-age=3600');
  });

  it('when an asset is asked for by range, then the part is sent as it is stored, not gzip-encoded', async () => {
    const res = await client
      .get('/assets/index-B4x9Qz1k.js')
      .set('Accept-Encoding', 'gzip')
      .set('Range', 'bytes=0-99');
    expect(res.status).toBe(206);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.text).toBe(chunk.slice(0, 100));
  });
});
