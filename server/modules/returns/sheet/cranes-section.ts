// Lifts with several cranes on the calculation sheet. The input group lists each crane as entered
// (name, pick point, stated share, its own configuration and chart rows); the section prints each
// crane's share from the result (with its range when the centre of gravity is off, its gross load
// with its own block and rigging, its chart capacity and its worst check) and how the shares were
// found. Stored inputs of version 1 (`tandem`) are upgraded first (upgradeLiftInput), so both
// versions print the same way.
import { formatQuantity } from '@shared/engineering/format';
import type { CraneResult, LiftResult, UnitSystem } from '@shared/engineering/types';
import { upgradeLiftInput } from '@shared/engineering/upgrade';
import { SOURCES } from '@shared/engineering/sources';
import { LiftInput } from '@shared/schemas/lift-input';
import { CHECK_STATUS_WORDS } from '@shared/vocabulary/check-statuses';
import { SHARE_METHOD_WORDS } from '@shared/vocabulary/multi-crane';
import { INK_SOFT } from '../text-pdf';
import { chartInputs, craneInputs } from './inputs-crane';
import { pairs, table, WIDTH, type Flow } from './layout';
import { add, arr, asEntered, obj, str, type Obj } from './read-inputs';

/**
 * The stored input in the current schema version (version 1 `tandem` becomes `multiCrane`); the
 * raw input as it is when it does not parse (then only a `multiCrane` already there is printed).
 */
export function currentInputs(inputs: Obj): Obj {
  const parsed = LiftInput.safeParse(inputs);
  return parsed.success ? (upgradeLiftInput(parsed.data) as unknown as Obj) : inputs;
}

const point = (p: unknown): string | null => {
  const o = obj(p);
  const x = asEntered(o?.x);
  const y = asEntered(o?.y);
  return x && y ? `x ${x}, y ${y}` : null;
};

/** Input group: the cranes of a lift with several cranes, as entered (nothing for one crane). */
export function severalCranesInputs(flow: Flow, raw: Obj, result: LiftResult | null) {
  const mc = obj(currentInputs(raw).multiCrane);
  if (!mc) return;
  const lead = obj(mc.lead) ?? {};
  const others = arr(mc.others)
    .map(obj)
    .filter((o): o is Obj => o !== null);
  const r: [string, string][] = [];
  add(r, 'Cranes', String(others.length + 1));
  add(r, 'Load centre of gravity (plan)', point(mc.loadCg) ?? 'at the origin of the plan frame');
  add(
    r,
    'Centre of gravity off by',
    typeof mc.cgOffsetFraction === 'number'
      ? `${+(mc.cgOffsetFraction * 100).toPrecision(3)}% of the pick spacing`
      : 'default share of the pick spacing',
  );
  flow.subheading('Several cranes');
  pairs(flow, r);
  const row = (c: Obj, name: string, configured: string) => ({
    cells: [
      { text: name, bold: true },
      { text: point(c.pickPoint) ?? '—' },
      { text: asEntered(c.statedShare) ?? '—' },
      { text: asEntered(c.chartCapacity) ?? '—' },
      { text: asEntered(obj(c.hookBlock)?.weight) ?? '—' },
      { text: configured, soft: true },
    ],
  });
  table(
    flow,
    [
      { title: 'Crane', width: 120 },
      { title: 'Pick point', width: 86 },
      { title: 'Stated share', width: 62 },
      { title: 'Stated capacity', width: 62 },
      { title: 'Own hook block', width: 62 },
      { title: 'Configuration and chart', width: WIDTH - 392 },
    ],
    [
      row(lead, `1. ${str(lead.name) ?? 'Crane 1'}`, 'as entered above (lead crane)'),
      ...others.map((o, k) =>
        row(
          o,
          `${k + 2}. ${str(o.name) ?? str(obj(o.crane)?.name) ?? `Crane ${k + 2}`}`,
          o.crane ? 'below' : 'not entered: only the margin on its stated capacity is checked',
        ),
      ),
    ],
  );
  others.forEach((o, k) => {
    if (!obj(o.crane)) return;
    const name = str(o.name) ?? `Crane ${k + 2}`;
    const figures = result?.cranes?.[k + 1]?.figures;
    craneInputs(flow, { crane: o.crane }, null, `Crane ${k + 2} — ${name}`);
    chartInputs(
      flow,
      { crane: o.crane, chart: o.chart },
      result && figures ? { ...result, figures } : null,
      `Load chart of crane ${k + 2}`,
    );
  });
}

const weightText = (v: number | null, units: UnitSystem) => formatQuantity(v, 'weight', units);

function shareRow(c: CraneResult, units: UnitSystem, shade: boolean) {
  const pick = c.pickPoint
    ? `${formatQuantity(c.pickPoint.x, 'length', units)}, ${formatQuantity(c.pickPoint.y, 'length', units)}`
    : '—';
  return {
    cells: [
      { text: `${c.index}. ${c.name}`, bold: true },
      { text: pick },
      { text: weightText(c.share, units), bold: true },
      {
        text: c.shareRange
          ? `${weightText(c.shareRange.min, units)} – ${weightText(c.shareRange.max, units)}`
          : '—',
      },
      { text: weightText(c.grossLoad, units) },
      { text: weightText(c.chartCapacity, units) },
      { text: CHECK_STATUS_WORDS[c.overallStatus], status: c.overallStatus, bold: true },
    ],
    shade,
  };
}

/** Section: each crane's share and how the shares were found. */
export function cranesSection(flow: Flow, result: LiftResult, units: UnitSystem) {
  const mc = result.multiCrane;
  const cranes = result.cranes;
  if (!mc || !cranes) return;
  flow.para(SHARE_METHOD_WORDS[mc.method], { gap: 2 });
  const p: [string, string][] = [];
  add(p, 'Load shared', weightText(mc.loadWeight, units));
  add(
    p,
    'Centre of gravity (plan)',
    `${formatQuantity(mc.cg.x, 'length', units)}, ${formatQuantity(mc.cg.y, 'length', units)}`,
  );
  add(p, 'Pick spacing (largest)', formatQuantity(mc.spacing, 'length', units));
  add(
    p,
    'Centre of gravity moved by',
    mc.sensitivityOffset === null
      ? 'not found'
      : `${formatQuantity(mc.sensitivityOffset, 'length', units)} each way`,
  );
  add(
    p,
    'Margin on each share',
    `${mc.marginPct}% for ${cranes.length} cranes — site policy (default: ${SOURCES.queenslandTandem.text})`,
  );
  pairs(flow, p);
  table(
    flow,
    [
      { title: 'Crane', width: 130 },
      { title: 'Pick point (x, y)', width: 78 },
      { title: 'Share', width: 52 },
      { title: 'If the CG is off', width: 86 },
      { title: 'Gross', width: 52 },
      { title: 'Chart', width: 52 },
      { title: 'Worst check', width: WIDTH - 450 },
    ],
    cranes.map((c, i) => shareRow(c, units, i % 2 === 1)),
  );
  flow.para(
    'Gross: the share plus the crane’s own hook block, rigging, load line and chart deductions. Each crane’s checks for its gross load are under Checks, named by crane.',
    { size: 7.5, color: INK_SOFT },
  );
}
