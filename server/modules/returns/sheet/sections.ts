// The calculation sheet's numbered sections, in order, as data: a title, how much room to keep
// with the heading, whether it needs a result, and the function that lays it out. The sheet is
// built by walking this list (build.ts); adding a section is adding an entry.
import { INK_SOFT } from '../text-pdf';
import type { StampInput } from '../stamp-input';
import { checksSection } from './checks-section';
import { cranesSection } from './cranes-section';
import { criticalSection, fixesSection, SIDE_VIEW_HEIGHT, sideViewSection } from './closing-sections';
import { discrepanciesSection, findingsSection } from './discrepancies-section';
import { inputsSection } from './inputs-section';
import type { Flow } from './layout';

export interface SheetSection {
  title: string;
  /** Points of content kept on the heading's page (default 60). */
  keep?: number;
  /** Left out altogether when the revision has no stored result. */
  needsResult?: boolean;
  /** Left out, and not numbered, when this says the lift has nothing for it (default: always shown). */
  applies?: (input: StampInput) => boolean;
  draw: (flow: Flow, input: StampInput) => void;
}

export const SHEET_SECTIONS: SheetSection[] = [
  {
    title: 'Inputs as submitted',
    draw: (flow, { calculation: c }) => inputsSection(flow, c.inputs, c.result, c.units),
  },
  {
    title: 'Checks',
    keep: 80,
    needsResult: true,
    draw: (flow, { calculation: c }) => {
      flow.para(
        'Each check recomputed from the inputs: value, limit, outcome and where the limit comes from; the formula in words under each line. Figures to three significant figures.',
        { size: 7.5, color: INK_SOFT, gap: 2 },
      );
      if (c.result) checksSection(flow, c.result, c.units);
    },
  },
  {
    title: 'Shares of the cranes',
    keep: 80,
    needsResult: true,
    applies: ({ calculation: c }) => !!c.result?.cranes,
    draw: (flow, { calculation: c }) => {
      if (c.result) cranesSection(flow, c.result, c.units);
    },
  },
  {
    title: 'Contractor figures and how they were resolved',
    draw: (flow, input) => {
      discrepanciesSection(flow, input);
      flow.subheading('Findings');
      findingsSection(flow, input);
    },
  },
  {
    title: 'Why the lift is critical',
    keep: 30,
    draw: (flow, { calculation: c }) => criticalSection(flow, c.result, c.units),
  },
  {
    title: 'Fixes the check suggests',
    keep: 30,
    draw: (flow, { calculation: c }) => fixesSection(flow, c.result),
  },
  { title: 'Side view', keep: SIDE_VIEW_HEIGHT, draw: sideViewSection },
];
