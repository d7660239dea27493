import { describe, expect, it } from 'vitest';
import { gridToTable } from '@shared/library/chart-grid';
import { readChartGrid } from '@shared/library/chart-reader';
import { gridToCsv, previewText } from '@shared/library/chart-text';
import { capacityAtRadius, changedCells, fillFromVersion } from '@shared/library/to-lift-input';
import { TO_SI } from '@shared/engineering/units';

const CSV = [
  'radius (m) / boom (m) / capacity (t),12.2,18.3,24.4',
  '3,40,,',
  '5,30,28,',
  '8,18.5,17,15.2',
  '10,12,11.5,11',
].join('\n');

describe('chart grid import', () => {
  it('when a well-formed CSV is read, then units come from A1 and blanks stay unrated', () => {
    const p = previewText(CSV);
    expect(p.errors).toEqual([]);
    expect(p.warnings).toEqual([]);
    expect(p.units).toEqual({ radius: 'm', boomLength: 'm', capacity: 't' });
    expect(p.unitsSource).toContain('from A1');
    expect(p.grid!.boomLengths).toEqual([12.2, 18.3, 24.4]);
    expect(p.grid!.radii).toEqual([3, 5, 8, 10]);
    expect(p.grid!.capacities[0]).toEqual([40, null, null]);
    expect(p.ratedCells).toBe(9);
    expect(p.cells[2][2]).toMatchObject({ ref: 'C3', role: 'capacity', value: 28, unit: 't', problem: null });
  });

  it('when the text is tab-separated as pasted from a spreadsheet, then it reads the same grid', () => {
    const p = previewText(CSV.replace(/,/g, '\t'));
    expect(p.errors).toEqual([]);
    expect(p.grid).toEqual(previewText(CSV).grid);
  });

  it('when cells are bad, then each error names its cell and nothing is returned to store', () => {
    const p = previewText(
      [
        'radius (m) / boom (m) / capacity (t),12.2,12.2,24.4',
        '3,40,abc,',
        '5,-2,28,',
        ',18.5,17,15.2',
        '5,90000,11.5,11 lb',
      ].join('\n'),
    );
    const msgs = p.errors.map((e) => e.message);
    expect(p.grid).toBeNull();
    expect(msgs).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/^C1: duplicate boom length 12.2: B1 lists it already/),
        expect.stringMatching(/^C2: "abc" is not a number/),
        expect.stringMatching(/^B3: capacity -2 must be greater than 0/),
        expect.stringMatching(/^A4: the radius is blank/),
        expect.stringMatching(/^A5: duplicate radius 5: A3 lists it already/),
        expect.stringMatching(/^B5: capacity 90000 t is beyond 25,000 t/),
        expect.stringMatching(/^D5: mixed units: 11 lb where the capacities are in t/),
      ]),
    );
    const c2 = p.errors.find((e) => e.ref === 'C2')!;
    expect([c2.row, c2.column]).toEqual([2, 3]);
  });

  it('when the header names no units, then A1 is the error and says what to write', () => {
    const p = previewText('r,10,20\n3,5,4');
    expect(p.grid).toBeNull();
    expect(p.errors[0].ref).toBe('A1');
    expect(p.errors.map((e) => e.message).join(' ')).toMatch(/does not say the radius unit/);
  });

  it('when units ride on the cells instead of A1, then they are read from the cells', () => {
    const p = previewText('radius / boom,40 ft,60 ft\n10 ft,20 kip,18 kip\n20 ft,12 kip,11 kip');
    expect(p.errors).toEqual([]);
    expect(p.units).toEqual({ radius: 'ft', boomLength: 'ft', capacity: 'kip' });
    expect(p.unitsSource).toMatch(/from the cells/);
  });

  it('when capacity rises with radius in a boom column, then it is a warning, not an error', () => {
    const p = previewText('radius (m) / boom (m) / capacity (t),20\n4,10\n6,12\n8,7');
    expect(p.errors).toEqual([]);
    expect(p.grid).not.toBeNull();
    expect(p.warnings).toHaveLength(1);
    expect(p.warnings[0]).toMatchObject({ ref: 'B3', row: 3, column: 2 });
    expect(p.warnings[0].message).toMatch(/rises from 10 at B2/);
  });

  it('when A1 puts boom before radius, then boom lengths run down and radii across', () => {
    const p = previewText('"boom (m) \\ radius (m), capacity (t)",3,5\n12.2,40,30\n18.3,,28');
    expect(p.errors).toEqual([]);
    expect(p.orientation).toBe('boom_down');
    expect(p.grid!.radii).toEqual([3, 5]);
    expect(p.grid!.boomLengths).toEqual([12.2, 18.3]);
    expect(p.grid!.capacities).toEqual([
      [40, null],
      [30, 28],
    ]);
  });

  it('when a grid is exported to CSV and read again, then it is the same grid', () => {
    const g = previewText(CSV).grid!;
    expect(previewText(gridToCsv(g)).grid).toEqual(g);
    expect(gridToTable(g)[0][0]).toBe('radius (m) / boom (m) / capacity (t)');
  });

  it('when a table is larger than the limit, then one error names the limit', () => {
    const rows = Array.from({ length: 400 }, (_, i) => [
      i === 0 ? 'radius (m) / boom (m) / capacity (t)' : i,
      10,
    ]);
    expect(readChartGrid(rows).errors[0].message).toMatch(/400 rows; at most 300/);
  });
});

describe('chart grid use', () => {
  const g = previewText(CSV).grid!;
  it('when the capacity at a radius between rows is asked, then the lower bracketing capacity is used', () => {
    // 6 m lies between 5 m and 8 m: 12.2 m boom → min(30, 18.5) = 18.5; 18.3 m → min(28, 17) = 17
    expect(capacityAtRadius(g, 6, false)! / TO_SI.t).toBeCloseTo(18.5, 9);
    expect(capacityAtRadius(g, 5, false)! / TO_SI.t).toBeCloseTo(30, 9);
    expect(capacityAtRadius(g, 2, false)).toBeNull();
    expect(capacityAtRadius(g, 12, false)).toBeNull();
    // interpolation allowed: 30 + (1/3)(18.5 − 30)
    expect(capacityAtRadius(g, 6, true)! / TO_SI.t).toBeCloseTo(30 - 11.5 / 3, 9);
  });

  it('when a package chart differs from the version, then every added, removed and changed cell is listed', () => {
    const rows = [
      {
        radius: { value: 3, unit: 'm' },
        boomLength: { value: 12.2, unit: 'm' },
        capacity: { value: 40, unit: 't' },
      },
      {
        radius: { value: 5, unit: 'm' },
        boomLength: { value: 12.2, unit: 'm' },
        capacity: { value: 31, unit: 't' },
      },
      {
        radius: { value: 12, unit: 'm' },
        boomLength: { value: 12.2, unit: 'm' },
        capacity: { value: 9, unit: 't' },
      },
    ];
    const ch = changedCells(g, rows);
    expect(ch).toContainEqual({ boomLength: 12.2, radius: 5, library: 30, package: 31 });
    expect(ch).toContainEqual({ boomLength: 12.2, radius: 12, library: null, package: 9 });
    expect(ch).toContainEqual({ boomLength: 24.4, radius: 10, library: 11, package: null });
    expect(ch).not.toContainEqual(expect.objectContaining({ boomLength: 12.2, radius: 3 }));
    // same chart typed in feet and kip: no change
    const same = changedCells(
      g,
      [[3, 12.2, 40]].map(([r, b, c]) => ({
        radius: { value: r / 0.3048, unit: 'ft' },
        boomLength: { value: b / 0.3048, unit: 'ft' },
        capacity: { value: (c * 1000) / 0.45359237 / 1000, unit: 'kip' },
      })),
    );
    expect(same.filter((c) => c.boomLength === 12.2 && c.radius === 3)).toEqual([]);
  });

  it('when a version fills the lift input, then the chart rows carry the chart units and the chosen spread', () => {
    const fill = fillFromVersion({
      id: '00000000-0000-4000-8000-000000000001',
      number: 2,
      createdAt: '',
      createdBy: { id: '00000000-0000-4000-8000-000000000002', name: 'x' },
      changeNote: null,
      retiredAt: null,
      usedBy: 0,
      cellsChanged: null,
      verified: false,
      configurationId: '00000000-0000-4000-8000-000000000003',
      configurationName: 'Main boom, 18 t',
      crane: {
        id: '00000000-0000-4000-8000-000000000004',
        fleetNumber: 'HR-07',
        make: 'Demo',
        model: 'AT60',
        type: 'mobile_outriggers',
        fixed: {
          outriggerSpreads: [
            {
              name: 'full',
              longitudinalSpread: { value: 7.2, unit: 'm' },
              transverseSpread: { value: 7, unit: 'm' },
            },
            {
              name: 'mid',
              longitudinalSpread: { value: 7.2, unit: 'm' },
              transverseSpread: { value: 5, unit: 'm' },
            },
          ],
        },
      },
      details: {
        workingArea: 'full_circle',
        outriggerSpread: 'mid',
        hookBlock: { weight: { value: 0.5, unit: 't' } },
      },
      notes: { deductions: [], blockIncluded: false, interpolationAllowed: false },
      document: { title: 'Chart', file: null },
      chart: g,
      verifications: [],
    });
    expect(fill.crane.outriggers?.transverseSpread).toEqual({ value: 5, unit: 'm' });
    expect(fill.chart.rows).toHaveLength(9);
    expect(fill.chart.rows[0]).toEqual({
      radius: { value: 3, unit: 'm' },
      boomLength: { value: 12.2, unit: 'm' },
      capacity: { value: 40, unit: 't' },
    });
    expect(fill.hookBlock).toEqual({ weight: { value: 0.5, unit: 't' } });
    expect(fill.crane.name).toBe('HR-07 — Demo AT60, Main boom, 18 t (library version 2)');
  });
});

describe('chart pictures', () => {
  it('when the capacity lines are drawn, then each boom length keeps only its rated cells', async () => {
    const { capacityLines, ticks } = await import('@shared/library/chart-plot');
    const g = previewText('radius (m) / boom (m) / capacity (t),10,20\n6,10,8\n12,,5').grid!;
    // (the working range has its own hand-worked tests in working-range.test.ts)
    expect(capacityLines(g)[0].points).toEqual([{ x: 6, y: 10, rated: true }]);
    expect(capacityLines(g)[1].points).toEqual([
      { x: 6, y: 8, rated: true },
      { x: 12, y: 5, rated: true },
    ]);
    expect(ticks(47)).toEqual([0, 10, 20, 30, 40, 50]);
  });
});

describe('demo fleets', () => {
  it('when the demo charts are read back as files, then every one is a valid chart without errors', async () => {
    const { DEMO_FLEETS } = await import('@server/db/seed/library');
    const charts = Object.values(DEMO_FLEETS).flatMap((cranes) =>
      cranes.flatMap((c) => c.configs.map((k) => k.chart)),
    );
    expect(charts.length).toBeGreaterThanOrEqual(6);
    for (const g of charts) {
      const p = previewText(gridToCsv(g));
      expect(p.errors).toEqual([]);
      expect(p.warnings).toEqual([]);
    }
  });
});

describe('library paths', () => {
  it("when a path is the planner's own figure, then the library neither fills nor locks it", async () => {
    const { isLibraryPath } = await import('@shared/library/to-lift-input');
    expect(isLibraryPath('crane.radius')).toBe(false);
    expect(isLibraryPath('crane.boomLength')).toBe(false);
    expect(isLibraryPath('crane.upperWorks.weight')).toBe(true);
    expect(isLibraryPath('chart.rows')).toBe(true);
    expect(isLibraryPath('hookBlock.height')).toBe(false);
    expect(isLibraryPath('load.weight')).toBe(false);
  });
});
