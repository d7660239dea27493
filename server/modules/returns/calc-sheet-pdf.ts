// The calculation sheet appended to the stamped return: A4 pages in Lato for people on paper
// who were not in the review. The decision first, the caution on the first page, then the
// inputs as submitted, every check (value, limit, status word and shape, source, formula in
// words), the discrepancies and how they were resolved, the findings, the critical-lift
// triggers, the fixes, and the crane's side view. Text flows onto as many pages as it needs;
// the header's "page n of m" is drawn by the caller once the total is known.
import { PageSizes, type Color, type PDFDocument, type PDFFont, type PDFPage } from 'pdf-lib';
import { DECISION_LABELS } from '@shared/schemas/common';
import { formatFormula, formatQuantity } from '@shared/engineering/format';
import type { CheckItem, CheckStatus, LiftResult, UnitSystem } from '@shared/engineering/types';
import { drawSideView, SIDE_VIEW_HEIGHT, sideViewUnavailableReason } from './draw-side-view';
import { DECISION_SHAPES, SHORT_CAUTION } from './draw-stamp-block';
import type { StampInput } from './stamp-input';
import {
  drawStatusShape,
  fitText,
  GRAPHITE,
  INK,
  INK_SOFT,
  PAPER_ALT,
  RULE,
  RULE_STRONG,
  STATUS_WORDS,
  tradeDate,
  tradeDateTime,
  widthOf,
  WHITE,
  wrapText,
  type Fonts,
  type StatusKey,
} from './text-pdf';

const [PAGE_W, PAGE_H] = PageSizes.A4;
const LEFT = 44;
const RIGHT = PAGE_W - 44;
const WIDTH = RIGHT - LEFT;
const TOP = PAGE_H - 74;
const BOTTOM = 40;

const ENGINE_CAUTIONS = [
  "This check recomputes the arithmetic and consistency of the lift plan. It does not replace the crane manufacturer's load chart and operating instructions.",
  'It does not replace a qualified lift director or rigging supervisor, or the judgement of the engineer of record.',
  'Local codes and regulations, the site rules and the current editions of the standards named here govern where they differ.',
];

/** A flow of content down A4 pages. */
class Flow {
  page!: PDFPage;
  y = TOP;
  readonly pages: PDFPage[] = [];
  /** Called after a page break inside a table, to repeat its header. */
  onBreak: (() => void) | null = null;

  constructor(
    readonly doc: PDFDocument,
    readonly fonts: Fonts,
  ) {
    this.newPage();
  }

  newPage() {
    this.page = this.doc.addPage([PAGE_W, PAGE_H]);
    this.pages.push(this.page);
    this.y = TOP;
  }

  /** Make room for `h` points; a new page when they do not fit. */
  need(h: number) {
    if (this.y - h < BOTTOM) {
      this.newPage();
      this.onBreak?.();
    }
  }

  text(t: string, x: number, y: number, size: number, font: PDFFont, color: Color = INK) {
    this.page.drawText(t, { x, y, size, font, color });
  }

  /** A wrapped paragraph at the cursor. */
  para(
    t: string,
    opts: { size?: number; font?: PDFFont; color?: Color; indent?: number; gap?: number } = {},
  ) {
    const size = opts.size ?? 8.5;
    const font = opts.font ?? this.fonts.regular;
    const indent = opts.indent ?? 0;
    const lh = size * 1.35;
    for (const line of wrapText(t, font, size, WIDTH - indent)) {
      this.need(lh);
      this.y -= lh;
      this.text(line, LEFT + indent, this.y + size * 0.28, size, font, opts.color ?? INK);
    }
    this.y -= opts.gap ?? 4;
  }

  /** A section heading: a short heavy bar, the title, and a hairline; kept with what follows. */
  heading(title: string, keep = 60) {
    this.need(30 + keep);
    this.y -= 14;
    this.page.drawRectangle({ x: LEFT, y: this.y, width: 22, height: 2.6, color: GRAPHITE });
    this.y -= 13;
    this.text(title, LEFT, this.y, 11.5, this.fonts.black);
    this.y -= 5;
    this.page.drawLine({
      start: { x: LEFT, y: this.y },
      end: { x: RIGHT, y: this.y },
      thickness: 0.6,
      color: RULE_STRONG,
    });
    this.y -= 4;
  }

  subheading(title: string) {
    this.need(26);
    this.y -= 13;
    this.text(title.toUpperCase(), LEFT, this.y, 7.5, this.fonts.black, INK_SOFT);
    this.y -= 4;
  }
}

// ---------- tables ----------

interface Col {
  title: string;
  width: number;
}
interface Cell {
  text: string;
  bold?: boolean;
  status?: StatusKey;
  soft?: boolean;
}
interface Row {
  cells: Cell[];
  /** A line under the cells from `from` column to the right edge (e.g. the formula). */
  note?: { text: string; from: number };
  indent?: number;
  shade?: boolean;
}

const CELL_PAD = 3;
const T_SIZE = 7.6;
const T_LH = T_SIZE * 1.3;
const NOTE_SIZE = 7;
const NOTE_LH = NOTE_SIZE * 1.3;

function table(flow: Flow, cols: Col[], rows: Row[]) {
  const { fonts } = flow;
  const drawHeader = () => {
    flow.need(16);
    flow.page.drawRectangle({ x: LEFT, y: flow.y - 13, width: WIDTH, height: 13, color: GRAPHITE });
    let x = LEFT;
    for (const c of cols) {
      flow.text(
        fitText(c.title, fonts.bold, 7, c.width - 2 * CELL_PAD),
        x + CELL_PAD,
        flow.y - 9.3,
        7,
        fonts.bold,
        WHITE,
      );
      x += c.width;
    }
    flow.y -= 13;
  };
  drawHeader();
  flow.onBreak = drawHeader;
  for (const row of rows) {
    const wrapped = row.cells.map((cell, i) => {
      const font = cell.bold ? fonts.bold : fonts.regular;
      const inset = (cell.status ? 12 : 0) + (i === 0 ? (row.indent ?? 0) : 0);
      return wrapText(cell.text, font, T_SIZE, cols[i].width - 2 * CELL_PAD - inset);
    });
    let noteLines: string[] = [];
    let noteX = LEFT;
    if (row.note && row.note.text) {
      noteX = LEFT + cols.slice(0, row.note.from).reduce((a, c) => a + c.width, 0);
      noteLines = wrapText(row.note.text, fonts.regular, NOTE_SIZE, RIGHT - noteX - 2 * CELL_PAD);
    }
    const cellH = Math.max(1, ...wrapped.map((l) => l.length)) * T_LH;
    const h = cellH + noteLines.length * NOTE_LH + 2 * CELL_PAD + (noteLines.length ? 1 : 0);
    flow.need(Math.min(h, TOP - BOTTOM - 20));
    if (row.shade)
      flow.page.drawRectangle({ x: LEFT, y: flow.y - h, width: WIDTH, height: h, color: PAPER_ALT });
    let x = LEFT;
    row.cells.forEach((cell, i) => {
      const font = cell.bold ? fonts.bold : fonts.regular;
      let cx = x + CELL_PAD + (i === 0 ? (row.indent ?? 0) : 0);
      if (cell.status) {
        drawStatusShape(flow.page, cell.status, cx, flow.y - CELL_PAD - T_LH + 0.8, 9);
        cx += 12;
      }
      wrapped[i].forEach((line, j) =>
        flow.text(
          line,
          cx,
          flow.y - CELL_PAD - (j + 1) * T_LH + 2.4,
          T_SIZE,
          font,
          cell.soft ? INK_SOFT : INK,
        ),
      );
      x += cols[i].width;
    });
    noteLines.forEach((line, j) =>
      flow.text(
        line,
        noteX + CELL_PAD,
        flow.y - CELL_PAD - cellH - (j + 1) * NOTE_LH + 2.6,
        NOTE_SIZE,
        fonts.regular,
        INK_SOFT,
      ),
    );
    flow.y -= h;
    flow.page.drawLine({
      start: { x: LEFT, y: flow.y },
      end: { x: RIGHT, y: flow.y },
      thickness: 0.4,
      color: RULE,
    });
  }
  flow.onBreak = null;
  flow.y -= 6;
}

/** Label/value pairs, two pairs to a line. */
function pairs(flow: Flow, items: [string, string][]) {
  const { fonts } = flow;
  const half = WIDTH / 2;
  const labelW = 88;
  const size = 7.8;
  const lh = size * 1.32;
  for (let i = 0; i < items.length; i += 2) {
    const line = items.slice(i, i + 2).map(([k, v]) => ({
      k: wrapText(k, fonts.regular, size, labelW - 6),
      v: wrapText(v, fonts.bold, size, half - labelW - 8),
    }));
    const n = Math.max(...line.map((p) => Math.max(p.k.length, p.v.length)));
    flow.need(n * lh + 3);
    line.forEach((p, j) => {
      const x = LEFT + j * half;
      p.k.forEach((t, r) => flow.text(t, x, flow.y - (r + 1) * lh + 2, size, fonts.regular, INK_SOFT));
      p.v.forEach((t, r) => flow.text(t, x + labelW, flow.y - (r + 1) * lh + 2, size, fonts.bold));
    });
    flow.y -= n * lh + 3;
  }
  flow.y -= 2;
}

// ---------- reading the raw inputs ----------

type Obj = Record<string, unknown>;
const obj = (v: unknown): Obj | null => (v && typeof v === 'object' && !Array.isArray(v) ? (v as Obj) : null);
const arr = (v: unknown): unknown[] => (Array.isArray(v) ? v : []);
const str = (v: unknown): string | null => (typeof v === 'string' && v.trim() ? v : null);

const UNIT_LABELS: Record<string, string> = {
  m2: 'm²',
  ft2: 'ft²',
  deg: '°',
  N_m: 'N·m',
  kN_m: 'kN·m',
  lb_ft: 'lb·ft',
  kip_ft: 'kip·ft',
  ton_us: 'US ton',
  knot: 'knots',
};

/** A quantity as entered: its own number and unit, no rounding. */
export function asEntered(q: unknown): string | null {
  const o = obj(q);
  if (!o || typeof o.value !== 'number' || !Number.isFinite(o.value)) return null;
  const unit = typeof o.unit === 'string' ? (UNIT_LABELS[o.unit] ?? o.unit.replace(/_/g, '·')) : '';
  const n = Math.abs(o.value) >= 10000 ? o.value.toLocaleString('en-GB') : String(o.value);
  return unit === '°' ? `${n}°` : `${n} ${unit}`.trim();
}

function add(list: [string, string][], label: string, value: string | null | undefined) {
  if (value) list.push([label, value]);
}

const CRANE_TYPES: Record<string, string> = {
  mobile_outriggers: 'Mobile crane on outriggers',
  mobile_crawler: 'Crawler crane',
  gantry_a_frame: 'Gantry / A-frame',
};

function weightAt(o: unknown, armKey: string, armWords: string): string | null {
  const w = asEntered(obj(o)?.weight);
  if (!w) return null;
  const arm = asEntered(obj(o)?.[armKey]);
  return arm ? `${w}, centre of gravity ${arm} ${armWords}` : w;
}

function inputsSection(flow: Flow, inputs: Obj, result: LiftResult | null) {
  const crane = obj(inputs.crane) ?? {};
  const c: [string, string][] = [];
  add(c, 'Crane', str(crane.name));
  add(c, 'Type', CRANE_TYPES[String(crane.type)] ?? str(crane.type));
  add(c, 'Boom length', asEntered(crane.boomLength));
  add(c, 'Boom angle', asEntered(crane.boomAngle));
  add(c, 'Radius', asEntered(crane.radius));
  add(c, 'Boom foot pivot offset', asEntered(crane.pivotOffset));
  add(c, 'Boom foot pivot height', asEntered(crane.pivotHeight));
  add(
    c,
    'Slew angle',
    asEntered(crane.slewAngle) ?? (crane.type !== 'gantry_a_frame' ? 'least favourable' : null),
  );
  add(c, 'Upper works', weightAt(crane.upperWorks, 'cgBehindRotation', 'behind rotation'));
  add(c, 'Counterweight', weightAt(crane.counterweight, 'cgBehindRotation', 'behind rotation'));
  add(c, 'Carrier / carbody', weightAt(crane.carrier, 'cgRearOfRotation', 'rear of rotation'));
  add(c, 'Boom', weightAt(crane.boom, 'cgFromFoot', 'from the foot'));
  const out = obj(crane.outriggers);
  if (out) {
    add(
      c,
      'Outrigger spread',
      `${asEntered(out.longitudinalSpread)} long × ${asEntered(out.transverseSpread)} across`,
    );
    add(
      c,
      'Outrigger box centre',
      asEntered(out.boxCentreRearOfRotation) && `${asEntered(out.boxCentreRearOfRotation)} rear of rotation`,
    );
  }
  const tr = obj(crane.tracks);
  if (tr) {
    add(
      c,
      'Tracks',
      `${asEntered(tr.length)} long, shoes ${asEntered(tr.shoeWidth)}, gauge ${asEntered(tr.gauge)}`,
    );
    add(
      c,
      'Track centre',
      asEntered(tr.centreRearOfRotation) && `${asEntered(tr.centreRearOfRotation)} rear of rotation`,
    );
  }
  const g = obj(crane.gantry);
  if (g) {
    add(c, 'Legs', `${asEntered(g.legLength)} at ${asEntered(g.legInclination)} from vertical`);
    add(c, 'Leg spread', asEntered(g.legSpread));
    add(c, 'Frame weight', asEntered(g.frameWeight));
    add(
      c,
      'Backstay anchor',
      asEntered(g.backstayAnchorDistance) && `${asEntered(g.backstayAnchorDistance)} behind the feet`,
    );
    add(c, 'Ballast', asEntered(g.ballastWeight));
    add(c, 'Backstay rated load', asEntered(g.backstayRatedLoad));
    add(c, 'Leg rated compression', asEntered(g.legRatedCompression));
  }
  flow.subheading('Crane');
  pairs(flow, c);

  // Chart rows used: the configuration's rows, the one the check used marked.
  const chart = obj(inputs.chart) ?? {};
  const rows = arr(chart.rows)
    .map(obj)
    .filter((r): r is Obj => r !== null);
  flow.subheading(`Load chart${str(chart.name) ? ` — ${str(chart.name)}` : ''}`);
  const used = result?.figures.chartCapacity ?? null;
  const bl = asEntered(crane.boomLength);
  let shown = rows.filter((r) => !bl || asEntered(r.boomLength) === bl);
  if (shown.length === 0) shown = rows;
  const omitted = Math.max(0, shown.length - 24);
  shown = shown.slice(0, 24);
  const usedNote = result?.checks
    .find((ch) => ch.id === 'capacity')
    ?.items.find((i) => i.label.toLowerCase().includes('chart'));
  table(
    flow,
    [
      { title: 'Radius', width: 110 },
      { title: 'Boom length', width: 110 },
      { title: 'Capacity', width: 110 },
      { title: 'Interpolation', width: 80 },
      { title: '', width: WIDTH - 410 },
    ],
    shown.map((r) => {
      const cap = obj(r.capacity);
      const isUsed =
        used !== null && cap !== null && Math.abs(siOf(cap) - used) <= Math.max(1, Math.abs(used) * 1e-3);
      return {
        cells: [
          { text: asEntered(r.radius) ?? '—', bold: isUsed },
          { text: asEntered(r.boomLength) ?? '—', bold: isUsed },
          { text: asEntered(r.capacity) ?? '—', bold: isUsed },
          { text: r.interpolationAllowed ? 'allowed' : 'no', soft: true },
          { text: isUsed ? 'row used by the check' : '', bold: true },
        ],
        shade: isUsed,
      };
    }),
  );
  if (omitted)
    flow.para(`${omitted} further rows of this boom length are not printed.`, { size: 7.5, color: INK_SOFT });
  if (usedNote) flow.para(usedNote.formulaText, { size: 7.5, color: INK_SOFT });

  const load = obj(inputs.load) ?? {};
  const l: [string, string][] = [];
  add(l, 'Load', str(load.description));
  add(l, 'Weight', asEntered(load.weight));
  const dims = [load.length, load.width, load.height].map(asEntered);
  if (dims.some(Boolean)) add(l, 'Size (L × W × H)', dims.map((d) => d ?? '—').join(' × '));
  add(l, 'Wind area', asEntered(load.windArea));
  add(l, 'Drag coefficient', typeof load.dragCoefficient === 'number' ? String(load.dragCoefficient) : null);
  add(l, 'Hook block', asEntered(obj(inputs.hookBlock)?.weight));
  add(l, 'Hook block height', asEntered(obj(inputs.hookBlock)?.height));
  add(l, 'Load-line allowance', asEntered(inputs.loadLineAllowance));
  for (const d of arr(inputs.chartDeductions))
    add(l, `Chart deduction: ${str(obj(d)?.name) ?? 'unnamed'}`, asEntered(obj(d)?.weight));
  add(l, 'Required lift height', asEntered(inputs.requiredLiftHeight));
  flow.subheading('Load');
  pairs(flow, l);

  const rig = obj(inputs.rigging);
  if (rig) {
    const r: [string, string][] = [];
    for (const it of arr(rig.items)) add(r, str(obj(it)?.name) ?? 'Rigging item', asEntered(obj(it)?.weight));
    const s = obj(rig.slings);
    if (s) {
      add(
        r,
        'Slings',
        `${str(s.name) ?? 'sling set'}: ${String(s.material ?? '')}, ${String(s.hitch ?? '')} hitch`,
      );
      add(r, 'Sling rating (vertical, per leg)', asEntered(s.ratedLoadVertical));
      add(r, 'Sling weight', asEntered(s.weight));
      arr(s.legs).forEach((leg, i) => {
        const lg = obj(leg) ?? {};
        const bits = [
          asEntered(lg.angle) && `${asEntered(lg.angle)} from horizontal`,
          asEntered(lg.length) && `length ${asEntered(lg.length)}`,
          asEntered(lg.horizontalDistance) && `${asEntered(lg.horizontalDistance)} from the hook`,
        ].filter(Boolean);
        add(r, `Leg ${i + 1}${str(lg.name) ? ` (${str(lg.name)})` : ''}`, bits.join(', ') || '—');
      });
    }
    for (const h of arr(rig.hardware)) {
      const hw = obj(h) ?? {};
      add(
        r,
        str(hw.name) ?? 'Hardware',
        `WLL ${asEntered(hw.wll) ?? '—'}${asEntered(hw.weight) ? `, weighs ${asEntered(hw.weight)}` : ''}${hw.carries === 'leg' ? ', one per leg' : ''}`,
      );
    }
    add(r, 'Rigging height', asEntered(rig.height));
    if (r.length) {
      flow.subheading('Rigging');
      pairs(flow, r);
    }
  }

  const rv = obj(inputs.reeving);
  if (rv) {
    const r: [string, string][] = [];
    add(r, 'Parts of line', typeof rv.partsOfLine === 'number' ? String(rv.partsOfLine) : null);
    add(r, 'Sheaves passed', typeof rv.sheavesPassed === 'number' ? String(rv.sheavesPassed) : null);
    add(r, 'Sheave bearings', str(rv.bearing));
    add(r, 'Hoist line pull', asEntered(rv.hoistLinePull));
    add(r, 'Rope rated load', asEntered(rv.ropeRatedLoad));
    add(r, 'Rope breaking strength', asEntered(rv.ropeBreakingStrength));
    add(r, 'Rope type', str(rv.ropeType)?.replace(/_/g, ' '));
    flow.subheading('Reeving');
    pairs(flow, r);
  }

  const gr = obj(inputs.ground);
  if (gr) {
    const r: [string, string][] = [];
    const mat = obj(gr.mat);
    if (mat)
      add(
        r,
        'Mats',
        `${asEntered(mat.length)} × ${asEntered(mat.width)}${typeof mat.perSupport === 'number' ? `, ${mat.perSupport} per support` : ''}`,
      );
    add(r, 'Allowable bearing', asEntered(gr.allowableBearing));
    add(r, 'Soil class', str(gr.soilClass)?.replace(/_/g, ' '));
    flow.subheading('Ground');
    pairs(flow, r);
  }

  const env = obj(inputs.environment);
  if (env) {
    const r: [string, string][] = [];
    add(r, 'Wind speed', asEntered(env.windSpeed));
    add(r, 'Boom wind area', asEntered(env.boomWindArea));
    add(
      r,
      'Boom drag coefficient',
      typeof env.boomDragCoefficient === 'number' ? String(env.boomDragCoefficient) : null,
    );
    for (const p of arr(env.powerLines)) {
      const pl = obj(p) ?? {};
      add(
        r,
        `Power line${str(pl.name) ? `: ${str(pl.name)}` : ''}`,
        `${asEntered(pl.voltage)} at ${asEntered(pl.distance)}`,
      );
    }
    flow.subheading('Environment');
    pairs(flow, r.length ? r : [['Environment', 'nothing entered']]);
  }

  const tandem = obj(inputs.tandem);
  if (tandem) {
    const r: [string, string][] = [];
    arr(tandem.cranes).forEach((cr, i) => {
      const t = obj(cr) ?? {};
      const bits = [
        asEntered(t.chartCapacity) && `chart ${asEntered(t.chartCapacity)}`,
        asEntered(t.pickPointDistance) && `pick point ${asEntered(t.pickPointDistance)}`,
        asEntered(t.share) && `share ${asEntered(t.share)}`,
        asEntered(t.ownHookWeight) && `own hook ${asEntered(t.ownHookWeight)}`,
      ].filter(Boolean);
      add(r, str(t.name) ?? `Crane ${i + 1}`, bits.join(', '));
    });
    flow.subheading('Tandem lift');
    pairs(flow, r);
  }

  const pers = obj(inputs.personnel);
  if (pers) {
    const r: [string, string][] = [];
    add(r, 'Platform', asEntered(pers.platformWeight));
    add(r, 'Platform rigging', asEntered(pers.riggingWeight));
    add(
      r,
      'Occupants',
      typeof pers.occupants === 'number'
        ? `${pers.occupants} × ${asEntered(pers.occupantWeight) ?? '—'}`
        : null,
    );
    add(r, 'Tools', asEntered(pers.toolsWeight));
    add(r, 'Platform rated load', asEntered(pers.platformRatedLoad));
    flow.subheading('Personnel lift');
    pairs(flow, r);
  }

  const site = obj(inputs.site);
  const SITE: Record<string, string> = {
    overOccupiedArea: 'over an occupied area',
    overOperatingPlant: 'over operating plant',
    loadOutOfOperatorView: 'load out of the operator’s view',
    nonRoutineRigging: 'non-routine rigging',
    hazardousOrIrreplaceableLoad: 'hazardous or irreplaceable load',
    declaredCritical: 'declared critical by the contractor',
  };
  const flags = site ? Object.keys(SITE).filter((k) => site[k] === true) : [];
  const stated = obj(inputs.stated);
  const st: [string, string][] = [];
  if (stated)
    for (const [k, v] of Object.entries(stated))
      add(
        st,
        STATED_LABELS[k] ?? k,
        typeof v === 'number' ? (k === 'percentOfChart' ? `${v}%` : String(v)) : asEntered(v),
      );
  flow.subheading('Site conditions and stated figures');
  pairs(flow, [['Site conditions', flags.length ? flags.join('; ') : 'none declared'], ...st]);
}

const STATED_LABELS: Record<string, string> = {
  grossLoad: 'Stated gross load',
  radius: 'Stated radius',
  boomAngle: 'Stated boom angle',
  chartCapacity: 'Stated chart capacity',
  percentOfChart: 'Stated % of chart',
  overturningMoment: 'Stated overturning moment',
  resistingMoment: 'Stated resisting moment',
  stabilityRatio: 'Stated stability ratio',
  maxSupportReaction: 'Stated max support reaction',
  groundPressure: 'Stated ground pressure',
  maxSlingTension: 'Stated max sling tension',
  linePull: 'Stated line pull',
};

const SI_FACTORS: Record<string, number> = {
  kg: 9.80665,
  t: 9806.65,
  lb: 0.45359237 * 9.80665,
  kip: 453.59237 * 9.80665,
  ton_us: 907.18474 * 9.80665,
  N: 1,
  kN: 1000,
};
function siOf(q: Obj): number {
  const f = SI_FACTORS[String(q.unit)];
  return typeof q.value === 'number' && f ? q.value * f : NaN;
}

// ---------- checks ----------

function limitText(item: Pick<CheckItem, 'limit' | 'limitType' | 'unit'>, units: UnitSystem): string {
  if (item.limit === null) return '—';
  const v = formatQuantity(item.limit, item.unit, units);
  return item.limitType === 'max' ? `max ${v}` : item.limitType === 'min' ? `min ${v}` : v;
}

const statusKey = (s: CheckStatus): StatusKey => s;

function checksSection(flow: Flow, result: LiftResult, units: UnitSystem) {
  const cols: Col[] = [
    { title: 'Status', width: 60 },
    { title: 'Check', width: 146 },
    { title: 'Value', width: 62 },
    { title: 'Limit', width: 66 },
    { title: 'Source of the limit', width: WIDTH - 334 },
  ];
  const rows: Row[] = [];
  result.checks.forEach((c, ci) => {
    const shade = ci % 2 === 1;
    const single = c.items.length <= 1;
    rows.push({
      cells: [
        { text: STATUS_WORDS[statusKey(c.status)], status: statusKey(c.status), bold: true },
        { text: c.label, bold: true },
        { text: c.value === null ? '—' : formatQuantity(c.value, c.unit, units), bold: true },
        { text: limitText(c, units), bold: true },
        { text: c.source.text, soft: true },
      ],
      note: {
        text: single ? [c.message, formatFormula(c.formula, units)].filter(Boolean).join(' — ') : c.message,
        from: 1,
      },
      shade,
    });
    if (!single)
      for (const it of c.items)
        rows.push({
          cells: [
            { text: STATUS_WORDS[statusKey(it.status)], status: statusKey(it.status) },
            { text: it.label },
            { text: it.value === null ? '—' : formatQuantity(it.value, it.unit, units) },
            { text: limitText(it, units) },
            { text: it.source.text === c.source.text ? '' : it.source.text, soft: true },
          ],
          note: { text: formatFormula(it.formula, units), from: 1 },
          indent: 8,
          shade,
        });
  });
  table(flow, cols, rows);
}

const DISCREPANCY_WORDS = {
  agrees: 'AGREES',
  discrepancy: 'DIFFERS',
  cannot_compare: 'NOT COMPARED',
} as const;

function discrepanciesSection(flow: Flow, input: StampInput) {
  const { result, units, acceptedFigures } = input.calculation;
  const list = result?.discrepancies ?? [];
  const accepted = new Map(acceptedFigures.map((a) => [a.figure, a]));
  if (list.length === 0 && acceptedFigures.length === 0) {
    flow.para('The contractor stated no figures to compare with the recomputation.');
    return;
  }
  const rows: Row[] = list.map((d) => {
    const acc = accepted.get(d.figure);
    accepted.delete(d.figure);
    const outcome: StatusKey =
      d.status === 'agrees'
        ? 'pass'
        : d.status === 'discrepancy'
          ? acc
            ? 'caution'
            : 'fail'
          : 'not_applicable';
    const resolution =
      d.status === 'agrees'
        ? `Agrees within the ${d.tolerancePct}% tolerance.`
        : acc
          ? `Accepted by ${acc.engineer}: ${acc.reason}`
          : d.status === 'discrepancy'
            ? `Not accepted${d.unsafeSide ? '; stated figure is on the unsafe side' : ''}. See the findings.`
            : d.message;
    return {
      cells: [
        { text: DISCREPANCY_WORDS[d.status], status: outcome, bold: true },
        { text: d.label, bold: true },
        { text: formatQuantity(d.stated, d.unit, units) },
        { text: d.computed === null ? '—' : formatQuantity(d.computed, d.unit, units) },
        { text: d.differencePct === null ? '—' : `${d.differencePct.toFixed(1)}% (tol. ${d.tolerancePct}%)` },
        { text: resolution },
      ],
    };
  });
  for (const a of accepted.values())
    rows.push({
      cells: [
        { text: 'ACCEPTED', status: 'caution', bold: true },
        { text: a.figure, bold: true },
        { text: '—' },
        { text: '—' },
        { text: '—' },
        { text: `Accepted by ${a.engineer}: ${a.reason}` },
      ],
    });
  table(
    flow,
    [
      { title: 'Outcome', width: 74 },
      { title: 'Figure', width: 92 },
      { title: 'Stated', width: 58 },
      { title: 'Recomputed', width: 58 },
      { title: 'Difference', width: 66 },
      { title: 'How it was resolved', width: WIDTH - 348 },
    ],
    rows,
  );
}

function findingsSection(flow: Flow, input: StampInput) {
  const { findings, result } = input.calculation;
  if (findings.length === 0) {
    flow.para('No findings were raised on this revision.');
    return;
  }
  const labels = new Map((result?.checks ?? []).map((c) => [c.id as string, c.label]));
  table(
    flow,
    [
      { title: '#', width: 22 },
      { title: 'Severity / state', width: 82 },
      { title: 'Finding', width: 200 },
      { title: 'On', width: 70 },
      { title: 'Response', width: WIDTH - 374 },
    ],
    findings.map((f, i) => ({
      cells: [
        { text: String(i + 1), bold: true },
        { text: `${f.severity.toUpperCase()} · ${f.state}`, bold: true },
        { text: f.text },
        {
          text:
            [
              f.pageNumber ? `page ${f.pageNumber}` : null,
              f.checkId ? (labels.get(f.checkId) ?? f.checkId) : null,
            ]
              .filter(Boolean)
              .join(', ') || '—',
          soft: true,
        },
        { text: f.response ?? 'No response yet.', soft: !f.response },
      ],
    })),
  );
}

// ---------- the sheet ----------

export function drawSheetHeader(page: PDFPage, fonts: Fonts, input: StampInput, n: number, total: number) {
  const { stamp } = input;
  const top = PAGE_H - 30;
  page.drawRectangle({ x: LEFT, y: top + 8, width: WIDTH, height: 3, color: GRAPHITE });
  page.drawText('CALCULATION SHEET · STAMPED RETURN', {
    x: LEFT,
    y: top - 4,
    size: 7,
    font: fonts.black,
    color: INK_SOFT,
  });
  const ref = `${stamp.reference} · revision ${stamp.revision}`;
  page.drawText(fitText(ref, fonts.black, 12, WIDTH - 130), {
    x: LEFT,
    y: top - 19,
    size: 12,
    font: fonts.black,
    color: INK,
  });
  page.drawText(fitText(stamp.title, fonts.regular, 8, WIDTH - 130), {
    x: LEFT,
    y: top - 31,
    size: 8,
    font: fonts.regular,
    color: INK,
  });
  const pg = `page ${n} of ${total}`;
  page.drawText(pg, {
    x: RIGHT - widthOf(pg, fonts.black, 10),
    y: top - 19,
    size: 10,
    font: fonts.black,
    color: INK,
  });
  const dl = `${DECISION_LABELS[stamp.decision]} · ${tradeDate(stamp.issuedAt, stamp.timeZone)}`;
  page.drawText(fitText(dl, fonts.bold, 7.5, 125), {
    x: RIGHT - Math.min(125, widthOf(dl, fonts.bold, 7.5)),
    y: top - 31,
    size: 7.5,
    font: fonts.bold,
    color: INK_SOFT,
  });
  page.drawLine({
    start: { x: LEFT, y: top - 38 },
    end: { x: RIGHT, y: top - 38 },
    thickness: 0.8,
    color: INK,
  });
}

function decisionPanel(flow: Flow, input: StampInput) {
  const { stamp } = input;
  const { fonts } = flow;
  const cond = stamp.conditions.trim() || 'None.';
  const condLines = wrapText(cond, fonts.regular, 8.5, WIDTH - 120);
  const h = 96 + condLines.length * 11.5;
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
  flow.text('Conditions', x, top - 92, 8.5, fonts.black);
  flow.y = top - 92 + 11.5 - 2;
  for (const line of condLines) {
    if (flow.y - 11.5 < BOTTOM) flow.newPage();
    flow.y -= 11.5;
    flow.text(line, x + 72, flow.y + 2, 8.5, fonts.regular);
  }
  flow.y = Math.min(flow.y - 12, top - h);
}

function cautionPanel(flow: Flow, result: LiftResult | null) {
  const { fonts } = flow;
  const texts = result?.cautions?.length ? result.cautions : ENGINE_CAUTIONS;
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

function summaryLine(flow: Flow, result: LiftResult, units: UnitSystem) {
  const { fonts } = flow;
  flow.need(30);
  const y = flow.y - 18;
  drawStatusShape(flow.page, result.overallStatus, LEFT, y - 2, 13);
  const head = `Independent check: ${STATUS_WORDS[result.overallStatus]}`;
  flow.text(head, LEFT + 18, y, 11, fonts.black);
  const critical = result.critical.isCritical
    ? `Critical lift — ${result.critical.triggers.length} trigger${result.critical.triggers.length === 1 ? '' : 's'} apply`
    : 'Not a critical lift by the triggers checked';
  const worst = result.checks.filter((c) => c.status === 'fail').length;
  const caution = result.checks.filter((c) => c.status === 'caution').length;
  const differ = result.discrepancies.filter((d) => d.status === 'discrepancy').length;
  const rest = `${worst} failed, ${caution} with caution, of ${result.checks.length} checks · ${differ} contractor figure${differ === 1 ? '' : 's'} outside the tolerance · ${critical} · figures in ${units === 'metric' ? 'metric (m, t, kN, kPa)' : 'US customary (ft, lb, kip, psf)'} units`;
  const hx = LEFT + 18 + widthOf(head, fonts.black, 11) + 12;
  const lines = wrapText(rest, fonts.regular, 8, RIGHT - hx);
  lines.forEach((l, i) => flow.text(l, hx, y + 1 - i * 10, 8, fonts.regular, INK_SOFT));
  flow.y = y - 8 - Math.max(0, lines.length - 1) * 10;
}

/** Lay out the calculation sheet on new A4 pages at the end of `doc`; returns those pages. */
export function buildCalculationSheet(doc: PDFDocument, fonts: Fonts, input: StampInput): PDFPage[] {
  const flow = new Flow(doc, fonts);
  const { result, units, inputs } = input.calculation;
  decisionPanel(flow, input);
  cautionPanel(flow, result);
  if (result) summaryLine(flow, result, units);
  else
    flow.para(
      'No calculation result is stored for this revision: the checks, discrepancies and side view are not shown.',
      {
        font: fonts.bold,
      },
    );

  flow.heading('1  Inputs as submitted');
  flow.para('Shown as the contractor entered them, in their own units.', {
    size: 7.5,
    color: INK_SOFT,
    gap: 0,
  });
  inputsSection(flow, inputs, result);

  if (result) {
    flow.heading('2  Checks', 80);
    flow.para(
      'Each check recomputed from the inputs: value, limit, outcome and where the limit comes from; the formula in words under each line. Figures to three significant figures.',
      { size: 7.5, color: INK_SOFT, gap: 2 },
    );
    checksSection(flow, result, units);
  }

  flow.heading('3  Contractor figures and how they were resolved');
  discrepanciesSection(flow, input);
  flow.subheading('Findings');
  findingsSection(flow, input);

  flow.heading('4  Why the lift is critical', 30);
  if (!result) flow.para('No result.');
  else if (result.critical.triggers.length === 0) flow.para('No critical-lift trigger applies.');
  else
    for (const t of result.critical.triggers) {
      flow.para(`• ${t.reason}`, { font: fonts.bold, gap: 0 });
      flow.para(t.source.text, { size: 7.3, color: INK_SOFT, indent: 9 });
    }

  flow.heading('5  Fixes the check suggests', 30);
  if (!result || result.fixes.length === 0) flow.para('None: no failed capacity or stability check to fix.');
  else for (const f of result.fixes) flow.para(`• ${f.text}`);

  flow.heading('6  Side view', SIDE_VIEW_HEIGHT);
  const reason = result ? sideViewUnavailableReason(inputs, result) : 'No result to draw from.';
  if (reason || !result) flow.para(reason ?? '');
  else {
    flow.need(SIDE_VIEW_HEIGHT + 4);
    drawSideView(
      flow.page,
      fonts,
      { x: LEFT, y: flow.y - SIDE_VIEW_HEIGHT, width: WIDTH, height: SIDE_VIEW_HEIGHT },
      inputs,
      result,
      units,
    );
    flow.y -= SIDE_VIEW_HEIGHT + 6;
  }

  flow.need(24);
  flow.y -= 8;
  flow.page.drawLine({
    start: { x: LEFT, y: flow.y },
    end: { x: RIGHT, y: flow.y },
    thickness: 0.4,
    color: RULE,
  });
  flow.para(
    `${result ? `Engine ${result.engineVersion}, result version ${result.resultVersion}. ` : ''}Values recomputed in SI and shown to three significant figures; inputs as entered. ${SHORT_CAUTION}`,
    { size: 7, color: INK_SOFT },
  );
  return flow.pages;
}
