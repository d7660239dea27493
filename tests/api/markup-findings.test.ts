// Markups carry their finding's number in the return ("F2" drawn by the markup), the findings
// list of the calculation sheet names the page and the markup of each finding tied to one, and a
// text markup wraps inside its box and stays on the page (word boxes from pdftotext -bbox).
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl } from '@server/config';
import { buildReturn } from '@server/modules/returns/service';
import { startTestApp, TEST_PASSWORD, type TestApp } from '../support/app';
import { desk, pdftotext, submitted } from '../support/review-desk';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

const flat = (text: string) => text.replace(/\s+/g, ' ');

/** Page 1's size and its words with their boxes (points, y down), from pdftotext -bbox. */
function wordBoxes(bytes: Buffer) {
  const file = path.join(os.tmpdir(), `marks-${Date.now()}-${Math.random()}.pdf`);
  fs.writeFileSync(file, bytes);
  try {
    const html = execFileSync('pdftotext', ['-f', '1', '-l', '1', '-bbox', file, '-'], { encoding: 'utf8' });
    const page = /<page width="([\d.]+)" height="([\d.]+)"/.exec(html)!;
    const words = [
      ...html.matchAll(
        /<word xMin="([\d.-]+)" yMin="([\d.-]+)" xMax="([\d.-]+)" yMax="([\d.-]+)">([^<]*)<\/word>/g,
      ),
    ].map((m) => ({ xMin: +m[1], yMin: +m[2], xMax: +m[3], yMax: +m[4], text: m[5] }));
    return { width: +page[1], height: +page[2], words };
  } finally {
    fs.rmSync(file, { force: true });
  }
}

const LONG_NOTE =
  'Exclusion zone fence moves north of gridline seven before the trial lift; banksman stands at the gate with a radio; no traffic on the access road while the load is above it.';

describe('markups and their findings in the stamped return', () => {
  it('when findings are tied to markups, then each markup shows its finding number, the sheet names the page and markup, and a text markup near the edge wraps on the page', async () => {
    const d = await desk(t);
    const p = await submitted(t, d.w, d.contractor);
    await d.reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: d.w.engineer.id });
    const mark = (body: Record<string, unknown>) =>
      d.engineer.post(`/api/packages/${p.id}/markups`).send({ fileId: p.fileId, pageNumber: 1, ...body });
    const cloud = await mark({ kind: 'cloud', geometry: { x: 120, y: 400, width: 160, height: 90 } });
    expect(cloud.status).toBe(201);
    const pin = await mark({ kind: 'pin', geometry: { x: 80, y: 300 } });
    expect(pin.status).toBe(201);
    const probe = wordBoxes(Buffer.from(await (await import('../support/pdfs')).makePdf(1)));
    // A text markup whose point sits 40 points from the right edge of the page.
    const text = await mark({
      kind: 'text',
      geometry: { x: probe.width - 40, y: 200, fontSize: 11 },
      text: LONG_NOTE,
    });
    expect(text.status).toBe(201);
    const finding = (body: Record<string, unknown>) =>
      d.engineer.post(`/api/packages/${p.id}/findings`).send({ severity: 'minor', ...body });
    expect((await finding({ text: 'Rigging drawing missing.' })).status).toBe(201);
    expect(
      (
        await finding({
          text: 'Mat layout under the front outriggers is not shown.',
          markupId: cloud.body.id,
          fileId: p.fileId,
          pageNumber: 1,
        })
      ).status,
    ).toBe(201);
    expect(
      (
        await finding({
          text: 'Name the lift director.',
          markupId: pin.body.id,
          fileId: p.fileId,
          pageNumber: 1,
        })
      ).status,
    ).toBe(201);
    const version = (await d.engineer.get(`/api/packages/${p.id}`)).body.package.version;
    const decided = await d.engineer
      .post(`/api/packages/${p.id}/decision`)
      .send({ decision: 'revise_and_resubmit', password: TEST_PASSWORD, baseVersion: version });
    expect(decided.status).toBe(200);
    const issued = await d.reviewer.post(`/api/packages/${p.id}/returns`);
    await buildReturn(t.ctx.dataSource, t.ctx.storage, issued.body.id, appUrl(t.ctx.config));
    const file = (await d.contractor.get(`/api/packages/${p.id}/returns/${issued.body.id}/file`).buffer(true))
      .body as Buffer;

    // KEEP_RETURN=1 leaves the return in test-output/ to look at (pdftoppm).
    if (process.env.KEEP_RETURN) fs.writeFileSync('test-output/markup-findings-return.pdf', file);
    const page1 = wordBoxes(file);
    const labels = page1.words.map((w) => w.text);
    expect(labels).toContain('F2');
    expect(labels).toContain('F3');
    expect(labels).not.toContain('F1');
    // Every word of the text markup is printed, on several lines, inside the page.
    const noteWords = LONG_NOTE.split(' ');
    const printed = page1.words.filter((w) => noteWords.includes(w.text));
    expect(printed.length).toBeGreaterThanOrEqual(noteWords.length);
    for (const w of printed) {
      expect(w.xMin).toBeGreaterThanOrEqual(0);
      expect(w.xMax).toBeLessThanOrEqual(page1.width);
      expect(w.yMin).toBeGreaterThanOrEqual(0);
      expect(w.yMax).toBeLessThanOrEqual(page1.height);
    }
    expect(new Set(printed.map((w) => Math.round(w.yMin))).size).toBeGreaterThan(3);

    const sheet = flat(await pdftotext(file));
    // The cells wrap side by side: read each row with the response column's words left out.
    const findings = sheet.slice(sheet.indexOf('FINDINGS')).split(' No response yet.').join('');
    expect(findings).toContain('F1 MINOR · open Rigging drawing missing. —');
    expect(findings).toMatch(
      /F2 MINOR · open Mat layout .*?Page 1 of the return .*?\(plan\.pdf, page 1\), cloud marked F2 F3 MINOR/,
    );
    expect(findings).toMatch(
      /F3 MINOR · open Name the lift director\. Page 1 of the return \(plan\.pdf, page 1\), pin 1 marked F3 4 Why/,
    );
  }, 60_000);
});
