// Reeving, ground, environment and personnel lifts, the site's critical-lift conditions
// and the figures the contractor stated, as entered.
import { STATED_FIGURE_LABELS } from '@shared/vocabulary/stated-figures';
import { pairs, type Flow } from './layout';
import { add, arr, asEntered, obj, str, type Obj } from './read-inputs';

export function reevingInputs(flow: Flow, inputs: Obj) {
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
}

export function groundInputs(flow: Flow, inputs: Obj) {
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
}

export function environmentInputs(flow: Flow, inputs: Obj) {
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
}

export function personnelInputs(flow: Flow, inputs: Obj) {
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
}

export function siteInputs(flow: Flow, inputs: Obj) {
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
        k in STATED_FIGURE_LABELS
          ? `Stated ${STATED_FIGURE_LABELS[k as keyof typeof STATED_FIGURE_LABELS].toLowerCase()}`
          : k,
        typeof v === 'number' ? (k === 'percentOfChart' ? `${v}%` : String(v)) : asEntered(v),
      );
  flow.subheading('Site conditions and stated figures');
  pairs(flow, [['Site conditions', flags.length ? flags.join('; ') : 'none declared'], ...st]);
}
