// Load chart lookup. The contractor enters the manufacturer's rows for the configuration used.
// Rule (common practice, no source): never interpolate upward. Between two listed radii the lower
// of the two capacities is used (for a chart that falls with radius: the next longer radius); a
// boom length between listed lengths uses the lower of the two bracketing columns. Only when every row
// involved says `interpolationAllowed` is the capacity interpolated linearly. Outside the listed
// radii or boom lengths the chart does not rate the lift: `outside` says why, capacity is null.
// Between two listed boom lengths both bracketing columns are read (each at its next longer radius)
// and the lower capacity is used, since a shorter boom may rate less at the same radius.

/** How the chart was read at the lift's radius and boom (the context carries it to the checks). */
export interface ChartLookup {
  capacity: number | null;
  /** words describing how the capacity was read */
  method: string;
  outside: string | null;
  radiusUsed: number | null;
  boomLengthUsed: number | null;
}

export interface ChartRowSI {
  radius: number;
  boomLength: number;
  capacity: number;
  interpolationAllowed: boolean;
}

// Chart rows are matched to the plan with a looser tolerance than limits (compare.ts): a radius
// worked out from a boom angle, or a boom length typed in feet to four decimals, is the same row.
const EPS = 1e-6;
/** Same boom length or radius for reading a chart (relative 1e-6, at least 1e-6 m). */
export const same = (a: number, b: number) => Math.abs(a - b) <= EPS * Math.max(1, Math.abs(a), Math.abs(b));

export interface Column {
  boomLength: number;
  rows: ChartRowSI[];
}

/** Group rows by boom length, each column sorted by radius. */
export function columns(rows: readonly ChartRowSI[]): Column[] {
  const cols: Column[] = [];
  for (const r of rows) {
    let c: Column | undefined;
    for (const k of cols) if (same(k.boomLength, r.boomLength)) c = k;
    if (!c) cols.push((c = { boomLength: r.boomLength, rows: [] }));
    c.rows.push(r);
  }
  for (const c of cols) c.rows.sort((a, b) => a.radius - b.radius);
  cols.sort((a, b) => a.boomLength - b.boomLength);
  return cols;
}

interface ColumnRead {
  capacity: number | null;
  interpolated: boolean;
  /** every row used says interpolation is allowed */
  allowsInterp?: boolean;
  outside: string | null;
  radiusUsed: number | null;
}

export function readColumn(rows: readonly ChartRowSI[], radius: number): ColumnRead {
  const n = rows.length;
  if (n === 0)
    return {
      capacity: null,
      interpolated: false,
      outside: 'no chart rows for this boom length',
      radiusUsed: null,
    };
  if (radius < rows[0].radius && !same(radius, rows[0].radius))
    return {
      capacity: null,
      interpolated: false,
      outside: 'outside chart: radius shorter than the shortest radius listed',
      radiusUsed: null,
    };
  for (let i = 0; i < n; i++) {
    const r = rows[i];
    if (same(r.radius, radius))
      return {
        capacity: r.capacity,
        interpolated: false,
        allowsInterp: r.interpolationAllowed,
        outside: null,
        radiusUsed: r.radius,
      };
    if (r.radius > radius) {
      const lo = rows[i - 1];
      if (lo.interpolationAllowed && r.interpolationAllowed) {
        const t = (radius - lo.radius) / (r.radius - lo.radius);
        return {
          capacity: lo.capacity + t * (r.capacity - lo.capacity),
          interpolated: true,
          allowsInterp: true,
          outside: null,
          radiusUsed: radius,
        };
      }
      return lo.capacity < r.capacity
        ? { capacity: lo.capacity, interpolated: false, outside: null, radiusUsed: lo.radius }
        : { capacity: r.capacity, interpolated: false, outside: null, radiusUsed: r.radius };
    }
  }
  return {
    capacity: null,
    interpolated: false,
    outside: 'outside chart: radius beyond the last row listed',
    radiusUsed: null,
  };
}

export function lookupCapacity(
  rows: readonly ChartRowSI[],
  boomLength: number | null,
  radius: number,
): ChartLookup {
  const cols = columns(rows);
  if (cols.length === 0)
    return { capacity: null, method: '', outside: 'no chart rows', radiusUsed: null, boomLengthUsed: null };
  if (boomLength === null) {
    // No boom (gantry): every column applies; take the lowest capacity read.
    let best: ChartLookup | null = null;
    for (const c of cols) {
      const r = readColumn(c.rows, radius);
      if (r.capacity === null) continue;
      if (!best || r.capacity < best.capacity!)
        best = {
          capacity: r.capacity,
          method: 'lowest capacity listed at this radius',
          outside: null,
          radiusUsed: r.radiusUsed,
          boomLengthUsed: c.boomLength,
        };
    }
    return (
      best ?? {
        capacity: null,
        method: '',
        outside: 'outside chart: radius not covered by the rows listed',
        radiusUsed: null,
        boomLengthUsed: null,
      }
    );
  }
  let longer: Column | undefined;
  let shorter: Column | undefined;
  for (const c of cols) {
    if (same(c.boomLength, boomLength) || c.boomLength > boomLength) {
      longer = c;
      break;
    }
    shorter = c;
  }
  if (!longer)
    return {
      capacity: null,
      method: '',
      outside: 'outside chart: boom length longer than the longest listed',
      radiusUsed: null,
      boomLengthUsed: null,
    };
  const read = readColumn(longer.rows, radius);
  if (read.capacity === null)
    return {
      capacity: null,
      method: '',
      outside: read.outside,
      radiusUsed: null,
      boomLengthUsed: longer.boomLength,
    };
  const exactBoom = same(longer.boomLength, boomLength);
  if (!exactBoom && shorter && read.allowsInterp) {
    const s = readColumn(shorter.rows, radius);
    if (s.capacity !== null && s.allowsInterp) {
      const t = (boomLength - shorter.boomLength) / (longer.boomLength - shorter.boomLength);
      return {
        capacity: s.capacity! + t * (read.capacity - s.capacity!),
        method: 'interpolated between listed radii and boom lengths (chart allows)',
        outside: null,
        radiusUsed: radius,
        boomLengthUsed: boomLength,
      };
    }
  }
  // Between two listed boom lengths the shorter column may rate less at this radius (common
  // practice, no source): take the lower of the two, each read at its next longer radius.
  if (!exactBoom && shorter) {
    const s = readColumn(shorter.rows, radius);
    if (s.capacity !== null && s.capacity < read.capacity)
      return {
        capacity: s.capacity,
        method: `${
          s.interpolated
            ? 'interpolated between listed radii (chart allows)'
            : same(s.radiusUsed!, radius)
              ? 'row listed at this radius'
              : 'lower capacity of the bracketing rows (no upward interpolation)'
        }; lower of the two bracketing boom lengths listed`,
        outside: null,
        radiusUsed: s.radiusUsed,
        boomLengthUsed: shorter.boomLength,
      };
  }
  const method = read.interpolated
    ? 'interpolated between listed radii (chart allows)'
    : same(read.radiusUsed!, radius)
      ? 'row listed at this radius'
      : 'lower capacity of the bracketing rows (no upward interpolation)';
  return {
    capacity: read.capacity,
    method: exactBoom ? method : `${method}; next longer boom length listed`,
    outside: null,
    radiusUsed: read.radiusUsed,
    boomLengthUsed: longer.boomLength,
  };
}

/** Largest radius (not beyond `below`) at which the column still rates `need`; null when none. */
export function largestRadiusFor(rows: readonly ChartRowSI[], need: number, below: number): number | null {
  let best: number | null = null;
  for (let i = 0; i < rows.length; i++) {
    const r = rows[i];
    if (r.radius > below) break;
    if (r.capacity >= need) best = r.radius;
    const nx = rows[i + 1];
    if (nx && r.interpolationAllowed && nx.interpolationAllowed && r.capacity >= need && nx.capacity < need) {
      const x = r.radius + ((r.capacity - need) / (r.capacity - nx.capacity)) * (nx.radius - r.radius);
      if (x <= below && (best === null || x > best)) best = x;
    }
  }
  return best;
}
