// The crane seen from the side in the plane of the boom, drawn to scale from the inputs:
// supports and carrier, the tipping line, the boom at its angle, the load at the radius,
// the counterweight, and the two moment arms about the tipping line. Fills are hatches
// and outlines rather than colours, so the drawing reads in greyscale.
import { formatQuantity, sig3, toDisplay } from '@shared/engineering/format';
import type { LiftResult, UnitSystem } from '@shared/engineering/types';
import { squareGrid } from '@shared/drawing/plot-ticks';
import { sideViewScene } from '@shared/drawing/side-view';

const W = 680;
const H = 470;
const M = { left: 54, right: 16, top: 16, bottom: 110 };

export function CraneSideView({
  inputs,
  result,
  system,
}: {
  inputs: unknown;
  result: LiftResult;
  system: UnitSystem;
}) {
  const f = result.figures;
  // The tipping line the stability check used, so the drawing shows the same arms.
  const scene = sideViewScene(inputs, result);
  if (!scene) {
    return (
      <p className="text-[13px] text-ink-soft">
        The side view is drawn for mobile cranes with outriggers or tracks, a boom length and a radius.
      </p>
    );
  }
  const { fulcrum, radius, pivotOffset, pivotHeight, tipX, tipY, cw, cwWeight } = scene;
  const { loadLength, loadHeight, xMin, xMax, yMax, boomLength, angle } = scene;
  const pw = W - M.left - M.right;
  const ph = H - M.top - M.bottom;
  const scale = Math.min(pw / (xMax - xMin), ph / yMax);
  const X = (s: number) => M.left + (s - xMin) * scale;
  const Y = (h: number) => M.top + ph - h * scale;
  const ground = Y(0);

  const lu = toDisplay(1, 'length', system);
  const { x: xt, y: yt, step } = squareGrid(xMin * lu.value, xMax * lu.value, yMax * lu.value);

  const { loadArm, cwArm } = scene;
  const len = (m: number) => formatQuantity(m, 'length', system);
  const dimY1 = ground + 48;
  const dimY2 = ground + 76;

  return (
    <figure className="flex flex-col gap-1">
      <svg
        viewBox={`0 0 ${W} ${H}`}
        className="w-full max-w-[900px] text-ink"
        role="img"
        aria-label={`Side view to scale: tipping line ${len(fulcrum)} from the centre of rotation, load arm ${len(loadArm)} beyond it${cwArm !== null ? `, counterweight arm ${len(cwArm)} behind it` : ''}`}
      >
        <defs>
          <pattern
            id="hatch-cw"
            width="6"
            height="6"
            patternUnits="userSpaceOnUse"
            patternTransform="rotate(45)"
          >
            <rect width="6" height="6" fill="#fff" />
            <line x1="0" y1="0" x2="0" y2="6" stroke="#16191c" strokeWidth="2.2" />
          </pattern>
          <pattern id="hatch-load" width="7" height="7" patternUnits="userSpaceOnUse">
            <rect width="7" height="7" fill="#fff" />
            <path d="M0 0 L7 7 M7 0 L0 7" stroke="#16191c" strokeWidth="0.8" />
          </pattern>
          <pattern
            id="hatch-ground"
            width="8"
            height="8"
            patternUnits="userSpaceOnUse"
            patternTransform="rotate(-45)"
          >
            <line x1="0" y1="0" x2="0" y2="8" stroke="#8f8a7e" strokeWidth="1" />
          </pattern>
          <marker
            id="arrow"
            viewBox="0 0 8 8"
            refX="7"
            refY="4"
            markerWidth="7"
            markerHeight="7"
            orient="auto-start-reverse"
          >
            <path d="M0 0 L8 4 L0 8 Z" fill="#16191c" />
          </marker>
        </defs>

        {/* scale ticks along the top of the ground */}
        {xt.map((v) => (
          <g key={`x${v}`}>
            <line x1={X(v / lu.value)} x2={X(v / lu.value)} y1={M.top} y2={ground} stroke="#eeebe3" />
            <text x={X(v / lu.value)} y={ground + 24} textAnchor="middle" fontSize="11" fill="currentColor">
              {Number(v.toPrecision(6))}
            </text>
          </g>
        ))}
        {yt.map((v) => (
          <g key={`y${v}`}>
            <line x1={M.left} x2={W - M.right} y1={Y(v / lu.value)} y2={Y(v / lu.value)} stroke="#eeebe3" />
            <text x={M.left - 6} y={Y(v / lu.value) + 4} textAnchor="end" fontSize="11" fill="currentColor">
              {Number(v.toPrecision(6))}
            </text>
          </g>
        ))}
        <text
          transform={`translate(14 ${M.top + ph / 2}) rotate(-90)`}
          textAnchor="middle"
          fontSize="12"
          fontWeight="700"
          fill="currentColor"
        >
          Height above ground ({lu.unit})
        </text>

        <rect x={M.left} y={ground} width={pw} height={10} fill="url(#hatch-ground)" />
        <line x1={M.left} x2={W - M.right} y1={ground} y2={ground} stroke="#16191c" strokeWidth="1.5" />

        {/* supports and carrier */}
        {[-fulcrum, fulcrum].map((s) => (
          <rect key={s} x={X(s) - 6} y={ground - 5} width={12} height={5} fill="#16191c" />
        ))}
        <rect
          x={X(-fulcrum)}
          y={Y(pivotHeight * 0.55)}
          width={X(fulcrum) - X(-fulcrum)}
          height={Y(0.35) - Y(pivotHeight * 0.55)}
          fill="#fff"
          stroke="#16191c"
          strokeWidth="1.5"
        />
        {/* upper works */}
        <rect
          x={X(-(cw ?? 1.5) - 0.4)}
          y={Y(pivotHeight)}
          width={X(pivotOffset + 0.6) - X(-(cw ?? 1.5) - 0.4)}
          height={Y(pivotHeight * 0.55) - Y(pivotHeight)}
          fill="#f4f2ed"
          stroke="#16191c"
          strokeWidth="1.5"
        />
        {cw !== null && (
          <rect
            x={X(-cw - 0.7)}
            y={Y(pivotHeight + 0.4)}
            width={1.4 * scale}
            height={1.3 * scale}
            fill="url(#hatch-cw)"
            stroke="#16191c"
            strokeWidth="1.5"
          />
        )}
        {/* centre of rotation */}
        <line
          x1={X(0)}
          x2={X(0)}
          y1={ground + 8}
          y2={Y(pivotHeight + 6)}
          stroke="#16191c"
          strokeDasharray="10 3 2 3"
        />
        <text
          x={X(0) - 4}
          y={Y(pivotHeight + 6) + 4}
          textAnchor="end"
          fontSize="11"
          fill="currentColor"
          paintOrder="stroke"
          stroke="#fff"
          strokeWidth="3"
        >
          centre of rotation
        </text>
        {/* tipping line */}
        <line
          x1={X(fulcrum)}
          x2={X(fulcrum)}
          y1={ground + 84}
          y2={Y(pivotHeight + 4.5)}
          stroke="#9b1c1c"
          strokeWidth="1.6"
          strokeDasharray="6 3"
        />
        <path d={`M ${X(fulcrum)} ${ground - 1} l -6 10 h 12 Z`} fill="#9b1c1c" />
        <text
          x={X(fulcrum) + 4}
          y={Y(pivotHeight + 4.5) + 4}
          fontSize="11"
          fontWeight="700"
          fill="currentColor"
          paintOrder="stroke"
          stroke="#fff"
          strokeWidth="3"
        >
          tipping line
        </text>
        {/* boom, hoist line and load */}
        <line
          x1={X(pivotOffset)}
          y1={Y(pivotHeight)}
          x2={X(tipX)}
          y2={Y(tipY)}
          stroke="#16191c"
          strokeWidth="5"
          strokeLinecap="round"
        />
        <line
          x1={X(pivotOffset)}
          y1={Y(pivotHeight)}
          x2={X(tipX)}
          y2={Y(tipY)}
          stroke="#fff"
          strokeWidth="1.5"
          strokeDasharray="4 4"
        />
        <circle
          cx={X(pivotOffset)}
          cy={Y(pivotHeight)}
          r="3.5"
          fill="#fff"
          stroke="#16191c"
          strokeWidth="1.5"
        />
        <line
          x1={X(radius)}
          y1={Y(tipY)}
          x2={X(radius)}
          y2={Y(loadHeight + 0.6)}
          stroke="#16191c"
          strokeWidth="1.2"
        />
        <rect
          x={X(radius - loadLength / 2)}
          y={Y(loadHeight + 0.3)}
          width={loadLength * scale}
          height={loadHeight * scale}
          fill="url(#hatch-load)"
          stroke="#16191c"
          strokeWidth="1.5"
        />
        <text x={X(tipX) - 4} y={Y(tipY) - 6} textAnchor="end" fontSize="11" fill="currentColor">
          boom {len(boomLength)} at {sig3(angle)}°
        </text>
        <text
          x={X(radius)}
          y={Y(loadHeight + 0.3) - 4 - (tipY - loadHeight) * scale * 0.2}
          textAnchor="middle"
          fontSize="11"
          fontWeight="700"
          fill="currentColor"
          paintOrder="stroke"
          stroke="#fff"
          strokeWidth="3"
        >
          gross load {formatQuantity(f.grossLoad, 'weight', system)}
        </text>
        {cw !== null && cwWeight !== null && (
          <text
            x={X(-cw)}
            y={Y(pivotHeight + 2.4)}
            textAnchor="middle"
            fontSize="11"
            fill="currentColor"
            paintOrder="stroke"
            stroke="#fff"
            strokeWidth="3"
          >
            counterweight {formatQuantity(cwWeight, 'weight', system)}
          </text>
        )}

        {/* moment arms */}
        <line
          x1={X(fulcrum)}
          x2={X(radius)}
          y1={dimY1}
          y2={dimY1}
          stroke="#16191c"
          strokeWidth="1.2"
          markerStart="url(#arrow)"
          markerEnd="url(#arrow)"
        />
        <line x1={X(radius)} x2={X(radius)} y1={ground} y2={dimY1 + 6} stroke="#16191c" strokeWidth="0.8" />
        <text
          x={(X(fulcrum) + X(radius)) / 2}
          y={dimY1 - 5}
          textAnchor="middle"
          fontSize="11.5"
          fontWeight="700"
          fill="currentColor"
        >
          load arm {len(loadArm)} beyond the tipping line
        </text>
        {cwArm !== null && (
          <>
            <line
              x1={X(-(cw ?? 0))}
              x2={X(fulcrum)}
              y1={dimY2}
              y2={dimY2}
              stroke="#16191c"
              strokeWidth="1.2"
              markerStart="url(#arrow)"
              markerEnd="url(#arrow)"
            />
            <line
              x1={X(-(cw ?? 0))}
              x2={X(-(cw ?? 0))}
              y1={Y(pivotHeight + 0.4)}
              y2={dimY2 + 6}
              stroke="#16191c"
              strokeWidth="0.8"
              strokeDasharray="2 2"
            />
            <text
              x={(X(-(cw ?? 0)) + X(fulcrum)) / 2}
              y={dimY2 - 5}
              textAnchor="middle"
              fontSize="11.5"
              fontWeight="700"
              fill="currentColor"
            >
              counterweight arm {len(cwArm)} behind it
            </text>
          </>
        )}
        <text
          x={M.left + pw / 2}
          y={H - 6}
          textAnchor="middle"
          fontSize="12"
          fontWeight="700"
          fill="currentColor"
        >
          Horizontal distance from the centre of rotation ({lu.unit}), one grid square ={' '}
          {Number(step.toPrecision(6))} {lu.unit}
        </text>
      </svg>
      <figcaption className="text-[12px] text-ink-soft">
        Drawn to scale in the plane of the boom, over the support line nearest the load
        {f.overturningMoment !== null && (
          <>
            . Overturning moment {formatQuantity(f.overturningMoment, 'moment', system)} against resisting
            moment {formatQuantity(f.resistingMoment, 'moment', system)}
            {f.stabilityRatio !== null && (
              <>
                {' '}
                — ratio {sig3(f.stabilityRatio)} (site minimum {sig3(result.policy.minStabilityRatio)})
              </>
            )}
          </>
        )}
        .
      </figcaption>
    </figure>
  );
}
