// The crane seen from the side in the plane of the boom, drawn to scale from the inputs:
// supports and carrier, the tipping line, the boom at its angle, the load at the radius,
// the counterweight, and the two moment arms about the tipping line. The figure is computed
// in shared/drawing (side-view-figure.ts, the screen layout) and the calculation sheet draws
// the same one; here it is only painted. Fills are hatches and outlines rather than colours,
// so the drawing reads in greyscale.
import type { LiftResult, UnitSystem } from '@shared/engineering/types';
import { sideViewFigure, type SideViewRole } from '@shared/drawing/side-view-figure';
import { SCREEN_SIDE_VIEW, SCREEN_SIDE_VIEW_SIZE } from '@shared/drawing/side-view-layouts';
import { SceneSvg } from './scene-svg';

const COLOURS: Record<SideViewRole, string> = {
  ink: '#16191c',
  paper: '#fff',
  grid: '#eeebe3',
  ground: '#8f8a7e',
  body: '#f4f2ed',
  tipping: '#9b1c1c',
  tippingMark: '#9b1c1c',
  label: 'currentColor',
  axis: 'currentColor',
};

export function CraneSideView({
  inputs,
  result,
  system,
}: {
  inputs: unknown;
  result: LiftResult;
  system: UnitSystem;
}) {
  const figure = sideViewFigure(inputs, result, system, SCREEN_SIDE_VIEW, SCREEN_SIDE_VIEW_SIZE);
  if (!figure) {
    return (
      <p className="text-[13px] text-ink-soft">
        The side view is drawn for mobile cranes with outriggers or tracks, a boom length and a radius.
      </p>
    );
  }
  return (
    <figure className="flex flex-col gap-1">
      <SceneSvg scene={figure} colours={COLOURS} label={figure.summary} />
      <figcaption className="text-[12px] text-ink-soft">{figure.caption}</figcaption>
    </figure>
  );
}
