// The demo seed builds packages from the fleet library: at least one per invented fleet, read back
// through the API on a database of its own (migrated, seeded as the start command seeds it). The
// crane and chart of each such package are exactly what its library version fills; one version is
// verified by the owner desk's engineer on one package and shows verified on the next one that
// uses it; a detached copy shows its edited cell.
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDataSource } from '@server/db/data-source';
import { seedDemoOnce } from '@server/db/seed/seed';
import { DEMO_PASSWORD } from '@server/db/seed/demo-accounts';
import { fillFromVersion } from '@shared/library/to-lift-input';
import type { LibraryUse, VersionDetail } from '@shared/schemas/library';
import { signedIn, startTestApp, type TestApp } from '../support/app';

const base = process.env.DATABASE_URL!;
const dbName = `seed_${randomUUID().replace(/-/g, '').slice(0, 12)}`;
const url = base.replace(/\/[^/]+$/, `/${dbName}`);
const admin = new pg.Client({ connectionString: base });
let filesDir: string;
let t: TestApp;

beforeAll(async () => {
  await admin.connect();
  await admin.query(`CREATE DATABASE ${dbName}`);
  const ds = createDataSource(url);
  await ds.initialize();
  await ds.runMigrations();
  await ds.destroy();
  filesDir = fs.mkdtempSync(path.join(os.tmpdir(), 'counterpoise-seed-'));
  expect(await seedDemoOnce(url, 'http://127.0.0.1:9', process.env)).toBe(true);
  t = await startTestApp({ DATABASE_URL: url, DATA_DIR: filesDir });
}, 180_000);

afterAll(async () => {
  await t?.close();
  await admin.query(`DROP DATABASE IF EXISTS ${dbName}`);
  await admin.end();
  if (filesDir) fs.rmSync(filesDir, { recursive: true, force: true });
});

const as = (email: string) => signedIn(t.app, email, DEMO_PASSWORD);
type Agent = Awaited<ReturnType<typeof as>>;

async function packageTitled(agent: Agent, title: string) {
  const list = await agent.get('/api/packages').query({ q: title });
  const found = (list.body.items as { id: string; title: string }[]).find((p) => p.title === title);
  if (!found) throw new Error(`no demo package "${title}"`);
  return (await agent.get(`/api/packages/${found.id}`)).body;
}

/** The package's crane and chart against what its library version fills (planner's figures aside). */
async function expectFilledFrom(
  agent: Agent,
  detail: { package: { id: string }; current: { inputs: Record<string, Record<string, unknown>> } },
) {
  const uses = (await agent.get(`/api/packages/${detail.package.id}/library-uses`)).body
    .items as LibraryUse[];
  expect(uses.map((u) => u.slot)).toEqual([0]);
  const version = (await agent.get(`/api/library/versions/${uses[0].version.id}`)).body as VersionDetail;
  const fill = fillFromVersion(version);
  const { boomLength, radius, slewAngle, ...crane } = detail.current.inputs.crane;
  expect(boomLength).toBeDefined();
  expect(radius).toBeDefined();
  void slewAngle;
  expect(crane).toEqual(fill.crane);
  return { use: uses[0], version, fill };
}

describe('demo packages built from the fleet library', () => {
  it('when the demo is seeded, then each invented fleet has a package built from its library', async () => {
    const c = new pg.Client({ connectionString: url });
    await c.connect();
    const { rows } = await c
      .query(
        `SELECT o.name AS organisation, count(DISTINCT u.package_id)::int AS n
           FROM library_uses u
           JOIN lift_packages p ON p.id = u.package_id
           JOIN organisations o ON o.id = p.contractor_organisation_id
          GROUP BY o.name ORDER BY o.name`,
      )
      .finally(() => c.end());
    expect(rows).toEqual([
      { organisation: 'Brackwater Lifting Ltd', n: 2 },
      { organisation: 'Selsdon & Hale Crane Hire', n: 1 },
    ]);
  });

  it('when the Brackwater planner reads two demo packages, then both take BW-07’s crane and chart from the same version, and the checks ran', async () => {
    const lena = await as('lena.brisk@brackwater-lifting.example');
    const first = await packageTitled(lena, 'Set air cooler fan deck, bay 4');
    const second = await packageTitled(lena, 'Lift gangway landing platform, berth 2');
    const a = await expectFilledFrom(lena, first);
    const b = await expectFilledFrom(lena, second);
    expect(a.version.crane.fleetNumber).toBe('BW-07');
    expect(b.version.id).toBe(a.version.id);
    expect(first.current.inputs.chart).toEqual(a.fill.chart);
    expect(second.current.inputs.chart).toEqual(b.fill.chart);
    expect(a.use.detached).toBe(false);
    expect(second.current.inputs.crane.radius).toEqual({ value: 14, unit: 'm' });
    for (const d of [first, second]) {
      expect(d.current.check.status).toBe('done');
      const capacity = (d.current.results.checks as { id: string; status: string }[]).find(
        (c) => c.id === 'capacity',
      );
      expect(capacity?.status).toBe('pass');
    }
  });

  it('when the owner side reads them, then the first carries Dev Marsh’s verification and the second shows it too', async () => {
    const dev = await as('dev.marsh@tamsin-ridge.example');
    const first = await packageTitled(dev, 'Set air cooler fan deck, bay 4');
    const onFirst = (await dev.get(`/api/packages/${first.package.id}/library-uses`)).body
      .items as LibraryUse[];
    expect(onFirst[0].verifications).toHaveLength(1);
    const v = onFirst[0].verifications[0];
    expect(v.engineer.name).toBe('Dev Marsh, PE');
    expect(Number.isNaN(Date.parse(v.at))).toBe(false);
    // The reviewer sees the site's whole queue, the second package (not yet assigned) too.
    const rhea = await as('rhea.okafor@tamsin-ridge.example');
    const second = await packageTitled(rhea, 'Lift gangway landing platform, berth 2');
    const onSecond = (await rhea.get(`/api/packages/${second.package.id}/library-uses`)).body
      .items as LibraryUse[];
    expect(onSecond[0].version.id).toBe(onFirst[0].version.id);
    expect(onSecond[0].verifications).toEqual([v]);
  });

  it('when the Selsdon & Hale planner reads its demo package, then SH-9’s chart is a detached copy with one edited cell', async () => {
    const tomas = await as('tomas.hale@selsdon-hale.example');
    const pkg = await packageTitled(tomas, 'Replace compressor lube oil cooler');
    const { use, version } = await expectFilledFrom(tomas, pkg);
    expect(version.crane.fleetNumber).toBe('SH-9');
    expect(use.detached).toBe(true);
    const library =
      version.chart.capacities[version.chart.radii.indexOf(40)][version.chart.boomLengths.indexOf(100)];
    expect(use.changedCells).toEqual([{ boomLength: 100, radius: 40, library, package: 68 }]);
    expect(use.verifications).toEqual([]);
    expect(pkg.current.check.status).toBe('done');
  });
});
