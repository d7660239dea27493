// The decompression budget of the PDF check (server/modules/files/pdf-inspect.ts), on files
// made here: a bomb is stopped at the budget whether its stream is packed once with Flate,
// twice, or under a filter that qpdf unpacks; a file within the budget is taken with its pages.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inspectFile } from '@server/modules/files/pdf-inspect';
import { writeBombPdf } from '../support/big-pdfs';
import { makePdf } from '../support/pdfs';

const MB = 1024 * 1024;
let dir: string;
beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cp-budget-'));
});
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

async function inspect(file: string, decodeBudget: number) {
  const scratch = fs.mkdtempSync(path.join(dir, 'scratch-'));
  const started = Date.now();
  const result = await inspectFile(file, { maxPages: 500, decodeBudget, scratch });
  return { result, ms: Date.now() - started };
}

describe('the decompression budget', () => {
  for (const wrap of [undefined, 'flate', 'hex'] as const) {
    it(`when a page's content unpacks to 256 MiB${wrap ? ` under ${wrap === 'flate' ? 'a second Flate' : 'ASCIIHex'}` : ''} against a 64 MiB budget, then the check stops at the budget and names page 1`, async () => {
      const file = path.join(dir, `bomb-${wrap ?? 'plain'}.pdf`);
      await writeBombPdf(file, 256 * MB, wrap);
      const { result, ms } = await inspect(file, 64 * MB);
      process.stdout.write(
        `bomb ${wrap ?? 'plain'}: ${fs.statSync(file).size} bytes on disk, refused in ${ms} ms\n`,
      );
      expect(result).toEqual({ ok: false, refusal: 'decode_budget', budget: 64 * MB, page: 1 });
    }, 60_000);
  }

  it('when the same page unpacks to less than the budget, then the file is taken', async () => {
    const file = path.join(dir, 'packed-but-fine.pdf');
    await writeBombPdf(file, 16 * MB, 'flate');
    const { result } = await inspect(file, 64 * MB);
    expect(result).toMatchObject({ ok: true, pages: 1 });
  }, 60_000);

  it('when an ordinary plan is checked, then its pages are counted and it carries nothing else', async () => {
    const file = path.join(dir, 'plan.pdf');
    fs.writeFileSync(file, await makePdf(3));
    const { result } = await inspect(file, 64 * MB);
    expect(result).toEqual({
      ok: true,
      pages: 3,
      contents: { annotations: [], javascript: 0, actions: 0, embeddedFiles: 0, formFields: 0, xfa: false },
    });
  });
});
