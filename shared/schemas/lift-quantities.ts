// Quantities of the lift input: a number with its unit, bounded so every accepted value is
// finite and plausible; each message names the field and the limit. Used by lift-input.ts and
// lift-rigging.ts.
import { z } from 'zod';
import {
  ANGLE_UNITS,
  AREA_UNITS,
  LENGTH_UNITS,
  MOMENT_UNITS,
  PRESSURE_UNITS,
  SPEED_UNITS,
  VOLTAGE_UNITS,
  WEIGHT_UNITS,
  TO_SI,
} from '../engineering/units';
import { limitFigure } from '../vocabulary/units';

const finite = (label: string) =>
  z.number({
    error: (iss) => (iss.input === undefined ? `${label} is required` : `${label} must be a finite number`),
  });

interface Bounds {
  min?: number;
  /** true: value must be strictly greater than min */
  gt?: boolean;
  max?: number;
  /** words for the limit in messages, e.g. "degrees" */
  what?: string;
}

export function boundedNumber(label: string, b: Bounds) {
  let n = finite(label);
  const what = b.what ? ` ${b.what}` : '';
  if (b.min !== undefined && b.max !== undefined) {
    const msg = `${label} must be between ${b.min} and ${b.max}${what}`;
    n = (b.gt ? n.gt(b.min, { error: msg }) : n.min(b.min, { error: msg })).max(b.max, { error: msg });
  } else if (b.min !== undefined) {
    n = b.gt
      ? n.gt(b.min, { error: `${label} must be greater than ${b.min}${what}` })
      : n.min(b.min, { error: `${label} must be ${b.min}${what} or more` });
  } else if (b.max !== undefined) {
    n = n.max(b.max, { error: `${label} must be ${b.max}${what} or less` });
  }
  return n;
}

/**
 * Plausible upper bound of each kind of quantity, in SI (ours: common practice, no source). Each is
 * well above any crane lift on record (the heaviest lifts are a few tens of thousands of tonnes, the
 * tallest booms a few hundred metres) and keeps every product the engine forms finite.
 */
export const QUANTITY_MAX_SI = {
  length: 2000,
  weight: 100_000 * 1000 * TO_SI.kg,
  pressure: 100e6,
  speed: 100,
  area: 10_000,
  angle: 360,
  voltage: 2e6,
  moment: 1e12,
} as const;

const KIND_OF_UNITS = new Map<readonly string[], keyof typeof QUANTITY_MAX_SI>([
  [LENGTH_UNITS, 'length'],
  [WEIGHT_UNITS, 'weight'],
  [PRESSURE_UNITS, 'pressure'],
  [SPEED_UNITS, 'speed'],
  [AREA_UNITS, 'area'],
  [ANGLE_UNITS, 'angle'],
  [VOLTAGE_UNITS, 'voltage'],
  [MOMENT_UNITS, 'moment'],
]);

const limitText = limitFigure;

export function quantity<const U extends readonly [string, ...string[]]>(
  units: U,
  label: string,
  b: Bounds = {},
) {
  const kind = KIND_OF_UNITS.get(units);
  const maxSI = kind ? QUANTITY_MAX_SI[kind] : Infinity;
  return z
    .object(
      {
        value: boundedNumber(label, b),
        unit: z.enum(units, { error: `${label}: unit must be one of ${units.join(', ')}` }),
      },
      {
        error: (iss) =>
          iss.input === undefined ? `${label} is required` : `${label} must be an object { value, unit }`,
      },
    )
    .superRefine((q, ctx) => {
      const factor = TO_SI[q.unit as keyof typeof TO_SI];
      if (Math.abs(q.value * factor) > maxSI)
        ctx.addIssue({
          code: 'custom',
          path: ['value'],
          message: `${label} must be ${limitText(maxSI / factor)} ${q.unit} or less`,
        });
    });
}

export const length = (label: string, b: Bounds = { min: 0 }) => quantity(LENGTH_UNITS, label, b);
export const positiveLength = (label: string) => quantity(LENGTH_UNITS, label, { min: 0, gt: true });
export const signedLength = (label: string) => quantity(LENGTH_UNITS, label, {});
export const weight = (label: string) => quantity(WEIGHT_UNITS, label, { min: 0 });
export const positiveWeight = (label: string) => quantity(WEIGHT_UNITS, label, { min: 0, gt: true });
export const pressure = (label: string) => quantity(PRESSURE_UNITS, label, { min: 0, gt: true });
export const speed = (label: string) => quantity(SPEED_UNITS, label, { min: 0 });
export const area = (label: string) => quantity(AREA_UNITS, label, { min: 0 });
export const angle = (label: string, min: number, max: number) =>
  quantity(ANGLE_UNITS, label, { min, max, what: 'degrees' });
export const moment = (label: string) => quantity(MOMENT_UNITS, label, { min: 0 });
export const name = z.string().max(200).optional();
export const count = (label: string, min: number, max: number) =>
  boundedNumber(label, { min, max }).int({ error: `${label} must be a whole number` });
