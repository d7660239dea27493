// Section 1 of the calculation sheet: the inputs as submitted, group by group in the order of the
// editor's steps. Each group prints only what was entered; a new group is one function here.
import type { LiftResult } from '@shared/engineering/types';
import { UNIT_SYSTEM_WORDS } from '@shared/vocabulary/units';
import type { UnitSystem } from '@shared/schemas/common';
import { INK_SOFT } from '../text-pdf';
import { chartInputs, craneInputs } from './inputs-crane';
import { loadInputs, riggingInputs } from './inputs-load';
import { environmentInputs, groundInputs, personnelInputs, reevingInputs, siteInputs } from './inputs-site';
import { severalCranesInputs } from './cranes-section';
import type { Flow } from './layout';
import { anyConverted, type Obj } from './read-inputs';

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

export function inputsSection(flow: Flow, inputs: Obj, result: LiftResult | null, units: UnitSystem) {
  const note = anyConverted(inputs)
    ? `Shown as the contractor entered them; figures entered in the other unit system are converted to this document's ${UNIT_SYSTEM_WORDS[units]} units, to four significant figures.`
    : 'Shown as the contractor entered them.';
  flow.para(note, {
    size: 7.5,
    color: INK_SOFT,
    gap: 0,
  });
  for (const group of INPUT_GROUPS) group(flow, inputs, result);
}
