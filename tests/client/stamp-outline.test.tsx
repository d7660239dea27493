// @vitest-environment jsdom
// The workspace's stamp outline and text layout (issue 12 items 7 and 8): the outline shows at
// the size and place the return prints the block, a drag places it in page 1's display frame
// at any zoom, a cover-sheet answer says so; a text markup wraps inside its 220 pt box and a
// label near the page's edge stays on the page, by the layout the return uses.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import type { StampPlacementView } from '@shared/schemas/stamp-placement';
import type { Markup } from '@shared/schemas/reviews';
import { StampOutline } from '@/features/review-workspace/components/stamp-outline';
import { MarkupLayer } from '@/features/review-workspace/components/markup-layer';
import type { PdfViewport } from '@/features/review-workspace/lib/pdf-loader';
import { measureBold } from '@/features/review-workspace/lib/text-measure';

afterEach(() => cleanup());

/** An unrotated A4 page at `scale`, as pdf.js's viewport converts it. */
function viewport(scale: number): PdfViewport {
  const h = 842;
  return {
    width: 595 * scale,
    height: h * scale,
    scale,
    convertToViewportPoint: (x: number, y: number) => [x * scale, (h - y) * scale],
    convertToPdfPoint: (x: number, y: number) => [x / scale, h - y / scale],
  };
}

const VIEW: StampPlacementView = {
  revision: 1,
  fileId: '11111111-1111-4111-8111-111111111111',
  placement: null,
  page: { width: 595, height: 842 },
  stamp: { width: 230, height: 150 },
  lands: { on: 'page', how: 'top-right', rect: { x: 347, y: 674, width: 230, height: 150 } },
};

function outline(props: Partial<Parameters<typeof StampOutline>[0]> = {}) {
  const onPlace = vi.fn();
  const onReset = vi.fn();
  render(
    <StampOutline
      viewport={viewport(2)}
      view={VIEW}
      editable
      active
      saving={false}
      error={null}
      onPlace={onPlace}
      onReset={onReset}
      {...props}
    />,
  );
  return { onPlace, onReset, el: screen.getByTestId('stamp-outline') };
}

describe('stamp outline', () => {
  it('when the desk chose a corner, then the outline sits there at the printed size and says so', () => {
    const { el } = outline();
    expect(el.style.left).toBe('694px');
    expect(el.style.top).toBe(`${(842 - 674 - 150) * 2}px`);
    expect(el.style.width).toBe('460px');
    expect(el.style.height).toBe('300px');
    expect(el.textContent).toContain('Stamp block · top right corner, chosen by the desk');
  });

  it('when the engineer drags the outline at 200%, then the placement is sent in page points', () => {
    const { onPlace, el } = outline();
    fireEvent.pointerDown(el, { clientX: 800, clientY: 100, button: 0, pointerId: 1 });
    fireEvent.pointerMove(el, { clientX: 500, clientY: 700, pointerId: 1 });
    fireEvent.pointerUp(el, { clientX: 500, clientY: 700, pointerId: 1 });
    // 300 px left and 600 px down at 2 px per point: 150 pt left, 300 pt down.
    expect(onPlace).toHaveBeenCalledWith({ x: 197, y: 374 });
  });

  it('when dragged past the page edge, then the placement stops at the edge', () => {
    const { onPlace, el } = outline();
    fireEvent.pointerDown(el, { clientX: 800, clientY: 100, button: 0, pointerId: 1 });
    fireEvent.pointerUp(el, { clientX: 1400, clientY: -300, pointerId: 1 });
    expect(onPlace).toHaveBeenCalledWith({ x: 365, y: 692 });
  });

  it('when the arrow keys are used, then the outline moves by 6 pt', () => {
    const { onPlace, el } = outline();
    fireEvent.keyDown(el, { key: 'ArrowLeft' });
    expect(onPlace).toHaveBeenCalledWith({ x: 341, y: 674 });
  });

  it('when the person may not place it, then a drag sends nothing', () => {
    const { onPlace, el } = outline({ editable: false });
    fireEvent.pointerDown(el, { clientX: 800, clientY: 100, button: 0, pointerId: 1 });
    fireEvent.pointerUp(el, { clientX: 500, clientY: 700, pointerId: 1 });
    expect(onPlace).not.toHaveBeenCalled();
    expect(el.textContent).not.toContain('Drag');
  });

  it('when page 1 has no room, then the outline says the stamp goes on a cover sheet; a refusal is shown in words', () => {
    const { el } = outline({
      view: { ...VIEW, lands: { on: 'cover', why: 'page 1 had no free corner' } },
      error: 'The stamp placed at x 40 pt, y 640 pt would cover part of page 1.',
    });
    expect(el.dataset.on).toBe('cover');
    expect(el.textContent).toContain('Stamp on a cover sheet: page 1 had no free corner.');
    expect(screen.getByRole('alert').textContent).toContain('would cover part of page 1');
  });

  it('when the engineer placed it, then "Let the desk choose" hands it back', () => {
    const { onReset } = outline({
      view: {
        ...VIEW,
        placement: { x: 60, y: 260 },
        lands: { on: 'page', how: 'placed', rect: { x: 60, y: 260, width: 230, height: 150 } },
      },
    });
    fireEvent.click(screen.getByRole('button', { name: 'Let the desk choose' }));
    expect(onReset).toHaveBeenCalled();
  });
});

function layer(markups: Markup[]) {
  render(
    <MarkupLayer
      viewport={viewport(1.5)}
      fileId="f"
      pageNumber={1}
      markups={markups}
      tool="select"
      colour="rust"
      editable={false}
      selectedId={null}
      onSelect={() => {}}
      onCreate={() => {}}
      pending={null}
      onPendingStart={() => {}}
      onPendingChange={() => {}}
      onPendingSave={() => {}}
      onPendingCancel={() => {}}
    />,
  );
}

const markup = (m: Partial<Markup>): Markup => ({
  id: crypto.randomUUID(),
  revisionId: 'r',
  fileId: 'f',
  pageNumber: 1,
  kind: 'text',
  geometry: {},
  colour: 'rust',
  text: null,
  number: null,
  createdBy: 'E',
  createdAt: '2027-03-01T00:00:00Z',
  ...m,
});

describe('text in the workspace', () => {
  it('when a text markup is long, then it wraps inside its 220 pt box and stays on the page, as in the return', () => {
    const text =
      'Confirm the mat size under the front outrigger Averyveryveryveryveryveryverylongword before the lift';
    layer([markup({ kind: 'text', geometry: { x: 500, y: 400, fontSize: 11 }, text })]);
    const lines = [...screen.getByTestId('markup-text').querySelectorAll('tspan')];
    expect(lines.length).toBeGreaterThan(2);
    const x = Number(lines[0].getAttribute('x')) / 1.5;
    for (const l of lines) {
      const w = measureBold(l.textContent ?? '', 11);
      expect(w).toBeLessThanOrEqual(220);
      expect(x + w).toBeLessThanOrEqual(595 - 6 + 0.01);
    }
    expect(
      lines
        .map((l) => l.textContent)
        .join('')
        .replace(/ /g, ''),
    ).toBe(text.replace(/ /g, ''));
  });

  it('when a box near the top right corner has a label, then the label is drawn on the page', () => {
    layer([
      markup({
        kind: 'rectangle',
        geometry: { x: 545, y: 815, width: 45, height: 24 },
        text: 'Check the crane mats under the corner of the slab',
      }),
    ]);
    const label = screen.getByTestId('markup-text');
    const x = Number(label.getAttribute('x')) / 1.5;
    const y = Number(label.getAttribute('y')) / 1.5;
    const widest = Math.max(
      ...[...label.querySelectorAll('tspan')].map((t) => measureBold(t.textContent ?? '', 8)),
    );
    expect(x).toBeGreaterThanOrEqual(6);
    expect(x + widest).toBeLessThanOrEqual(595 - 6 + 0.01);
    // No room above the box at the top edge: the label goes under it (y grows downwards on screen).
    expect(y).toBeGreaterThan(842 - 815);
  });
});
