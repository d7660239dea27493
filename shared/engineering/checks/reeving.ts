// Check 7 — reeving (PRODUCT.md §7): line pull in the lead line with sheave friction, against the
// hoist's rated line pull and the rope's rated load.
// Lead-line factor = K^S (K − 1) / (K^N − 1), K the sheave bearing constant (Wire Rope Users Manual,
// 4th ed.: 1.09 plain bronze-bushed, 1.04 roller), N parts of line, S rotating sheaves the line
// passes from the dead end to the drum (formula from memory; reproduces the manual's tables).
// A sheave efficiency from the planner's data (with its source) may replace the bearing constant.
// Parts of line and sheaves are checked against each other in the input (S ≥ N − 1).
// Rope rated load = breaking strength ÷ design factor (3.5 running rope, 5 rotation-resistant:
// ASME B30.6/B30.22), unless a rated load is entered. Hook load taken as the gross load (conservative).
import { exceeds } from '../compare';
import { check, f, item, statusMax, term, type Ctx } from '../context';
import { SOURCES } from '../sources';
import { si } from '../units';
import type { CheckItem, CheckResult, LiftFigures } from '../types';

export const SHEAVE_BEARING_CONSTANT = { plain: 1.09, roller: 1.04 } as const;
export const ROPE_DESIGN_FACTOR = { running: 3.5, rotation_resistant: 5 } as const;

/** Lead-line pull as a fraction of the hook load. */
export function leadLineFactor(K: number, N: number, S: number): number {
  if (K === 1) return 1 / N;
  return (K ** S * (K - 1)) / (K ** N - 1);
}

export function reevingCheck(ctx: Ctx, figures: LiftFigures): CheckResult {
  const rv = ctx.input.reeving;
  if (!rv) {
    figures.linePull = null;
    return check('reeving', 'Reeving', [
      item(ctx, {
        id: 'reeving.line-pull',
        label: 'Line pull',
        status: 'not_applicable',
        value: null,
        unit: 'weight',
        source: SOURCES.input,
        message: 'Enter the parts of line, sheaves and bearing type to check the reeving.',
      }),
    ]);
  }
  // A planner's own sheave efficiency e (with its source) gives K = 1/e in place of the bearing constant.
  const K = rv.sheaveEfficiency !== undefined ? 1 / rv.sheaveEfficiency : SHEAVE_BEARING_CONSTANT[rv.bearing];
  const kSource =
    rv.sheaveEfficiency !== undefined
      ? {
          kind: 'input' as const,
          text: `sheave efficiency ${rv.sheaveEfficiency} as entered (${rv.sheaveEfficiencySource ?? 'no source given'}); lead-line factor K^S(K−1)/(K^N−1) from memory`,
        }
      : null;
  const N = rv.partsOfLine;
  const S = rv.sheavesPassed;
  const factor = leadLineFactor(K, N, S);
  const pull = ctx.gross * factor;
  figures.linePull = pull;
  const base = f`line pull = gross ${term(ctx.gross, 'weight')} × K^S(K−1)/(K^N−1) with K ${Number(K.toFixed(4))}, N ${N}, S ${S} = ${term(
    ctx.gross,
    'weight',
  )} × ${factor.toFixed(4)} = ${term(pull, 'weight')}`;
  const items: CheckItem[] = [];
  const hoist = si(rv.hoistLinePull);
  items.push(
    item(ctx, {
      id: 'reeving.line-pull',
      label: 'Line pull against hoist rating',
      status: hoist !== undefined ? statusMax(pull, hoist, ctx.policy) : 'pass',
      value: pull,
      limit: hoist ?? null,
      limitType: hoist !== undefined ? 'max' : null,
      unit: 'weight',
      formula: hoist !== undefined ? [...base, ' against hoist line pull ', term(hoist, 'weight')] : base,
      source: kSource ?? (hoist !== undefined ? SOURCES.wrumFormula : SOURCES.wrumSheave),
      message:
        hoist === undefined
          ? 'No hoist line pull rating entered.'
          : exceeds(pull, hoist)
            ? 'Line pull exceeds the hoist rating: add parts of line.'
            : 'Line pull against the hoist rating.',
    }),
  );
  const type = rv.ropeType ?? 'running';
  const rated = si(rv.ropeRatedLoad);
  const brk = si(rv.ropeBreakingStrength);
  const df = ROPE_DESIGN_FACTOR[type];
  const ropeLimit = rated ?? (brk !== undefined ? brk / df : undefined);
  if (ropeLimit !== undefined) {
    items.push(
      item(ctx, {
        id: 'reeving.rope',
        label: 'Line pull against rope rated load',
        status: statusMax(pull, ropeLimit, ctx.policy),
        value: pull,
        limit: ropeLimit,
        limitType: 'max',
        unit: 'weight',
        formula:
          rated !== undefined
            ? f`line pull ${term(pull, 'weight')} against rope rated load ${term(rated, 'weight')}`
            : f`line pull ${term(pull, 'weight')} against breaking strength ${term(brk!, 'weight')} ÷ design factor ${df} = ${term(
                ropeLimit,
                'weight',
              )}`,
        source:
          rated !== undefined
            ? SOURCES.input
            : type === 'running'
              ? SOURCES.ropeRunning
              : SOURCES.ropeRotationResistant,
        message: exceeds(pull, ropeLimit)
          ? 'Line pull exceeds the rope rated load.'
          : 'Line pull against the rope rated load.',
      }),
    );
  }
  return check('reeving', 'Reeving', items);
}
