// A load chart as a grid (capacity by boom length × radius) in its own units, and writing it back:
// as a table for export, or as the rated cells the lift input's chart rows take. Pure: no I/O.
// Reading a table of cells into a grid is chart-reader.ts.
//
// The grid's layout (ours): the top-left cell names the units, e.g. "radius (m) / boom (m) /
// capacity (t)"; the rest of the first row holds the boom lengths, the rest of the first column
// the radii, and the body the rated capacities, blank where the chart has none. When "boom" comes
// before "radius" in the top-left cell, the layout is turned: boom lengths down, radii across.
import type { LengthUnit, WeightUnit } from '../engineering/units';
import { same } from '../engineering/chart';

export interface ChartUnits {
  radius: LengthUnit;
  boomLength: LengthUnit;
  capacity: WeightUnit;
}

/** A chart as a grid, in its own units: capacities[i][j] at radii[i] and boomLengths[j]. */
export interface ChartGrid {
  units: ChartUnits;
  boomLengths: number[];
  radii: number[];
  capacities: (number | null)[][];
}

/** Radii and boom lengths ascending, capacities moved with them. */
export function sortGrid(g: ChartGrid): ChartGrid {
  const ri = g.radii.map((_, i) => i).sort((a, b) => g.radii[a] - g.radii[b]);
  const bj = g.boomLengths.map((_, j) => j).sort((a, b) => g.boomLengths[a] - g.boomLengths[b]);
  return {
    units: g.units,
    radii: ri.map((i) => g.radii[i]),
    boomLengths: bj.map((j) => g.boomLengths[j]),
    capacities: ri.map((i) => bj.map((j) => g.capacities[i]?.[j] ?? null)),
  };
}

/** The grid as a table for export: the units cell, boom lengths across, radii down. */
export function gridToTable(g: ChartGrid): (string | number)[][] {
  const head = `radius (${g.units.radius}) / boom (${g.units.boomLength}) / capacity (${g.units.capacity})`;
  return [
    [head, ...g.boomLengths],
    ...g.radii.map((r, i) => [r, ...g.capacities[i].map((c) => (c === null ? '' : c))]),
  ];
}

/** Every rated cell, as the lift input's chart rows take them. */
export interface GridCell {
  boomLength: number;
  radius: number;
  capacity: number;
}

export function gridCells(g: ChartGrid): GridCell[] {
  const out: GridCell[] = [];
  g.boomLengths.forEach((b, j) =>
    g.radii.forEach((r, i) => {
      const c = g.capacities[i][j];
      if (c !== null) out.push({ boomLength: b, radius: r, capacity: c });
    }),
  );
  return out;
}

export function gridFromCells(units: ChartUnits, cells: readonly GridCell[]): ChartGrid {
  const booms: number[] = [];
  const radii: number[] = [];
  for (const c of cells) {
    if (!booms.some((b) => same(b, c.boomLength))) booms.push(c.boomLength);
    if (!radii.some((r) => same(r, c.radius))) radii.push(c.radius);
  }
  booms.sort((a, b) => a - b);
  radii.sort((a, b) => a - b);
  const capacities = radii.map(() => booms.map((): number | null => null));
  for (const c of cells)
    capacities[radii.findIndex((r) => same(r, c.radius))][booms.findIndex((b) => same(b, c.boomLength))] =
      c.capacity;
  return { units, boomLengths: booms, radii, capacities };
}
