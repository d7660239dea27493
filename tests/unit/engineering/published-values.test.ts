// Checks against values published outside the project; the source is named beside each test.
// See the project reference notes (REFERENCES.md beside the repository) for how each value was read ("read" vs "from memory").
import { describe, expect, it } from 'vitest';
import { minimumClearanceFt } from '@shared/engineering/checks/power-line';
import { angleFactor, hitchFactor, twoLegTensions } from '@shared/engineering/checks/rigging';
import { IBC_1806_2_PSF } from '@shared/engineering/checks/ground-bearing-pressure';
import {
  leadLineFactor,
  SHEAVE_BEARING_CONSTANT,
  ROPE_DESIGN_FACTOR,
} from '@shared/engineering/checks/reeving';
import { dynamicPressure } from '@shared/engineering/checks/wind';
import { twoCraneShares, tandemMarginPct } from '@shared/engineering/checks/tandem';
import { DEFAULT_POLICY, POLICY_DEFAULTS } from '@shared/schemas/site-policy';
import { checkOf, findItem, G, outriggerLift, q, run } from './support';

describe('power-line clearance — OSHA 29 CFR 1926.1408 Table A (read)', () => {
  it.each([
    [0.12, 10],
    [11, 10],
    [50, 10],
    [50.1, 15],
    [132, 15],
    [200, 15],
    [200.1, 20],
    [345, 20],
    [350, 20],
    [350.1, 25],
    [500, 25],
    [500.1, 35],
    [750, 35],
    [750.1, 45],
    [1000, 45],
  ])('when the line is %s kV, then the minimum clearance is %s ft', (kV, ft) => {
    expect(minimumClearanceFt(kV)).toBe(ft);
  });

  it('when the line is over 1,000 kV, then there is no table value (utility or registered PE sets it)', () => {
    expect(minimumClearanceFt(1000.1)).toBeNull();
    const lift = outriggerLift();
    lift.environment = { powerLines: [{ voltage: q(1100, 'kV'), distance: q(100, 'ft') }] };
    const it1 = findItem(run(lift), 'power-line.clearance-1');
    expect(it1.status).toBe('fail');
    expect(it1.message).toMatch(/utility|professional engineer/);
  });

  it('when a 200 kV line is 14.9 ft away, then it fails; at 15 ft it is not a failure (15 ft, "to" includes 200 kV)', () => {
    const lift = outriggerLift();
    lift.environment = { powerLines: [{ voltage: q(200, 'kV'), distance: q(14.9, 'ft') }] };
    expect(findItem(run(lift), 'power-line.clearance-1').status).toBe('fail');
    lift.environment = { powerLines: [{ voltage: q(200, 'kV'), distance: q(15, 'ft') }] };
    expect(findItem(run(lift), 'power-line.clearance-1').status).not.toBe('fail');
    expect(findItem(run(lift), 'power-line.clearance-1').limit).toBeCloseTo(15 * 0.3048, 12);
  });

  it('when a 50 kV line is given in volts (50,000 V), then the limit is still 10 ft', () => {
    const lift = outriggerLift();
    lift.environment = { powerLines: [{ voltage: q(50000, 'V'), distance: q(40, 'ft') }] };
    expect(findItem(run(lift), 'power-line.clearance-1').limit).toBeCloseTo(3.048, 12);
  });
});

describe('personnel — OSHA 29 CFR 1926.1431: platform, rigging and occupants ≤ 50% of rated capacity (read)', () => {
  it('when the default policy is used, then the personnel limit is 50% and cites 1926.1431', () => {
    expect(DEFAULT_POLICY.personnelLimitPct).toBe(50);
    expect(POLICY_DEFAULTS.personnelLimitPct.source.text).toContain('1926.1431');
  });

  it('when platform, rigging, occupants and hook block are 50% of the 24 t rated capacity, then it passes the limit; just over 50% fails', () => {
    // chart capacity at 10 m = 24 t; 50% = 12 t; the 0.5 t hook block counts (everything on the hook)
    const lift = outriggerLift();
    lift.personnel = {
      platformWeight: q(10500, 'kg'),
      riggingWeight: q(500, 'kg'),
      occupants: 5,
      occupantWeight: q(100, 'kg'),
    };
    const at = findItem(run(lift), 'personnel.load');
    expect(at.value! / G).toBeCloseTo(12000, 6);
    expect(at.limit! / G).toBeCloseTo(12000, 6);
    expect(at.status).not.toBe('fail');
    lift.personnel.occupants = 6;
    expect(findItem(run(lift), 'personnel.load').status).toBe('fail');
  });

  it('when personnel are lifted and the wind is 21 mph, then the wind check fails against 20 mph (1926.1431)', () => {
    const lift = outriggerLift();
    lift.personnel = { platformWeight: q(500, 'kg') };
    lift.environment = { windSpeed: q(21, 'mph') };
    const w = findItem(run(lift, { windLimitMps: 15 }), 'wind.speed');
    expect(w.limit).toBeCloseTo(20 * 0.44704, 9);
    expect(w.status).toBe('fail');
  });
});

describe('sling angle factor 1/sin θ — rigging handbooks, ASME B30.9 practice (read)', () => {
  it.each([
    [90, 1.0],
    [75, 1.035],
    [60, 1.155],
    [50, 1.305],
    [45, 1.414],
    [40, 1.555],
    [30, 2.0],
  ])('when the leg is at %s° from horizontal, then the factor is %s', (deg, factor) => {
    // the table prints three decimals (1/sin 40° = 1.5557 is printed 1.555)
    expect(Math.abs(angleFactor(deg) - factor)).toBeLessThan(0.001);
    // two equal legs each carry W/2 × factor
    const [a, b] = twoLegTensions(1000, deg, deg);
    expect(a).toBeCloseTo(500 * angleFactor(deg), 9);
    expect(b).toBeCloseTo(a, 9);
  });

  it("when the legs are at 25° (below the handbooks' 30° minimum), then the angle item fails", () => {
    const lift = outriggerLift();
    lift.rigging = {
      slings: {
        material: 'wire',
        hitch: 'vertical',
        ratedLoadVertical: q(50, 't'),
        legs: [{ angle: q(25, 'deg') }, { angle: q(25, 'deg') }],
      },
    };
    expect(findItem(run(lift), 'rigging.angle-1').status).toBe('fail');
    lift.rigging.slings!.legs = [{ angle: q(30, 'deg') }, { angle: q(30, 'deg') }];
    expect(findItem(run(lift), 'rigging.angle-1').status).toBe('pass');
  });

  it('when the hitch is choker or basket, then the capacity is 0.75 (wire, read), 0.80 (synthetic, from memory) or 2× (basket, read)', () => {
    expect(hitchFactor('choker', 'wire').factor).toBe(0.75);
    expect(hitchFactor('choker', 'synthetic').factor).toBe(0.8);
    expect(hitchFactor('choker', 'synthetic').source.kind).toBe('from_memory');
    expect(hitchFactor('basket', 'wire').factor).toBe(2);
    expect(hitchFactor('vertical', 'chain').factor).toBe(1);
  });
});

describe('presumptive bearing — IBC Table 1806.2, 2012 edition (read)', () => {
  it('when the soil class is looked up, then the psf values match the table', () => {
    expect(IBC_1806_2_PSF).toEqual({
      crystalline_bedrock: 12000,
      sedimentary_rock: 4000,
      sandy_gravel: 3000,
      sand_silty_clayey: 2000,
      clay_silt: 1500,
      mud_organic_fill: null,
    });
  });

  it('when the ground is clay (1,500 psf), then the limit in the result is 1,500 psf in pascals', () => {
    const lift = outriggerLift();
    lift.ground = { mat: { length: q(2, 'm'), width: q(2, 'm') }, soilClass: 'clay_silt' };
    const p = findItem(run(lift), 'ground-bearing.pressure');
    expect(p.limit).toBeCloseTo((1500 * 0.45359237 * G) / 0.3048 ** 2, 6);
    expect(p.source.text).toContain('1806.2');
  });

  it('when the ground is peat or unprepared fill, then the check fails asking for a geotechnical value', () => {
    const lift = outriggerLift();
    lift.ground = { mat: { length: q(2, 'm'), width: q(2, 'm') }, soilClass: 'mud_organic_fill' };
    const p = findItem(run(lift), 'ground-bearing.pressure');
    expect(p.status).toBe('fail');
    expect(p.message).toMatch(/geotechnical/);
  });
});

describe('reeving — Wire Rope Users Manual, 4th ed. (sheave constants read; closed form from memory)', () => {
  // Part-by-part: each part carries K times the one before it (from the dead end); the lead line
  // has passed S sheaves from the dead end. The hook load is the sum of the N parts.
  function partByPart(K: number, N: number, S: number): number {
    let sum = 0;
    for (let i = 0; i < N; i++) sum += K ** i;
    return K ** S / sum;
  }

  it('when the bearing constants are read, then plain is 1.09 and roller 1.04', () => {
    expect(SHEAVE_BEARING_CONSTANT).toEqual({ plain: 1.09, roller: 1.04 });
  });

  it.each([
    [1.09, 1, 1],
    [1.09, 4, 4],
    [1.09, 4, 6],
    [1.09, 8, 9],
    [1.04, 2, 2],
    [1.04, 6, 7],
    [1.04, 12, 14],
  ])('when K = %s, N = %s, S = %s, then the closed form equals the part-by-part tension sum', (K, N, S) => {
    expect(leadLineFactor(K, N, S)).toBeCloseTo(partByPart(K, N, S), 12);
  });

  it('when 4 parts on plain bearings, then the factor is 0.309 and with two extra lead sheaves 0.367 (WRUM 4th ed. p. 88 worked example)', () => {
    expect(leadLineFactor(1.09, 4, 4)).toBeCloseTo(0.309, 3);
    expect(leadLineFactor(1.09, 4, 6)).toBeCloseTo(0.367, 3);
    // "What is the lead line load on this system with a 6000 lb load?" 6000 × .367 = 2202 lb
    expect(6000 * leadLineFactor(1.09, 4, 6)).toBeCloseTo(2202, -1);
  });

  it('when there is no friction (K → 1), then the factor tends to 1/N', () => {
    expect(leadLineFactor(1.0000001, 5, 5)).toBeCloseTo(0.2, 6);
  });

  it('when the rope is rotation-resistant, then the design factor is 5; running rope 3.5 (ASME B30.6/B30.22, read)', () => {
    expect(ROPE_DESIGN_FACTOR).toEqual({ running: 3.5, rotation_resistant: 5 });
    const lift = outriggerLift();
    lift.reeving = {
      partsOfLine: 4,
      sheavesPassed: 4,
      bearing: 'plain',
      ropeBreakingStrength: q(25, 't'),
      ropeType: 'rotation_resistant',
    };
    expect(findItem(run(lift), 'reeving.rope').limit! / G).toBeCloseTo(5000, 6);
  });
});

describe('wind — q = ½ρv², ρ = 1.225 kg/m³ (read, checked by derivation)', () => {
  it.each([5, 10, 20, 35])('when v = %s m/s, then q = 0.613 v² Pa (to the published rounding)', (v) => {
    expect(dynamicPressure(v) / (v * v)).toBeCloseTo(0.6125, 6);
    expect(Math.abs(dynamicPressure(v) - 0.613 * v * v) / (0.613 * v * v)).toBeLessThan(0.001);
  });

  it.each([10, 20, 30, 60])('when V = %s mph, then q in psf = 0.00256 V² (US form)', (mph) => {
    const qPsf = dynamicPressure(mph * 0.44704) / ((0.45359237 * G) / 0.3048 ** 2);
    expect(Math.abs(qPsf - 0.00256 * mph * mph) / (0.00256 * mph * mph)).toBeLessThan(0.002);
  });

  it('when the load has 10 m² at Cf 1.5 in 10 m/s wind, then F = q·A·Cf = 61.25 × 10 × 1.5 N', () => {
    const lift = outriggerLift();
    lift.load = { weight: q(10, 't'), windArea: q(10, 'm2'), dragCoefficient: 1.5 };
    lift.environment = { windSpeed: q(10, 'm/s') };
    expect(findItem(run(lift, { windLimitMps: 20 }), 'wind.force').value).toBeCloseTo(918.75, 9);
  });
});

describe('rated load against tipping load — ASME B30.5 §5-1.1.1 / SAE J765 (read, secondary copies)', () => {
  it('when the crane is on outriggers, then the comparison limit is 85%; on crawlers 75%', () => {
    const r = run(outriggerLift());
    expect(findItem(r, 'stability.rated-vs-tipping').limit).toBe(85);
    expect(findItem(r, 'stability.rated-vs-tipping').source.text).toMatch(/B30\.5.*J765/);
  });

  it('when the chart rates 86% of the computed tipping load, then it is flagged; 84% is not', () => {
    // Hand-worked lift (see moment-balance tests): tipping load over the side =
    // (resisting 275 t·m − boom 8 t·m) ÷ load arm 7 m = 38.142857 t
    const tipping = (275 - 8) / 7;
    const lift = outriggerLift();
    lift.chart.rows = [q(8, 'm'), q(10, 'm')].map((r) => ({
      radius: r,
      boomLength: q(20, 'm'),
      capacity: q(0.86 * tipping, 't'),
    }));
    expect(findItem(run(lift), 'stability.rated-vs-tipping').status).toBe('caution');
    lift.chart.rows = [q(8, 'm'), q(10, 'm')].map((r) => ({
      radius: r,
      boomLength: q(20, 'm'),
      capacity: q(0.84 * tipping, 't'),
    }));
    const it84 = findItem(run(lift), 'stability.rated-vs-tipping');
    expect(it84.value).toBeCloseTo(84, 6);
    expect(it84.status).toBe('pass');
  });
});

describe('tandem — share A = W·d_B/(d_A+d_B) (read) and margins 20/33/50% (Queensland Mobile Crane Code of Practice 2006 §14.3.2, read)', () => {
  it('when the CG is 4 m from A and 6 m from B, then A carries 60% and B 40%', () => {
    const [a, b] = twoCraneShares(100, 4, 6);
    expect(a).toBeCloseTo(60, 12);
    expect(b).toBeCloseTo(40, 12);
  });

  it('when 2, 3, 4 or 6 cranes lift, then the margins are 20, 33, 50, 50%', () => {
    expect([2, 3, 4, 6].map((n) => tandemMarginPct(DEFAULT_POLICY, n))).toEqual([20, 33, 50, 50]);
  });

  it('when crane B capacity is exactly 1.2 × its share, then it is at the limit; below fails', () => {
    // load 10 t (no rigging), d_A 4 m, d_B 6 m → share A 6 t, share B 4 t, B needs 1.2 × 4 = 4.8 t.
    // Crane A is the crane entered at the top: its own chart (24 t at 10 m) and block (0.5 t) count.
    const lift = outriggerLift();
    lift.tandem = {
      cranes: [
        { pickPointDistance: q(4, 'm'), chartCapacity: q(24, 't') },
        { pickPointDistance: q(6, 'm'), chartCapacity: q(4.8, 't') },
      ],
    };
    const r = run(lift);
    const a = findItem(r, 'tandem.crane-1');
    expect(a.value! / G).toBeCloseTo(6500, 6);
    expect(a.limit! / G).toBeCloseTo(24000 / 1.2, 6);
    const b = findItem(r, 'tandem.crane-2');
    expect(b.value! / G).toBeCloseTo(4000, 6);
    expect(b.limit! / G).toBeCloseTo(4000, 6);
    expect(b.status).not.toBe('fail');
    lift.tandem.cranes[1].chartCapacity = q(4.7, 't');
    expect(findItem(run(lift), 'tandem.crane-2').status).toBe('fail');
    expect(checkOf(run(lift), 'tandem').status).toBe('fail');
  });
});

describe('critical lift — USACE EM 385-1-1 §16.H (read) and site policy', () => {
  it('when the gross load is over 75% of the chart, then the capacity trigger applies; at 75% it does not', () => {
    const lift = outriggerLift(); // chart 24 t at 10 m
    lift.load = { weight: q(24 * 0.75 - 0.5, 't') }; // + 0.5 t block = 75.0%
    expect(run(lift).critical.triggers.map((t) => t.id)).not.toContain('capacity-threshold');
    lift.load = { weight: q(24 * 0.76 - 0.5, 't') };
    const r = run(lift);
    expect(r.critical.triggers.map((t) => t.id)).toContain('capacity-threshold');
    expect(r.critical.isCritical).toBe(true);
  });

  it('when the load is out of view, rigging is non-routine, tandem and personnel, then each is a trigger with USACE as source', () => {
    const lift = outriggerLift();
    lift.site = { loadOutOfOperatorView: true, nonRoutineRigging: true };
    lift.personnel = { platformWeight: q(500, 'kg') };
    lift.tandem = {
      cranes: [
        { share: q(5, 't'), chartCapacity: q(20, 't') },
        { share: q(5, 't'), chartCapacity: q(20, 't') },
      ],
    };
    const t = run(lift).critical.triggers;
    for (const id of ['load-out-of-view', 'non-routine-rigging', 'personnel', 'tandem']) {
      const found = t.find((x) => x.id === id);
      expect(found?.source.text).toContain('EM 385-1-1');
    }
  });
});
