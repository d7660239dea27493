// Widths of bold Lato text in points, for laying out text markups and labels exactly as the
// stamped return does (shared/drawing/text-layout.ts): the browser's canvas measures with the
// same face the workspace shows. Where no canvas can measure (the tests' jsdom), an average
// Lato bold advance stands in.
let context: CanvasRenderingContext2D | null | undefined;

function canvasContext(): CanvasRenderingContext2D | null {
  if (context !== undefined) return context;
  context = null;
  if (typeof document !== 'undefined' && !/jsdom/i.test(navigator.userAgent)) {
    try {
      context = document.createElement('canvas').getContext('2d');
    } catch {
      context = null;
    }
  }
  return context;
}

/** Average advance of Lato bold, in ems: a stand-in only. */
const AVERAGE_ADVANCE = 0.55;

export function measureBold(text: string, size: number): number {
  const ctx = canvasContext();
  if (!ctx) return [...text].length * size * AVERAGE_ADVANCE;
  ctx.font = `700 ${size}px Lato, ui-sans-serif, system-ui, sans-serif`;
  return ctx.measureText(text).width;
}
