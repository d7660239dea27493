// The engineer's placement of the stamp block (issue 12 item 7): where it lands is answered
// from page 1 of the plan as the stamp builder reads it; a placement off the page is refused
// naming the field and its limit, one over the plan's content is refused in words (422); the
// preview and the issued return put the block where it was placed; once the return is
// requested the placement is fixed (409), like the decision.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildReturn } from '@server/modules/returns/service';
import { appUrl } from '@server/config';
import { signedIn, startTestApp, TEST_PASSWORD, type TestApp } from '../support/app';
import { makeWorld } from '../support/factories';
import { desk, submitted } from '../support/review-desk';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

/** The box of the first word `text` on page 1, in points from the top-left corner. */
function wordBox(bytes: Buffer, text: string) {
  const file = path.join(os.tmpdir(), `placement-${Date.now()}-${Math.random()}.pdf`);
  fs.writeFileSync(file, bytes);
  try {
    // spawns: pdftotext
    const xml = execFileSync('pdftotext', ['-bbox', '-f', '1', '-l', '1', file, '-'], { encoding: 'utf8' });
    const m = new RegExp(
      `<word xMin="([\\d.]+)" yMin="([\\d.]+)" xMax="([\\d.]+)" yMax="([\\d.]+)">${text}</word>`,
    ).exec(xml);
    return m ? { xMin: +m[1], yMin: +m[2], xMax: +m[3], yMax: +m[4] } : null;
  } finally {
    fs.rmSync(file, { force: true });
  }
}

describe('the stamp placement', () => {
  it('when the engineer places the stamp, then it is checked against page 1, printed where placed, and fixed once the return is requested', async () => {
    const d = await desk(t);
    const p = await submitted(t, d.w, d.contractor);
    await d.reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: d.w.engineer.id });
    const url = `/api/packages/${p.id}/stamp-placement`;

    // The plan's page 1 carries its title at the top left: the desk picks the top right.
    const first = await d.engineer.get(url);
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({
      revision: 1,
      placement: null,
      page: { width: 595, height: 842 },
      stamp: { width: 230, height: 150 },
      lands: { on: 'page', how: 'top-right', rect: { x: 347, y: 674, width: 230, height: 150 } },
    });

    const off = await d.engineer.put(url).send({ x: 400, y: 100 });
    expect(off.status).toBe(400);
    expect(off.body.error.fields).toEqual([
      { path: 'x', message: 'X must be between 0 and 365 pt: page 1 is 595 pt wide and the stamp 230 pt' },
    ]);
    const negative = await d.engineer.put(url).send({ x: -5, y: 100 });
    expect(negative.status).toBe(400);
    expect(JSON.stringify(negative.body.error.fields)).toContain('X must be 0 or more');

    const over = await d.engineer.put(url).send({ x: 40, y: 640 });
    expect(over.status).toBe(422);
    expect(over.body.error.code).toBe('stamp_over_content');
    expect(over.body.error.message).toContain('would cover part of page 1');

    const placed = await d.engineer.put(url).send({ x: 200, y: 300 });
    expect(placed.status).toBe(200);
    expect(placed.body.placement).toEqual({ x: 200, y: 300 });
    expect(placed.body.lands).toEqual({
      on: 'page',
      how: 'placed',
      rect: { x: 200, y: 300, width: 230, height: 150 },
    });
    expect((await d.reviewer.get(url)).body.placement).toEqual({ x: 200, y: 300 });
    expect((await d.contractor.get(url)).status).toBe(403);
    expect((await d.reviewer.put(url).send({ x: 200, y: 300 })).status).toBe(403);
    const other = await makeWorld(t.ctx.dataSource);
    expect((await (await signedIn(t.app, other.engineer.email)).get(url)).status).toBe(404);

    const version = (await d.engineer.get(`/api/packages/${p.id}`)).body.package.version;
    const decided = await d.engineer.post(`/api/packages/${p.id}/decision`).send({
      decision: 'accepted',
      conditions: '',
      password: TEST_PASSWORD,
      baseVersion: version,
    });
    expect(decided.status).toBe(200);
    // After the decision and before the return the placement can still change.
    expect((await d.engineer.put(url).send({ x: 210, y: 300 })).status).toBe(200);

    // The preview and the return print "REVIEW STAMP" 7 pt in from the block's left edge, in its top band.
    const preview = await d.reviewer.get(`/api/packages/${p.id}/returns/preview`).buffer(true);
    expect(preview.status).toBe(200);
    const inPreview = wordBox(preview.body as Buffer, 'REVIEW')!;
    expect(inPreview.xMin).toBeCloseTo(217, 0);
    expect(inPreview.yMin).toBeGreaterThan(842 - 450);
    expect(inPreview.yMax).toBeLessThan(842 - 450 + 15);

    const issued = await d.reviewer.post(`/api/packages/${p.id}/returns`);
    expect(issued.status).toBe(202);
    const moved = await d.engineer.put(url).send({ x: 300, y: 300 });
    expect(moved.status).toBe(409);
    expect(moved.body.error.code).toBe('return_issued');
    expect((await d.engineer.delete(url)).status).toBe(409);

    await buildReturn(t.ctx.dataSource, t.ctx.storage, issued.body.id, appUrl(t.ctx.config));
    const file = await d.reviewer.get(`/api/packages/${p.id}/returns/${issued.body.id}/file`).buffer(true);
    expect(file.status).toBe(200);
    expect(wordBox(file.body as Buffer, 'REVIEW')).toEqual(inPreview);
  }, 90_000);

  it('when the engineer hands the placement back, then the desk chooses again', async () => {
    const d = await desk(t);
    const p = await submitted(t, d.w, d.contractor);
    await d.reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: d.w.engineer.id });
    const url = `/api/packages/${p.id}/stamp-placement`;
    expect((await d.engineer.put(url).send({ x: 100, y: 100 })).status).toBe(200);
    const reset = await d.engineer.delete(url);
    expect(reset.status).toBe(200);
    expect(reset.body).toMatchObject({ placement: null, lands: { on: 'page', how: 'top-right' } });
    const bad = await d.engineer.put(url).send({ x: 'left', y: 100 });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body.error.fields)).toContain('X must be a number of points');
  }, 60_000);
});
