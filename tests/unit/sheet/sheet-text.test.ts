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
  ['pass-spreader-beam', 'metric'],
  ['pass-gantry-a-frame', 'imperial'],
  ['fail-tandem', 'metric'],
  ['caution-two-cranes', 'metric'],
  ['caution-three-cranes', 'metric'],
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

describe('calculation sheet of a lift with several cranes', () => {
  it('when two cranes share the launder, then the sheet prints each share worked by hand, its range and one side view per crane', async () => {
    // Hand: W 16 t, picks at x −6 m and +6 m, centre of gravity at x 0.6 m.
    // west = 16 × (6 − 0.6) / 12 = 7.20 t, east = 16 × (6 + 0.6) / 12 = 8.80 t; the centre of gravity
    // moved 5% of 12 m = 0.6 m each way: west 16 × 4.8/12 = 6.40 t to 16 × 6/12 = 8.00 t.
    const text = (await sheetText('caution-two-cranes', 'metric')).replace(/\s+/g, ' ');
    expect(text).toContain('3 Shares of the cranes');
    expect(text).toMatch(/1\. HR-60 west −6\.00 m, 0 m 7\.20 t 6\.40 t – 8\.00 t/);
    expect(text).toMatch(/2\. HR-60 east \(invented\) 6\.00 m, 0 m 8\.80 t 8\.00 t – 9\.60 t/);
    expect(text).toContain('20% for 2 cranes');
    expect(text).toContain('SIDE VIEW OF CRANE 1 (HR-60 WEST) FOR ITS SHARE');
    expect(text).toContain('SIDE VIEW OF CRANE 2 (HR-60 EAST (INVENTED)) FOR ITS SHARE');
  });

  it('when a version 1 tandem input is printed, then it is upgraded: both cranes listed with their pick points and stated capacities', async () => {
    const text = (await sheetText('fail-tandem', 'metric')).replace(/\s+/g, ' ');
    expect(text).toMatch(/1\. HR-60 \(Harbour Row\) x -7 m, y 0 m — 6\.5 t/);
    expect(text).toMatch(/2\. KL-45 \(Kestrel Lifting\) x 9 m, y 0 m — 5\.5 t 0\.35 t/);
    expect(text).not.toContain('TANDEM LIFT');
  });
});
