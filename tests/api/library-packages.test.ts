// Issue 17's done-when, through the API and the check run the worker runs: a contractor builds a
// package from the library without typing crane data and its stored check equals the one of the
// same lift typed in; a second package reuses the version; the engineer verifies the version on
// the first and the second shows who and when; another desk's verification never shows here, nor
// this desk's there; a detached, edited copy is listed cell by cell for the engineer.
import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCheckRun } from '@server/modules/check-runs/service';
import { fillFromVersion, type LibraryFill } from '@shared/library/to-lift-input';
import type { LibraryUse, VersionDetail } from '@shared/schemas/library';
import { makeOrganisation, makeUser, makeWorld } from '../support/factories';
import { signedIn, startTestApp, type TestApp } from '../support/app';
import { makePdf } from '../support/pdfs';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

const example = JSON.parse(fs.readFileSync('shared/engineering/examples/pass-outriggers.json', 'utf8'));
type Row = { radius: { value: number }; boomLength: { value: number }; capacity: { value: number } };
type Agent = Awaited<ReturnType<typeof signedIn>>;

/** The example's crane, chart and block typed into the library once. */
async function library(a: Agent) {
  const c = example.crane;
  const crane = await a.post('/api/library/cranes').send({
    fleetNumber: `DW-${Math.random().toString(36).slice(2, 7)}`,
    make: 'Harbour Row',
    model: 'HR-60',
    type: c.type,
    fixed: {
      pivotOffset: c.pivotOffset,
      pivotHeight: c.pivotHeight,
      upperWorks: c.upperWorks,
      carrier: c.carrier,
      boom: c.boom,
      outriggerSpreads: [{ name: 'full', ...c.outriggers }],
    },
  });
  expect(crane.status).toBe(201);
  const csv = [
    'radius (m) / boom (m) / capacity (t),30.5',
    ...(example.chart.rows as Row[]).map((r) => `${r.radius.value},${r.capacity.value}`),
  ].join('\n');
  const preview = await a
    .post('/api/library/chart-import/file')
    .attach('file', Buffer.from(csv), { filename: 'hr60.csv', contentType: 'text/csv' });
  expect(preview.body.errors).toEqual([]);
  const config = await a.post(`/api/library/cranes/${crane.body.id}/configurations`).send({
    name: 'Main boom, 18 t, full spread, 360°',
    version: {
      details: {
        workingArea: 'full_circle',
        outriggerSpread: 'full',
        counterweight: { arrangement: '18 t slabs', ...c.counterweight },
        hookBlock: { name: '4-sheave block', weight: example.hookBlock.weight },
      },
      notes: { deductions: [], blockIncluded: false, interpolationAllowed: false },
      document: { title: 'HR-60 load chart (invented)', edition: '2026-1', page: '14' },
      chart: preview.body.grid,
    },
  });
  expect(config.status).toBe(201);
  const id = config.body.versions[0].id as string;
  return (await a.get(`/api/library/versions/${id}`)).body as VersionDetail;
}

/**
 * The planner's lift as typed without any crane data (boom length and radius only, the block's
 * height), then filled from the library the way the editor's pick fills it.
 */
function pickedFromLibrary(fill: LibraryFill) {
  const planned = structuredClone(example);
  delete planned.chart;
  planned.crane = { boomLength: example.crane.boomLength, radius: example.crane.radius };
  planned.hookBlock = { height: example.hookBlock.height };
  return {
    ...planned,
    crane: { ...fill.crane, ...planned.crane },
    chart: fill.chart,
    hookBlock: { ...planned.hookBlock, ...fill.hookBlock },
  };
}

/** A package made, drafted, given its plan and (optionally) its library version, then submitted and checked. */
async function submitted(
  a: Agent,
  siteId: string,
  inputs: unknown,
  use?: { versionId: string; detached?: boolean },
) {
  const created = await a
    .post('/api/packages')
    .send({ title: 'Library lift', siteId, plannedLiftDate: null });
  expect(created.status).toBe(201);
  const id = created.body.package.id as string;
  expect((await a.put(`/api/packages/${id}/draft`).send({ inputs })).status).toBe(200);
  if (use) expect((await a.put(`/api/packages/${id}/library-uses`).send(use)).status).toBe(200);
  await a
    .post(`/api/packages/${id}/files`)
    .field('kind', 'lift_plan')
    .attach('file', Buffer.from(await makePdf()), 'plan.pdf');
  const sent = await a.post(`/api/packages/${id}/submit`);
  expect(sent.status).toBe(202);
  // The worker's own step, run here: the check of the submitted revision, stored on it.
  await runCheckRun(t.ctx.dataSource, sent.body.current.id);
  const detail = (await a.get(`/api/packages/${id}`)).body;
  expect(detail.current.check.status).toBe('done');
  return { id, detail };
}

const figures = (results: {
  checks: {
    id: string;
    status: string;
    value: unknown;
    items: { id: string; status: string; value: unknown }[];
  }[];
  overallStatus: string;
}) => ({
  overall: results.overallStatus,
  checks: results.checks.map((c) => ({
    id: c.id,
    status: c.status,
    value: c.value,
    items: c.items.map((i) => [i.id, i.status, i.value]),
  })),
});

describe('packages built from the fleet library', () => {
  it('when a package is built from the library without typing crane data, then its stored check equals the typed-in one, a second package reuses the version, and a verification shows on both with who and when', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const a = await signedIn(t.app, w.plannerA.email);
    const version = await library(a);
    const inputs = pickedFromLibrary(fillFromVersion(version));
    // Nothing of the crane but the planner's boom length and radius came from anywhere but the library.
    const { boomLength, radius, ...fromLibrary } = inputs.crane;
    expect([boomLength, radius]).toEqual([example.crane.boomLength, example.crane.radius]);
    expect(fromLibrary).toEqual(fillFromVersion(version).crane);

    const typed = await submitted(a, w.site.id, example);
    const first = await submitted(a, w.site.id, inputs, { versionId: version.id });
    expect(figures(first.detail.current.results)).toEqual(figures(typed.detail.current.results));
    expect(first.detail.current.results.overallStatus).toBe('pass');

    const second = await submitted(a, w.site.id, inputs, { versionId: version.id });
    expect((await a.get(`/api/library/versions/${version.id}`)).body.usedBy).toBe(2);

    await t.ctx.dataSource.query(
      `UPDATE lift_packages SET status = 'with_engineer', assigned_engineer_id = $2 WHERE id = ANY($1)`,
      [[first.id, second.id], w.engineer.id],
    );
    const engineer = await signedIn(t.app, w.engineer.email);
    const verified = await engineer
      .post(`/api/library/versions/${version.id}/verifications`)
      .send({ note: 'Every cell against page 14, edition 2026-1', packageId: first.id });
    expect(verified.status).toBe(201);
    const v = verified.body.verifications[0];
    expect(v).toMatchObject({ engineer: { id: w.engineer.id, name: w.engineer.name } });
    expect(Math.abs(Date.parse(v.at) - Date.now())).toBeLessThan(60_000);

    const onSecond = (await engineer.get(`/api/packages/${second.id}/library-uses`)).body
      .items as LibraryUse[];
    expect(onSecond).toHaveLength(1);
    expect(onSecond[0]).toMatchObject({
      version: { id: version.id, number: 1 },
      detached: false,
      changedCells: [],
    });
    expect(onSecond[0].verifications).toEqual([v]);
    // The contractor reads the same: who verified the chart and when.
    const contractorSees = (await a.get(`/api/packages/${second.id}/library-uses`)).body
      .items as LibraryUse[];
    expect(contractorSees[0].verifications).toEqual([v]);
  });

  it('when two owner desks review packages using one version, then each desk sees only its own verification', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const other = await makeWorld(t.ctx.dataSource);
    // A contractor added to no desk submits to any owner's sites: here to both desks.
    const hire = await makeOrganisation(t.ctx.dataSource, 'contractor');
    const a = await signedIn(t.app, (await makeUser(t.ctx.dataSource, hire, 'contractor')).email);
    const version = await library(a);
    const inputs = pickedFromLibrary(fillFromVersion(version));
    const here = await submitted(a, w.site.id, inputs, { versionId: version.id });
    const there = await submitted(a, other.site.id, inputs, { versionId: version.id });
    await t.ctx.dataSource.query(
      `UPDATE lift_packages SET status = 'with_engineer', assigned_engineer_id = $2 WHERE id = $1`,
      [here.id, w.engineer.id],
    );
    await t.ctx.dataSource.query(
      `UPDATE lift_packages SET status = 'with_engineer', assigned_engineer_id = $2 WHERE id = $1`,
      [there.id, other.engineer.id],
    );

    const ours = await signedIn(t.app, w.engineer.email);
    const theirs = await signedIn(t.app, other.engineer.email);
    expect(
      (
        await ours
          .post(`/api/library/versions/${version.id}/verifications`)
          .send({ note: 'ours', packageId: here.id })
      ).status,
    ).toBe(201);
    // The other desk has not verified it: its package shows nothing of ours, and it may verify itself.
    const before = (await theirs.get(`/api/packages/${there.id}/library-uses`)).body.items as LibraryUse[];
    expect(before[0].verifications).toEqual([]);
    expect((await theirs.get(`/api/library/versions/${version.id}`)).body.verifications).toEqual([]);
    // Neither desk reads the other's package.
    expect((await theirs.get(`/api/packages/${here.id}/library-uses`)).status).toBe(404);
    expect((await ours.get(`/api/packages/${there.id}/library-uses`)).status).toBe(404);
    const mine = await theirs
      .post(`/api/library/versions/${version.id}/verifications`)
      .send({ note: 'theirs', packageId: there.id });
    expect(mine.status).toBe(201);
    expect(mine.body.verifications.map((x: { note: string }) => x.note)).toEqual(['theirs']);
    const ourUses = (await ours.get(`/api/packages/${here.id}/library-uses`)).body.items as LibraryUse[];
    expect(ourUses[0].verifications.map((x) => [x.note, x.engineer.name])).toEqual([
      ['ours', w.engineer.name],
    ]);
  });

  it('when the planner detaches a copy and edits two cells, then the engineer is shown each changed cell against library version N', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const a = await signedIn(t.app, w.plannerA.email);
    const version = await library(a);
    const inputs = pickedFromLibrary(fillFromVersion(version));
    const rows: NonNullable<LibraryFill['chart']['rows']> = inputs.chart.rows;
    const at = (r: number) => rows.find((x) => x.radius?.value === r)!;
    at(12).capacity = { value: 19, unit: 't' };
    at(16).capacity = { value: 12, unit: 't' };
    const pkg = await submitted(a, w.site.id, inputs, { versionId: version.id, detached: true });
    await t.ctx.dataSource.query(
      `UPDATE lift_packages SET status = 'with_engineer', assigned_engineer_id = $2 WHERE id = $1`,
      [pkg.id, w.engineer.id],
    );
    const engineer = await signedIn(t.app, w.engineer.email);
    const uses = (await engineer.get(`/api/packages/${pkg.id}/library-uses`)).body.items as LibraryUse[];
    const library16 = (example.chart.rows as Row[]).find((r) => r.radius.value === 16)!.capacity.value;
    expect(uses[0]).toMatchObject({ detached: true, version: { id: version.id, number: 1 } });
    expect(uses[0].changedCells).toEqual([
      { boomLength: 30.5, radius: 12, library: 18.2, package: 19 },
      { boomLength: 30.5, radius: 16, library: library16, package: 12 },
    ]);
    expect(uses[0].units).toEqual({ radius: 'm', boomLength: 'm', capacity: 't' });
    // The check ran on the package's own (edited) chart.
    const capacity = pkg.detail.current.results.checks.find((c: { id: string }) => c.id === 'capacity');
    expect(capacity.status).toBe('pass');
  });
});
