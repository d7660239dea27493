// The load, hook block, allowances and rigging as the contractor entered them.
import { pairs, type Flow } from './layout';
import { add, arr, asEntered, obj, str } from './read-inputs';
import type { Obj } from './read-inputs';

export function loadInputs(flow: Flow, inputs: Obj) {
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
}

export function riggingInputs(flow: Flow, inputs: Obj) {
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
      add(r, 'Hook height above the picks', asEntered(s.hookHeight));
      if (arr(s.legs).length === 4)
        add(r, 'Four legs', s.equalised === true ? 'equalising arrangement stated' : 'rated on two legs');
      arr(s.legs).forEach((leg, i) => {
        const lg = obj(leg) ?? {};
        const bits = [
          asEntered(lg.angle) && `${asEntered(lg.angle)} from horizontal`,
          asEntered(lg.length) && `length ${asEntered(lg.length)}`,
          asEntered(lg.horizontalDistance) && `${asEntered(lg.horizontalDistance)} from the hook`,
          asEntered(obj(lg.pickPoint)?.x) &&
            `pick point x ${asEntered(obj(lg.pickPoint)?.x)}, y ${asEntered(obj(lg.pickPoint)?.y)} from the centre of gravity`,
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
    const beam = obj(rig.beam);
    if (beam) {
      add(
        r,
        str(beam.name) ?? (beam.kind === 'lifting' ? 'Lifting beam' : 'Spreader beam'),
        `${beam.kind === 'lifting' ? 'lifting' : 'spreader'} beam, weighs ${asEntered(beam.weight) ?? '—'}, rated load ${asEntered(beam.ratedLoad) ?? '—'} (slings above it: the slings listed)`,
      );
      const d = obj(beam.slingsBelow);
      if (d) {
        add(
          r,
          'Drops below the beam',
          `${str(d.name) ? `${str(d.name)}: ` : ''}${String(d.material ?? '')}, ${String(d.hitch ?? '')} hitch${asEntered(d.chokeAngle) ? ` choked at ${asEntered(d.chokeAngle)}` : ''}, rated ${asEntered(d.ratedLoadVertical) ?? '—'} per drop${asEntered(d.weight) ? `, weigh ${asEntered(d.weight)}` : ''}`,
        );
        arr(d.legs).forEach((leg, i) => {
          const p = obj(obj(leg)?.pickPoint);
          add(
            r,
            str(obj(leg)?.name) ?? `Drop ${i + 1}`,
            [
              asEntered(obj(leg)?.angle) && `${asEntered(obj(leg)?.angle)} from horizontal`,
              asEntered(obj(leg)?.length) &&
                `length ${asEntered(obj(leg)?.length)}, ${asEntered(obj(leg)?.horizontalDistance) ?? '—'} across`,
              p && `pick point x ${asEntered(p.x)}, y ${asEntered(p.y)} from the centre of gravity`,
            ]
              .filter(Boolean)
              .join(', ') || 'vertical',
          );
        });
      }
    }
    add(r, 'Rigging height', asEntered(rig.height));
    if (r.length) {
      flow.subheading('Rigging');
      pairs(flow, r);
    }
  }
}
