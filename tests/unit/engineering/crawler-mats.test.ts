// Crawler tracks on mats: rigid mats (common practice, no source, as for mats under outriggers) laid
// across the track and covering the length in contact spread the track pressure over the mat length:
// p_ground = p_track × shoe width ÷ mat length. Worked by hand against the shoes-only figure.
import { describe, expect, it } from 'vitest';
import { LiftInput, type LiftInputRaw } from '@shared/schemas/lift-input';
import { evaluateLift } from '@shared/engineering/evaluate';
import { example, q } from './support';

const pressure = (raw: LiftInputRaw) =>
  evaluateLift(LiftInput.parse(raw))
    .checks.find((c) => c.id === 'ground-bearing')!
    .items.find((i) => i.id === 'ground-bearing.pressure')!;

function withMats(mat: Record<string, unknown> | undefined): LiftInputRaw {
  const raw = example('pass-crawler.json') as LiftInputRaw & { ground?: Record<string, unknown> };
  return { ...raw, ground: { ...(raw.ground ?? {}), ...(mat ? { mat } : {}) } } as LiftInputRaw;
}

describe('crawler tracks on mats', () => {
  it('when mats 3.6 m across cover the track, then the ground pressure is the track pressure × 1.2 ÷ 3.6', () => {
    const shoes = pressure(withMats(undefined));
    // 7 mats 1.2 m wide cover 8.4 m, more than the 7.4 m track
    const mats = pressure(withMats({ length: q(3.6, 'm'), width: q(1.2, 'm'), perSupport: 7 }));
    expect(mats.value! / shoes.value!).toBeCloseTo(1.2 / 3.6, 12);
    expect(mats.label).toBe('Peak bearing pressure under the track mats');
    expect(mats.source.kind).toBe('common_practice');
    expect(mats.formulaText).toContain('across the track');
  });

  it('when the mats do not cover the length in contact, then the pressure stays that of the shoes and says why', () => {
    const shoes = pressure(withMats(undefined));
    const short = pressure(withMats({ length: q(3.6, 'm'), width: q(1.2, 'm'), perSupport: 2 }));
    expect(short.value).toBe(shoes.value);
    expect(short.message).toMatch(/do not cover/);
  });

  it('when the mats are no wider than the shoe, then they do not spread the pressure', () => {
    const shoes = pressure(withMats(undefined));
    const narrow = pressure(withMats({ length: q(1.2, 'm'), width: q(1.2, 'm'), perSupport: 7 }));
    expect(narrow.value).toBe(shoes.value);
  });
});
