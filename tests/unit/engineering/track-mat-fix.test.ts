// "What would fix it" for a failed bearing pressure under crawler tracks: rigid mats across the
// track (common practice, no source) give p_ground = p_track × shoe ÷ mat length when they cover the
// length in contact, so the mat length that brings the peak to the allowable is p_track × shoe ÷
// allowable. Checked by applying the fix: the pressure then equals the allowable and does not fail.
import { describe, expect, it } from 'vitest';
import { LiftInput, type LiftInputRaw } from '@shared/schemas/lift-input';
import { evaluateLift } from '@shared/engineering/evaluate';
import { example, q } from './support';

const run = (raw: LiftInputRaw) => evaluateLift(LiftInput.parse(raw));
const pressure = (raw: LiftInputRaw) =>
  run(raw)
    .checks.find((c) => c.id === 'ground-bearing')!
    .items.find((i) => i.id === 'ground-bearing.pressure')!;
function crawler(ground: Record<string, unknown>): LiftInputRaw {
  return { ...(example('pass-crawler.json') as LiftInputRaw), ground } as LiftInputRaw;
}

describe('mat size that fixes a failed bearing under crawler tracks', () => {
  it('when the track pressure is 2.5 × the allowable, then the fix asks for mats 2.5 × the 1.2 m shoe across the track, and they bring it within', () => {
    const shoes = pressure(crawler({ allowableBearing: q(250, 'kPa') })).value!;
    const allowable = shoes / 2.5; // Pa
    const failed = crawler({
      allowableBearing: q(allowable / 1000, 'kPa'),
      mat: { length: q(1.2, 'm'), width: q(1.2, 'm'), perSupport: 7 },
    });
    const r = run(failed);
    expect(pressure(failed).status).toBe('fail');
    const fx = r.fixes.find((x) => x.kind === 'track_mat_length')!;
    // by hand: 1.2 m × 2.5 = 3.00 m across the track; 7 mats 1.2 m wide cover the 7.4 m track
    expect(fx.value).toBeCloseTo(3, 9);
    expect(fx.unit).toBe('length');
    const contact = r.checks
      .find((c) => c.id === 'ground-bearing')!
      .items.find((i) => i.id === 'ground-bearing.track-contact')!.value!;
    const count = Math.ceil(contact / 1.2 - 1e-9);
    expect(fx.text).toContain(`${count} mats 1.20 m wide per track`);
    // apply the fix: mats 3.0 m across, `count` of them along each track
    const fixed = crawler({
      allowableBearing: q(allowable / 1000, 'kPa'),
      mat: { length: q(fx.value, 'm'), width: q(1.2, 'm'), perSupport: count },
    });
    const p = pressure(fixed);
    expect(p.value! / allowable).toBeCloseTo(1, 9);
    expect(p.status).not.toBe('fail');
    expect(run(fixed).fixes.some((x) => x.kind === 'track_mat_length')).toBe(false);
  });

  it('when no mats are entered, then the fix still gives the mat length across the track, without a count', () => {
    const shoes = pressure(crawler({ allowableBearing: q(250, 'kPa') })).value!;
    const r = run(crawler({ allowableBearing: q(shoes / 2 / 1000, 'kPa') }));
    const fx = r.fixes.find((x) => x.kind === 'track_mat_length')!;
    expect(fx.value).toBeCloseTo(2.4, 9);
    expect(fx.text).not.toContain('mats 1.20 m wide');
  });

  it('when the track pressure is within the allowable, then there is no track-mat fix', () => {
    expect(
      run(crawler({ allowableBearing: q(250, 'kPa') })).fixes.some((x) => x.kind === 'track_mat_length'),
    ).toBe(false);
  });
});
