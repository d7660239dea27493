// Markup geometry against real pdf.js viewports (the legacy build runs in Node): a shape
// drawn at one zoom is stored in the same PDF points as the same shape drawn at another,
// and stored points come back to the same place on screen — on a plain page and on a page
// with a shifted media box and a quarter turn.
import { describe, expect, it } from 'vitest';
import { degrees, PDFDocument } from 'pdf-lib';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import {
  arrowFromDrag,
  boxFromDrag,
  boxToView,
  toPdfPoint,
  toViewPoint,
  type PointConverter,
} from '@/features/review-workspace/lib/geometry';

async function pages() {
  const pdf = await PDFDocument.create();
  pdf.addPage([612, 792]);
  const turned = pdf.addPage([1224, 792]);
  turned.setMediaBox(10, 20, 1224, 792);
  turned.setRotation(degrees(90));
  const doc = await getDocument({ data: await pdf.save() }).promise;
  return { plain: await doc.getPage(1), turned: await doc.getPage(2), doc };
}

/** Screen points of a PDF point at a viewport: what the engineer's pointer would hit. */
function screen(viewport: PointConverter, x: number, y: number) {
  return toViewPoint(viewport, x, y);
}

describe('markup geometry', () => {
  it('when a rectangle is dragged over the same place at 100% and at 200%, then the stored PDF box is the same', async () => {
    const { plain, doc } = await pages();
    const at1 = plain.getViewport({ scale: 1 });
    const at2 = plain.getViewport({ scale: 2 });

    const small = boxFromDrag(at1, { x: 100, y: 100 }, { x: 300, y: 250 });
    const large = boxFromDrag(at2, { x: 200, y: 200 }, { x: 600, y: 500 });

    expect(small).toEqual({ x: 100, y: 542, width: 200, height: 150 });
    expect(large).toEqual(small);
    await doc.destroy();
  });

  it('when a box is drawn on a turned page with a shifted media box, then it comes back to the same screen place at any zoom', async () => {
    const { turned, doc } = await pages();
    for (const scale of [0.75, 1.5, 3]) {
      const viewport = turned.getViewport({ scale });
      const a = { x: 40 * scale, y: 60 * scale };
      const b = { x: 220 * scale, y: 140 * scale };
      const stored = boxFromDrag(viewport, a, b);
      // The same stored box at every zoom…
      expect(stored).toEqual(
        boxFromDrag(turned.getViewport({ scale: 1 }), { x: 40, y: 60 }, { x: 220, y: 140 }),
      );
      // …and it is drawn where it was dragged.
      const back = boxToView(viewport, stored);
      expect(back.left).toBeCloseTo(40 * scale, 1);
      expect(back.top).toBeCloseTo(60 * scale, 1);
      expect(back.width).toBeCloseTo(180 * scale, 1);
      expect(back.height).toBeCloseTo(80 * scale, 1);
    }
    // A quarter turn: screen x runs along PDF y, so the stored box is tall where the drag was wide.
    const stored = boxFromDrag(turned.getViewport({ scale: 1 }), { x: 40, y: 60 }, { x: 220, y: 140 });
    expect(stored.height).toBeCloseTo(180, 1);
    expect(stored.width).toBeCloseTo(80, 1);
    await doc.destroy();
  });

  it('when an arrow and a point are placed at two zooms, then tail, head and point are stored identically', async () => {
    const { plain, doc } = await pages();
    const at1 = plain.getViewport({ scale: 1 });
    const at2 = plain.getViewport({ scale: 2 });
    expect(arrowFromDrag(at2, { x: 20, y: 40 }, { x: 400, y: 300 })).toEqual(
      arrowFromDrag(at1, { x: 10, y: 20 }, { x: 200, y: 150 }),
    );
    expect(toPdfPoint(at2, screen(at2, 306, 396))).toEqual({ x: 306, y: 396 });
    expect(toPdfPoint(at1, { x: 306, y: 396 })).toEqual({ x: 306, y: 396 });
    await doc.destroy();
  });
});
