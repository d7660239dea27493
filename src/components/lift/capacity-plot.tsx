// Chart capacity against radius for the configured boom length, as the check reads the
// chart (between listed radii the lower capacity; no upward interpolation), with the
// policy's lines and the planned lift point. Lines differ by dash and markers by shape,
// and every line is labelled where it ends, so the plot reads in greyscale.
import { formatPercent, formatQuantity } from '@shared/engineering/format';
import { TO_SI, type AnyUnit } from '@shared/engineering/units';
import type { LiftResult, UnitSystem } from '@shared/engineering/types';
import { niceTicks } from '@shared/drawing/plot-ticks';
import { toDisplay } from '@shared/engineering/format';

type RawQ = { value?: unknown; unit?: unknown } | undefined;
type RawRow = { radius?: RawQ; boomLength?: RawQ; capacity?: RawQ };

function si(q: RawQ): number | null {
  if (!q || typeof q.value !== 'number' || !Number.isFinite(q.value)) return null;
  const factor = TO_SI[q.unit as AnyUnit];
  return factor === undefined ? null : q.value * factor;
}

/** The chart column for the boom length: the one listed, else the next longer, else the longest. */
export function chartColumn(rows: readonly RawRow[], boomLength: number | null) {
  const points = rows
    .map((row) => ({ r: si(row.radius), l: si(row.boomLength), c: si(row.capacity) }))
    .filter((p): p is { r: number; l: number; c: number } => p.r !== null && p.l !== null && p.c !== null);
  const lengths = [...new Set(points.map((p) => Math.round(p.l * 1000) / 1000))].sort((a, b) => a - b);
  if (lengths.length === 0) return null;
  const chosen =
    boomLength === null
      ? lengths[0]
      : (lengths.find((l) => l >= boomLength - 1e-3) ?? lengths[lengths.length - 1]);
  const column = points.filter((p) => Math.abs(p.l - chosen) < 1e-3).sort((a, b) => a.r - b.r);
  return { boomLength: chosen, points: column };
}

const W = 620;
const H = 330;
const M = { left: 62, right: 150, top: 14, bottom: 46 };

export function CapacityPlot({
  rows,
  boomLength,
  result,
  system,
}: {
  rows: readonly RawRow[];
  boomLength: number | null;
  result: LiftResult;
  system: UnitSystem;
}) {
  const column = chartColumn(rows, boomLength);
  if (!column || column.points.length === 0) {
    return <p className="text-[13px] text-ink-soft">No chart rows to plot.</p>;
  }
  const { points } = column;
  const f = result.figures;
  const lengthUnit = toDisplay(1, 'length', system);
  const maxCap = Math.max(...points.map((p) => p.c), f.grossLoad);
  const weightAxis = toDisplay(maxCap, 'weight', system);
  const wf = weightAxis.value / maxCap; // display per SI
  const lf = lengthUnit.value;

  const xMax = Math.max(...points.map((p) => p.r), f.radius ?? 0) * 1.08;
  const yMax = maxCap * 1.12;
  const pw = W - M.left - M.right;
  const ph = H - M.top - M.bottom;
  const x = (r: number) => M.left + (r / xMax) * pw;
  const y = (c: number) => M.top + ph - (c / yMax) * ph;

  // The capacity as read: at a listed radius its own value; just past it, the lower neighbour.
  const step = (scale: number) => {
    let d = `M ${x(points[0].r)} ${y(points[0].c * scale)}`;
    for (let i = 1; i < points.length; i++) {
      const read = Math.min(points[i - 1].c, points[i].c) * scale;
      d += ` L ${x(points[i - 1].r)} ${y(read)} L ${x(points[i].r)} ${y(read)} L ${x(points[i].r)} ${y(points[i].c * scale)}`;
    }
    return d;
  };
  const last = points[points.length - 1];
  const maxUse = result.policy.maxChartUsePct / 100;
  const critical = result.policy.criticalThresholdPct / 100;

  const xTicks = niceTicks(0, xMax * lf);
  const yTicks = niceTicks(0, yMax * wf);

  const lift = f.radius !== null ? { px: x(f.radius), py: y(f.grossLoad) } : null;
  const endLabel = (scale: number) => y(Math.min(points[points.length - 2]?.c ?? last.c, last.c) * scale);

  return (
    <figure className="flex flex-col gap-1">
      <svg
        viewBox={`0 0 ${W} ${H}`}
        className="w-full max-w-[900px] text-ink"
        role="img"
        aria-label={`Chart capacity against radius for ${formatQuantity(column.boomLength, 'length', system)} boom, with the lift at ${formatQuantity(f.radius, 'length', system)} and ${formatQuantity(f.grossLoad, 'weight', system)}`}
      >
        <rect x={M.left} y={M.top} width={pw} height={ph} fill="#fff" stroke="#8f8a7e" />
        {xTicks.map((v) => (
          <g key={`x${v}`}>
            <line x1={x(v / lf)} x2={x(v / lf)} y1={M.top} y2={M.top + ph} stroke="#e6e2d8" />
            <text x={x(v / lf)} y={M.top + ph + 15} textAnchor="middle" fontSize="11" fill="currentColor">
              {Number(v.toPrecision(6))}
            </text>
          </g>
        ))}
        {yTicks.map((v) => (
          <g key={`y${v}`}>
            <line x1={M.left} x2={M.left + pw} y1={y(v / wf)} y2={y(v / wf)} stroke="#e6e2d8" />
            <text x={M.left - 6} y={y(v / wf) + 4} textAnchor="end" fontSize="11" fill="currentColor">
              {Number(v.toPrecision(6))}
            </text>
          </g>
        ))}
        <text
          x={M.left + pw / 2}
          y={H - 8}
          textAnchor="middle"
          fontSize="12"
          fontWeight="700"
          fill="currentColor"
        >
          Radius ({lengthUnit.unit})
        </text>
        <text
          transform={`translate(14 ${M.top + ph / 2}) rotate(-90)`}
          textAnchor="middle"
          fontSize="12"
          fontWeight="700"
          fill="currentColor"
        >
          Capacity, gross load ({weightAxis.unit})
        </text>

        <path d={step(critical)} fill="none" stroke="#7a4700" strokeWidth="1.4" strokeDasharray="2 3" />
        <path d={step(maxUse)} fill="none" stroke="#9b1c1c" strokeWidth="1.6" strokeDasharray="8 4" />
        <path d={step(1)} fill="none" stroke="#16191c" strokeWidth="2.4" />
        {points.map((p) => (
          <circle key={p.r} cx={x(p.r)} cy={y(p.c)} r="3" fill="#fff" stroke="#16191c" strokeWidth="1.5" />
        ))}

        <g fontSize="11" fill="currentColor">
          <text x={x(last.r) + 8} y={endLabel(1) + 4} fontWeight="700">
            Chart capacity
          </text>
          <text x={x(last.r) + 8} y={endLabel(maxUse) + 4}>
            Max use {formatPercent(result.policy.maxChartUsePct)}
          </text>
          <text x={x(last.r) + 8} y={endLabel(critical) + 14}>
            Critical {formatPercent(result.policy.criticalThresholdPct)}
          </text>
        </g>

        {lift && (
          <g>
            <line
              x1={lift.px}
              x2={lift.px}
              y1={M.top + ph}
              y2={lift.py}
              stroke="#16191c"
              strokeDasharray="1 2"
            />
            <line x1={M.left} x2={lift.px} y1={lift.py} y2={lift.py} stroke="#16191c" strokeDasharray="1 2" />
            <path
              d={`M ${lift.px} ${lift.py - 7} L ${lift.px + 7} ${lift.py} L ${lift.px} ${lift.py + 7} L ${lift.px - 7} ${lift.py} Z`}
              fill="#0f5f5b"
              stroke="#fff"
              strokeWidth="1.2"
            />
            <text
              x={lift.px + 10}
              y={lift.py - 9}
              fontSize="11.5"
              fontWeight="700"
              fill="currentColor"
              paintOrder="stroke"
              stroke="#fff"
              strokeWidth="3"
            >
              Lift {formatQuantity(f.grossLoad, 'weight', system)} at{' '}
              {formatQuantity(f.radius, 'length', system)}
              {f.percentOfChart !== null ? ` (${formatPercent(f.percentOfChart)})` : ''}
            </text>
          </g>
        )}
      </svg>
      <figcaption className="text-[12px] text-ink-soft">
        Boom length {formatQuantity(column.boomLength, 'length', system)} ({column.points.length} chart rows).
        Solid: chart capacity as the check reads it; long dashes: site maximum use (
        {formatPercent(result.policy.maxChartUsePct)}); short dashes: critical-lift threshold (
        {formatPercent(result.policy.criticalThresholdPct)}); diamond: the planned lift.
      </figcaption>
    </figure>
  );
}
