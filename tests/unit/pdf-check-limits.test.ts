// The PDF check's time limit: a check that runs past UPLOAD_CHECK_SECONDS is refused in words
// naming the file, and its whole process group (the check's node process and the qpdf it
// runs) is gone, not left running beside the API.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inspectPdf } from '@server/modules/files/pdf-check';
import { writeNoisePdf } from '../support/big-pdfs';

let dir: string;
let big: string;

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cp-check-limit-'));
  big = path.join(dir, 'slow-scan.pdf');
  await writeNoisePdf(big, 300 * 1000 * 1000);
}, 60_000);
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

/** The processes whose command line names `file`. */
function processesReading(file: string): string[] {
  return fs
    .readdirSync('/proc')
    .filter((p) => /^\d+$/.test(p))
    .map((p) => {
      try {
        return fs.readFileSync(`/proc/${p}/cmdline`, 'utf8').replace(/\0/g, ' ');
      } catch {
        return '';
      }
    })
    .filter((cmd) => cmd.includes(file));
}

describe('the time limit of the PDF check', () => {
  it('when the check of a 300 MB scan runs past a 1 s limit, then 422 pdf_check_timeout names the file and no check process is left', async () => {
    const started = Date.now();
    const error = await inspectPdf(
      { workFile: big, size: fs.statSync(big).size },
      { maxPages: 500, decodeMaxBytes: 256 * 1024 * 1024, checkSeconds: 1, workDir: dir },
      'slow-scan.pdf',
    ).catch((e: unknown) => e);
    expect(Date.now() - started).toBeLessThan(5000);
    expect(error).toMatchObject({
      status: 422,
      code: 'pdf_check_timeout',
      message:
        'The file “slow-scan.pdf” took longer than 1 s to check, the desk’s limit. Save or print it as a new PDF (flattened, without layers) and upload that copy.',
    });
    await new Promise((r) => setTimeout(r, 200));
    expect(processesReading(big)).toEqual([]);
    // The check's scratch folder (qpdf had begun writing the image's bytes there) is gone too.
    expect(fs.readdirSync(dir)).toEqual(['slow-scan.pdf']);
  }, 60_000);
});
