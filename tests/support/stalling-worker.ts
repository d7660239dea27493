// A worker process that takes one check-run job and then hangs, so a test can kill it
// mid-job (SIGKILL) and watch BullMQ's stalled-job check hand the job to another worker.
import { Worker } from 'bullmq';
import { Redis } from 'ioredis';
import { QUEUE_NAMES } from '../../server/lib/queues';

const connection = new Redis(process.env.REDIS_URL!, { maxRetriesPerRequest: null });
new Worker(
  QUEUE_NAMES.checkRun,
  async (job) => {
    process.stdout.write(`took ${job.id}\n`);
    await new Promise(() => undefined);
  },
  { connection, prefix: process.env.REDIS_PREFIX, lockDuration: 1500, stalledInterval: 60_000 },
);
process.stdout.write('ready\n');
