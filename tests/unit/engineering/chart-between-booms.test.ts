// Defect 4: between two listed boom lengths the chart is read conservatively — the lower of the two
// bracketing columns, each at its next longer radius (common practice, no source: never interpolate
// a load chart upward) — and duplicate rows are an input error naming both rows.
import { describe, expect, it } from 'vitest';
import { lookupCapacity, type ChartRowSI } from '@shared/engineering/chart';
import { LiftInput } from '@shared/schemas/lift-input';
import { outriggerLift, q } from './support';

const row = (radius: number, capacity: number, boomLength: number, interp = false): ChartRowSI => ({
  radius,
  boomLength,
  capacity,
  interpolationAllowed: interp,
});

describe('chart reading between boom lengths', () => {
  // The shorter boom rates less at 12 m (14 against 16): a 33 m boom is not rated above 14.
  const rows = [row(10, 20, 30), row(12, 14, 30), row(10, 22, 36), row(12, 16, 36), row(14, 12, 36)];
  it('when the shorter column rates less at that radius, then the shorter column governs', () => {
    const r = lookupCapacity(rows, 33, 12);
    expect(r.capacity).toBe(14);
    expect(r.boomLengthUsed).toBe(30);
  });
  it('when the radius falls between rows, then each column is read at its next longer radius first', () => {
    // 30 m column at 11 m → 14 (12 m row); 36 m column at 11 m → 16; lower is 14
    expect(lookupCapacity(rows, 33, 11).capacity).toBe(14);
  });
  it('when the longer column rates less, then the longer column governs', () => {
    const r = lookupCapacity([row(10, 25, 30), row(12, 20, 30), row(10, 22, 36), row(12, 16, 36)], 33, 12);
    expect(r.capacity).toBe(16);
  });
  it('when the shorter column does not reach the radius, then only the longer column rates it', () => {
    expect(lookupCapacity(rows, 33, 14).capacity).toBe(12);
  });
  it('when every row involved allows interpolation, then the capacity is interpolated between columns', () => {
    const ir = [row(12, 14, 30, true), row(12, 16, 36, true)];
    expect(lookupCapacity(ir, 33, 12).capacity).toBeCloseTo(15, 12);
  });
  it('when two rows list the same boom length and radius, then the input error names both rows', () => {
    const l = outriggerLift();
    l.chart.rows.push({ radius: q(32.8084, 'ft'), boomLength: q(20, 'm'), capacity: q(25, 't') });
    const r = LiftInput.safeParse(l);
    expect(r.success).toBe(false);
    if (r.success) return;
    const msg = r.error.issues.map((i) => i.message).join('\n');
    expect(msg).toMatch(/chart\.rows\[1\] and chart\.rows\[4\] list the same boom length and radius/);
  });
});
