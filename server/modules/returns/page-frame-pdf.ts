// The page as a person sees it. Everything the return adds to an original page (markups,
// the stamp block, the footer) is drawn in a "display frame": origin at the lower-left of
// the visible page (the CropBox, falling back to the MediaBox), x to the right and y up as
// the page is shown, after its /Rotate. One transformation matrix maps that frame to the
// page's user space, so a page whose box does not start at 0,0 or that is rotated gets its
// additions in the right place and upright.
import {
  concatTransformationMatrix,
  popGraphicsState,
  PDFContentStream,
  pushGraphicsState,
  type PDFPage,
} from 'pdf-lib';

export interface PageFrame {
  /** The visible box in user space. */
  box: { x: number; y: number; width: number; height: number };
  /** /Rotate normalised to 0, 90, 180 or 270 (clockwise, as displayed). */
  rotation: 0 | 90 | 180 | 270;
  /** Size of the page as displayed. */
  width: number;
  height: number;
}

export function frameOf(page: PDFPage): PageFrame {
  const box = page.getCropBox();
  const r = ((Math.round(page.getRotation().angle / 90) * 90) % 360) + 360;
  const rotation = (r % 360) as 0 | 90 | 180 | 270;
  const turned = rotation === 90 || rotation === 270;
  return {
    box,
    rotation,
    width: turned ? box.height : box.width,
    height: turned ? box.width : box.height,
  };
}

/** The matrix [a b c d e f] taking display-frame points to user space. */
export function displayToUser(f: PageFrame): [number, number, number, number, number, number] {
  const { x, y, width: w, height: h } = f.box;
  switch (f.rotation) {
    case 0:
      return [1, 0, 0, 1, x, y];
    case 90:
      return [0, 1, -1, 0, x + w, y];
    case 180:
      return [-1, 0, 0, -1, x + w, y + h];
    case 270:
      return [0, -1, 1, 0, x, y + h];
  }
}

/**
 * Markup geometry is stored in the page's unrotated space relative to the lower-left corner
 * of the visible box (what the viewer reports). This gives the same point in the display frame.
 */
export function markupToDisplay(f: PageFrame, px: number, py: number): [number, number] {
  const { width: w, height: h } = f.box;
  switch (f.rotation) {
    case 0:
      return [px, py];
    case 90:
      return [py, w - px];
    case 180:
      return [w - px, h - py];
    case 270:
      return [h - py, px];
  }
}

/**
 * Wrap the page's existing content in q … Q so a graphics state the original leaves behind
 * (a scale, a clip) cannot leak into what we draw after it. Only the copy in the output
 * document is touched.
 */
export function isolateOriginalContent(page: PDFPage) {
  const ctx = page.doc.context;
  const start = ctx.register(PDFContentStream.of(ctx.obj({}), [pushGraphicsState()]));
  const end = ctx.register(PDFContentStream.of(ctx.obj({}), [popGraphicsState()]));
  page.node.wrapContentStreams(start, end);
}

/** Run `draw` with the display frame as the coordinate system. */
export function inDisplayFrame(page: PDFPage, f: PageFrame, draw: () => void) {
  const [a, b, c, d, e, g] = displayToUser(f);
  page.pushOperators(pushGraphicsState(), concatTransformationMatrix(a, b, c, d, e, g));
  draw();
  page.pushOperators(popGraphicsState());
}
