// The two painters only paint: the pdf-lib one turns the figure's y-down units into page points
// inside its box (y up), the SVG one writes the same numbers as elements; both take each role's
// colour from the map they are given.
import { PDFDocument, rgb } from 'pdf-lib';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it, vi } from 'vitest';
import type { Scene } from '@shared/drawing/scene';
import { paintScene } from '@server/modules/returns/draw-scene';
import { embedFonts, widthOf } from '@server/modules/returns/text-pdf';
import { SceneSvg } from '@/components/lift/scene-svg';

type Role = 'ink' | 'soft';

const scene: Scene<Role> = {
  width: 80,
  height: 50,
  shapes: [
    { kind: 'line', from: [10, 20], to: [30, 40], stroke: { role: 'ink', width: 2, dash: [3, 1] } },
    {
      kind: 'polygon',
      points: [
        [0, 0],
        [10, 0],
        [10, 5],
      ],
      fill: 'soft',
    },
    { kind: 'circle', centre: [40, 10], r: 3, fill: 'soft', stroke: { role: 'ink', width: 1 } },
    { kind: 'text', at: [60, 10], text: 'end', size: 10, anchor: 'end', role: 'ink' },
    { kind: 'text', at: [5, 25], text: 'up', size: 10, anchor: 'middle', role: 'soft', rotate: -90 },
  ],
};

describe('scene painters', () => {
  it('when the PDF painter paints into a box at (100, 200), then every y is flipped inside it', async () => {
    const doc = await PDFDocument.create();
    const fonts = embedFonts(doc);
    const page = doc.addPage([300, 300]);
    const calls = {
      line: vi.spyOn(page, 'drawLine'),
      path: vi.spyOn(page, 'drawSvgPath'),
      circle: vi.spyOn(page, 'drawCircle'),
      text: vi.spyOn(page, 'drawText'),
    };
    const INK = rgb(0, 0, 0);
    const SOFT = rgb(0.5, 0.5, 0.5);
    paintScene(page, fonts, { x: 100, y: 200 }, scene, { ink: INK, soft: SOFT });

    // the box's top is at 200 + 50 = 250: figure y 20 is page y 230
    expect(calls.line.mock.calls[0][0]).toMatchObject({
      start: { x: 110, y: 230 },
      end: { x: 130, y: 210 },
      thickness: 2,
      color: INK,
      dashArray: [3, 1],
    });
    // paths keep the figure's coordinates: drawSvgPath runs y down from the box's top-left
    expect(calls.path.mock.calls[0][0]).toBe('M0 0 L10 0 L10 5 Z');
    expect(calls.path.mock.calls[0][1]).toMatchObject({ x: 100, y: 250, color: SOFT });
    expect(calls.circle.mock.calls[0][0]).toMatchObject({
      x: 140,
      y: 240,
      size: 3,
      color: SOFT,
      borderColor: INK,
    });
    // end-anchored: it finishes at x = 160
    const w = widthOf('end', fonts.regular, 10);
    expect(calls.text.mock.calls[0][1]).toMatchObject({ x: 160 - w, y: 240, size: 10, color: INK });
    // turned to read upwards, centred on (105, 225): it starts half its width below
    const up = calls.text.mock.calls[1][1]!;
    const wu = widthOf('up', fonts.regular, 10);
    expect(up.x).toBeCloseTo(105, 9);
    expect(up.y).toBeCloseTo(225 - wu / 2, 9);
    expect(up.rotate).toMatchObject({ angle: 90 });
  });

  it('when the SVG painter paints, then the elements carry the figure numbers and the mapped colours', () => {
    const html = renderToStaticMarkup(
      createElement(SceneSvg<Role>, { scene, colours: { ink: '#111', soft: '#999' }, label: 'test figure' }),
    );
    expect(html).toContain('viewBox="0 0 80 50"');
    expect(html).toContain('aria-label="test figure"');
    expect(html).toContain(
      '<line x1="10" y1="20" x2="30" y2="40" stroke="#111" stroke-width="2" stroke-dasharray="3 1"',
    );
    expect(html).toContain('<polygon points="0,0 10,0 10,5" fill="#999" stroke="none"');
    expect(html).toContain('<circle cx="40" cy="10" r="3" fill="#999" stroke="#111" stroke-width="1"');
    expect(html).toMatch(/<text x="60" y="10" text-anchor="end" font-size="10" fill="#111">end<\/text>/);
    expect(html).toContain('transform="rotate(-90 5 25)"');
  });
});
