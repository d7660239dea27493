// How a text markup and a markup's label are laid out, the same in the review workspace (SVG,
// measured with the browser's Lato) and in the stamped return (pdf-lib, measured with the
// embedded Lato): lines wrapped to a width (a word wider than the line breaks by character),
// and the block moved so that it stays on the page. Coordinates are the page's display frame
// (points, origin at the lower-left of the page as shown, y up); `measure` gives a string's
// width in points at the size asked.

export type Measure = (text: string, size: number) => number;

/** A text markup's box width, the margin every layout keeps from the page's edges, line height. */
export const TEXT_BOX_WIDTH = 220;
export const PAGE_MARGIN = 6;
export const LINE_HEIGHT = 1.2;
/** Labels of shapes and pins: bold 8 pt, wrapped to 180 pt, three lines at most. */
export const LABEL = { size: 8, width: 180, maxLines: 3 } as const;

/** Break `text` into lines no wider than `width`; paragraphs stay, a long word breaks by character. */
export function wrapLines(text: string, width: number, size: number, measure: Measure): string[] {
  const lines: string[] = [];
  for (const para of text.split('\n')) {
    const words = para.split(/ +/).filter((w) => w.length > 0);
    if (words.length === 0) {
      lines.push('');
      continue;
    }
    let line = '';
    for (const whole of words) {
      const candidate = line ? `${line} ${whole}` : whole;
      if (measure(candidate, size) <= width) {
        line = candidate;
        continue;
      }
      if (line) lines.push(line);
      let word = [...whole];
      while (word.length > 1 && measure(word.join(''), size) > width) {
        let cut = word.length - 1;
        while (cut > 1 && measure(word.slice(0, cut).join(''), size) > width) cut--;
        lines.push(word.slice(0, cut).join(''));
        word = word.slice(cut);
      }
      line = word.join('');
    }
    lines.push(line);
  }
  return lines;
}

export interface PageSize {
  width: number;
  height: number;
}

export interface TextBlock {
  lines: string[];
  size: number;
  /** Left edge and first baseline, display frame. */
  x: number;
  y: number;
  lineHeight: number;
  /** Width of the widest line. */
  width: number;
}

/**
 * A text markup stored at (x, y) (its first baseline) with `fontSize`: wrapped to its box (the
 * stored width, else TEXT_BOX_WIDTH, never wider than the page allows), moved left or down so it
 * stays on the page, and made smaller only when the whole page cannot hold it.
 */
export function layoutTextBox(
  at: { x: number; y: number; fontSize: number; width?: number },
  text: string,
  page: PageSize,
  measure: Measure,
): TextBlock {
  let size = Math.min(72, Math.max(4, at.fontSize));
  const room = Math.max(20, page.width - 2 * PAGE_MARGIN);
  const boxWidth = Math.min(at.width ?? TEXT_BOX_WIDTH, room);
  let lines = wrapLines(text, boxWidth, size, measure);
  while (size > 4 && lines.length * size * LINE_HEIGHT > page.height - 2 * PAGE_MARGIN) {
    size = Math.max(4, size - 1);
    lines = wrapLines(text, boxWidth, size, measure);
  }
  const width = Math.max(0, ...lines.map((l) => measure(l, size)));
  const lineHeight = size * LINE_HEIGHT;
  const x = Math.max(PAGE_MARGIN, Math.min(at.x, page.width - PAGE_MARGIN - width));
  // The first baseline sits at the stored point; the last line's descent stays above the margin.
  const top = Math.min(at.y, page.height - PAGE_MARGIN - size);
  const y = Math.max(top, PAGE_MARGIN + size * 0.25 + (lines.length - 1) * lineHeight);
  return { lines, size, x, y, lineHeight, width };
}

/**
 * A label whose first baseline would be at `at`: wrapped to LABEL.width in three lines at most
 * (the third ending "…" when cut), then moved so that its whole block, backing included, lies on
 * the page — left of the right edge, right of the left, below the top and above the bottom. A
 * shape's label that has no room above the shape goes below it (`below`).
 */
export function layoutLabel(
  text: string,
  at: { x: number; y: number },
  page: PageSize,
  measure: Measure,
  /** Where the first baseline goes instead when `at` is too near the top (below a shape, say). */
  below?: number,
): TextBlock {
  const size = LABEL.size;
  const all = wrapLines(text, LABEL.width, size, measure);
  const lines = all.slice(0, LABEL.maxLines);
  if (all.length > LABEL.maxLines) {
    let last = lines[LABEL.maxLines - 1];
    while (last.length > 0 && measure(`${last}…`, size) > LABEL.width) last = last.slice(0, -1);
    lines[LABEL.maxLines - 1] = `${last.trimEnd()}…`;
  }
  const width = Math.max(0, ...lines.map((l) => measure(l, size)));
  const lineHeight = size * LINE_HEIGHT;
  const x = Math.max(PAGE_MARGIN, Math.min(at.x, page.width - PAGE_MARGIN - width));
  const wanted = below !== undefined && at.y > page.height - PAGE_MARGIN - size ? below : at.y;
  const y = Math.max(
    PAGE_MARGIN + 2.5 + (lines.length - 1) * lineHeight,
    Math.min(wanted, page.height - PAGE_MARGIN - size),
  );
  return { lines, size, x, y, lineHeight, width };
}
