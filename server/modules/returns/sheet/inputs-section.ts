// Section 1 of the calculation sheet: the inputs as submitted, group by group in the order of the
// editor's steps. Each group prints only what was entered; a new group is one function here.
import type { LiftResult } from '@shared/engineering/types';
import { INK_SOFT } from '../text-pdf';
import { chartInputs, craneInputs } from './inputs-crane';
import { loadInputs, riggingInputs } from './inputs-load';
import { environmentInputs, groundInputs, personnelInputs, reevingInputs, siteInputs } from './inputs-site';
import { severalCranesInputs } from './cranes-section';
import type { Flow } from './layout';
import type { Obj } from './read-inputs';

type InputGroup = (flow: Flow, inputs: Obj, result: LiftResult | null) => void;

const INPUT_GROUPS: InputGroup[] = [
  craneInputs,
  chartInputs,
  loadInputs,
  riggingInputs,
  reevingInputs,
  groundInputs,
  environmentInputs,
  severalCranesInputs,
  personnelInputs,
  siteInputs,
];

export function inputsSection(flow: Flow, inputs: Obj, result: LiftResult | null) {
  flow.para('Shown as the contractor entered them, in their own units.', {
    size: 7.5,
    color: INK_SOFT,
    gap: 0,
  });
  for (const group of INPUT_GROUPS) group(flow, inputs, result);
}
