// Check 1 — gross load: everything the crane lifts counts against the chart (PRODUCT.md §1).
// Load + rigging items + slings + hardware + hook block + load-line allowance + chart deductions
// the contractor lists (a spreader or lifting beam and its drops count as rigging items). ASME
// B30.5 counts block, hook and rigging as part of the load.
import type { LiftInput } from '../../schemas/lift-input';
import { check, f, item, term, type Ctx } from '../context';
import { si, siOr } from '../units';
import type { CheckResult, FormulaPart } from '../types';

export interface GrossParts {
  load: number;
  riggingItems: number;
  slings: number;
  hardware: number;
  hookBlock: number;
  loadLine: number;
  deductions: number;
  belowHook: number;
  gross: number;
}

export function grossLoadParts(input: LiftInput): GrossParts {
  const load = si(input.load.weight)!;
  let riggingItems = 0;
  const r = input.rigging;
  if (r?.items) for (const it of r.items) riggingItems += si(it.weight)!;
  // a spreader or lifting beam and the drops under it hang from the hook too
  if (r?.beam) riggingItems += si(r.beam.weight)! + siOr(r.beam.slingsBelow?.weight, 0);
  const slings = siOr(r?.slings?.weight, 0);
  let hardware = 0;
  if (r?.hardware) for (const h of r.hardware) hardware += siOr(h.weight, 0);
  const hookBlock = siOr(input.hookBlock?.weight, 0);
  const loadLine = siOr(input.loadLineAllowance, 0);
  let deductions = 0;
  if (input.chartDeductions) for (const d of input.chartDeductions) deductions += si(d.weight)!;
  const belowHook = load + riggingItems + slings + hardware;
  return {
    load,
    riggingItems,
    slings,
    hardware,
    hookBlock,
    loadLine,
    deductions,
    belowHook,
    gross: belowHook + hookBlock + loadLine + deductions,
  };
}

export function grossLoadCheck(ctx: Ctx, p: GrossParts): CheckResult {
  const formula: FormulaPart[] = f`gross load = load ${term(p.load, 'weight')} + rigging items ${term(
    p.riggingItems,
    'weight',
  )} + slings ${term(p.slings, 'weight')} + hardware ${term(p.hardware, 'weight')} + hook block ${term(
    p.hookBlock,
    'weight',
  )} + load-line allowance ${term(p.loadLine, 'weight')} + chart deductions ${term(p.deductions, 'weight')} = ${term(
    p.gross,
    'weight',
  )}`;
  const noBlock = !ctx.input.hookBlock;
  return check('gross-load', 'Gross load', [
    item(ctx, {
      id: 'gross-load',
      label: 'Gross load',
      status: noBlock ? 'caution' : 'pass',
      value: p.gross,
      unit: 'weight',
      formula,
      source: { kind: 'standard', text: 'ASME B30.5: block, hook and rigging count as part of the load' },
      message: noBlock
        ? 'No hook block weight entered: charts usually rate the gross load including the block; confirm it is counted.'
        : 'Gross load includes the load, rigging, hook block, load-line allowance and listed chart deductions.',
    }),
  ]);
}
