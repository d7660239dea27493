// The status shapes (a tick in a circle, an exclamation in a triangle, a cross in a filled
// octagon, a dash in a dotted circle) as plain scenes in a 14 × 14 box, y down, so the screens
// (SVG) and the stamped return (pdf-lib) paint the same figure and it reads in greyscale.
import type { CheckStatus } from '@shared/engineering/types';

/** `ink` is the status's colour on screen and ink on paper; `paper` is white; `soft` is muted ink. */
export type GlyphTone = 'ink' | 'paper' | 'soft';

export type GlyphPart =
  | { kind: 'path'; d: string; fill?: GlyphTone; stroke?: GlyphTone; width?: number }
  | {
      kind: 'circle';
      cx: number;
      cy: number;
      r: number;
      fill?: GlyphTone;
      stroke?: GlyphTone;
      width?: number;
      dash?: number;
    };

export const GLYPH_BOX = 14;

export const STATUS_GLYPHS: Record<CheckStatus, GlyphPart[]> = {
  pass: [
    { kind: 'circle', cx: 7, cy: 7, r: 5.8, stroke: 'ink', width: 1.4 },
    { kind: 'path', d: 'M4.3 7.2 L6.2 9 L9.8 5', stroke: 'ink', width: 1.6 },
  ],
  caution: [
    { kind: 'path', d: 'M7 1.4 L12.8 11.8 H1.2 Z', stroke: 'ink', width: 1.4 },
    { kind: 'path', d: 'M7 5.2 V8', stroke: 'ink', width: 1.6 },
    { kind: 'circle', cx: 7, cy: 10, r: 0.8, fill: 'ink' },
  ],
  fail: [
    { kind: 'path', d: 'M4.6 1.2 H9.4 L12.8 4.6 V9.4 L9.4 12.8 H4.6 L1.2 9.4 V4.6 Z', fill: 'ink' },
    { kind: 'path', d: 'M5 5 L9 9 M9 5 L5 9', stroke: 'paper', width: 1.6 },
  ],
  not_applicable: [
    { kind: 'circle', cx: 7, cy: 7, r: 5.8, stroke: 'soft', width: 1.2, dash: 1.6 },
    { kind: 'path', d: 'M4.5 7 H9.5', stroke: 'soft', width: 1.4 },
  ],
};

/** A stated figure that disagrees with the recomputed one: a struck-through equals sign. */
export const DISAGREE_GLYPH: GlyphPart[] = [
  { kind: 'path', d: 'M2 4 H12 M2 10 H12', stroke: 'ink', width: 1.6 },
  { kind: 'path', d: 'M9 1.5 L5 12.5', stroke: 'ink', width: 1.6 },
];
