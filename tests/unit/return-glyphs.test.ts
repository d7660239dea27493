// Every character of the stamped return prints as itself (issue 12): ≤ ≥ × ° ² – in finding text,
// conditions, responses and the engine's own words read back from pdftotext as typed, never as
// "<=" / ">=" substitutes; long conditions and findings print in full, wrapped, the stamp block
// pointing to the calculation sheet and a table row taller than a page going on over the next.
import { execFileSync } from 'node:child_process';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildStampedReturn, type StampInput } from '@server/modules/returns/stamp-pdf';
import { exampleResult, stampInput } from './stamp-fixtures';

const SHEET_FIRST_PAGE = 4; // the fixtures' plan (2 pages) and drawing (1 page) come first

function pdftotext(bytes: Uint8Array, args: string[] = []): string {
  return execFileSync('/usr/bin/pdftotext', [...args, '-', '-'], {
    input: Buffer.from(bytes),
    maxBuffer: 64 * 1024 * 1024,
  }).toString();
}

const flat = (s: string) => s.replace(/\s+/g, ' ');

/** Every word pdftotext finds, with its page's height and its box (y from the top). */
function words(bytes: Uint8Array) {
  const xml = pdftotext(bytes, ['-bbox']);
  const out: Array<{ page: number; height: number; yMin: number; yMax: number; text: string }> = [];
  let page = 0;
  let height = 0;
  for (const line of xml.split('\n')) {
    const p = /<page width="[\d.]+" height="([\d.]+)"/.exec(line);
    if (p) {
      page += 1;
      height = Number(p[1]);
      continue;
    }
    const w = /<word xMin="[\d.]+" yMin="([\d.]+)" xMax="[\d.]+" yMax="([\d.]+)">([^<]*)<\/word>/.exec(line);
    if (w) out.push({ page, height, yMin: Number(w[1]), yMax: Number(w[2]), text: w[3] });
  }
  return out;
}

const CONDITION = 'Outriggers ≤ 7.2 m × 7 m; stop when wind ≥ 9 m/s; slew 0°–180°; mats 2.25 m² each.';
const FINDING =
  'Stated radius 11 m ≤ recomputed 12 m; sling angle ≥ 60°; 3 × 2 mats of 2.25 m² – see sheet 2.';
const RESPONSE = 'Revised: bearing 127 kPa ≤ 300 kPa, clearance ≥ 3.05 m, 1.5 m × 1.5 m mats.';

describe('stamped return characters', () => {
  let input: StampInput;
  let all: string;
  let firstPage: string;
  let sheet: string;

  beforeAll(async () => {
    input = await stampInput({ conditions: CONDITION });
    const { inputs, result } = exampleResult('caution-two-cranes');
    input.calculation = {
      ...input.calculation,
      inputs,
      result,
      findings: [{ ...input.calculation.findings[0], text: FINDING, response: RESPONSE, checkId: null }],
    };
    const bytes = await buildStampedReturn(input);
    all = pdftotext(bytes);
    firstPage = flat(pdftotext(bytes, ['-f', '1', '-l', '1']));
    sheet = flat(pdftotext(bytes, ['-f', String(SHEET_FIRST_PAGE)]));
  });

  it('when conditions, a finding and its response hold ≤ ≥ × ° ² –, then pdftotext reads them as typed', () => {
    expect(firstPage).toContain(CONDITION);
    expect(sheet).toContain(CONDITION);
    expect(sheet).toContain(FINDING);
    expect(sheet).toContain(RESPONSE);
    // the free-text markup on the plan
    expect(firstPage).toContain('Check sling angle ≥ 60° — see finding 1');
  });

  it('when the engine and the inputs write ≤ × ° ² and a range with an en dash, then those print too', () => {
    expect(sheet).toContain('SAE J765: rated load ≤ 85% of tipping load');
    expect(sheet).toContain('7.2 m long × 7 m across');
    expect(sheet).toMatch(/Wind area 19\.6 m²/);
    expect(sheet).toMatch(/slew \d+°/);
    expect(sheet).toContain('6.40 t – 8.00 t');
  });

  it('when the return is read, then no plain-text substitute of a symbol is left', () => {
    for (const substitute of ['<=', '>=', '->', '=>', 'sqrt', ' theta ', ' rho ', 'sum <'])
      expect(all, substitute).not.toContain(substitute);
  });
});

describe('long conditions and findings', () => {
  it('when a condition is 1,500 characters, then the stamp points to the sheet and the sheet prints all of it', async () => {
    const clauses: string[] = [];
    for (let i = 1; clauses.join(' ').length < 1500; i++)
      clauses.push(`Clause ${i}: keep the exclusion zone ≥ 6 m clear and the mats ≤ 2.25 m² apart.`);
    const condition = clauses.join(' ');
    expect(condition.length).toBeGreaterThanOrEqual(1500);
    const bytes = await buildStampedReturn(await stampInput({ conditions: condition }));
    const first = flat(pdftotext(bytes, ['-f', '1', '-l', '1']));
    expect(first).toContain('Clause 1: keep the exclusion zone ≥ 6 m clear');
    expect(first).toContain(`see calculation sheet, page ${SHEET_FIRST_PAGE}`);
    expect(first).not.toContain(clauses[clauses.length - 1]);
    expect(flat(pdftotext(bytes, ['-f', String(SHEET_FIRST_PAGE)]))).toContain(condition);
  });

  it('when a finding and its response are 4,000 characters, then every word prints once, inside a page', async () => {
    const tokens = (prefix: string) =>
      Array.from({ length: 800 }, (_, i) => `${prefix}${String(i).padStart(3, '0')}`).join(' ');
    const input = await stampInput();
    const text = tokens('f');
    const response = tokens('r');
    expect(text.length).toBe(3999);
    input.calculation.findings[0] = { ...input.calculation.findings[0], text, response };
    const found = words(await buildStampedReturn(input)).filter((w) => /^[fr]\d{3}$/.test(w.text));
    const seen = found.map((w) => w.text).sort();
    expect(seen).toEqual([...text.split(' '), ...response.split(' ')].sort());
    // inside the page and above the sheet's bottom margin (40 pt) and footer
    for (const w of found) {
      expect(w.yMin, w.text).toBeGreaterThan(0);
      expect(w.yMax, w.text).toBeLessThan(w.height - 30);
    }
    // the row went on over a second page, under the table's repeated header
    expect(new Set(found.map((w) => w.page)).size).toBeGreaterThan(1);
  });
});
