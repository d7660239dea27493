// From a library configuration version to the parts of the lift input it fills (the crane's fixed
// data and the configuration, the chart rows, the hook block and the chart deductions), and back
// from a package's chart to the cells it changed against the version. Pure.
import type { LiftInputRaw } from '../schemas/lift-input';
import type { VersionDetail } from '../schemas/library';
import { same } from '../engineering/chart';
import { TO_SI } from '../engineering/units';
import { gridCells, type ChartGrid } from './chart-grid';

type CraneRaw = LiftInputRaw['crane'];
type ChartRaw = LiftInputRaw['chart'];

export interface LibraryFill {
  crane: Omit<CraneRaw, 'boomLength' | 'boomAngle' | 'radius' | 'slewAngle'>;
  chart: ChartRaw;
  hookBlock?: LiftInputRaw['hookBlock'];
  chartDeductions?: LiftInputRaw['chartDeductions'];
}

export function craneLabel(v: Pick<VersionDetail, 'crane'>): string {
  return `${v.crane.fleetNumber} — ${v.crane.make} ${v.crane.model}`;
}

export function versionLabel(v: Pick<VersionDetail, 'crane' | 'configurationName' | 'number'>): string {
  return `${craneLabel(v)}, ${v.configurationName} (library version ${v.number})`;
}

/** The lift input parts a version fills; the planner still enters boom length, radius and slew. */
export function fillFromVersion(v: VersionDetail): LibraryFill {
  const f = v.crane.fixed;
  const d = v.details;
  const spread = f.outriggerSpreads?.find((s) => s.name === d.outriggerSpread) ?? f.outriggerSpreads?.[0];
  const crane: LibraryFill['crane'] = {
    type: v.crane.type,
    name: versionLabel(v),
    ...(f.pivotOffset ? { pivotOffset: f.pivotOffset } : {}),
    ...(f.pivotHeight ? { pivotHeight: f.pivotHeight } : {}),
    ...(f.upperWorks ? { upperWorks: f.upperWorks } : {}),
    ...(d.counterweight
      ? {
          counterweight: {
            weight: d.counterweight.weight,
            cgBehindRotation: d.counterweight.cgBehindRotation,
          },
        }
      : {}),
    ...(f.carrier ? { carrier: f.carrier } : {}),
    ...(f.boom ? { boom: f.boom } : {}),
    ...(v.crane.type === 'mobile_outriggers' && spread
      ? {
          outriggers: {
            longitudinalSpread: spread.longitudinalSpread,
            transverseSpread: spread.transverseSpread,
            ...(spread.boxCentreRearOfRotation
              ? { boxCentreRearOfRotation: spread.boxCentreRearOfRotation }
              : {}),
          },
        }
      : {}),
    ...(v.crane.type === 'mobile_crawler' && f.tracks ? { tracks: f.tracks } : {}),
    ...(v.crane.type === 'gantry_a_frame' && f.gantry ? { gantry: f.gantry } : {}),
  };
  const u = v.chart.units;
  const interp = v.notes.interpolationAllowed;
  const chart: ChartRaw = {
    name: versionLabel(v),
    rows: gridCells(v.chart).map((c) => ({
      radius: { value: c.radius, unit: u.radius },
      boomLength: { value: c.boomLength, unit: u.boomLength },
      capacity: { value: c.capacity, unit: u.capacity },
      ...(interp ? { interpolationAllowed: true } : {}),
    })),
  };
  return {
    crane,
    chart,
    ...(d.hookBlock && !v.notes.blockIncluded ? { hookBlock: { weight: d.hookBlock.weight } } : {}),
    ...(v.notes.deductions.length
      ? { chartDeductions: v.notes.deductions.map((x) => ({ name: x.name, weight: x.weight })) }
      : {}),
  };
}

export interface CellChange {
  boomLength: number;
  radius: number;
  library: number | null;
  package: number | null;
}

/** A chart row as stored in a draft: any figure may be missing. */
export type ChartRowLike = {
  radius?: { value?: number; unit?: string };
  boomLength?: { value?: number; unit?: string };
  capacity?: { value?: number; unit?: string };
};

/**
 * Cells where the package's chart rows differ from the version's grid: changed capacity, a row
 * added, a row removed. Compared in SI; reported in the chart's own units.
 */
export function changedCells(grid: ChartGrid, rows: readonly ChartRowLike[] | undefined): CellChange[] {
  const u = grid.units;
  const toSI = (q: ChartRowLike['radius']) =>
    q && typeof q.value === 'number' && q.unit && q.unit in TO_SI
      ? q.value * TO_SI[q.unit as keyof typeof TO_SI]
      : NaN;
  const pkg = (rows ?? [])
    .map((r) => ({ b: toSI(r.boomLength), r: toSI(r.radius), c: toSI(r.capacity) }))
    .filter((x) => Number.isFinite(x.b) && Number.isFinite(x.r));
  const lib = gridCells(grid).map((c) => ({
    b: c.boomLength * TO_SI[u.boomLength],
    r: c.radius * TO_SI[u.radius],
    c: c.capacity * TO_SI[u.capacity],
  }));
  const out: CellChange[] = [];
  const inUnits = (x: { b: number; r: number }) => ({
    boomLength: round(x.b / TO_SI[u.boomLength]),
    radius: round(x.r / TO_SI[u.radius]),
  });
  const cap = (si: number) => (Number.isFinite(si) ? round(si / TO_SI[u.capacity]) : null);
  for (const l of lib) {
    const p = pkg.find((x) => same(x.b, l.b) && same(x.r, l.r));
    if (!p) out.push({ ...inUnits(l), library: cap(l.c), package: null });
    else if (!same(p.c, l.c)) out.push({ ...inUnits(l), library: cap(l.c), package: cap(p.c) });
  }
  for (const p of pkg)
    if (!lib.some((l) => same(l.b, p.b) && same(l.r, p.r)))
      out.push({ ...inUnits(p), library: null, package: cap(p.c) });
  return out.sort((a, b) => a.boomLength - b.boomLength || a.radius - b.radius);
}

const round = (x: number) => Math.round(x * 1e6) / 1e6;

/** Cells added, removed or changed between two grids (for the versions history). */
export function gridDifference(before: ChartGrid, after: ChartGrid): CellChange[] {
  const u = before.units;
  return changedCells(
    after,
    gridCells(before).map((c) => ({
      radius: { value: c.radius, unit: u.radius },
      boomLength: { value: c.boomLength, unit: u.boomLength },
      capacity: { value: c.capacity, unit: u.capacity },
    })),
  ).map((c) => ({ ...c, library: c.package, package: c.library }));
}

/** Highest capacity (in SI) any boom length of the grid rates at the radius, reading no cell upward. */
export function capacityAtRadius(
  grid: ChartGrid,
  radiusSI: number,
  interpolationAllowed: boolean,
): number | null {
  let best: number | null = null;
  const rU = TO_SI[grid.units.radius];
  const cU = TO_SI[grid.units.capacity];
  grid.boomLengths.forEach((_, j) => {
    const col = grid.radii
      .map((r, i) => ({ r: r * rU, c: grid.capacities[i][j] }))
      .filter((x): x is { r: number; c: number } => x.c !== null);
    for (let i = 0; i < col.length; i++) {
      let cap: number | null = null;
      const exact = same(col[i].r, radiusSI);
      if (!exact && col[i].r < radiusSI) continue;
      if (exact) cap = col[i].c * cU;
      else if (i > 0) {
        const lo = col[i - 1];
        const hi = col[i];
        cap = interpolationAllowed
          ? (lo.c + ((radiusSI - lo.r) / (hi.r - lo.r)) * (hi.c - lo.c)) * cU
          : Math.min(lo.c, hi.c) * cU;
      }
      if (cap !== null && (best === null || cap > best)) best = cap;
      break;
    }
  });
  return best;
}

/** The planner's own figures of the crane step: never filled from the library, never locked. */
const PLANNED = new Set(['crane.boomLength', 'crane.boomAngle', 'crane.radius', 'crane.slewAngle']);

/** A lift input path the library fills (read-only while the package uses a library version). */
export function isLibraryPath(path: string): boolean {
  if (PLANNED.has(path)) return false;
  return (
    path.startsWith('crane.') ||
    path === 'crane' ||
    path.startsWith('chart.') ||
    path === 'chart' ||
    path === 'hookBlock.weight' ||
    path.startsWith('chartDeductions')
  );
}
