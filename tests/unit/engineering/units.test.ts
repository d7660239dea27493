// Unit factors cross-checked against general-purpose units libraries from the npm registry
// (convert-units 2.3.4 and mathjs 15), not against our own table. convert-units rounds some of its
// factors to about six figures, so it is compared at 1e-5 relative; mathjs at 1e-7.
import { describe, expect, it } from 'vitest';
import convert from 'convert-units';
import { unit } from 'mathjs';
import { TO_SI, STANDARD_GRAVITY } from '@shared/engineering/units';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('units against convert-units', () => {
  it.each([
    ['ft', 'ft', 'm'],
    ['in', 'in', 'm'],
    ['mm', 'mm', 'm'],
    ['mph', 'm/h', 'm/s'],
    ['km/h', 'km/h', 'm/s'],
    ['knot', 'knot', 'm/s'],
    ['ft2', 'ft2', 'm2'],
    ['psi', 'psi', 'Pa'],
    ['kPa', 'kPa', 'Pa'],
  ] as const)('when 1 %s is converted, then it matches convert-units (%s → %s)', (ours, from, to) => {
    const theirs = convert(1).from(from).to(to);
    expect(rel(TO_SI[ours], theirs)).toBeLessThan(1e-5);
  });

  it.each([
    ['lb', 'lb'],
    ['t', 'mt'],
    ['kg', 'kg'],
  ] as const)('when 1 %s of mass is converted, then × g matches convert-units kg × 9.80665', (ours, from) => {
    const kg = convert(1).from(from).to('kg');
    expect(rel(TO_SI[ours], kg * STANDARD_GRAVITY)).toBeLessThan(1e-5);
  });
});

describe('units against mathjs', () => {
  it.each([
    ['lb', '1 lbf', 'N'],
    ['kip', '1 kip', 'N'],
    ['ton_us', '2000 lbf', 'N'],
    ['psf', '1 lbf/ft^2', 'Pa'],
    ['psi', '1 lbf/in^2', 'Pa'],
    ['lb_ft', '1 lbf ft', 'N m'],
    ['kip_ft', '1000 lbf ft', 'N m'],
    ['ft', '1 ft', 'm'],
    ['mph', '1 mi/h', 'm/s'],
    ['ft2', '1 ft^2', 'm^2'],
    ['kV', '1 kV', 'V'],
  ] as const)('when 1 %s is converted, then it matches mathjs %s in %s', (ours, expr, to) => {
    expect(rel(TO_SI[ours], unit(expr).toNumber(to))).toBeLessThan(1e-7);
  });

  it('when a tonne-force metre is converted, then it matches mathjs 1000 kgf m', () => {
    expect(rel(TO_SI.t_m, unit('1000 kgf m').toNumber('N m'))).toBeLessThan(1e-9);
  });
});
