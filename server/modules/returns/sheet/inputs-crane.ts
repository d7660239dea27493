// The crane and its load chart as the contractor entered them: the configuration, the masses
// and supports, and the chart rows of the configuration with the row the check used marked.
import type { LiftResult } from '@shared/engineering/types';
import { CRANE_TYPE_LABELS } from '@shared/vocabulary/crane-types';
import { INK_SOFT } from '../text-pdf';
import { pairs, table, WIDTH, type Flow } from './layout';
import { add, arr, asEntered, obj, str, weightAt, weightSI, type Obj } from './read-inputs';

/** `title` names the crane when it is one of several (the calculation sheet's crane shares section). */
export function craneInputs(flow: Flow, inputs: Obj, _result?: LiftResult | null, title = 'Crane') {
  const crane = obj(inputs.crane) ?? {};
  const c: [string, string][] = [];
  add(c, 'Crane', str(crane.name));
  add(c, 'Type', CRANE_TYPE_LABELS[String(crane.type) as keyof typeof CRANE_TYPE_LABELS] ?? str(crane.type));
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
  flow.subheading(title);
  pairs(flow, c);
}

export function chartInputs(flow: Flow, inputs: Obj, result: LiftResult | null, title = 'Load chart') {
  const crane = obj(inputs.crane) ?? {};
  // Chart rows used: the configuration's rows, the one the check used marked.
  const chart = obj(inputs.chart) ?? {};
  const rows = arr(chart.rows)
    .map(obj)
    .filter((r): r is Obj => r !== null);
  flow.subheading(`${title}${str(chart.name) ? ` — ${str(chart.name)}` : ''}`);
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
        used !== null && cap !== null && Math.abs(weightSI(cap) - used) <= Math.max(1, Math.abs(used) * 1e-3);
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
}
