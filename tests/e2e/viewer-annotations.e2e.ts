// The review workspace shows a plan's pages as the stamped return will print them: the page
// content alone. A contractor's PDF whose page 1 carries an opaque green stamp annotation
// reading "ACCEPTED" is drawn without it (the return drops it too), while the page's own text
// and frame are drawn.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { PDFDocument, PDFName, rgb, StandardFonts } from 'pdf-lib';
import type { APIRequestContext, Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { close, launch, screenshot, screenshotOnFailure, signedIn, unique, WAIT } from './support/browser';
import { apiAs, assign, engineerId, submittedPackage } from './support/api';

const PAGE = { width: 842, height: 595 };
// Where the annotation sits, in PDF points from the bottom-left corner.
const ANNOT = { x: 480, y: 300, width: 300, height: 200 };

let browser: Browser;
let contractor: APIRequestContext;
let reviewer: APIRequestContext;

async function planWithForgedStamp(title: string): Promise<string> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.HelveticaBold);
  const page = doc.addPage([PAGE.width, PAGE.height]);
  page.drawText(`${title}: set the drive unit`, { x: 48, y: 540, size: 18, font });
  page.drawRectangle({ x: 48, y: 80, width: 746, height: 420, borderWidth: 2, borderColor: rgb(0, 0, 0) });
  const ctx = doc.context;
  const { width, height } = ANNOT;
  const appearance = ctx.stream(
    `0 0.6 0 rg 0 0 ${width} ${height} re f BT /F 40 Tf 1 1 1 rg 30 80 Td (ACCEPTED) Tj ET`,
    { Type: 'XObject', Subtype: 'Form', BBox: [0, 0, width, height], Resources: { Font: { F: font.ref } } },
  );
  const stamp = ctx.register(
    ctx.obj({
      Type: 'Annot',
      Subtype: 'Stamp',
      Rect: [ANNOT.x, ANNOT.y, ANNOT.x + width, ANNOT.y + height],
      F: 4,
      AP: { N: ctx.register(appearance) },
    }),
  );
  page.node.set(PDFName.of('Annots'), ctx.obj([stamp]));
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'counterpoise-pdf-')), 'forged.pdf');
  fs.writeFileSync(file, await doc.save());
  return file;
}

screenshotOnFailure();
beforeAll(async () => {
  browser = await launch();
  [contractor, reviewer] = await Promise.all([apiAs('contractor'), apiAs('reviewer')]);
});
afterAll(async () => {
  await Promise.all([contractor?.dispose(), reviewer?.dispose()]);
  await close(browser);
});

describe('the review viewer', () => {
  it('when a plan carries its own opaque annotation, then the workspace draws the page content without it', async () => {
    const title = unique('E2E forged stamp');
    const pkg = await submittedPackage(contractor, title, 1, await planWithForgedStamp(title));
    await assign(reviewer, [pkg.id], await engineerId(reviewer, 'Dev Marsh'));

    const desk = await signedIn(browser, 'engineer');
    const page = desk.page;
    await page.goto(`/packages/${pkg.id}/review`);
    const canvas = page.getByRole('img', { name: /^Page 1 of 1,/ });
    await canvas.waitFor({ timeout: WAIT.job });
    // Once drawn: the page's frame and heading are ink; the annotation's rectangle would be
    // solid green if pdf.js drew it.
    const read = () =>
      canvas.evaluate(
        (el: HTMLCanvasElement, { annot, sheet }) => {
          const ctx = el.getContext('2d')!;
          const { data, width, height } = ctx.getImageData(0, 0, el.width, el.height);
          const sx = width / sheet.width;
          const sy = height / sheet.height;
          const x0 = Math.round(annot.x * sx);
          const x1 = Math.round((annot.x + annot.width) * sx);
          const y0 = Math.round((sheet.height - annot.y - annot.height) * sy);
          const y1 = Math.round((sheet.height - annot.y) * sy);
          let ink = 0;
          let green = 0;
          for (let y = 0; y < height; y += 2) {
            for (let x = 0; x < width; x += 2) {
              const i = (y * width + x) * 4;
              const [r, g, b] = [data[i], data[i + 1], data[i + 2]];
              if (r < 100 && g < 100 && b < 100) ink += 1;
              if (x >= x0 && x < x1 && y >= y0 && y < y1 && g > 110 && r < 60 && b < 60) green += 1;
            }
          }
          return { ink, green };
        },
        { annot: ANNOT, sheet: PAGE },
      );
    await expect.poll(async () => (await read()).ink, { timeout: WAIT.ui }).toBeGreaterThan(150);
    expect((await read()).green).toBe(0);
    await screenshot(page, 'viewer-without-annotations');
    await desk.context.close();
  });
});
