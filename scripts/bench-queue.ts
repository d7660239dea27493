// npm run bench:queue [-- --packages 100000 --requests 1000 --explain]: is the reviewer's queue
// instant at 100,000 lifts (issue 16 items 4 and 5)? Against a throwaway PostgreSQL, Redis and S3
// (as the test command starts them) it seeds the packages with their revisions and results
// (scripts/lib/bench-queue-seed.ts), starts the API in a process of its own, signs in as the
// reviewer and times every sort, every filter, two searches and deep pages (by cursor, and by
// offset for comparison), one request at a time and 50 at once over keep-alive connections. A
// bare Express route answering the same bytes as the default page, in its own process, is timed
// in the same run (before and after the queue) as the floor. With --explain it prints
// EXPLAIN (ANALYZE, BUFFERS) of each variant's statements, as the API builds them.
// The last line is the issue's: the worst p95 at 50 concurrent over the variants, and the lowest
// throughput of a variant as a multiple of the bare route's.
import 'reflect-metadata';
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import type { DataSource, Logger } from 'typeorm';
import { PACKAGE_SORTS } from '../shared/schemas/packages';
import { benchServices } from './lib/bench-flow';
import { seedQueue, type SeededQueue } from './lib/bench-queue-seed';

const arg = (name: string, fallback: number) => {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? Number(process.argv[i + 1]) : fallback;
};
const PACKAGES = arg('packages', 100_000);
const REQUESTS = arg('requests', 1000);
const SERIAL = arg('serial', 100);
const CONCURRENCY = 50;
const DEEP_PAGES = 200;
const EXPLAIN = process.argv.includes('--explain');
const TARGET_P95 = 30;
const TARGET_RATIO = 0.5;

const pct = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil(s.length * p) - 1)] ?? NaN;
};
const f = (n: number, d = 1) => (Number.isFinite(n) ? n.toFixed(d) : '–');

const agent = new http.Agent({ keepAlive: true, maxSockets: CONCURRENCY });

function get(
  port: number,
  url: string,
  cookie: string,
  retry = true,
): Promise<{ status: number; body: Buffer; ms: number }> {
  const t0 = performance.now();
  return new Promise((resolve, reject) => {
    const req = http.request({ host: '127.0.0.1', port, path: url, agent, headers: { cookie } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () =>
        resolve({ status: res.statusCode ?? 0, body: Buffer.concat(chunks), ms: performance.now() - t0 }),
      );
      res.on('error', reject);
    });
    // A kept-alive socket the server closed while it sat idle (its 5 s keep-alive timeout): asked
    // again once on a new one, as Node's documentation advises.
    req.on('error', (e: NodeJS.ErrnoException) => {
      if (retry && req.reusedSocket && e.code === 'ECONNRESET')
        get(port, url, cookie, false).then(resolve, reject);
      else reject(e);
    });
    req.end();
  });
}

interface Run {
  p50: number;
  p95: number;
  perSecond: number;
  bytes: number;
}

/** `total` requests, `concurrency` at a time; every answer must be 200. */
async function load(
  port: number,
  url: string,
  cookie: string,
  total: number,
  concurrency: number,
): Promise<Run> {
  const times: number[] = [];
  let next = 0;
  let bytes = 0;
  const t0 = performance.now();
  await Promise.all(
    Array.from({ length: concurrency }, async () => {
      while (next < total) {
        next++;
        const res = await get(port, url, cookie);
        if (res.status !== 200) throw new Error(`${url}: ${res.status} ${res.body.toString().slice(0, 300)}`);
        bytes = res.body.length;
        times.push(res.ms);
      }
    }),
  );
  const seconds = (performance.now() - t0) / 1000;
  return { p50: pct(times, 0.5), p95: pct(times, 0.95), perSecond: total / seconds, bytes };
}

// --profile <folder>: the API process writes a V8 CPU profile there when it stops.
const PROFILE = process.argv.includes('--profile')
  ? process.argv[process.argv.indexOf('--profile') + 1]
  : null;

async function startServer(
  env: NodeJS.ProcessEnv,
  args: string[],
): Promise<{ port: number; child: ChildProcess }> {
  const prof = PROFILE && !args.includes('--bare') ? ['--cpu-prof', `--cpu-prof-dir=${PROFILE}`] : [];
  // spawns: node (process.execPath: the API or the bare route, in a process of its own)
  const child = spawn(
    process.execPath,
    [...prof, '--import', 'tsx', 'scripts/bench-queue-server.ts', ...args],
    {
      env,
      stdio: ['ignore', 'pipe', 'inherit'],
    },
  );
  const port = await new Promise<number>((resolve, reject) => {
    let out = '';
    child.stdout!.on('data', (c: Buffer) => {
      out += c.toString();
      const m = /listening (\d+)/.exec(out);
      if (m) resolve(Number(m[1]));
    });
    child.on('exit', (code) => reject(new Error(`bench server exited (${code}): ${out.slice(-2000)}`)));
  });
  return { port, child };
}

function stopServer(child: ChildProcess): Promise<void> {
  return new Promise((resolve) => {
    if (child.exitCode !== null) return resolve();
    child.once('exit', () => resolve());
    child.kill('SIGTERM');
  });
}

async function signIn(port: number, email: string, password: string): Promise<string> {
  const body = JSON.stringify({ email, password });
  return new Promise((resolve, reject) => {
    const req = http.request(
      {
        host: '127.0.0.1',
        port,
        path: '/api/auth/sign-in',
        method: 'POST',
        agent,
        headers: {
          'content-type': 'application/json',
          'x-csrf-guard': '1',
          'content-length': Buffer.byteLength(body),
        },
      },
      (res) => {
        res.resume();
        const cookies = (res.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]);
        if (res.statusCode !== 200) reject(new Error(`sign-in: ${res.statusCode}`));
        else resolve(cookies.join('; '));
      },
    );
    req.on('error', reject);
    req.end(body);
  });
}

interface Variant {
  name: string;
  query: string;
  /** Not one the client asks for (offset paging): shown, outside the target. */
  outsideTarget?: boolean;
}

function variants(s: SeededQueue, deep: { plannedLiftDate: string; updatedAt: string }): Variant[] {
  const sorts = [...PACKAGE_SORTS];
  return [
    { name: 'signed-in floor: GET /api/me', query: '', outsideTarget: true },
    ...sorts.map((sort) => ({ name: `sort ${sort}`, query: `sort=${sort}` })),
    { name: 'status ready_for_review', query: 'status=ready_for_review' },
    { name: 'status with_engineer, -updatedAt', query: 'status=with_engineer&sort=-updatedAt' },
    { name: 'site', query: `siteId=${s.siteId}` },
    { name: 'contractor', query: `contractorId=${s.contractorId}` },
    { name: 'engineer', query: `engineerId=${s.engineerId}` },
    { name: 'engineer none', query: 'engineerId=none' },
    { name: 'critical', query: 'critical=true' },
    { name: 'discrepancies', query: 'discrepancies=true' },
    { name: 'lift within 14 days', query: 'liftWithinDays=14' },
    { name: 'revision 3 or more', query: 'revisionMin=3' },
    { name: `search reference ${s.referencePart}`, query: `q=${s.referencePart}` },
    { name: `search title "${s.titleWord}"`, query: `q=${s.titleWord}` },
    { name: `deep page ${DEEP_PAGES + 1} by cursor`, query: `cursor=${deep.plannedLiftDate}` },
    {
      name: `deep page ${DEEP_PAGES + 1} by cursor, -updatedAt`,
      query: `sort=-updatedAt&cursor=${deep.updatedAt}`,
    },
    { name: `deep page ${DEEP_PAGES + 1} by offset`, query: `page=${DEEP_PAGES + 1}`, outsideTarget: true },
  ];
}

/** Every statement the listing runs for this query, as the API builds them, explained as run. */
async function explain(url: string, s: SeededQueue, v: Variant) {
  const { DataSource: DS } = await import('typeorm');
  const { createDataSource } = await import('../server/db/data-source');
  const { listPackages } = await import('../server/modules/packages/list-packages');
  const { PackageListQuery } = await import('../shared/schemas/packages');
  const statements: Array<{ sql: string; params: unknown[] }> = [];
  const capture: Logger = {
    logQuery: (sql, params) => void statements.push({ sql, params: (params as unknown[]) ?? [] }),
    logQueryError: () => undefined,
    logQuerySlow: () => undefined,
    logSchemaBuild: () => undefined,
    logMigration: () => undefined,
    log: () => undefined,
  };
  const ds: DataSource = new DS({ ...createDataSource(url).options, logging: ['query'], logger: capture });
  await ds.initialize();
  // The list's statements go to the pool as named prepared statements (server/db/prepared.ts),
  // past TypeORM's logger: the pool's query is wrapped to see them too.
  const pool = (ds.driver as unknown as { master: { query: (...a: unknown[]) => Promise<unknown> } }).master;
  const poolQuery = pool.query.bind(pool);
  pool.query = (...a: unknown[]) => {
    const config = a[0] as { text?: string; values?: unknown[] };
    if (typeof config === 'object' && config.text)
      statements.push({ sql: config.text, params: config.values ?? [] });
    return poolQuery(...a);
  };
  try {
    const [user] = await ds.query(
      `SELECT u.id, u.role, u.organisation_id AS "organisationId", o.kind AS "organisationKind", u.name
       FROM users u JOIN organisations o ON o.id = u.organisation_id WHERE u.email = $1`,
      [s.reviewerEmail],
    );
    const query = PackageListQuery.parse(Object.fromEntries(new URLSearchParams(v.query)));
    statements.length = 0;
    await listPackages(ds, user, query);
    const runs = statements.filter((st) => /^\s*SELECT/i.test(st.sql));
    for (const st of runs) {
      const plan: Array<{ 'QUERY PLAN': string }> = await ds.query(
        `EXPLAIN (ANALYZE, BUFFERS) ${st.sql}`,
        st.params as unknown[],
      );
      process.stdout.write(`\n--- ${v.name}: ${st.sql.replace(/\s+/g, ' ').slice(0, 160)}…\n`);
      process.stdout.write(plan.map((r) => r['QUERY PLAN']).join('\n') + '\n');
    }
  } finally {
    await ds.destroy();
  }
}

async function main() {
  const { dir, env, stops } = await benchServices('cp-bench-queue-', {
    NODE_ENV: 'production',
    REDIS_PREFIX: 'bench',
  });
  const children: ChildProcess[] = [];
  try {
    const { createDataSource } = await import('../server/db/data-source');
    const { TEST_PASSWORD } = await import('../tests/support/app');
    const ds = createDataSource(env.DATABASE_URL);
    await ds.initialize();
    const t0 = performance.now();
    const seeded = await seedQueue(ds, PACKAGES);
    const seedSeconds = (performance.now() - t0) / 1000;
    const [sizes] = await ds.query(
      `SELECT (SELECT count(*) FROM lift_packages)::int AS packages, (SELECT count(*) FROM revisions)::int AS revisions,
         pg_size_pretty(pg_database_size(current_database())) AS size`,
    );
    await ds.destroy();
    console.log(
      `seeded ${sizes.packages} packages, ${sizes.revisions} revisions (${sizes.size}) in ${f(seedSeconds)} s; ` +
        `${os.cpus().length} cores, load ${os
          .loadavg()
          .map((l) => l.toFixed(2))
          .join(' ')}`,
    );

    const api = await startServer({ ...process.env, ...env, LOG_LEVEL: 'silent' }, []);
    children.push(api.child);
    const cookie = await signIn(api.port, seeded.reviewerEmail, TEST_PASSWORD);
    const first = await get(api.port, '/api/packages', cookie);
    const firstBody = JSON.parse(first.body.toString());
    console.log(
      `reviewer's queue: ${firstBody.total} packages in scope, ${first.body.length} bytes a page of ${firstBody.items.length}`,
    );
    // The cursors of a deep page: 200 pages walked from the start, as "next" would.
    const deepCursor = async (sort: string) => {
      let cursor = '';
      for (let i = 0; i < DEEP_PAGES; i++) {
        const res = await get(
          api.port,
          `/api/packages?sort=${sort}${cursor ? `&cursor=${cursor}` : ''}`,
          cookie,
        );
        cursor = JSON.parse(res.body.toString()).nextCursor;
      }
      return cursor;
    };
    const deep = {
      plannedLiftDate: await deepCursor('plannedLiftDate'),
      updatedAt: await deepCursor('-updatedAt'),
    };

    const bareBody = path.join(dir, 'bare.json');
    fs.writeFileSync(bareBody, first.body);
    const bareRun = async () => {
      const bare = await startServer({ ...process.env, BENCH_BARE_BODY: bareBody }, ['--bare']);
      try {
        await load(bare.port, '/bare', cookie, 200, CONCURRENCY);
        const one = await load(bare.port, '/bare', cookie, SERIAL, 1);
        const many = await load(bare.port, '/bare', cookie, REQUESTS * 5, CONCURRENCY);
        return { one, many };
      } finally {
        await stopServer(bare.child);
      }
    };
    const bareBefore = await bareRun();

    const rows: Array<{ v: Variant; one: Run; many: Run }> = [];
    for (const v of variants(seeded, deep)) {
      const url = v.name.startsWith('signed-in floor') ? '/api/me' : `/api/packages?${v.query}`;
      await load(api.port, url, cookie, 20, 5);
      const one = await load(api.port, url, cookie, SERIAL, 1);
      const many = await load(api.port, url, cookie, REQUESTS, CONCURRENCY);
      rows.push({ v, one, many });
    }
    const bareAfter = await bareRun();
    await stopServer(api.child);

    const barePerSecond = (bareBefore.many.perSecond + bareAfter.many.perSecond) / 2;
    console.log(
      `\n${'variant'.padEnd(44)} ${'1 at a time p50/p95 ms'.padStart(22)}  ${`${CONCURRENCY} at once p50/p95 ms`.padStart(22)}  ${'req/s'.padStart(7)}  × bare  bytes`,
    );
    const print = (name: string, one: Run, many: Run) =>
      console.log(
        `${name.padEnd(44)} ${`${f(one.p50)} / ${f(one.p95)}`.padStart(22)}  ${`${f(many.p50)} / ${f(many.p95)}`.padStart(22)}  ${f(many.perSecond, 0).padStart(7)}  ${f(many.perSecond / barePerSecond, 2).padStart(6)}  ${many.bytes}`,
      );
    print('bare Express route, same bytes (before)', bareBefore.one, bareBefore.many);
    for (const r of rows) print(r.v.name + (r.v.outsideTarget ? ' (outside target)' : ''), r.one, r.many);
    print('bare Express route, same bytes (after)', bareAfter.one, bareAfter.many);

    if (EXPLAIN) {
      console.log('\nEXPLAIN (ANALYZE, BUFFERS) of each variant, as the API builds its statements:');
      for (const v of variants(seeded, deep))
        if (!v.name.startsWith('signed-in')) await explain(env.DATABASE_URL, seeded, v);
    }

    const counted = rows.filter((r) => !r.v.outsideTarget);
    const worst = counted.reduce((a, b) => (b.many.p95 > a.many.p95 ? b : a));
    const slowest = counted.reduce((a, b) => (b.many.perSecond < a.many.perSecond ? b : a));
    const all = counted.reduce((sum, r) => sum + r.many.perSecond, 0) / counted.length;
    console.log(
      `\ntargets: p95 ≤ ${TARGET_P95} ms at ${CONCURRENCY} concurrent for every variant (worst: ${worst.v.name}, ${f(worst.many.p95)} ms: ${worst.many.p95 <= TARGET_P95 ? 'met' : 'not met'}); ` +
        `throughput ≥ ${TARGET_RATIO}× the bare route's ${f(barePerSecond, 0)}/s (lowest: ${slowest.v.name}, ${f(slowest.many.perSecond / barePerSecond, 2)}×; mean over the variants ${f(all / barePerSecond, 2)}×: ${slowest.many.perSecond / barePerSecond >= TARGET_RATIO ? 'met' : 'not met'})`,
    );
    console.log(
      `queue: ${sizes.packages} lifts, ${CONCURRENCY} concurrent, p95 ${f(worst.many.p95)} ms, throughput ${f(slowest.many.perSecond / barePerSecond, 2)}× a bare route`,
    );
  } finally {
    for (const child of children) await stopServer(child);
    for (const stop of stops) await Promise.resolve(stop()).catch(() => undefined);
    fs.rmSync(dir, { recursive: true, force: true });
    agent.destroy();
  }
}

await main();
