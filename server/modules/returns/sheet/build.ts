// Lays out the calculation sheet: the decision, caution and summary on the first page, then the
// numbered sections of sections.ts, then the closing note.
import type { PDFDocument, PDFPage } from 'pdf-lib';
import type { StampInput } from '../stamp-input';
import type { Fonts } from '../text-pdf';
import { closingNote } from './closing-sections';
import { cautionPanel, decisionPanel, summaryLine } from './decision-section';
import { Flow } from './layout';
import { inputsInSystem, type Obj } from './read-inputs';
import { SHEET_SECTIONS } from './sections';

export function buildSheet(doc: PDFDocument, fonts: Fonts, entered: StampInput): PDFPage[] {
  const flow = new Flow(doc, fonts);
  // One unit system for the whole sheet: inputs entered in the other one are converted.
  const inputs = inputsInSystem(entered.calculation.inputs, entered.calculation.units) as Obj;
  const input = { ...entered, calculation: { ...entered.calculation, inputs } };
  const { result, units } = input.calculation;
  decisionPanel(flow, input);
  cautionPanel(flow, result);
  if (result) summaryLine(flow, result, units);
  else
    flow.para(
      'No calculation result is stored for this revision: the checks, discrepancies and side view are not shown.',
      { font: fonts.bold },
    );
  let n = 0;
  for (const section of SHEET_SECTIONS) {
    if (section.applies && !section.applies(input)) continue;
    n += 1;
    if (section.needsResult && !result) continue;
    flow.heading(`${n}  ${section.title}`, section.keep);
    section.draw(flow, input);
  }
  closingNote(flow, result);
  return flow.pages;
}
