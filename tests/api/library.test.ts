// The fleet library end to end against the real PostgreSQL: import a chart from CSV and from an
// .xlsx made here, build packages from the library, verify once on the owner's desk, see a
// detached copy flagged cell by cell; isolation, roles and every bad-input limit.
import fs from 'node:fs';
import ExcelJS from 'exceljs';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateLift } from '@shared/engineering/evaluate';
import { LiftInput } from '@shared/schemas/lift-input';
import { fillFromVersion } from '@shared/library/to-lift-input';
import type { VersionDetail } from '@shared/schemas/library';
import { makePackage, makeUser, makeWorld } from '../support/factories';
import { signedIn, startTestApp, type TestApp } from '../support/app';
import { makePdf } from '../support/pdfs';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ CHART_IMPORT_MAX_BYTES: 64 * 1024 });
});
afterAll(async () => t.close());

const example = JSON.parse(fs.readFileSync('shared/engineering/examples/pass-outriggers.json', 'utf8'));
type Row = { radius: { value: number }; boomLength: { value: number }; capacity: { value: number } };
/** The example's chart as a CSV grid: one boom column, radii down. */
const exampleCsv = () =>
  [
    'radius (m) / boom (m) / capacity (t),30.5',
    ...(example.chart.rows as Row[]).map((r) => `${r.radius.value},${r.capacity.value}`),
  ].join('\n');

const craneBody = (fleetNumber: string) => ({
  fleetNumber,
  make: 'Harbour Row',
  model: 'HR-60',
  type: 'mobile_outriggers',
  fixed: {
    pivotOffset: example.crane.pivotOffset,
    pivotHeight: example.crane.pivotHeight,
    upperWorks: example.crane.upperWorks,
    carrier: example.crane.carrier,
    boom: example.crane.boom,
    outriggerSpreads: [
      { name: 'full', ...example.crane.outriggers },
      {
        name: 'mid',
        longitudinalSpread: { value: 7.2, unit: 'm' },
        transverseSpread: { value: 5, unit: 'm' },
      },
    ],
  },
});

const versionBody = (chart: unknown, changeNote?: string) => ({
  details: {
    workingArea: 'full_circle',
    outriggerSpread: 'full',
    counterweight: { arrangement: '18 t slabs', ...example.crane.counterweight },
    hookBlock: { name: '4-sheave block', weight: example.hookBlock.weight },
  },
  notes: { deductions: [], blockIncluded: false, interpolationAllowed: false },
  document: { title: 'HR-60 load chart (invented)', edition: '2026-1', page: '14' },
  chart,
  ...(changeNote ? { changeNote } : {}),
});

async function xlsxBytes(rows: (string | number | null | { formula: string; result?: number })[][]) {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet('Chart');
  for (const r of rows) ws.addRow(r);
  return Buffer.from(await wb.xlsx.writeBuffer());
}

/** Contractor A with a crane and a configuration imported from CSV; B's planner; the owner side. */
async function fleet() {
  const w = await makeWorld(t.ctx.dataSource);
  const a = await signedIn(t.app, w.plannerA.email);
  const crane = await a
    .post('/api/library/cranes')
    .send(craneBody(`HR-${Math.random().toString(36).slice(2, 7)}`));
  expect(crane.status).toBe(201);
  const preview = await a
    .post('/api/library/chart-import/file')
    .attach('file', Buffer.from(exampleCsv()), { filename: 'hr60.csv', contentType: 'text/csv' });
  expect(preview.status).toBe(200);
  expect(preview.body.errors).toEqual([]);
  const config = await a
    .post(`/api/library/cranes/${crane.body.id}/configurations`)
    .send({ name: 'Main boom, 18 t, full spread, 360°', version: versionBody(preview.body.grid) });
  expect(config.status).toBe(201);
  return { w, a, crane: crane.body, config: config.body, v1: config.body.versions[0].id as string };
}

/** The example lift with every crane and chart figure taken from the library version. */
function liftFromLibrary(v: VersionDetail) {
  const fill = fillFromVersion(v);
  const planned = structuredClone(example);
  return {
    ...planned,
    crane: { ...fill.crane, boomLength: example.crane.boomLength, radius: example.crane.radius },
    chart: fill.chart,
    hookBlock: { ...planned.hookBlock, ...fill.hookBlock },
  };
}

describe('fleet library', () => {
  it('when a CSV and an .xlsx made here are previewed, then every cell, the header units and nothing stored come back', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const a = await signedIn(t.app, w.plannerA.email);
    const csv = await a
      .post('/api/library/chart-import/file')
      .attach('file', Buffer.from(exampleCsv()), { filename: 'chart.csv', contentType: 'text/csv' });
    expect(csv.status).toBe(200);
    expect(csv.body.units).toEqual({ radius: 'm', boomLength: 'm', capacity: 't' });
    expect(csv.body.cells[1][1]).toMatchObject({ ref: 'B2', role: 'capacity', value: 28, unit: 't' });
    const xlsx = await a.post('/api/library/chart-import/file').attach(
      'file',
      await xlsxBytes([
        ['radius (ft) / boom (ft) / capacity (kip)', 100, 120],
        [30, 80, 72],
        [40, { formula: 'B2*0.8', result: 64 }, 60],
        [50, 51, null],
      ]),
      { filename: 'chart.xlsx' },
    );
    expect(xlsx.status).toBe(200);
    expect(xlsx.body.errors).toEqual([]);
    expect(xlsx.body.grid).toEqual({
      units: { radius: 'ft', boomLength: 'ft', capacity: 'kip' },
      boomLengths: [100, 120],
      radii: [30, 40, 50],
      capacities: [
        [80, 72],
        [64, 60],
        [51, null],
      ],
    });
    expect(xlsx.body.warnings.map((x: { message: string }) => x.message)).toEqual([
      'B3: holds a formula; its stored value 64 was read, the formula was not calculated',
    ]);
    const cranes = await t.ctx.dataSource.query(
      'SELECT count(*) AS n FROM library_cranes WHERE organisation_id = $1',
      [w.contractorA.id],
    );
    expect(Number(cranes[0].n)).toBe(0);
  });

  it('when chart files are bad, then each gets a message naming the cell or the limit', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const a = await signedIn(t.app, w.plannerA.email);
    const mixed = await a
      .post('/api/library/chart-import/text')
      .send({ text: 'radius (m) / boom (m) / capacity (t)\t20\t30\n5\t12 lb\t10\n5\t-1\t9000000' });
    expect(mixed.status).toBe(200);
    expect(mixed.body.grid).toBeNull();
    expect(mixed.body.errors.map((e: { ref: string }) => e.ref)).toEqual(['B2', 'B3', 'C3', 'A3']);
    const formulaNoValue = await a.post('/api/library/chart-import/file').attach(
      'file',
      await xlsxBytes([
        ['radius (m) / boom (m) / capacity (t)', 20],
        [5, { formula: 'A2*2' }],
      ]),
      {
        filename: 'f.xlsx',
      },
    );
    const b2 = formulaNoValue.body.errors.find((e: { ref: string | null }) => e.ref === 'B2');
    expect(b2).toMatchObject({ row: 2, column: 2 });
    expect(b2.message).toMatch(/formula with no stored value/);
    expect(formulaNoValue.body.grid).toBeNull();
    const big = await a
      .post('/api/library/chart-import/file')
      .attach('file', Buffer.alloc(70 * 1024, 'x'), { filename: 'huge.xlsx' });
    expect(big.status).toBe(413);
    expect(big.body.error.message).toBe('The chart file is larger than the limit of 0.1 MB.');
    const macro = await a
      .post('/api/library/chart-import/file')
      .attach(
        'file',
        Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.from('xl/vbaProject.bin')]),
        { filename: 'm.xlsm' },
      );
    expect(macro.status).toBe(415);
    expect(macro.body.error.message).toMatch(/contains macros/);
    const badCrane = await a.post('/api/library/cranes').send({ ...craneBody(''), type: 'tower' });
    expect(badCrane.status).toBe(400);
    expect(badCrane.body.error.fields.map((f: { path: string }) => f.path)).toEqual(['fleetNumber', 'type']);
    const forged = await a.post('/api/library/cranes').send(craneBody('X-1'));
    const badGrid = await a.post(`/api/library/cranes/${forged.body.id}/configurations`).send({
      name: 'forged',
      version: versionBody({
        units: { radius: 'm', boomLength: 'm', capacity: 't' },
        boomLengths: [20],
        radii: [5, 5],
        capacities: [[10], [9]],
      }),
    });
    expect(badGrid.status).toBe(400);
    expect(badGrid.body.error.message).toMatch(/A3: duplicate radius 5/);
  });

  it('when another contractor or the owner side asks for a fleet, then they see only what they may', async () => {
    const { w, crane, v1 } = await fleet();
    const b = await signedIn(t.app, w.plannerB.email);
    expect((await b.get(`/api/library/cranes/${crane.id}`)).status).toBe(404);
    expect((await b.get(`/api/library/versions/${v1}`)).status).toBe(404);
    expect((await b.get('/api/library/cranes')).body.items).toEqual([]);
    const reviewer = await signedIn(t.app, w.reviewer.email);
    expect((await reviewer.get('/api/library/cranes')).status).toBe(403);
    // The owner side sees a version only through a package on its sites that uses it.
    expect((await reviewer.get(`/api/library/versions/${v1}`)).status).toBe(404);
    expect((await supertest(t.app).get('/api/library/cranes')).status).toBe(401);
  });

  it('when a configuration is edited, then a new version is written, the history says what changed, and a version in use can only be retired', async () => {
    const { w, a, config, v1 } = await fleet();
    const before = (await a.get(`/api/library/versions/${v1}`)).body as VersionDetail;
    const grid = structuredClone(before.chart);
    grid.capacities[0][0] = 27.5;
    const v2 = await a
      .post(`/api/library/configurations/${config.id}/versions`)
      .send(versionBody(grid, 'Corrected 8 m row'));
    expect(v2.status).toBe(201);
    expect(v2.body.number).toBe(2);
    expect(v2.body.cellsChanged).toBe(1);
    const history = (await a.get(`/api/library/configurations/${config.id}`)).body;
    expect(
      history.versions.map((v: { number: number; changeNote: string | null }) => [v.number, v.changeNote]),
    ).toEqual([
      [1, null],
      [2, 'Corrected 8 m row'],
    ]);
    expect(history.versions[1].createdBy.name).toBe(w.plannerA.name);
    await expect(
      t.ctx.dataSource.query(`UPDATE library_versions SET notes = '{}'::jsonb WHERE id = $1`, [v1]),
    ).rejects.toThrow(/cannot change/);
    const pkg = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      status: 'draft',
    });
    expect((await a.put(`/api/packages/${pkg.id}/library-uses`).send({ versionId: v1 })).status).toBe(200);
    const del = await a.delete(`/api/library/versions/${v1}`);
    expect(del.status).toBe(409);
    expect(del.body.error.message).toMatch(/used by 1 package: it cannot be deleted\. Retire it instead/);
    const retired = await a.post(`/api/library/versions/${v1}/retire`);
    expect(retired.status).toBe(200);
    expect(retired.body.retiredAt).not.toBeNull();
    const audit = await t.ctx.dataSource.query(
      `SELECT action FROM audit_events WHERE organisation_id = $1 ORDER BY created_at`,
      [w.contractorA.id],
    );
    expect(audit.map((r: { action: string }) => r.action)).toEqual([
      'library.crane_added',
      'library.configuration_added',
      'library.version_added',
      'library.version_picked',
      'library.version_retired',
    ]);
  });

  it('when a package is built from the library, then its check equals the typed-in one, the engineer verifies once and the next package shows it', async () => {
    const { w, a, v1 } = await fleet();
    const version = (await a.get(`/api/library/versions/${v1}`)).body as VersionDetail;
    const fromLibrary = liftFromLibrary(version);
    const typed = evaluateLift(LiftInput.parse(example));
    const picked = evaluateLift(LiftInput.parse(fromLibrary));
    const figures = (r: ReturnType<typeof evaluateLift>) =>
      r.checks.map((c) => ({
        id: c.id,
        status: c.status,
        value: c.value,
        items: c.items.map((i) => [i.id, i.status, i.value]),
      }));
    expect(figures(picked)).toEqual(figures(typed));
    expect(picked.overallStatus).toBe(typed.overallStatus);

    const engineer = await signedIn(t.app, w.engineer.email);
    const first = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      status: 'draft',
      inputs: fromLibrary,
    });
    expect((await a.put(`/api/packages/${first.id}/library-uses`).send({ versionId: v1 })).status).toBe(200);
    // Submitted and assigned to the engineer (the submit flow itself is tested elsewhere).
    await t.ctx.dataSource.query(
      `UPDATE lift_packages SET status = 'with_engineer', assigned_engineer_id = $2 WHERE id = $1`,
      [first.id, w.engineer.id],
    );
    await t.ctx.dataSource.query(
      `UPDATE revisions SET state = 'submitted', submitted_at = now() WHERE package_id = $1`,
      [first.id],
    );
    expect((await a.put(`/api/packages/${first.id}/library-uses`).send({ versionId: v1 })).status).toBe(409);
    const seen = await engineer.get(`/api/library/versions/${v1}`);
    expect(seen.status).toBe(200);
    expect(seen.body.chart.radii).toHaveLength(9);
    expect((await a.post(`/api/library/versions/${v1}/verifications`).send({ note: 'x' })).status).toBe(403);
    const verified = await engineer
      .post(`/api/library/versions/${v1}/verifications`)
      .send({ note: 'Checked every cell against page 14 of the 2026-1 chart', packageId: first.id });
    expect(verified.status).toBe(201);
    expect(verified.body.verifications[0]).toMatchObject({ engineer: { name: w.engineer.name } });
    expect(
      (await engineer.post(`/api/library/versions/${v1}/verifications`).send({ note: 'again' })).status,
    ).toBe(409);

    const second = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      status: 'draft',
      inputs: fromLibrary,
    });
    const uses = await a.put(`/api/packages/${second.id}/library-uses`).send({ versionId: v1 });
    expect(uses.body.items[0]).toMatchObject({
      slot: 0,
      detached: false,
      changedCells: [],
      version: { id: v1, number: 1 },
    });
    expect(uses.body.items[0].verifications[0]).toMatchObject({
      engineer: { name: w.engineer.name },
      note: 'Checked every cell against page 14 of the 2026-1 chart',
    });

    // Another owner desk's package using the same version does not show this desk's verification.
    const other = await makeWorld(t.ctx.dataSource);
    const otherPlanner = await makeUser(t.ctx.dataSource, w.contractorA, 'contractor');
    const elsewhere = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: other.site,
      createdBy: otherPlanner,
      status: 'draft',
      inputs: fromLibrary,
    });
    const there = await a.put(`/api/packages/${elsewhere.id}/library-uses`).send({ versionId: v1 });
    expect(there.body.items[0].verifications).toEqual([]);
    const otherEngineer = await signedIn(t.app, other.engineer.email);
    expect((await otherEngineer.get(`/api/library/versions/${v1}`)).status).toBe(404);
  });

  it('when a detached copy is edited, then the engineer sees each changed cell', async () => {
    const { w, a, v1 } = await fleet();
    const version = (await a.get(`/api/library/versions/${v1}`)).body as VersionDetail;
    const edited = liftFromLibrary(version);
    edited.chart.rows[2].capacity = { value: 19, unit: 't' };
    edited.chart.rows.pop();
    const pkg = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      engineer: w.engineer,
      status: 'with_engineer',
      inputs: edited,
    });
    await t.ctx.dataSource.query(
      `INSERT INTO library_uses (revision_id, package_id, slot, version_id, detached)
       SELECT r.id, r.package_id, 0, $2, true FROM revisions r WHERE r.package_id = $1`,
      [pkg.id, v1],
    );
    const engineer = await signedIn(t.app, w.engineer.email);
    const uses = await engineer.get(`/api/packages/${pkg.id}/library-uses`);
    expect(uses.status).toBe(200);
    expect(uses.body.items[0].detached).toBe(true);
    const last = (example.chart.rows as Row[]).at(-1)!;
    expect(uses.body.items[0].changedCells).toEqual([
      { boomLength: 30.5, radius: 12, library: 18.2, package: 19 },
      { boomLength: 30.5, radius: last.radius.value, library: last.capacity.value, package: null },
    ]);
    const b = await signedIn(t.app, w.plannerB.email);
    expect((await b.get(`/api/packages/${pkg.id}/library-uses`)).status).toBe(404);
  });

  it('when a returned package starts its next revision, then the new draft keeps the library version it used', async () => {
    const { w, a, v1 } = await fleet();
    const version = (await a.get(`/api/library/versions/${v1}`)).body as VersionDetail;
    const pkg = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      status: 'draft',
      inputs: liftFromLibrary(version),
    });
    await a.put(`/api/packages/${pkg.id}/library-uses`).send({ versionId: v1 });
    await t.ctx.dataSource.query(
      `UPDATE lift_packages SET status = 'returned', decision = 'revise_and_resubmit' WHERE id = $1`,
      [pkg.id],
    );
    await t.ctx.dataSource.query(
      `UPDATE revisions SET state = 'submitted', submitted_at = now() WHERE package_id = $1`,
      [pkg.id],
    );
    expect((await a.post(`/api/packages/${pkg.id}/revisions`)).status).toBe(201);
    const uses = await a.get(`/api/packages/${pkg.id}/library-uses`);
    expect(uses.body.items).toHaveLength(1);
    expect(uses.body.items[0]).toMatchObject({ version: { id: v1 }, detached: false, changedCells: [] });
    // The draft of revision 2 may change its pick; revision 1 keeps its own.
    expect((await a.delete(`/api/packages/${pkg.id}/library-uses/0`)).status).toBe(204);
    const rows = await t.ctx.dataSource.query(
      `SELECT r.number FROM library_uses u JOIN revisions r ON r.id = u.revision_id WHERE u.package_id = $1`,
      [pkg.id],
    );
    expect(rows).toEqual([{ number: 1 }]);
  });

  it("when the manufacturer's document is attached and the chart exported, then both come back as stored", async () => {
    const { a, v1 } = await fleet();
    const pdf = await makePdf(1);
    const attached = await a.post(`/api/library/versions/${v1}/document`).attach('file', Buffer.from(pdf), {
      filename: 'hr60-chart.pdf',
      contentType: 'application/pdf',
    });
    expect(attached.status).toBe(201);
    expect(attached.body.document.file).toMatchObject({ name: 'hr60-chart.pdf', pages: 1 });
    const again = await a.post(`/api/library/versions/${v1}/document`).attach('file', Buffer.from(pdf), {
      filename: 'b.pdf',
    });
    expect(again.status).toBe(409);
    const got = await a.get(`/api/library/versions/${v1}/document`).buffer(true);
    expect(Buffer.compare(got.body, Buffer.from(pdf))).toBe(0);
    const csv = await a.get(`/api/library/versions/${v1}/chart?format=csv`);
    expect(csv.text.split('\r\n')[0]).toBe('radius (m) / boom (m) / capacity (t),30.5');
    const xlsx = await a
      .get(`/api/library/versions/${v1}/chart?format=xlsx`)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    const round = await a
      .post('/api/library/chart-import/file')
      .attach('file', xlsx.body, { filename: 'back.xlsx' });
    expect(round.body.grid).toEqual((await a.get(`/api/library/versions/${v1}`)).body.chart);
    expect((await a.get(`/api/library/versions/${v1}/chart?format=pdf`)).status).toBe(400);
  });

  it('when the OpenAPI document is read, then every library route is in it', async () => {
    const paths = (await supertest(t.app).get('/api/openapi.json')).body.paths as Record<string, object>;
    const library = Object.entries(paths)
      .filter(([p]) => p.includes('/library'))
      .flatMap(([p, ops]) => Object.keys(ops).map((m) => `${m} ${p}`))
      .sort();
    expect(library).toEqual([
      'delete /api/library/versions/{id}',
      'delete /api/packages/{id}/library-uses/{slot}',
      'get /api/library/configurations/{id}',
      'get /api/library/cranes',
      'get /api/library/cranes/{id}',
      'get /api/library/versions/{id}',
      'get /api/library/versions/{id}/chart',
      'get /api/library/versions/{id}/document',
      'get /api/packages/{id}/library-uses',
      'patch /api/library/cranes/{id}',
      'post /api/library/chart-import/file',
      'post /api/library/chart-import/text',
      'post /api/library/configurations/{id}/versions',
      'post /api/library/cranes',
      'post /api/library/cranes/{id}/configurations',
      'post /api/library/cranes/{id}/retire',
      'post /api/library/versions/{id}/document',
      'post /api/library/versions/{id}/retire',
      'post /api/library/versions/{id}/verifications',
      'post /api/packages/{id}/library-uses/crane-removed',
      'put /api/packages/{id}/library-uses',
    ]);
  });

  it('when the fleet is searched by model and by capacity at a radius, then only configurations that rate it are listed', async () => {
    const { a, crane } = await fleet();
    const byNumber = await a.get('/api/library/cranes').query({ q: crane.fleetNumber });
    expect(byNumber.body.items.map((c: { id: string }) => c.id)).toEqual([crane.id]);
    // 11 m lies between the 10 m (22.5 t) and 12 m (18.2 t) rows: no upward reading, 18.2 t.
    const rates = await a.get('/api/library/cranes').query({ radius: 11, capacity: 18, capacityUnit: 't' });
    expect(rates.body.items[0].configurations[0].capacityAtRadius).toBeCloseTo(18.2, 9);
    const tooMuch = await a.get('/api/library/cranes').query({ radius: 11, capacity: 19 });
    expect(tooMuch.body.items).toEqual([]);
    const bad = await a.get('/api/library/cranes').query({ radius: 'far' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields[0].path).toBe('query.radius');
  });
});
