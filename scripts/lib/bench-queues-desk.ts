// The desk npm run bench:queues measures against: a throwaway PostgreSQL and Redis started as
// the test command starts them, the migrations, seeded packages whose check runs can be asked
// for again and again (each time a new round of the job intent, as "run the check again"
// writes), one decided package with a ~95 MB scanned lift plan whose stamped return can be
// built again, and real worker processes (`worker/index.ts` with WORKER_QUEUES) with their
// logs in files, as the start command runs them.
import 'reflect-metadata';
import fs from 'node:fs';
import path from 'node:path';
import type { Job } from 'bullmq';
import type { AppContext } from '../../server/context';
import { benchPeople, benchServices, decidedPackage, must } from './bench-flow';
import { startProcess, stopChild, type Managed } from './processes';

export interface BenchDesk {
  dir: string;
  ctx: AppContext;
  /** The seeded revisions whose check runs the benchmark asks for. */
  revisions: string[];
  /** Puts the check runs of these revisions back to queued with a new intent round each; returns the job ids. */
  askChecks(revisionIds: string[]): Promise<string[]>;
  addCheck(revisionId: string, jobId: string): Promise<Job>;
  /** The large return pending again, with a new intent round, and its job queued. */
  rebuildLargeReturn(): Promise<Job>;
  largeReturnBytes: number;
  /** `node --import tsx <entry…>` (the worker by default) with its log in the desk's folder. */
  startWorker(name: string, env: Record<string, string>, entry?: string[]): Promise<Managed>;
  stopWorker(worker: Managed): Promise<void>;
  close(): Promise<void>;
}

async function waitForLine(file: string, text: string, ms: number, worker: Managed) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    // A worker's stamping child logs its own "worker ready" (service worker-stamp) first.
    const lines = fs.existsSync(file) ? fs.readFileSync(file, 'utf8').split('\n') : [];
    if (lines.some((l) => l.includes(text) && !l.includes('"worker-stamp"'))) return;
    if (worker.child.exitCode !== null)
      throw new Error(`${worker.name} exited at start:\n${fs.readFileSync(file, 'utf8').slice(-3000)}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`${worker.name} did not log "${text}" within ${ms} ms`);
}

export async function startBenchDesk(opts: { checks: number; largePdf: string }): Promise<BenchDesk> {
  const { dir, env, stops } = await benchServices('cp-bench-queues-', {
    NODE_ENV: 'production',
    REDIS_PREFIX: 'bench',
  });
  fs.mkdirSync(path.join(dir, 'logs'));
  const workers = new Set<Managed>();
  const close = async () => {
    await Promise.all([...workers].map((w) => stopChild(w.child, 15_000)));
    for (const stop of stops) await Promise.resolve(stop()).catch(() => undefined);
    fs.rmSync(dir, { recursive: true, force: true });
  };
  try {
    const { loadConfig } = await import('../../server/config');
    const { connect } = await import('../../server/bootstrap');
    const { createApp } = await import('../../server/app');
    const { signerFor } = await import('../../server/lib/pdf-tools/signer');
    const { JOB_NAMES } = await import('../../server/lib/queues');
    const { checkRunIntent, markIntentDone, recordIntent } =
      await import('../../server/modules/jobs/intents');
    const { runCheckRun } = await import('../../server/modules/check-runs/service');
    const { makePackage, makeWorld } = await import('../../tests/support/factories');
    const { signedIn, TEST_PASSWORD } = await import('../../tests/support/app');
    const config = loadConfig();
    // The desk's own signing certificate is made here once, not by two worker processes at once.
    await signerFor(config);
    const ctx = await connect(config);
    stops.unshift(async () => ctx.close?.());
    const ds = ctx.dataSource;
    const inputs = JSON.parse(fs.readFileSync('shared/engineering/examples/pass-outriggers.json', 'utf8'));
    const w = await makeWorld(ds);

    const packages: string[] = [];
    for (let i = 0; i < opts.checks; i++)
      packages.push(
        (
          await makePackage(ds, {
            contractor: w.contractorA,
            site: w.site,
            createdBy: w.plannerA,
            status: 'checking',
            inputs,
          })
        ).id,
      );
    // Not waiting for a check until the benchmark asks (else the worker's relay adopts them).
    // TypeORM answers an UPDATE with [rows, affected].
    const [rows]: [Array<{ id: string }>, number] = await ds.query(
      `UPDATE revisions SET check_status = 'none' WHERE package_id = ANY($1) RETURNING id`,
      [packages],
    );
    const revisions = rows.map((r) => r.id);
    const rounds = new Map<string, number>();

    // The large return: draft, upload, submit, check, assign, decide, issue, through the API.
    const app = createApp(ctx, { clientDir: '/nonexistent' });
    const people = await benchPeople((email) => signedIn(app, email), w);
    const { reviewer } = people;
    const id = await decidedPackage({
      ...people,
      password: TEST_PASSWORD,
      title: 'Bench large return',
      inputs,
      plan: fs.readFileSync(opts.largePdf),
      planName: 'scanned-plan.pdf',
      runCheck: runCheckRun,
      ds,
    });
    const issued = must(await reviewer.post(`/api/packages/${id}/returns`), 202, 'issue');
    const returnId = issued.body.id as string;
    // The jobs the API queued are taken back: the benchmark says when each build starts.
    for (const job of [
      ...(await ctx.queues.checkRun.getJobs(['waiting'])),
      ...(await ctx.queues.stampedReturn.getJobs(['waiting'])),
    ]) {
      await job.remove();
      await markIntentDone(ds, job.id!);
    }
    let builds = 0;

    return {
      dir,
      ctx,
      revisions,
      largeReturnBytes: fs.statSync(opts.largePdf).size,
      async askChecks(ids) {
        const jobIds: string[] = [];
        await ds.transaction(async (m) => {
          await m.query(
            `UPDATE revisions SET check_status = 'queued', check_progress = 0, results = NULL,
               check_error = NULL WHERE id = ANY($1)`,
            [ids],
          );
          await m.query(
            `UPDATE lift_packages SET status = 'checking'
             WHERE id IN (SELECT package_id FROM revisions WHERE id = ANY($1))`,
            [ids],
          );
          for (const revisionId of ids) {
            const round = (rounds.get(revisionId) ?? 0) + 1;
            rounds.set(revisionId, round);
            const intent = checkRunIntent(revisionId, round);
            await recordIntent(m, intent);
            jobIds.push(intent.jobId);
          }
        });
        return jobIds;
      },
      addCheck: (revisionId, jobId) =>
        ctx.queues.checkRun.add(JOB_NAMES['check-run'], { revisionId }, { jobId }),
      async rebuildLargeReturn() {
        builds++;
        const jobId = `stamp-bench-${returnId}-${builds}`;
        await ds.transaction(async (m) => {
          await m.query(`UPDATE stamped_returns SET state = 'pending', progress = 0 WHERE id = $1`, [
            returnId,
          ]);
          await recordIntent(m, { queue: 'stamp-return', jobId, subjectId: returnId, payload: { returnId } });
        });
        return ctx.queues.stampedReturn.add(JOB_NAMES['stamp-return'], { returnId }, { jobId });
      },
      async startWorker(name, extra, entry = ['worker/index.ts']) {
        const logFile = path.join(dir, 'logs', `${name}.log`);
        const worker = startProcess(
          name,
          process.execPath,
          ['--import', 'tsx', ...entry],
          { ...process.env, ...env, CP_SERVICE: 'worker', LOG_LEVEL: 'info', ...extra },
          logFile,
        );
        workers.add(worker);
        await waitForLine(logFile, 'worker ready', 90_000, worker);
        return worker;
      },
      async stopWorker(worker) {
        await stopChild(worker.child, 15_000);
        workers.delete(worker);
      },
      close,
    };
  } catch (error) {
    await close();
    throw error;
  }
}
