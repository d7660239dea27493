// A package taken through the desk's API as the benchmarks need it: created, drafted with the
// inputs, its lift plan uploaded, submitted, checked, assigned, optionally marked up, and
// decided "accepted". Shared by bench:stamp (the real job) and bench:queues (the large return).
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type supertest from 'supertest';
import type { DataSource } from 'typeorm';
import { fakeS3Env } from '../../server/lib/fake-s3';
import { runMigrations } from './migrate';
import { startThrowawayS3 } from './s3';
import { freePort, startPostgres, startRedis } from './services';

type Agent = ReturnType<typeof supertest.agent>;

/**
 * A throwaway PostgreSQL (migrated), Redis and fake S3 server in a new temporary folder, as
 * the test command starts them, and the environment the desk's code reads (also set on this
 * process, quiet). `stops` stops the servers, last started first.
 */
export async function benchServices(folder: string, extra: Record<string, string>) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), folder));
  // PostgreSQL runs as its own user when this runs as root (scripts/lib/services.ts).
  fs.chmodSync(dir, 0o755);
  const pg = await startPostgres(path.join(dir, 'pg'), await freePort(), 'counterpoise_bench');
  const redis = await startRedis(path.join(dir, 'redis'), await freePort(), { persist: false });
  const s3 = await startThrowawayS3(path.join(dir, 'data'), await freePort());
  const stops: Array<() => Promise<void> | void> = [() => s3.stop(), () => redis.stop(), () => pg.stop()];
  const env = {
    ...fakeS3Env(s3.url, 'counterpoise-bench'),
    DATABASE_URL: pg.url,
    REDIS_URL: redis.url,
    JWT_SECRET: randomBytes(32).toString('hex'),
    DATA_DIR: path.join(dir, 'data'),
    UPLOAD_MAX_BYTES: String(300 * 1024 * 1024),
    ...extra,
  };
  Object.assign(process.env, env, { LOG_LEVEL: 'silent' });
  try {
    await runMigrations(pg.url);
  } catch (e) {
    for (const stop of stops) await Promise.resolve(stop()).catch(() => undefined);
    throw e;
  }
  return { dir, env, stops };
}

export function must(res: supertest.Response, status: number, what: string): supertest.Response {
  if (res.status !== status) throw new Error(`${what}: ${res.status} ${JSON.stringify(res.body)}`);
  return res;
}

/** The three people the benchmarks act as, signed in, with the site and engineer they use. */
export interface BenchPeople {
  contractor: Agent;
  reviewer: Agent;
  engineer: Agent;
  siteId: string;
  engineerId: string;
}

type World = {
  site: { id: string };
  plannerA: { email: string };
  reviewer: { email: string };
  engineer: { id: string; email: string };
};

export async function benchPeople(
  signedIn: (email: string) => Promise<Agent>,
  w: World,
): Promise<BenchPeople> {
  const [contractor, reviewer, engineer] = await Promise.all(
    [w.plannerA, w.reviewer, w.engineer].map((u) => signedIn(u.email)),
  );
  return { contractor, reviewer, engineer, siteId: w.site.id, engineerId: w.engineer.id };
}

export interface DecidedPackageOptions extends BenchPeople {
  title: string;
  /** the engineer's password: a decision is confirmed with it */
  password: string;
  inputs: unknown;
  plan: Buffer;
  planName: string;
  /** the check run, in this process (the service's runCheckRun) */
  runCheck: (ds: DataSource, revisionId: string) => Promise<unknown>;
  ds: DataSource;
  /** three markups (cloud, arrow, text) on page 1 before the decision */
  markups?: boolean;
}

/** Returns the package's id; the caller issues the return. */
export async function decidedPackage(o: DecidedPackageOptions): Promise<string> {
  const created = must(
    await o.contractor
      .post('/api/packages')
      .send({ title: o.title, siteId: o.siteId, plannedLiftDate: '2030-03-14' }),
    201,
    'create package',
  );
  const id = created.body.package.id as string;
  must(await o.contractor.put(`/api/packages/${id}/draft`).send({ inputs: o.inputs }), 200, 'draft');
  const up = must(
    await o.contractor
      .post(`/api/packages/${id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', o.plan, o.planName),
    201,
    'upload',
  );
  const sub = must(await o.contractor.post(`/api/packages/${id}/submit`), 202, 'submit');
  await o.runCheck(o.ds, sub.body.current.id);
  must(
    await o.reviewer.post('/api/assignments').send({ packageIds: [id], engineerId: o.engineerId }),
    200,
    'assign',
  );
  if (o.markups)
    for (const [k, kind] of (['cloud', 'arrow', 'text'] as const).entries())
      must(
        await o.engineer.post(`/api/packages/${id}/markups`).send({
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
  const version = (await o.engineer.get(`/api/packages/${id}`)).body.package.version;
  must(
    await o.engineer
      .post(`/api/packages/${id}/decision`)
      .send({ decision: 'accepted', conditions: '', baseVersion: version, password: o.password }),
    200,
    'decision',
  );
  return id;
}
