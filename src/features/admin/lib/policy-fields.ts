// The limits of a site's review policy as the policy page edits them: one row per number
// the engine reads (the tandem margin is three), the unit it is stored in, the unit the
// form edits it in, and the plain equivalent in the other unit system.
import { z } from 'zod';
import { TO_SI, type AnyUnit } from '@shared/engineering/units';
import { POLICY_DEFAULTS, SitePolicy } from '@shared/schemas/site-policy';
import { unitLabel } from '@shared/vocabulary/units';

export type PolicyKey = keyof typeof POLICY_DEFAULTS;
type TandemKey = keyof (typeof POLICY_DEFAULTS)['tandemMarginPct']['value'];

export type PolicyFieldName = Exclude<PolicyKey, 'tandemMarginPct'> | `tandemMarginPct.${TandemKey}`;

export type PolicyField = {
  /** The form field and the path in the overrides object, e.g. "tandemMarginPct.twoCranes". */
  name: PolicyFieldName;
  key: PolicyKey;
  sub?: TandemKey;
  /** Shown instead of the default's label for the tandem rows. */
  label?: string;
  /** The unit the form edits in. */
  unit: string;
  /** Stored value = edited value × scale (the critical gross load is stored in N, edited in kN). */
  scale: number;
  equivalent?: (stored: number) => string;
};

const sig3 = (value: number) => Number(value.toPrecision(3)).toLocaleString('en-GB');
/** A stored SI value in another unit, by the engine's own factors. */
const inUnits =
  (...units: AnyUnit[]) =>
  (stored: number) =>
    units.map((unit) => `${sig3(stored / TO_SI[unit])} ${unitLabel(unit)}`).join(', ');

const TANDEM_LABELS: Record<TandemKey, string> = {
  twoCranes: 'Tandem margin, two cranes: capacity must exceed share by (%)',
  threeCranes: 'Tandem margin, three cranes: capacity must exceed share by (%)',
  fourOrMore: 'Tandem margin, four or more cranes: capacity must exceed share by (%)',
};

export const POLICY_FIELDS: readonly PolicyField[] = [
  { name: 'criticalThresholdPct', key: 'criticalThresholdPct', unit: '%', scale: 1 },
  { name: 'maxChartUsePct', key: 'maxChartUsePct', unit: '%', scale: 1 },
  { name: 'minStabilityRatio', key: 'minStabilityRatio', unit: '×', scale: 1 },
  ...(['twoCranes', 'threeCranes', 'fourOrMore'] as const).map((sub) => ({
    name: `tandemMarginPct.${sub}` as const,
    key: 'tandemMarginPct' as const,
    sub,
    label: TANDEM_LABELS[sub],
    unit: '%',
    scale: 1,
  })),
  { name: 'personnelLimitPct', key: 'personnelLimitPct', unit: '%', scale: 1 },
  { name: 'windLimitMps', key: 'windLimitMps', unit: 'm/s', scale: 1, equivalent: inUnits('mph') },
  {
    name: 'personnelWindLimitMps',
    key: 'personnelWindLimitMps',
    unit: 'm/s',
    scale: 1,
    equivalent: inUnits('mph'),
  },
  { name: 'minSlingAngleDeg', key: 'minSlingAngleDeg', unit: '°', scale: 1 },
  { name: 'discrepancyTolerancePct', key: 'discrepancyTolerancePct', unit: '%', scale: 1 },
  { name: 'cautionMarginPct', key: 'cautionMarginPct', unit: '%', scale: 1 },
  { name: 'minBlockClearanceM', key: 'minBlockClearanceM', unit: 'm', scale: 1, equivalent: inUnits('ft') },
  { name: 'backwardCrawlerCgPct', key: 'backwardCrawlerCgPct', unit: '%', scale: 1 },
  { name: 'backwardBoomSideSupportPct', key: 'backwardBoomSideSupportPct', unit: '%', scale: 1 },
  {
    name: 'criticalGrossLoadN',
    key: 'criticalGrossLoadN',
    label: 'Site rule: gross loads at or above this weight are critical (kN)',
    unit: 'kN',
    scale: 1000,
    equivalent: inUnits('t', 'kip'),
  },
];

type TandemValues = Record<TandemKey, string>;
export type PolicyFormValues = {
  [K in Exclude<PolicyKey, 'tandemMarginPct'>]: string;
} & { tandemMarginPct: TandemValues };

const text = z.string();
const PolicyFormShape = z.object({
  criticalThresholdPct: text,
  maxChartUsePct: text,
  minStabilityRatio: text,
  tandemMarginPct: z.object({ twoCranes: text, threeCranes: text, fourOrMore: text }),
  personnelLimitPct: text,
  windLimitMps: text,
  personnelWindLimitMps: text,
  minSlingAngleDeg: text,
  discrepancyTolerancePct: text,
  cautionMarginPct: text,
  minBlockClearanceM: text,
  backwardCrawlerCgPct: text,
  backwardBoomSideSupportPct: text,
  criticalGrossLoadN: text,
});

function fieldText(values: PolicyFormValues, field: PolicyField): string {
  if (field.sub) return values.tandemMarginPct[field.sub];
  return values[field.key as Exclude<PolicyKey, 'tandemMarginPct'>];
}

/** The overrides a form holds: only the limits with a value typed in; an empty field takes the default. */
export function toOverrides(values: PolicyFormValues): Record<string, unknown> {
  const overrides: Record<string, unknown> = {};
  for (const field of POLICY_FIELDS) {
    const typed = fieldText(values, field).trim();
    if (typed === '') continue;
    const stored = Number(typed.replace(/\s/g, '')) * field.scale;
    if (field.sub) {
      const tandem = (overrides.tandemMarginPct ??= {}) as Record<string, number>;
      tandem[field.sub] = stored;
    } else {
      overrides[field.key] = stored;
    }
  }
  return overrides;
}

/** The form's starting values from a site's stored overrides. */
export function toFormValues(overrides: Record<string, unknown>): PolicyFormValues {
  const shown = (value: unknown, scale: number) =>
    typeof value === 'number' && Number.isFinite(value)
      ? String(Number((value / scale).toPrecision(12)))
      : '';
  const tandem = (overrides.tandemMarginPct ?? {}) as Record<string, unknown>;
  const values = { tandemMarginPct: { twoCranes: '', threeCranes: '', fourOrMore: '' } } as PolicyFormValues;
  for (const field of POLICY_FIELDS) {
    if (field.sub) values.tandemMarginPct[field.sub] = shown(tandem[field.sub], field.scale);
    else
      values[field.key as Exclude<PolicyKey, 'tandemMarginPct'>] = shown(overrides[field.key], field.scale);
  }
  return values;
}

/**
 * The form schema: text fields in, the overrides object out, each typed value checked
 * against the shared SitePolicy schema so the message names the limit and its range.
 */
export const PolicyForm = PolicyFormShape.transform((values) => toOverrides(values)).superRefine(
  (overrides, ctx) => {
    const result = SitePolicy.safeParse(overrides);
    if (result.success) return;
    for (const issue of result.error.issues) {
      ctx.addIssue({ code: 'custom', path: issue.path as (string | number)[], message: issue.message });
    }
  },
);

/** The stored value of one field in a policy object (overrides, effective or defaults). */
export function storedValue(policy: Record<string, unknown>, field: PolicyField): unknown {
  const value = policy[field.key];
  if (field.sub)
    return value && typeof value === 'object' ? (value as Record<string, unknown>)[field.sub] : undefined;
  return value;
}

/** "8.94 m/s (20 mph)", "None" for an unset site rule. */
export function formatPolicyValue(value: unknown, field: PolicyField): string {
  if (value === null || value === undefined) return 'None';
  if (typeof value !== 'number') return String(value);
  const edited = sig3(value / field.scale);
  const unit = field.unit === '%' || field.unit === '°' ? field.unit : ` ${field.unit}`;
  const main = field.unit === '×' ? `${edited} ×` : `${edited}${unit}`;
  return field.equivalent ? `${main} (${field.equivalent(value)})` : main;
}

/** Every limit path whose override differs between two override sets, for the change history. */
export function changedFields(
  before: Record<string, unknown>,
  after: Record<string, unknown>,
): { field: PolicyField; from: unknown; to: unknown }[] {
  return POLICY_FIELDS.flatMap((field) => {
    const from = storedValue(before, field);
    const to = storedValue(after, field);
    return from === to ? [] : [{ field, from, to }];
  });
}
