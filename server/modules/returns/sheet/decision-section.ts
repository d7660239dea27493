// The top of the calculation sheet's first page: the decision first (who, when, conditions),
// the caution, and a one-line summary of the independent check.
import { DECISION_LABELS } from '@shared/schemas/common';
import type { LiftResult, UnitSystem } from '@shared/engineering/types';
import { CAUTIONS, SHORT_CAUTION } from '@shared/vocabulary/cautions';
import { CHECK_STATUS_WORDS } from '@shared/vocabulary/check-statuses';
import { DECISION_SHAPES } from '../draw-stamp-block';
import { tradeDateTime } from '@shared/vocabulary/dates';
import { UNIT_SYSTEM_WORDS } from '@shared/vocabulary/units';
import type { StampInput } from '../stamp-input';
import {
  drawStatusShape,
  fitText,
  GRAPHITE,
  INK,
  INK_SOFT,
  PAPER_ALT,
  RULE_STRONG,
  widthOf,
  wrapText,
} from '../text-pdf';
import { BOTTOM, LEFT, RIGHT, TOP, WIDTH, type Flow } from './layout';

/** The labelled blocks under the decision: conditions, then any override and what it overrode. */
function decisionBlocks(input: StampInput, flow: Flow): { label: string; lines: string[] }[] {
  const { stamp } = input;
  const wrap = (text: string) => wrapText(text, flow.fonts.regular, 8.5, WIDTH - 120);
  const blocks = [{ label: 'Conditions', lines: wrap(stamp.conditions.trim() || 'None.') }];
  const reason = stamp.overrideReason?.trim();
  if (reason) {
    blocks.push({ label: 'Override', lines: wrap(reason) });
    const items = stamp.overridden ?? [];
    if (items.length) blocks.push({ label: 'Overridden', lines: items.flatMap((item) => wrap(`• ${item}`)) });
  }
  return blocks;
}

export function decisionPanel(flow: Flow, input: StampInput) {
  const { stamp } = input;
  const { fonts } = flow;
  const blocks = decisionBlocks(input, flow);
  const lineCount = blocks.reduce((n, b) => n + b.lines.length, 0);
  const h = 96 + lineCount * 11.5 + (blocks.length - 1) * 16;
  flow.need(Math.min(h, TOP - BOTTOM));
  const top = flow.y;
  const firstPart = Math.min(h, top - BOTTOM);
  flow.page.drawRectangle({
    x: LEFT,
    y: top - firstPart,
    width: WIDTH,
    height: firstPart,
    borderColor: INK,
    borderWidth: 1.2,
  });
  flow.page.drawRectangle({ x: LEFT, y: top - firstPart, width: 6, height: firstPart, color: GRAPHITE });
  const x = LEFT + 18;
  flow.text('DECISION', x, top - 15, 7, fonts.black, INK_SOFT);
  drawStatusShape(flow.page, DECISION_SHAPES[stamp.decision], x, top - 42, 20);
  flow.text(DECISION_LABELS[stamp.decision], x + 27, top - 40, 22, fonts.black);
  const whoX = LEFT + WIDTH / 2 + 20;
  const who: [string, string][] = [
    ['Engineer of record', stamp.engineer],
    ['Reviewer', stamp.reviewer],
    ['Decided', `${tradeDateTime(stamp.decidedAt, stamp.timeZone)}`],
    ['Issued', `${tradeDateTime(stamp.issuedAt, stamp.timeZone)} (${stamp.timeZone})`],
  ];
  who.forEach(([k, v], i) => {
    flow.text(k, whoX, top - 16 - i * 11, 7.5, fonts.regular, INK_SOFT);
    flow.text(fitText(v, fonts.bold, 8, RIGHT - whoX - 92), whoX + 84, top - 16 - i * 11, 8, fonts.bold);
  });
  const line2 = `Site ${stamp.site} · Contractor ${stamp.contractor} · Verification code ${stamp.verificationCode}`;
  flow.text(fitText(line2, fonts.regular, 7.5, WIDTH - 30), x, top - 64, 7.5, fonts.regular, INK);
  flow.text(
    fitText(`Verify at ${stamp.verificationUrl}`, fonts.regular, 7.5, WIDTH - 30),
    x,
    top - 75,
    7.5,
    fonts.regular,
    INK_SOFT,
  );
  flow.y = top - 92 + 11.5 - 2;
  const firstPage = flow.page;
  blocks.forEach((block, b) => {
    if (b > 0) flow.y -= 16;
    if (flow.y - 11.5 < BOTTOM) flow.newPage();
    flow.text(block.label, x, flow.y - 11.5 + 2, 8.5, fonts.black);
    for (const line of block.lines) {
      if (flow.y - 11.5 < BOTTOM) flow.newPage();
      flow.y -= 11.5;
      flow.text(line, x + 72, flow.y + 2, 8.5, fonts.regular);
    }
  });
  // Text that ran onto another page goes on from its last line there.
  flow.y = flow.page === firstPage ? Math.min(flow.y - 12, top - h) : flow.y - 12;
}

export function cautionPanel(flow: Flow, result: LiftResult | null) {
  const { fonts } = flow;
  const texts = result?.cautions?.length ? result.cautions : CAUTIONS;
  const lines = texts.flatMap((t) => wrapText(t, fonts.regular, 7.8, WIDTH - 44));
  const h = 26 + lines.length * 10;
  flow.need(h + 8);
  const top = flow.y - 4;
  flow.page.drawRectangle({
    x: LEFT,
    y: top - h,
    width: WIDTH,
    height: h,
    color: PAPER_ALT,
    borderColor: RULE_STRONG,
    borderWidth: 0.8,
  });
  drawStatusShape(flow.page, 'caution', LEFT + 9, top - 19, 13);
  flow.text(fitText(SHORT_CAUTION, fonts.bold, 8.4, WIDTH - 40), LEFT + 30, top - 15, 8.4, fonts.bold);
  lines.forEach((l, i) => flow.text(l, LEFT + 30, top - 28 - i * 10, 7.8, fonts.regular, INK_SOFT));
  flow.y = top - h - 6;
}

export function summaryLine(flow: Flow, result: LiftResult, units: UnitSystem) {
  const { fonts } = flow;
  flow.need(30);
  const y = flow.y - 18;
  drawStatusShape(flow.page, result.overallStatus, LEFT, y - 2, 13);
  const head = `Independent check: ${CHECK_STATUS_WORDS[result.overallStatus]}`;
  flow.text(head, LEFT + 18, y, 11, fonts.black);
  const critical = result.critical.isCritical
    ? `Critical lift — ${result.critical.triggers.length} trigger${result.critical.triggers.length === 1 ? '' : 's'} apply`
    : 'Not a critical lift by the triggers checked';
  const worst = result.checks.filter((c) => c.status === 'fail').length;
  const caution = result.checks.filter((c) => c.status === 'caution').length;
  const differ = result.discrepancies.filter((d) => d.status === 'discrepancy').length;
  const rest = `${worst} failed, ${caution} with caution, of ${result.checks.length} checks · ${differ} contractor figure${differ === 1 ? '' : 's'} outside the tolerance · ${critical} · figures in ${UNIT_SYSTEM_WORDS[units]} units`;
  const hx = LEFT + 18 + widthOf(head, fonts.black, 11) + 12;
  const lines = wrapText(rest, fonts.regular, 8, RIGHT - hx);
  lines.forEach((l, i) => flow.text(l, hx, y + 1 - i * 10, 8, fonts.regular, INK_SOFT));
  flow.y = y - 8 - Math.max(0, lines.length - 1) * 10;
}
