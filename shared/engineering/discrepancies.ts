// Every figure the contractor states in the plan, compared with the recomputed one. A difference past
// the site's tolerance (default 5%, common practice) is a discrepancy; `unsafeSide` marks a stated
// figure that understates a demand or overstates a capacity, so the engineer sees those first.
import { exceeds } from './compare';
import type { LiftInput } from '../schemas/lift-input';
import type { SitePolicy } from '../schemas/site-policy';
import { formatQuantity } from './format';
import { si } from './units';
import type { Discrepancy, LiftFigures, StatedFigure, UnitKind, UnitSystem } from './types';

interface Spec {
  figure: StatedFigure;
  label: string;
  unit: UnitKind;
  /** +1: stated below computed is unsafe (a demand); −1: stated above computed is unsafe (a capacity) */
  demand: 1 | -1;
}

const SPECS: Spec[] = [
  { figure: 'grossLoad', label: 'Gross load', unit: 'weight', demand: 1 },
  { figure: 'radius', label: 'Radius', unit: 'length', demand: 1 },
  { figure: 'boomAngle', label: 'Boom angle', unit: 'angle', demand: -1 },
  { figure: 'chartCapacity', label: 'Chart capacity', unit: 'weight', demand: -1 },
  { figure: 'percentOfChart', label: 'Percent of chart', unit: 'percent', demand: 1 },
  { figure: 'overturningMoment', label: 'Overturning moment', unit: 'moment', demand: 1 },
  { figure: 'resistingMoment', label: 'Resisting moment', unit: 'moment', demand: -1 },
  { figure: 'stabilityRatio', label: 'Stability ratio', unit: 'ratio', demand: -1 },
  { figure: 'maxSupportReaction', label: 'Largest support reaction', unit: 'weight', demand: 1 },
  { figure: 'groundPressure', label: 'Ground bearing pressure', unit: 'pressure', demand: 1 },
  { figure: 'maxSlingTension', label: 'Largest sling tension', unit: 'weight', demand: 1 },
  { figure: 'linePull', label: 'Line pull', unit: 'weight', demand: 1 },
];

function statedValue(stated: NonNullable<LiftInput['stated']>, fig: StatedFigure): number | undefined {
  switch (fig) {
    case 'percentOfChart':
      return stated.percentOfChart;
    case 'stabilityRatio':
      return stated.stabilityRatio;
    case 'boomAngle':
      return stated.boomAngle?.value;
    default:
      return si(stated[fig]);
  }
}

function computedValue(f: LiftFigures, fig: StatedFigure): number | null {
  switch (fig) {
    case 'grossLoad':
      return f.grossLoad;
    case 'radius':
      return f.radius;
    case 'boomAngle':
      return f.boomAngleDeg;
    case 'chartCapacity':
      return f.chartCapacity;
    case 'percentOfChart':
      return f.percentOfChart;
    case 'overturningMoment':
      return f.overturningMoment;
    case 'resistingMoment':
      return f.resistingMoment;
    case 'stabilityRatio':
      return f.stabilityRatio;
    case 'maxSupportReaction':
      return f.maxSupportReaction;
    case 'groundPressure':
      return f.groundPressure;
    case 'maxSlingTension':
      return f.maxSlingTension;
    case 'linePull':
      return f.linePull;
  }
}

export function compareStated(
  input: LiftInput,
  figures: LiftFigures,
  policy: SitePolicy,
  system: UnitSystem,
): Discrepancy[] {
  const stated = input.stated;
  if (!stated) return [];
  const tol = policy.discrepancyTolerancePct;
  const out: Discrepancy[] = [];
  for (const s of SPECS) {
    const sv = statedValue(stated, s.figure);
    if (sv === undefined) continue;
    const cv = computedValue(figures, s.figure);
    if (cv === null || !Number.isFinite(cv)) {
      out.push({
        figure: s.figure,
        label: s.label,
        unit: s.unit,
        stated: sv,
        computed: null,
        differencePct: null,
        tolerancePct: tol,
        status: 'cannot_compare',
        unsafeSide: false,
        message: `${s.label}: stated ${formatQuantity(sv, s.unit, system)}; not recomputed from the data entered.`,
      });
      continue;
    }
    const diff = cv === 0 ? (sv === 0 ? 0 : Infinity) : (Math.abs(sv - cv) / Math.abs(cv)) * 100;
    const bad = exceeds(diff, tol);
    const unsafe = s.demand === 1 ? sv < cv : sv > cv;
    out.push({
      figure: s.figure,
      label: s.label,
      unit: s.unit,
      stated: sv,
      computed: cv,
      differencePct: Number.isFinite(diff) ? diff : null,
      tolerancePct: tol,
      status: bad ? 'discrepancy' : 'agrees',
      unsafeSide: bad && unsafe,
      message: `${s.label}: stated ${formatQuantity(sv, s.unit, system)}, recomputed ${formatQuantity(cv, s.unit, system)} (${
        Number.isFinite(diff) ? diff.toFixed(1) + '%' : 'no common base'
      } difference; tolerance ${tol}%)${bad ? (unsafe ? ' — stated figure is on the unsafe side' : '') : ''}.`,
    });
  }
  // discrepancies first, unsafe ones before the rest
  const rank = (d: Discrepancy) =>
    d.status === 'discrepancy' ? (d.unsafeSide ? 0 : 1) : d.status === 'cannot_compare' ? 2 : 3;
  return out.sort((a, b) => rank(a) - rank(b));
}
