// The one layout of text markups and labels (shared/drawing/text-layout.ts) that the workspace
// and the stamped return both draw: wrapped inside the box, a long word broken, kept on the page.
import { describe, expect, it } from 'vitest';
import {
  LABEL,
  layoutLabel,
  layoutTextBox,
  PAGE_MARGIN,
  TEXT_BOX_WIDTH,
  wrapLines,
} from '@shared/drawing/text-layout';

/** Every character 0.5 em wide: easy to count. */
const measure = (t: string, size: number) => [...t].length * size * 0.5;
const PAGE = { width: 595, height: 842 };

describe('text layout', () => {
  it('when text is longer than its box, then every line fits the box and a long word breaks by character', () => {
    const lines = wrapLines('short words then Averyveryveryverylongwordthatcannotfit end', 100, 10, measure);
    for (const l of lines) expect(measure(l, 10)).toBeLessThanOrEqual(100);
    expect(lines.join('').replace(/ /g, '')).toBe('shortwordsthenAveryveryveryverylongwordthatcannotfitend');
    expect(lines.length).toBeGreaterThan(3);
  });

  it('when paragraphs are typed, then each starts a line', () => {
    expect(wrapLines('one\ntwo', 100, 10, measure)).toEqual(['one', 'two']);
  });

  it('when a text markup sits at the right edge, then its block moves left to stay on the page and keeps the box width', () => {
    const text = 'Confirm the mat size under the front outrigger before the lift and sign it off on site';
    const b = layoutTextBox({ x: 580, y: 400, fontSize: 11 }, text, PAGE, measure);
    for (const l of b.lines) expect(measure(l, b.size)).toBeLessThanOrEqual(TEXT_BOX_WIDTH);
    expect(b.x + b.width).toBeLessThanOrEqual(PAGE.width - PAGE_MARGIN);
    expect(b.x).toBeGreaterThanOrEqual(PAGE_MARGIN);
    expect(b.y).toBe(400);
  });

  it('when a text markup sits at the bottom, then it moves up so its last line stays on the page', () => {
    const b = layoutTextBox(
      { x: 50, y: 10, fontSize: 11 },
      'a b c d e f g h i j k l m n o p q r s t u v w x y z '.repeat(8),
      PAGE,
      measure,
    );
    expect(b.y - (b.lines.length - 1) * b.lineHeight).toBeGreaterThanOrEqual(PAGE_MARGIN);
  });

  it('when a label would start off the top right corner, then it is moved onto the page and cut to three lines', () => {
    const text =
      'F1 · Check the crane mats under the corner of the slab and the edge distance to the excavation, then again after the mats are moved to the north side';
    const b = layoutLabel(text, { x: 560, y: 850 }, PAGE, measure);
    expect(b.lines.length).toBe(LABEL.maxLines);
    expect(b.lines[2].endsWith('…')).toBe(true);
    expect(b.x + b.width).toBeLessThanOrEqual(PAGE.width - PAGE_MARGIN);
    expect(b.y + b.size).toBeLessThanOrEqual(PAGE.height - PAGE_MARGIN);
    expect(layoutLabel(text, { x: 560, y: 850 }, PAGE, measure, 780).y).toBe(780);
    expect(layoutLabel(text, { x: 560, y: 700 }, PAGE, measure, 600).y).toBe(700);
    const low = layoutLabel(text, { x: -20, y: 2 }, PAGE, measure);
    expect(low.x).toBe(PAGE_MARGIN);
    expect(low.y - (low.lines.length - 1) * low.lineHeight - 2.5).toBeGreaterThanOrEqual(PAGE_MARGIN);
  });
});
