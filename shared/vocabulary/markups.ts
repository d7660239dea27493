// What the markup kinds and colours are called in the review workspace and the stamped return.
// The colours' values and the list of kinds are the contract in shared/schemas/reviews.ts.
import type { MARKUP_KINDS, MarkupColour } from '@shared/schemas/reviews';

export type MarkupKind = (typeof MARKUP_KINDS)[number];

export const MARKUP_KIND_LABELS: Record<MarkupKind, string> = {
  rectangle: 'Box',
  ellipse: 'Oval',
  cloud: 'Cloud',
  arrow: 'Arrow',
  text: 'Text',
  pin: 'Pin',
};

export const MARKUP_COLOUR_NAMES: Record<MarkupColour, string> = {
  rust: 'Rust',
  cobalt: 'Cobalt',
  verdigris: 'Verdigris',
  graphite: 'Graphite',
};
