// Sections 4 to 6 of the calculation sheet and its closing note: why the lift is critical, the
// fixes the check suggests, and the side view of each crane to scale.
import { sourceText } from '@shared/engineering/sources';
import type { LiftResult, UnitSystem } from '@shared/engineering/types';
import { craneSideViews } from '@shared/drawing/side-view';
import { SHORT_CAUTION } from '@shared/vocabulary/cautions';
import { drawSideView, SIDE_VIEW_HEIGHT, sideViewUnavailableReason } from '../draw-side-view';
import type { StampInput } from '../stamp-input';
import { INK_SOFT, RULE } from '../text-pdf';
import { currentInputs } from './cranes-section';
import { LEFT, RIGHT, WIDTH, type Flow } from './layout';

export { SIDE_VIEW_HEIGHT };

export function criticalSection(flow: Flow, result: LiftResult | null, units: UnitSystem) {
  if (!result) flow.para('No result.');
  else if (result.critical.triggers.length === 0) flow.para('No critical-lift trigger applies.');
  else
    for (const t of result.critical.triggers) {
      flow.para(`• ${t.reason}`, { font: flow.fonts.bold, gap: 0 });
      flow.para(sourceText(t.source, units), { size: 7.3, color: INK_SOFT, indent: 9 });
    }
}

export function fixesSection(flow: Flow, result: LiftResult | null) {
  if (!result || result.fixes.length === 0) flow.para('None: no failed capacity or stability check to fix.');
  else for (const f of result.fixes) flow.para(`• ${f.text}`);
}

/** One side view per crane (shared/drawing/side-view.ts craneSideViews); one crane draws untitled. */
export function sideViewSection(flow: Flow, input: StampInput) {
  const { result, units, inputs } = input.calculation;
  if (!result) {
    flow.para('No result to draw from.');
    return;
  }
  const views = craneSideViews(result, currentInputs(inputs));
  for (const view of views) {
    const reason = sideViewUnavailableReason(view.inputs, view.result);
    // the title stays on the page of its drawing
    if (views.length > 1) {
      if (!reason) flow.need(SIDE_VIEW_HEIGHT + 30);
      flow.subheading(view.title);
    }
    if (reason) flow.para(reason);
    else {
      flow.need(SIDE_VIEW_HEIGHT + 4);
      drawSideView(
        flow.page,
        flow.fonts,
        { x: LEFT, y: flow.y - SIDE_VIEW_HEIGHT, width: WIDTH, height: SIDE_VIEW_HEIGHT },
        view.inputs,
        view.result,
        units,
      );
      flow.y -= SIDE_VIEW_HEIGHT + 6;
    }
  }
}

export function closingNote(flow: Flow, result: LiftResult | null) {
  flow.need(24);
  flow.y -= 8;
  flow.page.drawLine({
    start: { x: LEFT, y: flow.y },
    end: { x: RIGHT, y: flow.y },
    thickness: 0.4,
    color: RULE,
  });
  flow.para(
    `${result ? `Engine ${result.engineVersion}, result version ${result.resultVersion}. ` : ''}Values recomputed in SI and shown to three significant figures; inputs as entered, in the document's unit system. ${SHORT_CAUTION}`,
    { size: 7, color: INK_SOFT },
  );
}
