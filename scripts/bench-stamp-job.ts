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
import { createHash, randomBytes } from 'node:crypto';
import { chmodSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import supertest from 'supertest';
import { freePort, startPostgres, startRedis } from './lib/services';
import { runMigrations } from './lib/migrate';

export interface JobFigure {
  file: string;
  seconds: number[];
  /** Of the same runs: waiting in the queue, and the worker's run (BullMQ's own timestamps). */
  queuedSeconds: number[];
  runSeconds: number[];
  pages: number;
}

export async function benchThroughJob(files: string[]): Promise<{ figures: JobFigure[]; maxRssMb: number }> {
  const dir = mkdtempSync(path.join(tmpdir(), 'cp-bench-job-'));
  // PostgreSQL runs as its own user when this runs as root (scripts/lib/services.ts).
  chmodSync(dir, 0o755);
  const pg = await startPostgres(path.join(dir, 'pg'), await freePort(), 'counterpoise_bench');
  const redis = await startRedis(path.join(dir, 'redis'), await freePort(), { persist: false });
  Object.assign(process.env, {
    NODE_ENV: 'test',
    DATABASE_URL: pg.url,
    REDIS_URL: redis.url,
    JWT_SECRET: randomBytes(32).toString('hex'),
    DATA_DIR: path.join(dir, 'data'),
    UPLOAD_MAX_BYTES: String(300 * 1024 * 1024),
    LOG_LEVEL: 'silent',
  });
  const stops: Array<() => Promise<void> | void> = [() => redis.stop(), () => pg.stop()];
  try {
    await runMigrations(pg.url);
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
    const [contractor, reviewer, engineer] = await Promise.all([
      signedIn(app, w.plannerA.email),
      signedIn(app, w.reviewer.email),
      signedIn(app, w.engineer.email),
    ]);
    const must = (res: supertest.Response, status: number, what: string) => {
      if (res.status !== status) throw new Error(`${what}: ${res.status} ${JSON.stringify(res.body)}`);
      return res;
    };
    const figures: JobFigure[] = [];
    for (const file of files) {
      const bytes = readFileSync(file);
      const figure: JobFigure = { file, seconds: [], queuedSeconds: [], runSeconds: [], pages: 0 };
      for (let round = 0; round < 2; round++) {
        const created = must(
          await contractor.post('/api/packages').send({
            title: `Bench ${path.basename(file)} ${round}`,
            siteId: w.site.id,
            plannedLiftDate: '2030-03-14',
          }),
          201,
          'create package',
        );
        const id = created.body.package.id as string;
        must(await contractor.put(`/api/packages/${id}/draft`).send({ inputs }), 200, 'draft');
        const up = must(
          await contractor
            .post(`/api/packages/${id}/files`)
            .field('kind', 'lift_plan')
            .attach('file', bytes, path.basename(file)),
          201,
          'upload',
        );
        const sub = must(await contractor.post(`/api/packages/${id}/submit`), 202, 'submit');
        await runCheck(ctx.dataSource, sub.body.current.id);
        must(
          await reviewer.post('/api/assignments').send({ packageIds: [id], engineerId: w.engineer.id }),
          200,
          'assign',
        );
        for (const [k, kind] of (['cloud', 'arrow', 'text'] as const).entries())
          must(
            await engineer.post(`/api/packages/${id}/markups`).send({
              fileId: up.body.id,
              pageNumber: 1,
              kind,
              geometry:
                kind === 'arrow'
                  ? { x1: 80, y1: 200, x2: 200, y2: 260 }
                  : { x: 80 + k * 120, y: 300, width: 100, height: 60 },
              ...(kind === 'text' ? { text: 'Check the mat size' } : {}),
            }),
            201,
            'markup',
          );
        const version = (await engineer.get(`/api/packages/${id}`)).body.package.version;
        must(
          await engineer
            .post(`/api/packages/${id}/decision`)
            .send({ decision: 'accepted', conditions: '', baseVersion: version, password: TEST_PASSWORD }),
          200,
          'decision',
        );
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
