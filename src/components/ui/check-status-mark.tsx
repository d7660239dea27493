// The outcome of one check (pass, caution, fail, not applicable) as word + shape + colour.
import type { CheckStatus } from '@shared/schemas/packages';
import {
  DISAGREE_GLYPH,
  GLYPH_BOX,
  STATUS_GLYPHS,
  type GlyphPart,
  type GlyphTone,
} from '@shared/drawing/status-glyphs';
import { CHECK_STATUS_LABELS } from '@shared/vocabulary/check-statuses';

const STYLES: Record<CheckStatus, string> = {
  pass: 'bg-pass-tint text-pass-ink',
  caution: 'bg-caution-tint text-caution-ink',
  fail: 'bg-fail-tint text-fail-ink',
  not_applicable: 'bg-na-tint text-na-ink',
};

export function CheckShape({ status, className = 'size-3.5' }: { status: CheckStatus; className?: string }) {
  return <GlyphSvg parts={STATUS_GLYPHS[status]} className={className} />;
}

function GlyphSvg({ parts, className }: { parts: GlyphPart[]; className: string }) {
  // The shape is computed in shared/drawing; ink and soft take the mark's colour, paper is white.
  const paint = (t: GlyphTone | undefined) =>
    t === undefined ? 'none' : t === 'paper' ? '#fff' : 'currentColor';
  return (
    <svg
      className={className}
      viewBox={`0 0 ${GLYPH_BOX} ${GLYPH_BOX}`}
      aria-hidden
      focusable={false}
      strokeLinecap="round"
      strokeLinejoin="round"
    >
      {parts.map((part, i) =>
        part.kind === 'circle' ? (
          <circle
            key={i}
            cx={part.cx}
            cy={part.cy}
            r={part.r}
            fill={paint(part.fill)}
            stroke={paint(part.stroke)}
            strokeWidth={part.width}
            strokeDasharray={part.dash ? `${part.dash} ${part.dash}` : undefined}
          />
        ) : (
          <path
            key={i}
            d={part.d}
            fill={paint(part.fill)}
            stroke={paint(part.stroke)}
            strokeWidth={part.width}
          />
        ),
      )}
    </svg>
  );
}

export function CheckStatusMark({ status, className = '' }: { status: CheckStatus; className?: string }) {
  return (
    <span
      className={`inline-flex items-center gap-1 whitespace-nowrap rounded-sm px-1.5 py-px text-[12.5px] font-bold leading-5 ${STYLES[status]} ${className}`}
    >
      <CheckShape status={status} />
      {CHECK_STATUS_LABELS[status]}
    </span>
  );
}

/** A stated figure the recomputation disagrees with (beside its percentages and tolerance). */
export function DisagreeMark({ className = '' }: { className?: string }) {
  return (
    <span
      className={`inline-flex items-center gap-1 rounded-sm bg-caution-tint px-1.5 text-[12.5px] font-bold leading-5 text-caution-ink ${className}`}
    >
      <GlyphSvg parts={DISAGREE_GLYPH} className="size-3.5" />
      Disagrees
    </span>
  );
}
