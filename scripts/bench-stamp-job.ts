// The stamped return through the real job, for npm run bench:stamp: a throwaway PostgreSQL and
// Redis (as the test command starts them), the migrations, the Express app and the stamp worker
// in this one process (supertest drives the app; the worker consumes the stamp queue over the
// real Redis). For each bench file a package goes through draft, upload, submit, the check run,
// assignment, three markups and a decision; the clock runs from the reviewer's
// POST /api/packages/:id/returns to the moment GET …/returns reports the return `ready` — so
// it includes the queue hand-off, reading the originals out of storage, the build and signature,
// storing the file and its sha-256. The stored sha-256 is then checked against the download.
// Each file is issued twice (two packages); the second, warm, figure is the one reported.
import 'reflect-metadata';
import { createHash } from 'node:crypto';
import { readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { benchPeople, benchServices, decidedPackage, must } from './lib/bench-flow';

export interface JobFigure {
  file: string;
  seconds: number[];
  /** Of the same runs: waiting in the queue, and the worker's run (BullMQ's own timestamps). */
  queuedSeconds: number[];
  runSeconds: number[];
  pages: number;
}

export async function benchThroughJob(files: string[]): Promise<{ figures: JobFigure[]; maxRssMb: number }> {
  const { dir, stops } = await benchServices('cp-bench-job-', { NODE_ENV: 'test' });
  try {
    const { loadConfig } = await import('../server/config');
    const { connect } = await import('../server/bootstrap');
    const { createApp } = await import('../server/app');
    const { createRedis } = await import('../server/lib/redis');
    const { runCheckRun: runCheck } = await import('../server/modules/check-runs/service');
    const { stampedReturnTask: stampTask } = await import('../worker/tasks/stamped-return-task');
    const { startTask } = await import('../worker/tasks/task');
    const { signerFor } = await import('../server/lib/pdf-tools/signer');
    const { makeWorld } = await import('../tests/support/factories');
    const { signedIn, TEST_PASSWORD } = await import('../tests/support/app');
    const config = loadConfig();
    const ctx = await connect(config);
    stops.unshift(async () => ctx.close?.());
    const app = createApp(ctx, { clientDir: '/nonexistent' });
    const connection = createRedis(config.REDIS_URL, { forWorker: true });
    connection.on('error', () => undefined);
    const worker = startTask(ctx, connection, stampTask(ctx, 1, await signerFor(config)));
    stops.unshift(async () => {
      await worker.close();
      connection.disconnect();
    });
    const inputs = JSON.parse(readFileSync('shared/engineering/examples/pass-outriggers.json', 'utf8'));
    const w = await makeWorld(ctx.dataSource);
    const people = await benchPeople((email) => signedIn(app, email), w);
    const { reviewer } = people;
    const figures: JobFigure[] = [];
    for (const file of files) {
      const bytes = readFileSync(file);
      const figure: JobFigure = { file, seconds: [], queuedSeconds: [], runSeconds: [], pages: 0 };
      for (let round = 0; round < 2; round++) {
        const id = await decidedPackage({
          ...people,
          password: TEST_PASSWORD,
          title: `Bench ${path.basename(file)} ${round}`,
          inputs,
          plan: bytes,
          planName: path.basename(file),
          runCheck,
          ds: ctx.dataSource,
          markups: true,
        });
        const t0 = process.hrtime.bigint();
        const issued = must(await reviewer.post(`/api/packages/${id}/returns`), 202, 'issue');
        let item: { id: string; state: string; sha256: string; pages: number } | undefined;
        for (;;) {
          const list = await reviewer.get(`/api/packages/${id}/returns`);
          item = list.body.items?.find((r: { id: string }) => r.id === issued.body.id);
          if (item?.state === 'ready') break;
          if (item?.state === 'failed') throw new Error(`the return failed: ${JSON.stringify(item)}`);
          await new Promise((r) => setTimeout(r, 10));
        }
        figure.seconds.push(Number(process.hrtime.bigint() - t0) / 1e9);
        const dl = await reviewer.get(`/api/packages/${id}/returns/${item.id}/file`).buffer(true);
        const sha = createHash('sha256').update(dl.body).digest('hex');
        if (sha !== item.sha256) throw new Error(`the stored sha-256 of ${file} does not match the download`);
        figure.pages = item.pages;
        const [decision] = await ctx.dataSource.query(
          'SELECT id FROM decisions WHERE package_id = $1 ORDER BY created_at DESC LIMIT 1',
          [id],
        );
        const job = await ctx.queues.stampedReturn.getJob(`stamp-${decision.id}`);
        if (job?.processedOn && job.finishedOn) {
          figure.queuedSeconds.push((job.processedOn - job.timestamp) / 1000);
          figure.runSeconds.push((job.finishedOn - job.processedOn) / 1000);
        }
      }
      figures.push(figure);
    }
    return { figures, maxRssMb: process.resourceUsage().maxRSS / 1024 };
  } finally {
    for (const stop of stops) {
      try {
        await stop();
      } catch {
        // A service that will not stop is left to the temporary folder's cleanup.
      }
    }
    rmSync(dir, { recursive: true, force: true });
  }
}
