// npm run bench:queues: is a check run held up? Against a throwaway PostgreSQL and Redis (as the
// test command starts them) and real worker processes (worker/index.ts, WORKER_QUEUES naming
// their queues), it measures, one job at a time:
//   - a no-op BullMQ job (a worker process of its own whose processor does nothing, the check
//     queue's job options) — the floor the target is a multiple of;
//   - the worker side of a check run (BullMQ's processedOn → finishedOn: job active to
//     completed) and its round trip (add → the completed event), over --checks checks;
//   - the same while a ~95 MB scanned stamped return builds, first in the same worker process
//     (WORKER_QUEUES=check,stamp, what one worker process of the start command does) and then
//     in a process of its own (WORKER_QUEUES=check beside WORKER_QUEUES=stamp);
//   - check throughput (all queued at once) with one and with two check worker processes.
// It prints the figures and the two targets of issue 16 item 7: the worker side of a check at
// most 3 × a no-op job, and at most 100 ms while a large return builds. One durable commit of the
// same PostgreSQL is printed too: a check must write its results durably once, so that is its
// floor on this disk.
import 'reflect-metadata';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Queue, QueueEvents, Worker, type Job } from 'bullmq';
import { scannedPackage } from './lib/bench-packages';
import type { BenchDesk } from './lib/bench-queues-desk';

const arg = (name: string, fallback: number) => {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? Number(process.argv[i + 1]) : fallback;
};
const CHECKS = arg('checks', 200);
const THROUGHPUT = arg('throughput', 300);
const BUILDS = arg('builds', 2);
const WARM = 20;
const NOOP_QUEUE = 'bench-noop';
// The stamp benchmark's cache: the scanned package is made once and shared.
const LARGE_PDF = path.join(os.tmpdir(), 'cp-bench-stamp', 'scanned-60.pdf');

interface Sample {
  workerMs: number;
  roundTripMs: number;
  processedOn: number;
  finishedOn: number;
}

const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / Math.max(1, xs.length);
const pct = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(s.length * p))] ?? NaN;
};
const f = (n: number, d = 1) => (Number.isFinite(n) ? n.toFixed(d) : '–');
const line = (what: string, xs: number[]) =>
  `${what.padEnd(46)} mean ${f(mean(xs)).padStart(6)} ms  p95 ${f(pct(xs, 0.95)).padStart(6)} ms  max ${f(
    Math.max(...xs),
  ).padStart(7)} ms  (n ${xs.length})`;

/** One job, timed: the bench's add → completed event, and BullMQ's active → completed. */
async function timeJob(queue: Queue, events: QueueEvents, add: () => Promise<Job>): Promise<Sample> {
  const t0 = performance.now();
  const job = await add();
  await job.waitUntilFinished(events, 120_000);
  const roundTripMs = performance.now() - t0;
  const done = await queue.getJob(job.id!);
  if (!done?.processedOn || !done.finishedOn) throw new Error(`job ${job.id} has no timestamps`);
  return {
    workerMs: done.finishedOn - done.processedOn,
    roundTripMs,
    processedOn: done.processedOn,
    finishedOn: done.finishedOn,
  };
}

async function sequentialChecks(desk: BenchDesk, events: QueueEvents, n: number, offset = 0) {
  const samples: Sample[] = [];
  for (let i = 0; i < n; i++) {
    const revisionId = desk.revisions[(offset + i) % desk.revisions.length];
    const [jobId] = await desk.askChecks([revisionId]);
    samples.push(await timeJob(desk.ctx.queues.checkRun, events, () => desk.addCheck(revisionId, jobId)));
  }
  return samples;
}

/** Checks one after another while the large return builds, `BUILDS` builds in a row. */
async function checksDuringStamp(desk: BenchDesk, events: QueueEvents) {
  const inside: Sample[] = [];
  const buildSeconds: number[] = [];
  for (let b = 0; b < BUILDS; b++) {
    const stamp = await desk.rebuildLargeReturn();
    while ((await stamp.getState()) !== 'active') await new Promise((r) => setTimeout(r, 20));
    const during: Sample[] = [];
    let offset = 0;
    for (;;) {
      const state = await stamp.getState();
      if (state === 'failed') throw new Error(`the large return failed: ${stamp.failedReason}`);
      if (state === 'completed') break;
      during.push(...(await sequentialChecks(desk, events, 5, offset)));
      offset += 5;
    }
    const built = await desk.ctx.queues.stampedReturn.getJob(stamp.id!);
    if (!built?.processedOn || !built.finishedOn) throw new Error('the large return has no timestamps');
    buildSeconds.push((built.finishedOn - built.processedOn) / 1000);
    // Only checks that ran entirely while the return was building count.
    inside.push(
      ...during.filter((s) => s.processedOn >= built.processedOn! && s.finishedOn <= built.finishedOn!),
    );
  }
  return { samples: inside, buildSeconds };
}

/** Every check queued at once; checks per second from the first add to the last completion. */
async function throughput(desk: BenchDesk, events: QueueEvents, n: number) {
  const ids = Array.from({ length: n }, (_, i) => desk.revisions[i % desk.revisions.length]);
  const unique = [...new Set(ids)];
  const jobIds = await desk.askChecks(unique);
  const t0 = performance.now();
  const jobs = await desk.ctx.queues.checkRun.addBulk(
    unique.map((revisionId, i) => ({ name: 'check-run', data: { revisionId }, opts: { jobId: jobIds[i] } })),
  );
  await Promise.all(jobs.map((j) => j.waitUntilFinished(events, 300_000)));
  return unique.length / ((performance.now() - t0) / 1000);
}

/**
 * CPU time (user + system) a process has used, from /proc: on a machine other work shares, the
 * CPU a job costs its worker process is the figure the load does not stretch.
 */
function cpuMs(pid: number): number {
  const fields = fs.readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
  // utime and stime are fields 14 and 15 of stat(5), in clock ticks (100 a second on Linux).
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / 100;
}

/** A durable commit on the same PostgreSQL (an UPDATE outside a transaction). */
async function commitFloor(desk: BenchDesk) {
  const ds = desk.ctx.dataSource;
  await ds.query('CREATE TABLE bench_commit (id int PRIMARY KEY, n int NOT NULL)');
  await ds.query('INSERT INTO bench_commit VALUES (1, 0)');
  const xs: number[] = [];
  for (let i = 0; i < 100; i++) {
    const t = performance.now();
    await ds.query('UPDATE bench_commit SET n = n + 1 WHERE id = 1');
    xs.push(performance.now() - t);
  }
  return xs;
}

async function noopWorkerProcess() {
  const { createRedis } = await import('../server/lib/redis');
  const connection = createRedis(process.env.REDIS_URL!, { forWorker: true });
  const worker = new Worker(NOOP_QUEUE, async () => undefined, {
    connection,
    prefix: process.env.REDIS_PREFIX,
  });
  await worker.waitUntilReady();
  process.stdout.write('worker ready\n');
  process.on('SIGTERM', () => void worker.close().then(() => process.exit(0)));
}

/**
 * The worker as it was before issue 16 item 7: the check and the stamp workers in one process,
 * one event loop (today's worker forks stamping off). Measured to show what that costs.
 */
async function inlineWorkerProcess() {
  const { loadConfig } = await import('../server/config');
  const { connect } = await import('../server/bootstrap');
  const { createRedis } = await import('../server/lib/redis');
  const { signerFor } = await import('../server/lib/pdf-tools/signer');
  const { checkRunTask } = await import('../worker/tasks/check-run-task');
  const { stampedReturnTask } = await import('../worker/tasks/stamped-return-task');
  const { startTask } = await import('../worker/tasks/task');
  const config = loadConfig();
  const signer = await signerFor(config);
  const ctx = await connect(config);
  const connection = createRedis(config.REDIS_URL, { forWorker: true });
  const workers = [
    startTask(ctx, connection, checkRunTask(ctx, config.CHECK_CONCURRENCY)),
    startTask(ctx, connection, stampedReturnTask(ctx, config.STAMP_CONCURRENCY, signer)),
  ];
  await Promise.all(workers.map((w) => w.waitUntilReady()));
  process.stdout.write('worker ready\n');
  process.on('SIGTERM', () => void Promise.all(workers.map((w) => w.close())).then(() => process.exit(0)));
}

async function main() {
  const say = (m: string) => process.stdout.write(`[bench:queues] ${m}\n`);
  if (!fs.existsSync(LARGE_PDF)) {
    say('making the ~95 MB scanned package (once, in the temporary folder)');
    fs.mkdirSync(path.dirname(LARGE_PDF), { recursive: true });
    fs.writeFileSync(LARGE_PDF, await scannedPackage());
  }
  const { startBenchDesk } = await import('./lib/bench-queues-desk');
  say(`throwaway PostgreSQL and Redis, ${Math.max(CHECKS, THROUGHPUT)} packages, the large return's package`);
  const desk = await startBenchDesk({ checks: Math.max(CHECKS, THROUGHPUT), largePdf: LARGE_PDF });
  const { createRedis } = await import('../server/lib/redis');
  const conn = () => createRedis(process.env.REDIS_URL!, { forWorker: true });
  const prefix = desk.ctx.config.REDIS_PREFIX;
  const checkEvents = new QueueEvents('check-run', { connection: conn(), prefix });
  const noopQueue = new Queue(NOOP_QUEUE, {
    connection: conn(),
    prefix,
    defaultJobOptions: desk.ctx.queues.checkRun.defaultJobOptions,
  });
  const noopEvents = new QueueEvents(NOOP_QUEUE, { connection: conn(), prefix });
  // Waiting for every job of the throughput run at once listens on the queue once per job.
  checkEvents.setMaxListeners(THROUGHPUT + 50);
  desk.ctx.queues.checkRun.setMaxListeners(THROUGHPUT + 50);
  await Promise.all([checkEvents.waitUntilReady(), noopEvents.waitUntilReady()]);
  try {
    const cpus = os.cpus().length;
    say(
      `${cpus} cores, load average ${os
        .loadavg()
        .map((l) => l.toFixed(1))
        .join(' ')}`,
    );
    const commits = await commitFloor(desk);

    say('no-op jobs');
    const noopProc = await desk.startWorker('noop', {}, [process.argv[1], '--noop-worker']);
    let n = 0;
    const noop = async () =>
      timeJob(noopQueue, noopEvents, () => noopQueue.add('noop', {}, { jobId: `noop-${n++}` }));
    for (let i = 0; i < WARM; i++) await noop();
    const noops: Sample[] = [];
    const noopCpu0 = cpuMs(noopProc.child.pid!);
    for (let i = 0; i < CHECKS; i++) noops.push(await noop());
    const noopCpu = (cpuMs(noopProc.child.pid!) - noopCpu0) / CHECKS;
    await desk.stopWorker(noopProc);

    say('check runs, a worker process for checks only');
    const checker = await desk.startWorker('check-1', { WORKER_QUEUES: 'check' });
    await sequentialChecks(desk, checkEvents, WARM);
    const checkCpu0 = cpuMs(checker.child.pid!);
    const checks = await sequentialChecks(desk, checkEvents, CHECKS);
    const checkCpu = (cpuMs(checker.child.pid!) - checkCpu0) / CHECKS;

    say('check runs while the large return builds in another process (WORKER_QUEUES=stamp)');
    const stamper = await desk.startWorker('stamp', { WORKER_QUEUES: 'stamp' });
    const apart = await checksDuringStamp(desk, checkEvents);
    await desk.stopWorker(stamper);

    say('throughput, one and two check worker processes');
    const one = await throughput(desk, checkEvents, THROUGHPUT);
    const checker2 = await desk.startWorker('check-2', { WORKER_QUEUES: 'check' });
    await throughput(desk, checkEvents, WARM * 2);
    const two = await throughput(desk, checkEvents, THROUGHPUT);
    await desk.stopWorker(checker2);
    await desk.stopWorker(checker);

    say('check runs while the large return builds, one worker with WORKER_QUEUES=check,stamp');
    const both = await desk.startWorker('check-stamp', { WORKER_QUEUES: 'check,stamp' });
    await sequentialChecks(desk, checkEvents, WARM);
    const forked = await checksDuringStamp(desk, checkEvents);
    await desk.stopWorker(both);

    say('check runs while the large return builds in the same event loop (the worker before the fork)');
    const inline = await desk.startWorker('inline', {}, [process.argv[1], '--inline-worker']);
    await sequentialChecks(desk, checkEvents, WARM);
    const together = await checksDuringStamp(desk, checkEvents);
    await desk.stopWorker(inline);

    const workerSide = (xs: Sample[]) => xs.map((s) => s.workerMs);
    const noopMs = mean(workerSide(noops));
    const checkMs = mean(workerSide(checks));
    const concurrency = desk.ctx.config.CHECK_CONCURRENCY;
    console.log(
      `\nqueues: ${CHECKS} jobs one at a time after ${WARM} to warm up; ${cpus} cores, load average now ${os
        .loadavg()
        .map((l) => l.toFixed(1))
        .join(' ')}`,
    );
    console.log(
      'worker side = BullMQ active → completed (millisecond timestamps); round trip = add → completed event\n',
    );
    console.log(line('one durable commit (UPDATE, fsync)', commits));
    console.log(line('no-op job, worker side', workerSide(noops)));
    console.log(
      line(
        'no-op job, round trip',
        noops.map((s) => s.roundTripMs),
      ),
    );
    console.log(line('check run, worker side', workerSide(checks)));
    console.log(
      line(
        'check run, round trip',
        checks.map((s) => s.roundTripMs),
      ),
    );
    console.log(
      `CPU of the worker process per job: no-op ${f(noopCpu, 2)} ms, check run ${f(checkCpu, 2)} ms (× ${f(
        checkCpu / noopCpu,
        1,
      )})`,
    );
    const large = `${f(desk.largeReturnBytes / 1e6, 0)} MB return`;
    console.log(
      line(`check, worker side, ${large} in another process`, workerSide(apart.samples)) +
        `  builds ${apart.buildSeconds.map((s) => f(s)).join(', ')} s`,
    );
    console.log(
      line(`  …, WORKER_QUEUES=check,stamp (forks stamping)`, workerSide(forked.samples)) +
        `  builds ${forked.buildSeconds.map((s) => f(s)).join(', ')} s`,
    );
    console.log(
      line(`  …, both in one event loop (before)`, workerSide(together.samples)) +
        `  builds ${together.buildSeconds.map((s) => f(s)).join(', ')} s`,
    );
    console.log(
      `check throughput (${THROUGHPUT} queued at once, CHECK_CONCURRENCY ${concurrency} per process): one process ${f(
        one,
        0,
      )}/s, two processes ${f(two, 0)}/s (× ${f(two / one, 2)})`,
    );
    const ratio = checkMs / noopMs;
    const apartP95 = pct(workerSide(apart.samples), 0.95);
    const forkedP95 = pct(workerSide(forked.samples), 0.95);
    const togetherP95 = pct(workerSide(together.samples), 0.95);
    console.log('\ntargets');
    console.log(
      `  check worker side ${f(checkMs)} ms = ${f(ratio, 2)} × no-op job ${f(noopMs, 2)} ms; target ≤ 3 ×: ${
        ratio <= 3 ? 'met' : 'NOT met'
      } (one durable commit alone is ${f(mean(commits), 1)} ms = ${f(mean(commits) / noopMs, 2)} ×)`,
    );
    const verdict = (ms: number) => (ms <= 100 ? 'met' : 'NOT met');
    console.log(
      `  while a large return builds, p95 of the check's worker side; target ≤ 100 ms: stamp process apart ${f(
        apartP95,
      )} ms ${verdict(apartP95)}; one worker with check,stamp ${f(forkedP95)} ms ${verdict(
        forkedP95,
      )}; (before: one event loop ${f(togetherP95)} ms ${verdict(togetherP95)})`,
    );
  } finally {
    await Promise.all([checkEvents.close(), noopEvents.close(), noopQueue.close()]);
    await desk.close();
  }
}

if (process.argv[2] === '--noop-worker') await noopWorkerProcess();
else if (process.argv[2] === '--inline-worker') await inlineWorkerProcess();
else {
  await main();
  process.exit(0);
}
