// The stamp block's outline on page 1 of the plan, at the size it prints: where the return
// will put it (the engineer's placement, the corner the desk found empty, or — when page 1 has
// no room — a note that it goes on a cover sheet). The assigned engineer drags it (or moves it
// with the arrow keys) to place it; the server refuses a spot over the plan's content in
// words, and the outline goes back to where it was.
import { useState, type KeyboardEvent, type PointerEvent as ReactPointerEvent } from 'react';
import { CORNER_WORDS } from '@shared/drawing/stamp-outline';
import type { StampPlacementBody, StampPlacementView } from '@shared/schemas/stamp-placement';
import type { PdfViewport } from '../lib/pdf-loader';
import { pointScale } from '../lib/geometry';

type Drag = { startX: number; startY: number; dx: number; dy: number };

const KEY_STEP = 6;

export function StampOutline({
  viewport,
  view,
  editable,
  active,
  saving,
  error,
  onPlace,
  onReset,
}: {
  viewport: PdfViewport;
  view: StampPlacementView;
  /** The assigned engineer, before the return is requested. */
  editable: boolean;
  /** False while a markup tool is drawing: the outline lets the page take the pointer. */
  active: boolean;
  saving: boolean;
  error: string | null;
  onPlace: (at: StampPlacementBody) => void;
  onReset: () => void;
}) {
  const [drag, setDrag] = useState<Drag | null>(null);
  const s = pointScale(viewport);
  const { page, stamp, lands } = view;
  const cover = lands.on === 'cover';
  // On a cover sheet the outline waits in the top right corner, for the engineer to drag it onto room.
  const rect =
    lands.on === 'page'
      ? lands.rect
      : { x: page.width - 18 - stamp.width, y: page.height - 18 - stamp.height, ...stamp };
  const left = rect.x * s + (drag?.dx ?? 0);
  const top = (page.height - rect.y - stamp.height) * s + (drag?.dy ?? 0);

  function place(screenLeft: number, screenTop: number) {
    const x = Math.min(Math.max(0, screenLeft / s), page.width - stamp.width);
    const y = Math.min(Math.max(0, page.height - screenTop / s - stamp.height), page.height - stamp.height);
    onPlace({ x: Math.round(x * 10) / 10, y: Math.round(y * 10) / 10 });
  }
  function down(event: ReactPointerEvent<HTMLDivElement>) {
    if (!editable || event.button !== 0) return;
    if ((event.target as HTMLElement).closest('button')) return;
    event.preventDefault();
    event.currentTarget.setPointerCapture?.(event.pointerId);
    setDrag({ startX: event.clientX, startY: event.clientY, dx: 0, dy: 0 });
  }
  function move(event: ReactPointerEvent<HTMLDivElement>) {
    if (!drag) return;
    setDrag({ ...drag, dx: event.clientX - drag.startX, dy: event.clientY - drag.startY });
  }
  function up(event: ReactPointerEvent<HTMLDivElement>) {
    if (!drag) return;
    const dx = event.clientX - drag.startX;
    const dy = event.clientY - drag.startY;
    setDrag(null);
    if (Math.hypot(dx, dy) >= 3) place(rect.x * s + dx, (page.height - rect.y - stamp.height) * s + dy);
  }
  function key(event: KeyboardEvent<HTMLDivElement>) {
    if (!editable) return;
    const step = (event.shiftKey ? 5 : 1) * KEY_STEP * s;
    const moves: Record<string, [number, number]> = {
      ArrowLeft: [-step, 0],
      ArrowRight: [step, 0],
      ArrowUp: [0, -step],
      ArrowDown: [0, step],
    };
    const m = moves[event.key];
    if (!m) return;
    event.preventDefault();
    place(left + m[0], top + m[1]);
  }

  const where =
    lands.on === 'cover'
      ? `Stamp on a cover sheet: ${lands.why}.`
      : lands.how === 'placed'
        ? 'Stamp block · placed by the engineer'
        : `Stamp block · ${CORNER_WORDS[lands.how]}, chosen by the desk`;
  return (
    <div
      data-testid="stamp-outline"
      data-on={lands.on}
      data-how={lands.on === 'page' ? lands.how : 'cover'}
      role="group"
      aria-label={`${where} ${editable ? 'Drag, or use the arrow keys, to place it on page 1.' : ''}`.trim()}
      tabIndex={editable && active ? 0 : -1}
      onPointerDown={down}
      onPointerMove={move}
      onPointerUp={up}
      onPointerCancel={() => setDrag(null)}
      onKeyDown={key}
      className={`absolute border-2 border-dashed text-[11px] leading-tight ${
        cover ? 'border-ink-soft bg-sheet/60' : 'border-verdigris bg-verdigris-tint/35'
      } ${active ? '' : 'pointer-events-none'} ${editable && active ? 'cursor-move focus:outline-2 focus:outline-verdigris' : ''} ${
        saving ? 'opacity-60' : ''
      }`}
      style={{
        left,
        top,
        width: stamp.width * s,
        height: stamp.height * s,
        touchAction: editable ? 'none' : undefined,
      }}
    >
      <div className="m-1 inline-block bg-sheet/90 px-1 py-0.5 font-bold text-verdigris-deep">
        {where}
        {editable && <span className="block font-normal text-ink-soft">Drag to place it on page 1</span>}
      </div>
      {editable && view.placement && (
        <button
          type="button"
          onClick={onReset}
          className="absolute bottom-1 left-1 border border-rule-strong bg-sheet px-1 font-bold text-ink hover:bg-sheet-alt"
        >
          Let the desk choose
        </button>
      )}
      {error && (
        <p
          role="alert"
          className="absolute left-0 top-full mt-1 w-[max(100%,18rem)] border border-fail-ink bg-sheet px-1.5 py-1 font-bold text-fail-ink"
        >
          {error}
        </p>
      )}
    </div>
  );
}
