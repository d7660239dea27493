// The SVG over one rendered page: the stored markups drawn from their PDF coordinates at
// the page's current zoom, the shape being dragged, and the text box of a text markup
// being written. Drawing converts screen points back to PDF points (lib/geometry.ts).
import { useState, type PointerEvent as ReactPointerEvent } from 'react';
import { MARKUP_COLOURS, type Markup, type MarkupBody, type MarkupColour } from '@shared/schemas/reviews';
import {
  arrowFromDrag,
  boxFromDrag,
  boxToView,
  cloudPath,
  dragLength,
  MIN_DRAG_PX,
  pointScale,
  toPdfPoint,
  toViewPoint,
  type PointGeometry,
  type ViewPoint,
} from '../lib/geometry';
import type { PdfViewport } from '../lib/pdf-loader';
import { layoutLabel, layoutTextBox, type TextBlock } from '@shared/drawing/text-layout';
import { measureBold } from '../lib/text-measure';
import { markupName, type Tool } from '../lib/tools';

export const TEXT_SIZE = 11;
const STROKE = 1.6;
const PIN_RADIUS = 8;

export type PendingText = { fileId: string; pageNumber: number; at: PointGeometry; value: string };

function ArrowShape({ a, b, colour, s }: { a: ViewPoint; b: ViewPoint; colour: string; s: number }) {
  const len = Math.hypot(b.x - a.x, b.y - a.y);
  if (len < 0.5) return null;
  const ux = (b.x - a.x) / len;
  const uy = (b.y - a.y) / len;
  const head = Math.min(11 * s, len * 0.6);
  const hw = (4.5 * head) / 11;
  const bx = b.x - ux * head;
  const by = b.y - uy * head;
  return (
    <>
      <line
        x1={a.x}
        y1={a.y}
        x2={bx}
        y2={by}
        stroke={colour}
        strokeWidth={STROKE * s}
        strokeLinecap="round"
      />
      <path
        d={`M${b.x} ${b.y} L${bx - uy * hw} ${by + ux * hw} L${bx + uy * hw} ${by - ux * hw} Z`}
        fill={colour}
      />
    </>
  );
}

/**
 * The page as the return lays text out on it: the display frame in points (y up), from the
 * viewport (its size, turned by the page's rotation, over the zoom).
 */
function displayFrame(viewport: PdfViewport, s: number) {
  const page = { width: viewport.width / s, height: viewport.height / s };
  return {
    page,
    toDisplay: (p: ViewPoint) => ({ x: p.x / s, y: page.height - p.y / s }),
    toView: (x: number, y: number): ViewPoint => ({ x: x * s, y: (page.height - y) * s }),
  };
}

/** A laid-out block's lines as SVG text at the zoom; with a white backing for labels, as printed. */
function TextLines({
  block,
  frame,
  s,
  colour,
  backing,
}: {
  block: TextBlock;
  frame: ReturnType<typeof displayFrame>;
  s: number;
  colour: string;
  backing?: boolean;
}) {
  const at = frame.toView(block.x, block.y);
  const lh = block.lineHeight * s;
  return (
    <>
      {backing && (
        <rect
          x={at.x - 2 * s}
          y={at.y - block.size * s - 0.5 * s}
          width={(block.width + 4) * s}
          height={(block.lines.length * block.lineHeight + 2) * s}
          fill="#fff"
          opacity={0.85}
        />
      )}
      <text
        x={at.x}
        y={at.y}
        fontSize={block.size * s}
        fontWeight={700}
        fill={colour}
        data-testid="markup-text"
      >
        {block.lines.map((line, i) => (
          <tspan key={i} x={at.x} y={at.y + i * lh}>
            {line}
          </tspan>
        ))}
      </text>
    </>
  );
}

/** A label whose first baseline would be at view point `p`, kept on the page (layoutLabel). */
function Label({
  text,
  p,
  below,
  viewport,
  colour,
}: {
  text: string;
  p: ViewPoint;
  /** View y of the first baseline when there is no room above (below the shape). */
  below?: number;
  viewport: PdfViewport;
  colour: string;
}) {
  const s = pointScale(viewport);
  const frame = displayFrame(viewport, s);
  const under = below === undefined ? undefined : frame.toDisplay({ x: p.x, y: below }).y;
  const block = layoutLabel(text, frame.toDisplay(p), frame.page, measureBold, under);
  return <TextLines block={block} frame={frame} s={s} colour={colour} backing />;
}

function MarkupShape({
  markup,
  viewport,
}: {
  markup: Pick<Markup, 'kind' | 'geometry' | 'colour' | 'text' | 'number'>;
  viewport: PdfViewport;
}) {
  const colour = MARKUP_COLOURS[markup.colour] ?? MARKUP_COLOURS.rust;
  const g = markup.geometry;
  const s = pointScale(viewport);
  const note = markup.text?.trim() ? markup.text.trim() : null;
  switch (markup.kind) {
    case 'rectangle':
    case 'ellipse':
    case 'cloud': {
      const b = boxToView(viewport, g);
      return (
        <>
          {markup.kind === 'rectangle' && (
            <rect
              x={b.left}
              y={b.top}
              width={b.width}
              height={b.height}
              fill="transparent"
              stroke={colour}
              strokeWidth={STROKE * s}
            />
          )}
          {markup.kind === 'ellipse' && (
            <ellipse
              cx={b.left + b.width / 2}
              cy={b.top + b.height / 2}
              rx={b.width / 2}
              ry={b.height / 2}
              fill="transparent"
              stroke={colour}
              strokeWidth={STROKE * s}
            />
          )}
          {markup.kind === 'cloud' && (
            <path
              d={cloudPath(b.width / s, b.height / s)}
              transform={`translate(${b.left} ${b.top}) scale(${s})`}
              fill="transparent"
              stroke={colour}
              strokeWidth={STROKE}
            />
          )}
          {note && (
            <Label
              text={note}
              // The return puts a cloud's label higher, clear of its scallops.
              p={{ x: b.left, y: b.top - (markup.kind === 'cloud' ? 14 : 4) * s }}
              below={b.top + b.height + (markup.kind === 'cloud' ? 20 : 12) * s}
              viewport={viewport}
              colour={colour}
            />
          )}
        </>
      );
    }
    case 'arrow':
      return (
        <>
          <ArrowShape
            a={toViewPoint(viewport, g.x1 ?? 0, g.y1 ?? 0)}
            b={toViewPoint(viewport, g.x2 ?? 0, g.y2 ?? 0)}
            colour={colour}
            s={s}
          />
          {/* A wide invisible line so a thin arrow can be picked. */}
          <line
            {...(() => {
              const a = toViewPoint(viewport, g.x1 ?? 0, g.y1 ?? 0);
              const b = toViewPoint(viewport, g.x2 ?? 0, g.y2 ?? 0);
              return { x1: a.x, y1: a.y, x2: b.x, y2: b.y };
            })()}
            stroke="transparent"
            strokeWidth={10}
          />
        </>
      );
    case 'text': {
      const frame = displayFrame(viewport, s);
      const at = frame.toDisplay(toViewPoint(viewport, g.x ?? 0, g.y ?? 0));
      const block = layoutTextBox(
        { ...at, fontSize: g.fontSize ?? TEXT_SIZE, width: g.width },
        markup.text ?? '',
        frame.page,
        measureBold,
      );
      return <TextLines block={block} frame={frame} s={s} colour={colour} />;
    }
    case 'pin': {
      const p = toViewPoint(viewport, g.x ?? 0, g.y ?? 0);
      return (
        <>
          <circle cx={p.x} cy={p.y} r={PIN_RADIUS * s} fill={colour} stroke="#fff" strokeWidth={s} />
          <text x={p.x} y={p.y + 3.2 * s} fontSize={9 * s} fontWeight={900} fill="#fff" textAnchor="middle">
            {markup.number ?? ''}
          </text>
          {note && (
            <Label
              text={note}
              p={{ x: p.x + (PIN_RADIUS + 3) * s, y: p.y - 3 * s }}
              viewport={viewport}
              colour={colour}
            />
          )}
        </>
      );
    }
  }
}

type Drag = { start: ViewPoint; end: ViewPoint };

function relativePoint(event: ReactPointerEvent<SVGSVGElement>): ViewPoint {
  const rect = event.currentTarget.getBoundingClientRect();
  return { x: event.clientX - rect.left, y: event.clientY - rect.top };
}

function draftBody(
  tool: Tool,
  viewport: PdfViewport,
  drag: Drag,
  base: { fileId: string; pageNumber: number; colour: MarkupColour },
): MarkupBody | null {
  if (tool === 'rectangle' || tool === 'ellipse' || tool === 'cloud') {
    if (dragLength(drag.start, drag.end) < MIN_DRAG_PX) return null;
    return { ...base, kind: tool, geometry: boxFromDrag(viewport, drag.start, drag.end) };
  }
  if (tool === 'arrow') {
    if (dragLength(drag.start, drag.end) < MIN_DRAG_PX) return null;
    return { ...base, kind: 'arrow', geometry: arrowFromDrag(viewport, drag.start, drag.end) };
  }
  if (tool === 'pin') return { ...base, kind: 'pin', geometry: toPdfPoint(viewport, drag.end) };
  return null;
}

export function MarkupLayer({
  viewport,
  fileId,
  pageNumber,
  markups,
  tool,
  colour,
  editable,
  selectedId,
  onSelect,
  onCreate,
  pending,
  onPendingStart,
  onPendingChange,
  onPendingSave,
  onPendingCancel,
}: {
  viewport: PdfViewport;
  fileId: string;
  pageNumber: number;
  markups: Markup[];
  tool: Tool;
  colour: MarkupColour;
  editable: boolean;
  selectedId: string | null;
  onSelect: (id: string | null) => void;
  onCreate: (body: MarkupBody) => void;
  pending: PendingText | null;
  onPendingStart: (at: PointGeometry) => void;
  onPendingChange: (value: string) => void;
  onPendingSave: () => void;
  onPendingCancel: () => void;
}) {
  const [drag, setDrag] = useState<Drag | null>(null);
  const drawing = editable && tool !== 'select';
  const s = pointScale(viewport);

  function down(event: ReactPointerEvent<SVGSVGElement>) {
    if (!drawing || event.button !== 0) return;
    event.preventDefault();
    event.currentTarget.setPointerCapture?.(event.pointerId);
    const p = relativePoint(event);
    setDrag({ start: p, end: p });
  }
  function move(event: ReactPointerEvent<SVGSVGElement>) {
    if (!drag) return;
    setDrag({ start: drag.start, end: relativePoint(event) });
  }
  function up(event: ReactPointerEvent<SVGSVGElement>) {
    if (!drag) return;
    const finished = { start: drag.start, end: relativePoint(event) };
    setDrag(null);
    if (tool === 'text') {
      onPendingStart(toPdfPoint(viewport, finished.start));
      return;
    }
    const body = draftBody(tool, viewport, finished, { fileId, pageNumber, colour });
    if (body) onCreate(body);
  }

  const preview =
    drag && drawing && tool !== 'text'
      ? draftBody(tool, viewport, drag, { fileId, pageNumber, colour })
      : null;
  const pendingAt = pending ? toViewPoint(viewport, pending.at.x, pending.at.y) : null;

  return (
    <>
      <svg
        data-testid={`markup-layer-${pageNumber}`}
        className={`absolute inset-0 ${drawing ? 'cursor-crosshair' : ''}`}
        width={viewport.width}
        height={viewport.height}
        style={{ touchAction: drawing ? 'none' : undefined }}
        onPointerDown={down}
        onPointerMove={move}
        onPointerUp={up}
        onPointerCancel={() => setDrag(null)}
        onClick={(event) => {
          if (!drawing && event.target === event.currentTarget) onSelect(null);
        }}
        role="group"
        aria-label={`Markups on page ${pageNumber}`}
      >
        {markups.map((markup) => {
          const selected = markup.id === selectedId;
          return (
            <g
              key={markup.id}
              data-testid="markup"
              data-kind={markup.kind}
              role="button"
              tabIndex={drawing ? -1 : 0}
              aria-label={markupName(markup)}
              aria-pressed={selected}
              className={drawing ? 'pointer-events-none' : 'cursor-pointer focus:outline-none'}
              onClick={(event) => {
                event.stopPropagation();
                onSelect(selected ? null : markup.id);
              }}
              onKeyDown={(event) => {
                if (event.key === 'Enter' || event.key === ' ') {
                  event.preventDefault();
                  onSelect(selected ? null : markup.id);
                }
              }}
              style={
                selected
                  ? { filter: 'drop-shadow(0 0 2.5px #e2b34a) drop-shadow(0 0 1px #16191c)' }
                  : undefined
              }
            >
              <MarkupShape markup={markup} viewport={viewport} />
            </g>
          );
        })}
        {preview && (
          <g opacity={0.7} className="pointer-events-none">
            <MarkupShape
              markup={{
                kind: preview.kind,
                geometry: preview.geometry as Record<string, number>,
                colour,
                text: null,
                number: null,
              }}
              viewport={viewport}
            />
          </g>
        )}
      </svg>
      {pending && pendingAt && (
        <div className="absolute" style={{ left: pendingAt.x, top: pendingAt.y - TEXT_SIZE * s * 1.1 }}>
          <textarea
            autoFocus
            aria-label={`Text for page ${pageNumber}`}
            value={pending.value}
            rows={2}
            maxLength={500}
            onChange={(event) => onPendingChange(event.target.value)}
            onKeyDown={(event) => {
              if (event.key === 'Enter' && !event.shiftKey) {
                event.preventDefault();
                onPendingSave();
              } else if (event.key === 'Escape') {
                event.preventDefault();
                onPendingCancel();
              }
            }}
            placeholder="Type, then Enter"
            className="w-56 resize border border-rule-strong bg-sheet/95 px-1 py-0.5 font-bold leading-tight shadow"
            style={{ fontSize: Math.max(11, TEXT_SIZE * s), color: MARKUP_COLOURS[colour] }}
          />
        </div>
      )}
    </>
  );
}
