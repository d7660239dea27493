// npm run bench:stamp: times the stamped return against qpdf's own overlay on the same files.
// Generates (once, in the system's temporary folder) a 1-page package, a 200-page vector package
// and a ~95 MB 60-page scanned package of random-noise images (nothing compresses), builds the
// full signed return of each with a few markups in a child process of its own (so its peak
// resident memory is that build's alone, from process.resourceUsage().maxRSS), times
// `qpdf IN --overlay STAMP --to=1 --from=1 -- OUT` on the same files in the same run, and prints
// seconds, peak RSS, sizes and the four targets of the stamping issue with their ratios.
//
// Then, in one more child process, the same files through the real job (scripts/bench-stamp-job.ts:
// throwaway PostgreSQL and Redis, the app and the stamp worker in-process; request → ready,
// storage and the stored sha-256 included), with the same targets.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { PDFDocument, rgb, StandardFonts } from 'pdf-lib';
import { benchThroughJob } from './bench-stamp-job';
import { scannedPackage, vectorPackage } from './lib/bench-packages';

const DIR = path.join(tmpdir(), 'cp-bench-stamp');
const ROUNDS = 3;

/** A 1-page overlay, as the qpdf command uses. */
async function overlayPdf(): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.HelveticaBold);
  const page = doc.addPage([595.28, 841.89]);
  page.drawRectangle({
    x: 340,
    y: 680,
    width: 230,
    height: 150,
    borderColor: rgb(0, 0, 0),
    borderWidth: 1.4,
  });
  page.drawText('REVIEW STAMP', { x: 350, y: 810, size: 8, font });
  return doc.save();
}

function ensure(file: string, make: () => Promise<Uint8Array>) {
  if (existsSync(file)) return Promise.resolve();
  return make().then((b) => writeFileSync(file, b));
}

interface ChildResult {
  cold: number;
  warm: number[];
  maxRssMb: number;
  pages: number;
  returnBytes: number;
  overlayBytes: number;
}

/** In the child: build the signed return `rounds` times, report times and peak RSS. */
async function child(file: string, rounds: number) {
  const { buildStampedReturnFile } = await import('../server/modules/returns/stamp-pdf');
  const { loadSigner } = await import('../server/lib/pdf-tools/signer');
  const { stampInput } = await import('../tests/unit/stamp-fixtures');
  const signer = await loadSigner({ DATA_DIR: path.join(DIR, 'desk') });
  const base = await stampInput();
  const id = base.documents[0].fileId;
  const input = {
    ...base,
    documents: [{ fileId: id, name: path.basename(file), file }],
    markups: base.markups.map((m) => ({ ...m, fileId: id })),
  };
  const out = path.join(DIR, `${path.basename(file)}.return.pdf`);
  const times: number[] = [];
  let built = { pages: 0, overlayBytes: 0 };
  for (let r = 0; r <= rounds; r++) {
    rmSync(out, { force: true });
    const t = process.hrtime.bigint();
    built = await buildStampedReturnFile(input, out, { signer, workDir: DIR });
    times.push(Number(process.hrtime.bigint() - t) / 1e9);
  }
  const result: ChildResult = {
    cold: times[0],
    warm: times.slice(1),
    maxRssMb: process.resourceUsage().maxRSS / 1024,
    pages: built.pages,
    returnBytes: statSync(out).size,
    overlayBytes: built.overlayBytes,
  };
  process.stdout.write(`RESULT ${JSON.stringify(result)}\n`);
}

function runChild(file: string): ChildResult {
  // spawns: node
  const r = spawnSync(
    process.execPath,
    ['--import', 'tsx', process.argv[1], '--child', file, String(ROUNDS)],
    {
      encoding: 'utf8',
      maxBuffer: 16 * 1024 * 1024,
    },
  );
  const line = r.stdout.split('\n').find((l) => l.startsWith('RESULT '));
  if (!line) throw new Error(`the builder failed on ${file}:\n${r.stderr}`);
  return JSON.parse(line.slice(7)) as ChildResult;
}

function qpdfOverlay(file: string, stamp: string): number {
  const out = path.join(DIR, 'qpdf-overlay-out.pdf');
  const times: number[] = [];
  for (let r = 0; r < ROUNDS; r++) {
    const t = process.hrtime.bigint();
    execFileSync('qpdf', [file, '--overlay', stamp, '--to=1', '--from=1', '--', out]);
    times.push(Number(process.hrtime.bigint() - t) / 1e9);
  }
  rmSync(out, { force: true });
  return Math.min(...times);
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const f = (n: number, d = 2) => n.toFixed(d);

async function main() {
  mkdirSync(DIR, { recursive: true });
  const files = {
    '1 page': path.join(DIR, 'one-page.pdf'),
    '200 pages vector': path.join(DIR, 'vector-200.pdf'),
    '60 pages scanned': path.join(DIR, 'scanned-60.pdf'),
  };
  const stamp = path.join(DIR, 'stamp-overlay.pdf');
  await ensure(files['1 page'], () => vectorPackage(1));
  await ensure(files['200 pages vector'], () => vectorPackage(200));
  await ensure(files['60 pages scanned'], scannedPackage);
  await ensure(stamp, overlayPdf);

  const rows: Array<{ name: string; input: number; r: ChildResult; qpdf: number }> = [];
  for (const [name, file] of Object.entries(files)) {
    const r = runChild(file);
    rows.push({ name, input: statSync(file).size, r, qpdf: qpdfOverlay(file, stamp) });
  }
  console.log(
    `stamped return, signed; builder in its own process; ${ROUNDS} warm builds after one cold build\n`,
  );
  console.log(
    'package            input MB  pages  cold s  warm s (median)  qpdf overlay s  peak RSS MB  return MB  overlay+sheet MB',
  );
  for (const { name, input, r, qpdf } of rows)
    console.log(
      `${name.padEnd(18)} ${f(input / 1e6).padStart(8)}  ${String(r.pages).padStart(5)}  ${f(r.cold).padStart(6)}  ${f(
        median(r.warm),
      ).padStart(15)}  ${f(qpdf, 3).padStart(14)}  ${f(r.maxRssMb, 0).padStart(11)}  ${f(
        r.returnBytes / 1e6,
        3,
      ).padStart(9)}  ${f(r.overlayBytes / 1e6, 3).padStart(16)}`,
    );
  const one = rows[0];
  const big = rows[2];
  const sizeDependent = median(big.r.warm) - median(one.r.warm);
  const ratio = sizeDependent / big.qpdf;
  const growth = big.r.maxRssMb - one.r.maxRssMb;
  console.log('\ntargets');
  console.log(
    `  size-dependent part t(95 MB) − t(1 page) = ${f(sizeDependent)} s = ${f(ratio)} × qpdf overlay (${f(
      big.qpdf,
      3,
    )} s); target ≤ 2.5 ×: ${ratio <= 2.5 ? 'met' : 'NOT met'}`,
  );
  console.log(
    `  fixed part t(1 page) = ${f(median(one.r.warm))} s warm, ${f(one.r.cold)} s cold (first return in a process); target ≤ 0.5 s: ${
      median(one.r.warm) <= 0.5 ? 'met (warm)' : 'NOT met (warm)'
    }${one.r.cold <= 0.5 ? ', met cold' : ', not met cold'}`,
  );
  console.log(
    `  peak RSS growth 1 page → 95 MB = ${f(growth, 0)} MB; target ≤ 150 MB: ${growth <= 150 ? 'met' : 'NOT met'}`,
  );
  for (const { name, input, r } of rows) {
    const limit = (input + r.overlayBytes) * 1.02;
    console.log(
      `  size ${name}: ${f(r.returnBytes / 1e6, 3)} MB ≤ (input ${f(input / 1e6, 3)} + overlay and sheet ${f(
        r.overlayBytes / 1e6,
        3,
      )}) × 1.02 = ${f(limit / 1e6, 3)} MB: ${r.returnBytes <= limit ? 'met' : 'NOT met'}`,
    );
  }

  // spawns: node
  const j = spawnSync(
    process.execPath,
    ['--import', 'tsx', process.argv[1], '--job', ...Object.values(files)],
    {
      encoding: 'utf8',
      maxBuffer: 16 * 1024 * 1024,
    },
  );
  const jobLine = j.stdout.split('\n').find((l) => l.startsWith('RESULT '));
  if (!jobLine) {
    console.log(`\nthrough the real job: failed\n${j.stderr.slice(-4000)}`);
    return;
  }
  const job = JSON.parse(jobLine.slice(7)) as Awaited<ReturnType<typeof benchThroughJob>>;
  console.log(
    '\nthrough the real job (request → ready: API, queue, worker, storage, stored sha-256; the app and worker in one process)',
  );
  console.log('package            pages  cold s  warm s  (warm: queued s, worker run s)');
  Object.keys(files).forEach((name, i) => {
    const fig = job.figures[i];
    console.log(
      `${name.padEnd(18)} ${String(fig.pages).padStart(5)}  ${f(fig.seconds[0]).padStart(6)}  ${f(fig.seconds[1]).padStart(6)}  (${f(fig.queuedSeconds[1] ?? NaN)}, ${f(fig.runSeconds[1] ?? NaN)})`,
    );
  });
  const jobOne = job.figures[0].seconds[1];
  const jobBig = job.figures[2].seconds[1];
  const jobRatio = (jobBig - jobOne) / big.qpdf;
  console.log(
    `  size-dependent part through the job t(95 MB) − t(1 page) = ${f(jobBig - jobOne)} s = ${f(jobRatio)} × qpdf overlay; target ≤ 3 ×: ${
      jobRatio <= 3 ? 'met' : 'NOT met'
    }`,
  );
  console.log(`  fixed part through the job t(1 page) = ${f(jobOne)} s warm`);
  console.log(`  peak RSS of the process holding the app and the worker: ${f(job.maxRssMb, 0)} MB`);
}

if (process.argv[2] === '--child') await child(process.argv[3], Number(process.argv[4] ?? 1));
else if (process.argv[2] === '--job')
  process.stdout.write(`RESULT ${JSON.stringify(await benchThroughJob(process.argv.slice(3)))}\n`);
else await main();
