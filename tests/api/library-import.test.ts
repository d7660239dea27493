// Chart import with the importer's real limits (the default CHART_IMPORT_MAX_BYTES): a CSV and an
// .xlsx made here are previewed, nothing is stored until the preview is accepted, and what is
// stored is what the preview showed. Every bad file gets a message naming the row and column (or
// the limit): mixed units, a header that cannot be read, duplicate boom lengths and radii, negative
// and absurd capacities, a 50 MB file, formulas (values only) and a workbook with macros.
import ExcelJS from 'exceljs';
import JSZip from 'jszip';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeWorld } from '../support/factories';
import { signedIn, startTestApp, type TestApp } from '../support/app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

type Agent = Awaited<ReturnType<typeof signedIn>>;
type Issue = { ref: string | null; row: number | null; column: number | null; message: string };
type Cell = { ref: string; problem: string | null; message: string | null };

async function xlsx(rows: (string | number | null | { formula: string; result?: number })[][]) {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet('Chart');
  for (const r of rows) ws.addRow(r);
  return Buffer.from(await wb.xlsx.writeBuffer());
}

/** How much of the organisation's library is stored: cranes, configurations, versions, chart cells. */
async function stored(organisationId: string) {
  const [row] = await t.ctx.dataSource.query(
    `SELECT (SELECT count(*) FROM library_cranes c WHERE c.organisation_id = $1)::int AS cranes,
            (SELECT count(*) FROM library_configurations k JOIN library_cranes c ON c.id = k.crane_id
              WHERE c.organisation_id = $1)::int AS configurations,
            (SELECT count(*) FROM library_versions v JOIN library_configurations k ON k.id = v.configuration_id
              JOIN library_cranes c ON c.id = k.crane_id WHERE c.organisation_id = $1)::int AS versions,
            (SELECT count(*) FROM library_chart_cells x JOIN library_versions v ON v.id = x.version_id
              JOIN library_configurations k ON k.id = v.configuration_id
              JOIN library_cranes c ON c.id = k.crane_id WHERE c.organisation_id = $1)::int AS cells`,
    [organisationId],
  );
  return row as { cranes: number; configurations: number; versions: number; cells: number };
}

async function planner() {
  const w = await makeWorld(t.ctx.dataSource);
  const a = await signedIn(t.app, w.plannerA.email);
  const crane = await a.post('/api/library/cranes').send({
    fleetNumber: `IM-${Math.random().toString(36).slice(2, 7)}`,
    make: 'Harbour Row',
    model: 'HR-60',
    type: 'mobile_outriggers',
    fixed: {},
  });
  expect(crane.status).toBe(201);
  return { w, a, craneId: crane.body.id as string, org: w.contractorA.id };
}

const text = (a: Agent, body: string) => a.post('/api/library/chart-import/text').send({ text: body });
const file = (a: Agent, bytes: Buffer, filename: string) =>
  a.post('/api/library/chart-import/file').attach('file', bytes, { filename });

/** The one error of a preview at a cell: its row and column (from 1), message and the cell's mark. */
function errorAt(body: { errors: Issue[]; cells: Cell[][]; grid: unknown }, ref: string) {
  const e = body.errors.find((x) => x.ref === ref);
  if (!e) throw new Error(`no error at ${ref}: ${JSON.stringify(body.errors)}`);
  const cell = body.cells[e.row! - 1]?.[e.column! - 1];
  expect(cell?.ref).toBe(ref);
  expect(cell?.problem).toBe('error');
  expect(body.grid).toBeNull();
  return e;
}

describe('chart import, nothing stored until accepted', () => {
  it('when a CSV and an .xlsx made here are previewed, then nothing is stored; once each preview is accepted, the version holds exactly the previewed chart', async () => {
    const { a, craneId, org } = await planner();
    const before = await stored(org);
    expect(before).toEqual({ cranes: 1, configurations: 0, versions: 0, cells: 0 });
    const csv = await file(
      a,
      Buffer.from(
        'radius (m) / boom (m) / capacity (t),24.4,30.5\n8,30,28\n10,24,22.5\n12,19.5,18.2\n14,,15.1\n',
      ),
      'chart.csv',
    );
    const book = await file(
      a,
      await xlsx([
        ['boom (ft) / radius (ft) / capacity (kip)', 30, 40, 50],
        [100, 80, { formula: 'B2*0.8', result: 64 }, 51],
        [120, 72, 60, null],
      ]),
      'chart.xlsx',
    );
    for (const res of [csv, book]) {
      expect(res.status).toBe(200);
      expect(res.body.errors).toEqual([]);
    }
    expect(csv.body.units).toEqual({ radius: 'm', boomLength: 'm', capacity: 't' });
    expect(csv.body.cells[4][1]).toMatchObject({ ref: 'B5', role: 'capacity', raw: '', value: null });
    expect(book.body.orientation).toBe('boom_down');
    expect(book.body.unitsSource).toBe(
      'radius in ft (from A1); boom in ft (from A1); capacity in kip (from A1)',
    );
    expect(book.body.warnings).toEqual([
      {
        ref: 'C2',
        row: 2,
        column: 3,
        message: 'C2: holds a formula; its stored value 64 was read, the formula was not calculated',
      },
    ]);
    expect(await stored(org)).toEqual(before);

    for (const [name, res] of [
      ['from CSV', csv],
      ['from .xlsx', book],
    ] as const) {
      const accepted = await a.post(`/api/library/cranes/${craneId}/configurations`).send({
        name: `Main boom ${name}`,
        version: {
          details: { workingArea: 'full_circle' },
          notes: { deductions: [], blockIncluded: false, interpolationAllowed: false },
          document: { title: 'Invented chart' },
          chart: res.body.grid,
        },
      });
      expect(accepted.status).toBe(201);
      const v = await a.get(`/api/library/versions/${accepted.body.versions[0].id}`);
      expect(v.body.chart).toEqual(res.body.grid);
    }
    expect(book.body.grid).toEqual({
      units: { radius: 'ft', boomLength: 'ft', capacity: 'kip' },
      boomLengths: [100, 120],
      radii: [30, 40, 50],
      capacities: [
        [80, 72],
        [64, 60],
        [51, null],
      ],
    });
    expect(await stored(org)).toEqual({ cranes: 1, configurations: 2, versions: 2, cells: 7 + 5 });
  });
});

describe('chart import, bad input named by row and column', () => {
  it('when a capacity carries another unit than the header, then mixed units names its cell', async () => {
    const { a } = await planner();
    const res = await text(a, 'radius (m) / boom (m) / capacity (t)\t20\t30\n5\t12\t10\n6\t11\t12500 kg');
    expect(errorAt(res.body, 'C3')).toEqual({
      ref: 'C3',
      row: 3,
      column: 3,
      message: 'C3: mixed units: 12500 kg where the capacities are in t',
    });
  });

  it('when the header cannot be read, then A1 (row 1, column 1) says what it lacks and what to write', async () => {
    const { a } = await planner();
    const noUnits = await text(a, 'Lastdiagramm\t20\t30\n5\t12\t10');
    const messages = noUnits.body.errors.map((e: Issue) => [e.row, e.column, e.message]);
    expect(messages).toEqual([
      [
        1,
        1,
        'A1: the header does not say the radius unit; write e.g. "radius (m) / boom (m) / capacity (t)"',
      ],
      [1, 1, 'A1: the header does not say the boom unit; write e.g. "radius (m) / boom (m) / capacity (t)"'],
      [
        1,
        1,
        'A1: the header does not say the capacity unit; write e.g. "radius (m) / boom (m) / capacity (t)"',
      ],
    ]);
    expect(noUnits.body.grid).toBeNull();
    const unknown = await text(a, 'radius (furlong) / boom (m) / capacity (t)\t20\n5\t12');
    expect(unknown.body.errors[0]).toMatchObject({ ref: 'A1', row: 1, column: 1 });
    expect(unknown.body.errors[0].message).toMatch(
      /^A1: the unit radius "furlong" is not one the importer knows \(m, mm, ft/,
    );
  });

  it('when a boom length or a radius is listed twice, then the second cell is named with the first', async () => {
    const { a } = await planner();
    const res = await text(
      a,
      'radius (m) / boom (m) / capacity (t)\t30.5\t30.5\n8\t28\t27\n10\t22\t21\n8\t20\t19',
    );
    expect(errorAt(res.body, 'C1')).toMatchObject({
      row: 1,
      column: 3,
      message: 'C1: duplicate boom length 30.5: B1 lists it already',
    });
    expect(errorAt(res.body, 'A4')).toMatchObject({
      row: 4,
      column: 1,
      message: 'A4: duplicate radius 8: A2 lists it already',
    });
  });

  it('when capacities are negative, zero or absurd, then each cell is named with the limit', async () => {
    const { a } = await planner();
    const res = await text(a, 'radius (m) / boom (m) / capacity (t)\t20\t30\n5\t-4\t0\n6\t90000\t12');
    expect(errorAt(res.body, 'B2')).toMatchObject({
      row: 2,
      column: 2,
      message: 'B2: capacity -4 must be greater than 0 (leave the cell blank where the chart rates nothing)',
    });
    expect(errorAt(res.body, 'C2')).toMatchObject({ row: 2, column: 3 });
    expect(errorAt(res.body, 'B3')).toMatchObject({
      row: 3,
      column: 2,
      message: 'B3: capacity 90000 t is beyond 25,000 t: check the figure and the unit',
    });
  });

  it('when a 50 MB spreadsheet is sent, then 413 names the limit and nothing is stored', async () => {
    const { a, org } = await planner();
    const before = await stored(org);
    expect(t.ctx.config.CHART_IMPORT_MAX_BYTES).toBe(5 * 1024 * 1024);
    const big = Buffer.alloc(50 * 1024 * 1024, 0x20);
    Buffer.from([0x50, 0x4b, 0x03, 0x04]).copy(big);
    const res = await file(a, big, 'fleet-charts.xlsx');
    expect(res.status).toBe(413);
    expect(res.body.error.message).toBe('The chart file is larger than the limit of 5 MB.');
    expect(res.body.error.fields).toEqual([{ path: 'file', message: 'File must be at most 5 MB' }]);
    expect(await stored(org)).toEqual(before);
  });

  it('when a workbook holds formulas, then only their stored values are read, and one without a value is an error at its cell', async () => {
    const { a } = await planner();
    const res = await file(
      a,
      await xlsx([
        ['radius (m) / boom (m) / capacity (t)', 20, 30],
        [5, { formula: 'C2*1.2', result: 12 }, 10],
        [6, { formula: 'NOW()' }, 9],
      ]),
      'formulas.xlsx',
    );
    expect(res.status).toBe(200);
    expect(res.body.warnings).toEqual([
      {
        ref: 'B2',
        row: 2,
        column: 2,
        message: 'B2: holds a formula; its stored value 12 was read, the formula was not calculated',
      },
    ]);
    expect(errorAt(res.body, 'B3')).toEqual({
      ref: 'B3',
      row: 3,
      column: 2,
      message:
        'B3: holds a formula with no stored value: type the value itself (formulas are never calculated here)',
    });
  });

  it('when a real workbook carries a macro project, then it is refused unopened and nothing is stored', async () => {
    const { a, org } = await planner();
    const before = await stored(org);
    // An .xlsx made here, turned into a macro-enabled workbook: a VBA project part and its type.
    const zip = await JSZip.loadAsync(
      await xlsx([
        ['radius (m) / boom (m) / capacity (t)', 20],
        [5, 12],
      ]),
    );
    zip.file('xl/vbaProject.bin', Buffer.from('Attribute VB_Name = "Module1"\nSub AutoOpen()\nEnd Sub\n'));
    const types = await zip.file('[Content_Types].xml')!.async('string');
    zip.file(
      '[Content_Types].xml',
      types.replace(
        '</Types>',
        '<Default Extension="bin" ContentType="application/vnd.ms-office.vbaProject"/></Types>',
      ),
    );
    const xlsm = await zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' });
    const res = await file(a, xlsm, 'chart.xlsm');
    expect(res.status).toBe(415);
    expect(res.body.error.message).toBe(
      'chart.xlsm contains macros (vbaProject.bin); they are never run here. Save the chart as a plain .xlsx without macros, or as CSV.',
    );
    expect(res.body.error.fields).toEqual([
      { path: 'file', message: 'File: workbook must not contain macros' },
    ]);
    expect(await stored(org)).toEqual(before);
  });

  it('when an accepted grid is sent back altered, then the version is refused with the cell named and nothing stored', async () => {
    const { a, craneId, org } = await planner();
    const before = await stored(org);
    const res = await a.post(`/api/library/cranes/${craneId}/configurations`).send({
      name: 'forged',
      version: {
        details: { workingArea: 'full_circle' },
        notes: { deductions: [], blockIncluded: false, interpolationAllowed: false },
        document: { title: 'Invented chart' },
        chart: {
          units: { radius: 'm', boomLength: 'm', capacity: 't' },
          boomLengths: [20, 30],
          radii: [5, 6],
          capacities: [
            [12, -1],
            [11, 9],
          ],
        },
      },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/C2: capacity -1 must be greater than 0/);
    expect(await stored(org)).toEqual(before);
  });
});
