// The markup tools and colours, with the names and keys the workspace shows.
import { MARKUP_COLOURS, type MarkupColour } from '@shared/schemas/reviews';
import { MARKUP_COLOUR_NAMES, MARKUP_KIND_LABELS } from '@shared/vocabulary/markups';

export type Tool = 'select' | 'rectangle' | 'ellipse' | 'cloud' | 'arrow' | 'text' | 'pin';

export const TOOLS: ReadonlyArray<{ tool: Tool; label: string; key: string; hint: string }> = [
  { tool: 'select', label: 'Pick', key: '1', hint: 'Pick a markup to link or remove it' },
  { tool: 'rectangle', label: 'Box', key: '2', hint: 'Drag a box round an area' },
  { tool: 'ellipse', label: 'Oval', key: '3', hint: 'Drag an oval round an area' },
  { tool: 'cloud', label: 'Cloud', key: '4', hint: 'Drag a scalloped outline round a change' },
  { tool: 'arrow', label: 'Arrow', key: '5', hint: 'Drag from the tail to the point' },
  { tool: 'text', label: 'Text', key: '6', hint: 'Click where the text starts, type, then Enter' },
  { tool: 'pin', label: 'Pin', key: '7', hint: 'Click to drop a numbered pin' },
];

export const COLOUR_NAMES = MARKUP_COLOUR_NAMES;

export const COLOURS = Object.keys(MARKUP_COLOURS) as MarkupColour[];

export const KIND_LABELS: Record<string, string> = MARKUP_KIND_LABELS;

export function markupName(m: { kind: string; number: number | null; pageNumber: number }): string {
  const name = m.kind === 'pin' && m.number != null ? `Pin ${m.number}` : (KIND_LABELS[m.kind] ?? m.kind);
  return `${name}, page ${m.pageNumber}`;
}

export const ZOOM_STEPS = [0.5, 0.75, 1, 1.25, 1.5, 2, 3, 4] as const;

export function nextZoom(current: number, direction: 1 | -1): number {
  if (direction === 1)
    return ZOOM_STEPS.find((z) => z > current + 0.001) ?? ZOOM_STEPS[ZOOM_STEPS.length - 1];
  return [...ZOOM_STEPS].reverse().find((z) => z < current - 0.001) ?? ZOOM_STEPS[0];
}
