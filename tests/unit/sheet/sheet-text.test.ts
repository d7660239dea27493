// The calculation sheet's words, read back with pdftotext, match the text recorded before the
// sheet was split into sections (tests/unit/sheet/baseline/): the same labels, values, status
// words and order for lifts of every crane type and both unit systems.
// Set UPDATE_SHEET_TEXT=1 to record a new baseline after a deliberate change of wording.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildStampedReturn } from '@server/modules/returns/stamp-pdf';
import { exampleResult, stampInput } from '../stamp-fixtures';

const CASES: Array<[string, 'metric' | 'imperial']> = [
  ['caution-discrepancies', 'metric'],
  ['pass-imperial-units', 'imperial'],
  ['pass-crawler', 'metric'],
  ['pass-gantry-a-frame', 'imperial'],
  ['fail-tandem', 'metric'],
  ['caution-two-cranes', 'metric'],
  ['fail-personnel', 'imperial'],
  ['fail-power-line', 'metric'],
];
const baseDir = new URL('./baseline/', import.meta.url);

async function sheetText(name: string, units: 'metric' | 'imperial'): Promise<string> {
  const input = await stampInput();
  const { inputs, result } = exampleResult(name, units);
  input.calculation = { ...input.calculation, inputs, result, units };
  const bytes = await buildStampedReturn(input);
  // The plan and drawing fixtures have three pages; the sheet starts on the fourth.
  return execFileSync('/usr/bin/pdftotext', ['-layout', '-f', '4', '-', '-'], {
    input: Buffer.from(bytes),
  }).toString();
}

describe('calculation sheet text', () => {
  for (const [name, units] of CASES)
    it(`when the sheet for ${name} (${units}) is read, then its text is the recorded text`, async () => {
      const text = await sheetText(name, units);
      const file = new URL(`${name}-${units}.txt`, baseDir);
      if (process.env.UPDATE_SHEET_TEXT === '1' || !existsSync(file)) {
        mkdirSync(baseDir, { recursive: true });
        writeFileSync(file, text);
        if (process.env.UPDATE_SHEET_TEXT !== '1') throw new Error(`no baseline: recorded ${file.pathname}`);
      }
      expect(text).toBe(readFileSync(file, 'utf8'));
    });
});
