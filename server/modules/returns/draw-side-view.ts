// The crane seen from the side for the calculation sheet: the figure shared/drawing computes at
// the paper layout (side-view-figure.ts), painted with pdf-lib. Greys, hatching and dashes only,
// so it prints in greyscale. Mobile cranes only: a gantry's frame and backstay are described in
// words (sideViewUnavailableReason).
import { rgb, type Color, type PDFPage } from 'pdf-lib';
import type { LiftResult, UnitSystem } from '@shared/engineering/types';
import { sideViewUnavailableReason } from '@shared/drawing/side-view';
import { sideViewFigure, type SideViewRole } from '@shared/drawing/side-view-figure';
import { PAPER_SIDE_VIEW } from '@shared/drawing/side-view-layouts';
import { paintScene, pdfMetrics } from './draw-scene';
import { INK, INK_SOFT, RULE, WHITE, type Fonts } from './text-pdf';

export const SIDE_VIEW_HEIGHT = 430;

export { sideViewUnavailableReason };

const COLOURS: Record<SideViewRole, Color> = {
  ink: INK,
  paper: WHITE,
  grid: rgb(0.93, 0.92, 0.89),
  ground: RULE,
  body: rgb(0.957, 0.949, 0.929),
  tipping: rgb(0.25, 0.25, 0.25),
  tippingMark: INK,
  label: INK,
  axis: INK_SOFT,
};

/** Draw the side view into `box` (page coordinates, y up). Check sideViewUnavailableReason first. */
export function drawSideView(
  page: PDFPage,
  fonts: Fonts,
  box: { x: number; y: number; width: number; height: number },
  inputs: unknown,
  result: LiftResult,
  system: UnitSystem,
) {
  const figure = sideViewFigure(inputs, result, system, PAPER_SIDE_VIEW, box, pdfMetrics(fonts));
  if (figure) paintScene(page, fonts, box, figure, COLOURS);
}
