// The chart as pictures: capacity against radius with one line per boom length (and, opened from
// a package, each of its cranes' lift points: radius and gross load), and the working range —
// hook height against radius for each boom length (and the hook height the package's lift needs).
// The geometry is computed in shared/library/chart-plot.ts; this file only paints it. Shapes as
// well as colours tell the lines apart so the plot reads in greyscale print.
import { useId, useState, type ReactNode } from 'react';
import type { ChartGrid } from '@shared/library/chart-grid';
import { capacityLines, labelSide, ticks, workingRange, type PlotLine } from '@shared/library/chart-plot';
import type { CraneLiftFigures } from '@shared/library/lift-points';
import { TO_SI } from '@shared/engineering/units';

// Near the width a plot is drawn at beside its neighbour on a desktop (about 420 px), so the
// 11 to 12 px labels read at their size rather than scaled down.
const W = 440;
const H = 280;
const PAD = { l: 50, r: 14, t: 14, b: 38 };
const STROKES = ['#0f5f5b', '#a4461b', '#1a4c95', '#51368a', '#1c6434', '#7a4700', '#16191c'];
const DASHES = ['', '6 3', '2 3', '10 3 2 3', '1 2', '8 2 2 2 2 2', '4 4'];
const MARK = '#9b1c1c';

const sig3 = (x: number) => Number(x.toPrecision(3));

/** A mark on a plot, in the plot's units. */
export interface PlotMark {
  x: number;
  y: number;
  label: string;
}

/** The package a chart was opened from: its reference and the cranes that use this version. */
export interface PackageOnChart {
  reference: string;
  cranes: CraneLiftFigures[];
}

function Cross({ x, y }: { x: number; y: number }) {
  return (
    <path
      d={`M ${x - 6} ${y - 6} L ${x + 6} ${y + 6} M ${x - 6} ${y + 6} L ${x + 6} ${y - 6}`}
      stroke={MARK}
      strokeWidth="2.5"
    />
  );
}

function Triangle({ x, y }: { x: number; y: number }) {
  return (
    <path
      d={`M ${x} ${y - 7} L ${x + 7} ${y + 5} L ${x - 7} ${y + 5} Z`}
      fill="none"
      stroke={MARK}
      strokeWidth="2.5"
    />
  );
}

function Plot({
  lines,
  title,
  xLabel,
  yLabel,
  marks = [],
  markShape = 'cross',
  lineLabel,
  children,
}: {
  lines: PlotLine[];
  title: string;
  xLabel: string;
  yLabel: string;
  marks?: PlotMark[];
  markShape?: 'cross' | 'triangle';
  lineLabel: (l: PlotLine) => string;
  children?: ReactNode;
}) {
  const all = [...lines.flatMap((l) => l.points), ...marks];
  const xt = ticks(Math.max(1, ...all.map((p) => p.x)));
  const yt = ticks(Math.max(1, ...all.map((p) => p.y)));
  const xMax = xt[xt.length - 1];
  const yMax = yt[yt.length - 1];
  const sx = (x: number) => PAD.l + (x / xMax) * (W - PAD.l - PAD.r);
  const sy = (y: number) => H - PAD.b - (Math.max(0, y) / yMax) * (H - PAD.t - PAD.b);
  const Shape = markShape === 'cross' ? Cross : Triangle;
  return (
    <figure className="border border-rule bg-sheet p-2">
      <figcaption className="mb-1 text-[13px] font-bold">{title}</figcaption>
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={title} className="w-full max-w-[640px]">
        {xt.map((x) => (
          <g key={`x${x}`}>
            <line x1={sx(x)} x2={sx(x)} y1={PAD.t} y2={H - PAD.b} stroke="#d9d5cb" />
            <text x={sx(x)} y={H - PAD.b + 14} fontSize="11" textAnchor="middle" fill="#4a4f55">
              {x}
            </text>
          </g>
        ))}
        {yt.map((y) => (
          <g key={`y${y}`}>
            <line x1={PAD.l} x2={W - PAD.r} y1={sy(y)} y2={sy(y)} stroke="#d9d5cb" />
            <text x={PAD.l - 6} y={sy(y) + 4} fontSize="11" textAnchor="end" fill="#4a4f55">
              {y}
            </text>
          </g>
        ))}
        <text x={(PAD.l + W - PAD.r) / 2} y={H - 6} fontSize="12" textAnchor="middle" fill="#16191c">
          {xLabel}
        </text>
        <text
          x={12}
          y={(PAD.t + H - PAD.b) / 2}
          fontSize="12"
          textAnchor="middle"
          fill="#16191c"
          transform={`rotate(-90 12 ${(PAD.t + H - PAD.b) / 2})`}
        >
          {yLabel}
        </text>
        {lines.map((l, k) => (
          <g key={l.boomLength}>
            <polyline
              fill="none"
              stroke={STROKES[k % STROKES.length]}
              strokeWidth="2"
              strokeDasharray={DASHES[k % DASHES.length]}
              points={l.points.map((p) => `${sx(p.x)},${sy(p.y)}`).join(' ')}
            />
            {l.points
              .filter((p) => p.rated)
              .map((p) => (
                <circle key={p.x} cx={sx(p.x)} cy={sy(p.y)} r="2.5" fill={STROKES[k % STROKES.length]} />
              ))}
          </g>
        ))}
        {marks.map((p, k) => {
          // labels to the left of a mark when they would run off the plot to its right (about 6.6
          // units a character in 12 px bold); below the mark when the lines all pass above it (room
          // down to the axis permitting), so none crosses them
          const right = sx(p.x) + 9 + p.label.length * 6.6 > W - 2;
          const down = labelSide(lines, p.x, p.y) === 'below' && sy(p.y) + 22 + 13 * k < H - PAD.b - 4;
          return (
            <g key={p.label} data-testid="plot-mark">
              <Shape x={sx(p.x)} y={sy(p.y)} />
              <text
                x={sx(p.x) + (right ? -9 : 9)}
                y={down ? sy(p.y) + 20 + 13 * k : sy(p.y) - 9 - 13 * k}
                fontSize="12"
                fontWeight="bold"
                textAnchor={right ? 'end' : 'start'}
                fill={MARK}
                stroke="#ffffff"
                strokeWidth="3"
                paintOrder="stroke"
              >
                {p.label}
              </text>
            </g>
          );
        })}
      </svg>
      <ul className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-[12px]" aria-label="Boom lengths">
        {lines.map((l, k) => (
          <li key={l.boomLength} className="flex items-center gap-1.5">
            <svg width="26" height="8" aria-hidden="true">
              <line
                x1="0"
                x2="26"
                y1="4"
                y2="4"
                stroke={STROKES[k % STROKES.length]}
                strokeWidth="2"
                strokeDasharray={DASHES[k % DASHES.length]}
              />
            </svg>
            {lineLabel(l)}
          </li>
        ))}
      </ul>
      {children}
    </figure>
  );
}

const craneName = (slot: number) => `crane ${slot + 1}`;

export function ChartPlots({
  grid,
  pivotOffset,
  pivotHeight,
  fromPackage,
}: {
  grid: ChartGrid;
  /** m, from the crane's fixed data; absent when the crane data does not give it */
  pivotOffset?: number;
  pivotHeight?: number;
  fromPackage?: PackageOnChart;
}) {
  const u = grid.units;
  const lu = TO_SI[u.radius];
  const cu = TO_SI[u.capacity];
  const cranes = fromPackage?.cranes ?? [];
  const several = cranes.some((c) => c.cranesInLift > 1);
  const who = (c: CraneLiftFigures) => `${fromPackage?.reference}${several ? ` ${craneName(c.slot)}` : ''}`;

  // The allowance from the tip to the hook: the package's hook block and the site's clearance when
  // known; the person may change it (in the chart's length unit) to read other blocks.
  const first = cranes[0];
  const known = first && (first.blockHeight !== null || first.clearance !== null);
  const initial = known ? (first.blockHeight ?? 0) + (first.clearance ?? 0) : 0;
  // null until the person types: the package's figures may arrive after the chart.
  const [typedText, setAllowanceText] = useState<string | null>(null);
  const allowanceText = typedText ?? String(sig3(initial / lu));
  const typed = allowanceText.trim() === '' ? NaN : Number(allowanceText);
  const allowance = Number.isFinite(typed) && typed >= 0 ? typed * lu : initial;
  const allowanceId = useId();

  const liftMarks: PlotMark[] = cranes
    .filter((c) => c.radius !== null && c.grossLoad !== null)
    .map((c) => ({
      x: c.radius! / lu,
      y: c.grossLoad! / cu,
      label: `${who(c)}: ${sig3(c.grossLoad! / cu)} ${u.capacity} at ${sig3(c.radius! / lu)} ${u.radius}`,
    }));
  const hookMarks: PlotMark[] = cranes
    .filter((c) => c.radius !== null && c.neededHookHeight !== null)
    .map((c) => ({
      x: c.radius! / lu,
      y: c.neededHookHeight! / lu,
      label: `${who(c)}: hook needed ${sig3(c.neededHookHeight! / lu)} ${u.radius}`,
    }));
  const waiting = cranes.filter((c) => c.radius === null || c.grossLoad === null);
  const basis = { pivotOffset: pivotOffset ?? 0, pivotHeight: pivotHeight ?? 0, allowance };
  const f = (m: number) => `${sig3(m / lu)} ${u.radius}`;

  return (
    <div className="grid gap-3 xl:grid-cols-2">
      <Plot
        title="Rated capacity against radius"
        xLabel={`Radius (${u.radius})`}
        yLabel={`Rated capacity (${u.capacity})`}
        lines={capacityLines(grid)}
        marks={liftMarks}
        lineLabel={(l) => `Boom ${l.boomLength} ${u.boomLength}`}
      >
        {liftMarks.length > 0 && (
          <p className="mt-1 text-[12px]">
            <span aria-hidden="true" className="font-bold text-failed-ink">
              ✕
            </span>{' '}
            {fromPackage?.reference}: the check’s radius and gross load{several ? ' of each crane' : ''}.
          </p>
        )}
        {fromPackage && waiting.length > 0 && (
          <p className="mt-1 text-[12px] text-ink-soft">
            {waiting.map((c) => who(c)).join(', ')}: no check result yet — the lift point appears once the
            package has been checked.
          </p>
        )}
      </Plot>
      <Plot
        title="Working range: hook height against radius"
        xLabel={`Radius (${u.radius})`}
        yLabel={`Hook height (${u.radius})`}
        lines={workingRange(grid, basis)}
        marks={hookMarks}
        markShape="triangle"
        lineLabel={(l) => `Boom ${l.boomLength} ${u.boomLength}`}
      >
        <div className="mt-2 flex flex-col gap-1 text-[12px]">
          <p>
            Hook height = pivot height {f(basis.pivotHeight)} + √(L² − (R − pivot offset{' '}
            {f(basis.pivotOffset)})²) − allowance {f(allowance)}: a straight boom hinged at its foot pin
            (plane geometry).
          </p>
          {pivotHeight === undefined && (
            <p className="font-bold text-caution-ink" role="note">
              ! Assumed: the crane data has no pivot height, so heights are drawn from the boom foot pin
              (taken as 0 {u.radius} above the ground). Add the pivot height on the crane page to read heights
              above ground.
            </p>
          )}
          {pivotOffset === undefined && (
            <p className="font-bold text-caution-ink" role="note">
              ! Assumed: the crane data has no pivot offset, so the boom foot is taken at the centre of
              rotation.
            </p>
          )}
          <div className="mt-1 flex flex-wrap items-center gap-2">
            <label htmlFor={allowanceId} className="font-bold">
              Allowance from boom tip to hook ({u.radius})
            </label>
            <input
              id={allowanceId}
              inputMode="decimal"
              className="w-20 rounded-[3px] border border-rule-strong px-1.5 py-0.5 tabular-nums"
              value={allowanceText}
              onChange={(e) => setAllowanceText(e.target.value)}
              aria-invalid={allowance !== typed * lu || undefined}
            />
            {allowance !== typed * lu && (
              <span role="alert" className="font-bold text-failed-ink">
                Enter a length of 0 {u.radius} or more; drawn with {f(initial)} meanwhile.
              </span>
            )}
          </div>
          <p className="text-ink-soft">
            {known
              ? `From ${fromPackage?.reference}: hook block height ${f(first.blockHeight ?? 0)}${first.blockHeight === null ? ' (not entered)' : ''} + clearance kept under the tip ${f(first.clearance ?? 0)} (the site policy's minimum block clearance).`
              : 'The hook block height plus the clearance to keep under the tip; 0 draws the boom tip itself.'}
            {hookMarks.length > 0 &&
              ' ▵ the hook height the lift needs (required lift height + load height + rigging height): at or under the line of the boom used, the block keeps its clearance.'}
          </p>
        </div>
      </Plot>
    </div>
  );
}
