// The chart as pictures: capacity against radius with one line per boom length (and the
// package's lift points when opened from a package), and the working range — boom-tip height
// against radius for each boom length. SVG drawn from the grid; shapes as well as colours tell
// the lines apart so the plot reads in greyscale print.
import type { ChartGrid } from '@shared/library/chart-grid';
import { capacityLines, ticks, workingRange, type PlotLine } from '@shared/library/chart-plot';

const W = 520;
const H = 300;
const PAD = { l: 52, r: 16, t: 14, b: 40 };
const STROKES = ['#0f5f5b', '#a4461b', '#1a4c95', '#51368a', '#1c6434', '#7a4700', '#16191c'];
const DASHES = ['', '6 3', '2 3', '10 3 2 3', '1 2', '8 2 2 2 2 2', '4 4'];

export interface LiftPoint {
  radius: number;
  load: number;
  label: string;
}

function Plot({
  lines,
  title,
  xLabel,
  yLabel,
  points = [],
  lineLabel,
}: {
  lines: PlotLine[];
  title: string;
  xLabel: string;
  yLabel: string;
  points?: LiftPoint[];
  lineLabel: (l: PlotLine) => string;
}) {
  const all = [...lines.flatMap((l) => l.points), ...points.map((p) => ({ x: p.radius, y: p.load }))];
  const xt = ticks(Math.max(1, ...all.map((p) => p.x)));
  const yt = ticks(Math.max(1, ...all.map((p) => p.y)));
  const xMax = xt[xt.length - 1];
  const yMax = yt[yt.length - 1];
  const sx = (x: number) => PAD.l + (x / xMax) * (W - PAD.l - PAD.r);
  const sy = (y: number) => H - PAD.b - (y / yMax) * (H - PAD.t - PAD.b);
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
            {l.points.map((p) => (
              <circle key={p.x} cx={sx(p.x)} cy={sy(p.y)} r="2.5" fill={STROKES[k % STROKES.length]} />
            ))}
          </g>
        ))}
        {points.map((p) => (
          <g key={p.label}>
            <path
              d={`M ${sx(p.radius) - 6} ${sy(p.load) - 6} L ${sx(p.radius) + 6} ${sy(p.load) + 6} M ${sx(p.radius) - 6} ${sy(p.load) + 6} L ${sx(p.radius) + 6} ${sy(p.load) - 6}`}
              stroke="#9b1c1c"
              strokeWidth="2.5"
            />
            <text x={sx(p.radius) + 8} y={sy(p.load) - 8} fontSize="11" fill="#9b1c1c">
              {p.label}
            </text>
          </g>
        ))}
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
    </figure>
  );
}

export function ChartPlots({
  grid,
  pivotOffset,
  pivotHeight,
  liftPoints,
}: {
  grid: ChartGrid;
  /** m, from the crane's fixed data */
  pivotOffset?: number;
  pivotHeight?: number;
  liftPoints?: LiftPoint[];
}) {
  const u = grid.units;
  return (
    <div className="grid gap-3 xl:grid-cols-2">
      <Plot
        title="Rated capacity against radius"
        xLabel={`Radius (${u.radius})`}
        yLabel={`Rated capacity (${u.capacity})`}
        lines={capacityLines(grid)}
        points={liftPoints}
        lineLabel={(l) => `Boom ${l.boomLength} ${u.boomLength}`}
      />
      <Plot
        title="Working range: boom-tip height against radius"
        xLabel={`Radius (${u.radius})`}
        yLabel={`Boom-tip height (${u.radius})`}
        lines={workingRange(grid, pivotOffset ?? 0, pivotHeight ?? 0)}
        lineLabel={(l) => `Boom ${l.boomLength} ${u.boomLength}`}
      />
    </div>
  );
}
