// The status shapes are one scene for the screens and the paper: each status has its own figure
// inside the 14 × 14 box, told apart by shape (not colour) so it reads in greyscale.
import { describe, expect, it } from 'vitest';
import { GLYPH_BOX, STATUS_GLYPHS } from '@shared/drawing/status-glyphs';

const numbersOf = (d: string) => (d.match(/-?\d+(\.\d+)?/g) ?? []).map(Number);

describe('status glyphs', () => {
  it('when any status is drawn, then every point of its figure lies inside the box', () => {
    for (const parts of Object.values(STATUS_GLYPHS))
      for (const part of parts) {
        if (part.kind === 'circle') {
          expect(part.cx - part.r).toBeGreaterThanOrEqual(0);
          expect(part.cx + part.r).toBeLessThanOrEqual(GLYPH_BOX);
          expect(part.cy - part.r).toBeGreaterThanOrEqual(0);
          expect(part.cy + part.r).toBeLessThanOrEqual(GLYPH_BOX);
        } else
          for (const n of numbersOf(part.d)) {
            expect(n).toBeGreaterThanOrEqual(0);
            expect(n).toBeLessThanOrEqual(GLYPH_BOX);
          }
      }
  });

  it('when the four statuses are compared, then no two share a figure', () => {
    const figures = Object.values(STATUS_GLYPHS).map((parts) =>
      JSON.stringify(parts.map((p) => ({ ...p, fill: 0, stroke: 0 }))),
    );
    expect(new Set(figures).size).toBe(4);
  });

  it('when a check fails, then the octagon is filled and the cross is cut out in paper', () => {
    expect(STATUS_GLYPHS.fail[0]).toMatchObject({ kind: 'path', fill: 'ink' });
    expect(STATUS_GLYPHS.fail[1]).toMatchObject({ kind: 'path', stroke: 'paper' });
  });

  it('when a check does not apply, then its circle is dotted and muted', () => {
    expect(STATUS_GLYPHS.not_applicable[0]).toMatchObject({ kind: 'circle', stroke: 'soft', dash: 1.6 });
  });
});
