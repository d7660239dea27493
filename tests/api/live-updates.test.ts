// Live updates and hand-offs over real HTTP: a coordinator's open page hears of a package
// submitted at their site (announced by PostgreSQL when the change commits, whichever process
// made it), and of the hand-off mail written for them; a contractor of another organisation
// hears nothing of it. The hand-off list is the person's own, with its unread count, and
// marking read answers the new count; bad input names the field and the limit.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, TEST_PASSWORD, type TestApp } from '../support/app';
import { makeWorld } from '../support/factories';
import { submitted, passing } from '../support/review-desk';

let t: TestApp;
let server: http.Server;
let base = '';
beforeAll(async () => {
  t = await startTestApp();
  server = t.app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  server.closeAllConnections();
  await new Promise((r) => server.close(r));
  await t.close();
});

async function cookieOf(email: string): Promise<string> {
  const res = await supertest(t.app)
    .post('/api/auth/sign-in')
    .set('X-CSRF-Guard', '1')
    .send({ email, password: TEST_PASSWORD });
  expect(res.status).toBe(200);
  return ([] as string[])
    .concat(res.headers['set-cookie'] ?? [])
    .map((c) => c.split(';')[0])
    .join('; ');
}

/** An open event stream: every event it receives, by name, and a way to wait for one. */
function listen(cookie: string) {
  const events: Array<{ event: string; data: Record<string, unknown> }> = [];
  let buffer = '';
  let request: http.ClientRequest;
  const ready = new Promise<number>((resolve, reject) => {
    request = http.get(`${base}/api/live`, { headers: { cookie } }, (res) => {
      res.setEncoding('utf8');
      res.on('data', (chunk: string) => {
        buffer += chunk;
        let at: number;
        while ((at = buffer.indexOf('\n\n')) >= 0) {
          const block = buffer.slice(0, at);
          buffer = buffer.slice(at + 2);
          const event = /^event: (.*)$/m.exec(block)?.[1];
          const data = /^data: (.*)$/m.exec(block)?.[1];
          if (event) events.push({ event, data: JSON.parse(data ?? '{}') });
          if (event === 'ready') resolve(res.statusCode ?? 0);
        }
      });
      if (res.statusCode !== 200) resolve(res.statusCode ?? 0);
    });
    request.on('error', reject);
  });
  return {
    ready,
    events,
    async waitFor(match: (e: { event: string; data: Record<string, unknown> }) => boolean, ms = 5000) {
      const until = Date.now() + ms;
      while (Date.now() < until) {
        if (events.some(match)) return true;
        await new Promise((r) => setTimeout(r, 50));
      }
      return false;
    },
    close: () => request.destroy(),
  };
}

describe('live updates', () => {
  it('when a package is submitted at a site, then its coordinator hears of it and of the hand-off, and another organisation hears nothing', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const coordinator = listen(await cookieOf(w.reviewer.email));
    const stranger = listen(await cookieOf(w.plannerB.email));
    expect(await coordinator.ready).toBe(200);
    expect(await stranger.ready).toBe(200);

    const contractor = supertest.agent(t.app).set('X-CSRF-Guard', '1');
    await contractor.post('/api/auth/sign-in').send({ email: w.plannerA.email, password: TEST_PASSWORD });
    const p = await submitted(t, w, contractor, passing, 'Heard live');

    expect(await coordinator.waitFor((e) => e.event === 'package' && e.data.packageId === p.id)).toBe(true);
    expect(await coordinator.waitFor((e) => e.event === 'handoff')).toBe(true);
    // Give the stranger's stream the same time to hear anything it should not.
    await new Promise((r) => setTimeout(r, 300));
    expect(stranger.events.filter((e) => e.event === 'package' || e.event === 'handoff')).toEqual([]);
    coordinator.close();
    stranger.close();

    // The hand-off list: the coordinator's own, unread, in words.
    const reviewer = supertest.agent(t.app).set('X-CSRF-Guard', '1');
    await reviewer.post('/api/auth/sign-in').send({ email: w.reviewer.email, password: TEST_PASSWORD });
    const list = await reviewer.get('/api/hand-offs');
    expect(list.status).toBe(200);
    const mine = list.body.items.filter((i: { packageId: string }) => i.packageId === p.id);
    expect(mine).toEqual([
      expect.objectContaining({
        kind: 'Submitted for review',
        read: false,
        text: expect.stringContaining('submitted'),
      }),
    ]);
    expect(list.body.unread).toBeGreaterThanOrEqual(1);
    const read = await reviewer.post('/api/hand-offs/read').send({ ids: [mine[0].id] });
    expect(read.status).toBe(200);
    expect(read.body.unread).toBe(list.body.unread - 1);
    // Someone else's list does not hold it, and cannot mark it.
    const other = supertest.agent(t.app).set('X-CSRF-Guard', '1');
    await other.post('/api/auth/sign-in').send({ email: w.plannerB.email, password: TEST_PASSWORD });
    const theirs = await other.get('/api/hand-offs');
    expect(theirs.body.items.some((i: { id: string }) => i.id === mine[0].id)).toBe(false);

    const empty = await reviewer.post('/api/hand-offs/read').send({});
    expect(empty.status).toBe(400);
    expect(JSON.stringify(empty.body)).toMatch(/name the hand-offs to mark read/);
    const tooMany = await reviewer
      .post('/api/hand-offs/read')
      .send({ ids: Array.from({ length: 201 }, () => mine[0].id) });
    expect(tooMany.status).toBe(400);
    expect(JSON.stringify(tooMany.body)).toMatch(/at most 200/);
  }, 30_000);

  it('when no one is signed in, then the stream answers 401', async () => {
    const anonymous = listen('');
    expect(await anonymous.ready).toBe(401);
    anonymous.close();
  });
});
