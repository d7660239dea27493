// Chart reading rules, display formatting, the example inputs, the JSON Schema and the CLI.
import { describe, expect, it } from 'vitest';
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { lookupCapacity, type ChartRowSI } from '@shared/engineering/chart';
import { formatPercentOf, formatQuantity, sig3 } from '@shared/engineering/format';
import { liftInputJsonSchema } from '@shared/engineering/json-schema';
import { checkLift } from '@shared/engineering/evaluate';
import { POLICY_DEFAULTS, SitePolicy } from '@shared/schemas/site-policy';
import { badNumbers, example, exampleNames, G, EXAMPLES_DIR } from './support';

const row = (
  radius: number,
  capacity: number,
  boomLength = 30,
  interpolationAllowed = false,
): ChartRowSI => ({ radius, boomLength, capacity, interpolationAllowed });

describe('chart reading (common practice, no source: never interpolate upward)', () => {
  const rows = [row(10, 20), row(12, 16), row(14, 12), row(10, 18, 36), row(12, 14, 36), row(14, 11, 36)];
  it('when the radius falls between rows, then the next longer radius (lower capacity) is used', () => {
    expect(lookupCapacity(rows, 30, 11).capacity).toBe(16);
  });
  it('when the boom length falls between columns, then the next longer boom length is used', () => {
    expect(lookupCapacity(rows, 33, 12).capacity).toBe(14);
  });
  it('when both rows allow interpolation, then the capacity is linear between them', () => {
    expect(lookupCapacity([row(10, 20, 30, true), row(12, 16, 30, true)], 30, 11).capacity).toBeCloseTo(
      18,
      12,
    );
  });
  it('when only one of the bracketing rows allows interpolation, then no interpolation', () => {
    expect(lookupCapacity([row(10, 20, 30, true), row(12, 16, 30, false)], 30, 11).capacity).toBe(16);
  });
  it('when the radius is beyond the last row or short of the first, then it is outside the chart', () => {
    expect(lookupCapacity(rows, 30, 14.01).outside).toMatch(/beyond the last row/);
    expect(lookupCapacity(rows, 30, 9).outside).toMatch(/shorter than the shortest/);
    expect(lookupCapacity(rows, 37, 12).outside).toMatch(/boom length longer/);
  });
});

describe('display formatting', () => {
  it('when values are formatted, then three significant figures in the chosen system', () => {
    expect(sig3(16)).toBe('16.0');
    expect(sig3(12000)).toBe('12,000');
    expect(sig3(0.6125)).toBe('0.613');
    expect(formatQuantity(16000 * G, 'weight', 'metric')).toBe('16.0 t');
    expect(formatQuantity(850 * G, 'weight', 'metric')).toBe('850 kg');
    expect(formatQuantity(35300 * 0.45359237 * G, 'weight', 'imperial')).toBe('35.3 kip');
    expect(formatQuantity(10 * 0.3048, 'length', 'imperial')).toBe('10.0 ft');
    expect(formatQuantity(47.880259, 'pressure', 'imperial')).toBe('1.00 psf');
    expect(formatQuantity(0.44704 * 20, 'speed', 'imperial')).toBe('20.0 mph');
    expect(formatQuantity(1000 * 0.45359237 * G * 0.3048 * 100, 'moment', 'imperial')).toBe('100 kip·ft');
    expect(formatQuantity(250000, 'pressure', 'metric')).toBe('250 kPa');
  });
  it('when a percentage of a capacity is shown, then it reads "82% of 16.0 t"', () => {
    expect(formatPercentOf(82, 16000 * G, 'weight', 'metric')).toBe('82% of 16.0 t');
    expect(formatPercentOf(85.44, 16000 * G, 'weight', 'metric')).toBe('85.4% of 16.0 t');
  });
});

describe('site policy defaults', () => {
  it('when the admin page lists the defaults, then each has a value, a label and a source', () => {
    const parsed = SitePolicy.parse({});
    for (const [k, d] of Object.entries(POLICY_DEFAULTS)) {
      expect(d.source.text.length).toBeGreaterThan(5);
      expect(parsed[k as keyof typeof parsed]).toEqual(d.value);
    }
    expect(parsed.minStabilityRatio).toBe(1.5);
    expect(parsed.criticalThresholdPct).toBe(75);
    expect(parsed.minSlingAngleDeg).toBe(30);
  });
});

describe('example inputs', () => {
  const expected: Record<string, { overall: string; check?: [string, string] }> = {
    'pass-outriggers.json': { overall: 'pass' },
    'pass-imperial-units.json': { overall: 'pass' },
    'pass-crawler.json': { overall: 'pass' },
    'pass-gantry-a-frame.json': { overall: 'pass' },
    'pass-spreader-beam.json': { overall: 'pass', check: ['rigging', 'pass'] },
    'caution-capacity-critical.json': { overall: 'caution', check: ['capacity', 'caution'] },
    'caution-discrepancies.json': { overall: 'caution' },
    'caution-tandem.json': { overall: 'caution', check: ['critical-triggers', 'caution'] },
    'caution-two-cranes.json': { overall: 'caution', check: ['tandem', 'pass'] },
    'caution-three-cranes.json': { overall: 'caution', check: ['tandem', 'pass'] },
    'fail-capacity.json': { overall: 'fail', check: ['capacity', 'fail'] },
    'fail-outside-chart.json': { overall: 'fail', check: ['capacity', 'fail'] },
    'fail-stability.json': { overall: 'fail', check: ['stability', 'fail'] },
    'fail-ground-bearing.json': { overall: 'fail', check: ['ground-bearing', 'fail'] },
    'fail-ground-no-presumptive-value.json': { overall: 'fail', check: ['ground-bearing', 'fail'] },
    'fail-rigging.json': { overall: 'fail', check: ['rigging', 'fail'] },
    'fail-reeving.json': { overall: 'fail', check: ['reeving', 'fail'] },
    'fail-power-line.json': { overall: 'fail', check: ['power-line', 'fail'] },
    'fail-wind.json': { overall: 'fail', check: ['wind', 'fail'] },
    'fail-geometry-headroom.json': { overall: 'fail', check: ['geometry', 'fail'] },
    'fail-tandem.json': { overall: 'fail', check: ['tandem', 'fail'] },
    'fail-personnel.json': { overall: 'fail', check: ['personnel', 'fail'] },
  };
  it('when the examples folder is listed, then every example has an expectation here', () => {
    expect(exampleNames().sort()).toEqual(Object.keys(expected).sort());
  });
  it.each(Object.entries(expected))(
    'when %s is checked, then the outcome is as its name says',
    (name, exp) => {
      const out = checkLift(example(name));
      expect(out.ok).toBe(true);
      if (!out.ok) return;
      expect(out.result.overallStatus).toBe(exp.overall);
      if (exp.check) expect(out.result.checks.find((c) => c.id === exp.check![0])!.status).toBe(exp.check[1]);
      expect(badNumbers(out.result)).toEqual([]);
      expect(out.result.cautions.join(' ')).toMatch(/does not replace the crane manufacturer/);
    },
  );
  it('when the two- and three-crane examples are checked, then every crane is checked for its share', () => {
    for (const [name, n] of [
      ['caution-two-cranes.json', 2],
      ['caution-three-cranes.json', 3],
    ] as const) {
      const out = checkLift(example(name));
      if (!out.ok) throw new Error('invalid');
      expect(out.result.cranes).toHaveLength(n);
      const total = out.result.cranes!.reduce((a, c) => a + c.share!, 0);
      expect(total).toBeCloseTo(out.result.multiCrane!.loadWeight, 6);
      for (const c of out.result.cranes!) expect(c.checks.length).toBeGreaterThan(5);
    }
  });
  it('when the discrepancy example is checked, then the understated gross load is flagged on the unsafe side', () => {
    const out = checkLift(example('caution-discrepancies.json'));
    if (!out.ok) throw new Error('invalid');
    const g = out.result.discrepancies.find((d) => d.figure === 'grossLoad')!;
    expect(g.status).toBe('discrepancy');
    expect(g.unsafeSide).toBe(true);
  });
  it('when failing capacity and stability examples are checked, then they carry fixes', () => {
    const cap = checkLift(example('fail-capacity.json'));
    const st = checkLift(example('fail-stability.json'));
    if (!cap.ok || !st.ok) throw new Error('invalid');
    expect(cap.result.fixes.map((f) => f.kind)).toContain('max_radius');
    expect(st.result.fixes.map((f) => f.kind).sort()).toEqual([
      'counterweight_arm',
      'extra_counterweight',
      'max_radius',
    ]);
  });
});

describe('JSON Schema', () => {
  it('when the JSON Schema is generated, then it does not throw and describes crane, chart and load', () => {
    const s = liftInputJsonSchema() as { properties: Record<string, unknown>; required: string[] };
    expect(Object.keys(s.properties)).toEqual(expect.arrayContaining(['crane', 'chart', 'load', 'stated']));
    expect(s.required).toEqual(expect.arrayContaining(['crane', 'chart', 'load']));
  });
});

describe('command line', () => {
  const cli = (...args: string[]) =>
    spawnSync('npx', ['tsx', 'scripts/check-lift.ts', ...args], { encoding: 'utf8' });
  it('when a passing example is checked in imperial units, then it prints the table and exits 0', () => {
    const out = execFileSync(
      'npx',
      ['tsx', 'scripts/check-lift.ts', EXAMPLES_DIR + 'pass-outriggers.json', '--units', 'imperial'],
      { encoding: 'utf8' },
    );
    expect(out).toMatch(/Overall: pass/);
    expect(out).toMatch(/kip/);
    expect(out).toMatch(/does not replace/);
  });
  it('when a failing example is checked as JSON, then it prints the result and exits 1', () => {
    const r = cli(EXAMPLES_DIR + 'fail-stability.json', '--format', 'json');
    expect(r.status).toBe(1);
    expect(JSON.parse(r.stdout).resultVersion).toBe(2);
  });
  it('when the file is missing or the input invalid, then a clear message and a non-zero exit', () => {
    const missing = cli('no-such-file.json');
    expect(missing.status).toBe(3);
    expect(missing.stderr).toMatch(/file not found/);
    const dir = mkdtempSync(join(tmpdir(), 'lift-'));
    writeFileSync(
      join(dir, 'bad.json'),
      JSON.stringify({ ...example('pass-outriggers.json'), load: { weight: { value: -2, unit: 't' } } }),
    );
    const invalid = cli(join(dir, 'bad.json'));
    expect(invalid.status).toBe(2);
    expect(invalid.stderr).toMatch(/load\.weight\.value: load\.weight must be 0 or more/);
    const bad = cli(EXAMPLES_DIR + '../context.ts');
    expect(bad.status).toBe(3);
    expect(bad.stderr).toMatch(/not valid JSON/);
  });
});
