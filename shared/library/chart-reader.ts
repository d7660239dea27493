// Reading a load chart laid out as a grid (the layout chart-grid.ts describes) from a table of
// cells — a CSV file, a spreadsheet's values, or text pasted from either. Pure: no I/O. The importer
// shows how every cell was read, which units the header gave, and an error or warning naming the
// row and column of each problem; nothing is stored from here.
// A header or body cell may carry its own unit ("30.5 m", "12.5 t"); a unit other than the
// header's is a mixed-units error. Limits are ours (common practice, no source).
import { LENGTH_UNITS, TO_SI, WEIGHT_UNITS, type LengthUnit, type WeightUnit } from '../engineering/units';
import { same } from '../engineering/chart';
import { cellRef, isLength, isWeight, readNumber, readUnitsHeader, type RawCell } from './chart-cells';
import { gridToTable, sortGrid, type ChartGrid, type ChartUnits } from './chart-grid';
import { limitFigure } from '../vocabulary/units';

/** Most rated cells a chart may hold: the lift input takes at most 2000 chart rows. */
export const MAX_RATED_CELLS = 2000;
export const MAX_GRID_ROWS = 300;
export const MAX_GRID_COLUMNS = 100;
/** Above this a capacity is taken for a typing error (no crane rates 25,000 t): common practice, no source. */
export const MAX_CAPACITY_SI = 25_000 * TO_SI.t;
/** Above this a radius or boom length is taken for a typing error (common practice, no source). */
export const MAX_LENGTH_SI = 300;

export type CellRole = 'units' | 'boomLength' | 'radius' | 'capacity' | 'ignored';

export interface PreviewCell {
  /** Spreadsheet reference, e.g. "C4" (row and column from 1) */
  ref: string;
  row: number;
  column: number;
  role: CellRole;
  raw: string;
  /** The number read, in the header's unit; null for a blank or unreadable cell */
  value: number | null;
  /** The unit this cell was read in */
  unit: string | null;
  problem: 'error' | 'warning' | null;
  message: string | null;
}

export interface GridIssue {
  ref: string | null;
  row: number | null;
  column: number | null;
  message: string;
}

export interface ChartPreview {
  units: Partial<ChartUnits>;
  /** Which cell the units were read from and how, for the preview's header line */
  unitsSource: string;
  orientation: 'radius_down' | 'boom_down';
  cells: PreviewCell[][];
  errors: GridIssue[];
  warnings: GridIssue[];
  /** The chart read, only when there are no errors */
  grid: ChartGrid | null;
  ratedCells: number;
}

const text = (c: RawCell) => (c === null || c === undefined ? '' : typeof c === 'number' ? String(c) : c);

/** Reads a table of cells as a chart grid. Every problem names its cell. */
export function readChartGrid(table: readonly (readonly RawCell[])[]): ChartPreview {
  const errors: GridIssue[] = [];
  const warnings: GridIssue[] = [];
  const err = (row0: number | null, col0: number | null, message: string) =>
    errors.push({
      ref: row0 !== null && col0 !== null ? cellRef(row0, col0) : null,
      row: row0 === null ? null : row0 + 1,
      column: col0 === null ? null : col0 + 1,
      message,
    });
  const warn = (row0: number, col0: number, message: string) =>
    warnings.push({ ref: cellRef(row0, col0), row: row0 + 1, column: col0 + 1, message });

  // Trailing blank rows and columns are not part of the chart.
  const rows = table.map((r) => r.map(text));
  while (rows.length && rows[rows.length - 1].every((c) => c.trim() === '')) rows.pop();
  const width = Math.max(
    0,
    ...rows.map((r) => {
      let w = r.length;
      while (w > 0 && r[w - 1].trim() === '') w--;
      return w;
    }),
  );
  const empty: ChartPreview = {
    units: {},
    unitsSource: '',
    orientation: 'radius_down',
    cells: [],
    errors,
    warnings,
    grid: null,
    ratedCells: 0,
  };
  if (rows.length < 2 || width < 2) {
    err(
      null,
      null,
      'The chart needs a header row of boom lengths, a first column of radii and at least one capacity',
    );
    return empty;
  }
  if (rows.length > MAX_GRID_ROWS) {
    err(null, null, `The chart has ${rows.length} rows; at most ${MAX_GRID_ROWS} can be read`);
    return empty;
  }
  if (width > MAX_GRID_COLUMNS) {
    err(null, null, `The chart has ${width} columns; at most ${MAX_GRID_COLUMNS} can be read`);
    return empty;
  }

  const header = readUnitsHeader(rows[0][0] ?? '');
  const boomDown =
    header.order.indexOf('boom') >= 0 &&
    header.order.indexOf('boom') < Math.max(0, header.order.indexOf('radius'));
  const orientation = boomDown ? 'boom_down' : 'radius_down';
  for (const u of header.unknown)
    err(
      0,
      0,
      `A1: the unit ${u} is not one the importer knows (${[...LENGTH_UNITS, ...WEIGHT_UNITS].join(', ')})`,
    );

  const cells: PreviewCell[][] = [];
  const cell = (r: number, c: number, role: CellRole): PreviewCell => ({
    ref: cellRef(r, c),
    row: r + 1,
    column: c + 1,
    role,
    raw: rows[r]?.[c] ?? '',
    value: null,
    unit: null,
    problem: null,
    message: null,
  });
  const mark = (p: PreviewCell, problem: 'error' | 'warning', message: string) => {
    p.problem = problem;
    p.message = message;
    if (problem === 'error') err(p.row - 1, p.column - 1, `${p.ref}: ${message}`);
    else warn(p.row - 1, p.column - 1, `${p.ref}: ${message}`);
  };

  // Header units, or the unit every header/body cell of that kind carries alike.
  const axisAcross: 'boom' | 'radius' = boomDown ? 'radius' : 'boom';
  const axisDown: 'boom' | 'radius' = boomDown ? 'boom' : 'radius';
  const givenUnit: Partial<Record<'radius' | 'boom' | 'capacity', string>> = { ...header.units };
  const sources: string[] = [];
  for (const k of ['radius', 'boom', 'capacity'] as const)
    if (header.units[k]) sources.push(`${k} in ${header.units[k]} (from A1)`);

  // First pass: numbers of every cell.
  const reads: ReturnType<typeof readNumber>[][] = rows.map((r, i) =>
    Array.from({ length: width }, (_, j) =>
      i === 0 && j === 0 ? { value: null, unit: null, ok: true } : readNumber(r[j] ?? ''),
    ),
  );
  const kindOf = (i: number, j: number): 'radius' | 'boom' | 'capacity' | null =>
    i === 0 && j === 0 ? null : i === 0 ? axisAcross : j === 0 ? axisDown : 'capacity';
  for (const k of ['radius', 'boom', 'capacity'] as const) {
    if (givenUnit[k]) continue;
    const seen = new Set<string>();
    for (let i = 0; i < rows.length; i++)
      for (let j = 0; j < width; j++) if (kindOf(i, j) === k && reads[i][j].unit) seen.add(reads[i][j].unit!);
    if (seen.size === 1) {
      givenUnit[k] = [...seen][0];
      sources.push(`${k} in ${givenUnit[k]} (from the cells)`);
    }
  }
  const unitOk = (k: 'radius' | 'boom' | 'capacity', u: string | undefined) =>
    k === 'capacity' ? isWeight(u ?? null) : isLength(u ?? null);
  for (const k of ['radius', 'boom', 'capacity'] as const) {
    if (!givenUnit[k])
      err(
        0,
        0,
        `A1: the header does not say the ${k} unit; write e.g. "radius (m) / boom (m) / capacity (t)"`,
      );
    else if (!unitOk(k, givenUnit[k]))
      err(0, 0, `A1: ${givenUnit[k]} is not a ${k === 'capacity' ? 'weight' : 'length'} unit for the ${k}`);
  }

  const across: { col: number; value: number }[] = [];
  const down: { row: number; value: number }[] = [];
  for (let i = 0; i < rows.length; i++) {
    const line: PreviewCell[] = [];
    for (let j = 0; j < width; j++) {
      const k = kindOf(i, j);
      const role: CellRole = k === null ? 'units' : k === 'boom' ? 'boomLength' : k;
      const p = cell(i, j, role);
      line.push(p);
      if (k === null) {
        p.unit = sources.join('; ') || null;
        continue;
      }
      const r = reads[i][j];
      p.unit = r.unit ?? givenUnit[k] ?? null;
      const label = k === 'boom' ? 'boom length' : k;
      if (!r.ok) {
        mark(
          p,
          'error',
          `"${p.raw.trim()}" is not a number${k === 'capacity' ? ' (leave the cell blank where the chart rates nothing)' : ''}`,
        );
        continue;
      }
      if (r.value === null) {
        if (k !== 'capacity') mark(p, 'error', `the ${label} is blank`);
        continue;
      }
      if (r.unit && givenUnit[k] && r.unit !== givenUnit[k]) {
        mark(
          p,
          'error',
          `mixed units: ${r.value} ${r.unit} where the ${label === 'capacity' ? 'capacities' : `${label}s`} are in ${givenUnit[k]}`,
        );
        continue;
      }
      p.value = r.value;
      const u = givenUnit[k];
      const si = u && u in TO_SI ? r.value * TO_SI[u as keyof typeof TO_SI] : null;
      if (k === 'capacity') {
        if (r.value <= 0)
          mark(
            p,
            'error',
            `capacity ${r.value} must be greater than 0 (leave the cell blank where the chart rates nothing)`,
          );
        else if (si !== null && si > MAX_CAPACITY_SI)
          mark(
            p,
            'error',
            `capacity ${r.value} ${u} is beyond ${limitFigure(MAX_CAPACITY_SI / TO_SI[u as keyof typeof TO_SI])} ${u}: check the figure and the unit`,
          );
      } else {
        const min = k === 'boom' ? 'greater than 0' : '0 or more';
        if (k === 'boom' ? r.value <= 0 : r.value < 0) mark(p, 'error', `${label} ${r.value} must be ${min}`);
        else if (si !== null && si > MAX_LENGTH_SI)
          mark(
            p,
            'error',
            `${label} ${r.value} ${u} is beyond ${limitFigure(MAX_LENGTH_SI / TO_SI[u as keyof typeof TO_SI])} ${u}: check the figure and the unit`,
          );
        else if (i === 0) across.push({ col: j, value: r.value });
        else down.push({ row: i, value: r.value });
      }
    }
    cells.push(line);
  }

  // Duplicates among boom lengths or radii leave a capacity ambiguous: name both cells.
  const dup = (
    list: { at: number; value: number }[],
    refOf: (at: number) => [number, number],
    label: string,
  ) => {
    for (let a = 0; a < list.length; a++)
      for (let b = a + 1; b < list.length; b++)
        if (same(list[a].value, list[b].value)) {
          const [ra, ca] = refOf(list[a].at);
          const [rb, cb] = refOf(list[b].at);
          const p = cells[rb][cb];
          mark(p, 'error', `duplicate ${label} ${list[b].value}: ${cellRef(ra, ca)} lists it already`);
        }
  };
  dup(
    across.map((x) => ({ at: x.col, value: x.value })),
    (c) => [0, c],
    boomDown ? 'radius' : 'boom length',
  );
  dup(
    down.map((x) => ({ at: x.row, value: x.value })),
    (r) => [r, 0],
    boomDown ? 'boom length' : 'radius',
  );

  // Capacity rising with radius along one boom length: a warning, charts rarely do that.
  const lines = boomDown
    ? down.map((d) => ({ fixed: d.row, isRow: true }))
    : across.map((a) => ({ fixed: a.col, isRow: false }));
  for (const line of lines) {
    const along = (
      boomDown
        ? across.map((a) => ({ r: line.fixed, c: a.col, radius: a.value }))
        : down.map((d) => ({ r: d.row, c: line.fixed, radius: d.value }))
    )
      .filter((x) => cells[x.r][x.c].value !== null && cells[x.r][x.c].problem !== 'error')
      .sort((x, y) => x.radius - y.radius);
    for (let n = 1; n < along.length; n++) {
      const prev = cells[along[n - 1].r][along[n - 1].c];
      const cur = cells[along[n].r][along[n].c];
      if (cur.value! > prev.value! && !same(cur.value!, prev.value!))
        mark(
          cur,
          'warning',
          `capacity ${cur.value} rises from ${prev.value} at ${prev.ref} as the radius grows: charts rarely do that, check the figure`,
        );
    }
  }

  let rated = 0;
  for (let i = 1; i < rows.length; i++)
    for (let j = 1; j < width; j++) if (cells[i][j].value !== null) rated++;
  if (rated === 0 && errors.length === 0)
    err(null, null, 'The chart rates no capacity: fill at least one cell of the body');
  if (rated > MAX_RATED_CELLS)
    err(null, null, `The chart has ${rated} rated cells; at most ${MAX_RATED_CELLS} can be kept`);

  const units: Partial<ChartUnits> = {};
  if (isLength(givenUnit.radius ?? null)) units.radius = givenUnit.radius as LengthUnit;
  if (isLength(givenUnit.boom ?? null)) units.boomLength = givenUnit.boom as LengthUnit;
  if (isWeight(givenUnit.capacity ?? null)) units.capacity = givenUnit.capacity as WeightUnit;

  let grid: ChartGrid | null = null;
  if (errors.length === 0 && units.radius && units.boomLength && units.capacity) {
    const rowAxis = down.map((d) => d.value);
    const colAxis = across.map((a) => a.value);
    const at = (i: number, j: number) => cells[down[i].row][across[j].col].value;
    const boomLengths = boomDown ? rowAxis : colAxis;
    const radii = boomDown ? colAxis : rowAxis;
    const capacities = radii.map((_, ri) => boomLengths.map((_, bj) => (boomDown ? at(bj, ri) : at(ri, bj))));
    grid = sortGrid({ units: units as ChartUnits, boomLengths, radii, capacities });
  }
  return {
    units,
    unitsSource: sources.join('; '),
    orientation,
    cells,
    errors,
    warnings,
    grid,
    ratedCells: rated,
  };
}

/** The grid checked again as a table (for a grid sent back by a client after the preview). */
export function checkGrid(g: ChartGrid): ChartPreview {
  return readChartGrid(gridToTable(g));
}
