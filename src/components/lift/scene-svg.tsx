// Paints a figure computed in shared/drawing (see scene.ts) as SVG elements inside a <figure>
// with its caption: each role takes its colour from `colours`. Nothing here decides where
// anything goes.
import type { Point, Scene, Stroke } from '@shared/drawing/scene';

const points = (p: readonly Point[]) => p.map(([x, y]) => `${x},${y}`).join(' ');

function stroke<R extends string>(s: Stroke<R> | undefined, colours: Record<R, string>) {
  if (!s) return { stroke: 'none' };
  return {
    stroke: colours[s.role],
    strokeWidth: s.width,
    strokeDasharray: s.dash?.join(' '),
    strokeLinecap: s.cap,
  };
}

export function SceneSvg<R extends string>({
  scene,
  colours,
  label,
}: {
  scene: Scene<R>;
  colours: Record<R, string>;
  /** What the figure shows, for a screen reader. */
  label: string;
}) {
  return (
    <svg
      viewBox={`0 0 ${scene.width} ${scene.height}`}
      className="w-full max-w-[900px] text-ink"
      role="img"
      aria-label={label}
    >
      {scene.shapes.map((s, i) => {
        switch (s.kind) {
          case 'line':
            return (
              <line
                key={i}
                x1={s.from[0]}
                y1={s.from[1]}
                x2={s.to[0]}
                y2={s.to[1]}
                {...stroke(s.stroke, colours)}
              />
            );
          case 'polyline':
            return <polyline key={i} points={points(s.points)} fill="none" {...stroke(s.stroke, colours)} />;
          case 'polygon':
            return (
              <polygon
                key={i}
                points={points(s.points)}
                fill={s.fill ? colours[s.fill] : 'none'}
                {...stroke(s.stroke, colours)}
              />
            );
          case 'circle':
            return (
              <circle
                key={i}
                cx={s.centre[0]}
                cy={s.centre[1]}
                r={s.r}
                fill={s.fill ? colours[s.fill] : 'none'}
                {...stroke(s.stroke, colours)}
              />
            );
          case 'dimension':
            return (
              <g key={i}>
                <line
                  x1={s.from[0]}
                  y1={s.from[1]}
                  x2={s.to[0]}
                  y2={s.to[1]}
                  {...stroke(s.stroke, colours)}
                />
                {s.heads.map((h, k) => (
                  <polygon key={k} points={points(h)} fill={colours[s.stroke.role]} />
                ))}
              </g>
            );
          case 'text':
            return (
              <text
                key={i}
                x={s.at[0]}
                y={s.at[1]}
                transform={s.rotate ? `rotate(${s.rotate} ${s.at[0]} ${s.at[1]})` : undefined}
                textAnchor={s.anchor}
                fontSize={s.size}
                fontWeight={s.bold ? 700 : undefined}
                fill={colours[s.role]}
                {...(s.halo ? { paintOrder: 'stroke', stroke: '#fff', strokeWidth: 3 } : {})}
              >
                {s.text}
              </text>
            );
        }
      })}
    </svg>
  );
}
