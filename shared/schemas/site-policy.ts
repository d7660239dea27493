// Site policy: the limits a lift is checked against. Every field has a default with its source
// (POLICY_DEFAULTS) so the admin page can show where each number comes from, and each site can
// override any of them. Plain numbers: percentages, ratios, m/s, m, degrees, N.
import { z } from 'zod';

const pct = (label: string, min: number, max: number) =>
  z
    .number({ error: `${label} must be a finite number` })
    .min(min, { error: `${label} must be between ${min} and ${max} percent` })
    .max(max, { error: `${label} must be between ${min} and ${max} percent` });

type DefaultSource = { kind: 'standard' | 'common_practice' | 'from_memory'; text: string };

/** Each default, its value and where it comes from. */
export const POLICY_DEFAULTS = {
  criticalThresholdPct: {
    value: 75,
    label: 'Critical lift threshold (% of chart capacity)',
    source: { kind: 'standard', text: 'USACE EM 385-1-1 §16.H: load over 75% of rated capacity is critical' },
  },
  maxChartUsePct: {
    value: 85,
    label: 'Maximum chart use (% of chart capacity)',
    source: {
      kind: 'common_practice',
      text: 'Common practice, no source: many owners cap lifts at 85–90% of chart',
    },
  },
  minStabilityRatio: {
    value: 1.5,
    label: 'Minimum stability ratio (resisting ÷ overturning moment)',
    source: { kind: 'common_practice', text: 'Common practice, no source: resisting ≥ 1.5 × overturning' },
  },
  tandemMarginPct: {
    value: { twoCranes: 20, threeCranes: 33, fourOrMore: 50 },
    label: 'Tandem margin: capacity must exceed share by (%)',
    source: { kind: 'standard', text: 'Queensland Mobile Crane Code of Practice 2006 §14.3.2' },
  },
  personnelLimitPct: {
    value: 50,
    label: 'Personnel platform load limit (% of rated capacity)',
    source: {
      kind: 'standard',
      text: 'OSHA 29 CFR 1926.1431: platform, rigging and occupants ≤ 50% of rated capacity',
    },
  },
  windLimitMps: {
    value: 8.9408,
    label: 'Wind speed limit for general lifts (m/s)',
    source: {
      kind: 'common_practice',
      text: "Common practice, no source: 20 mph (8.94 m/s); the manufacturer's chart wind limit governs when lower",
    },
  },
  personnelWindLimitMps: {
    value: 8.9408,
    label: 'Wind speed limit for personnel lifts (m/s)',
    source: {
      kind: 'standard',
      text: 'OSHA 29 CFR 1926.1431: above 20 mph a qualified person decides whether to lift',
    },
  },
  minSlingAngleDeg: {
    value: 30,
    label: 'Minimum sling angle from horizontal (degrees)',
    source: {
      kind: 'standard',
      text: 'Rigging handbooks: leg angles below 30° from horizontal are not used',
    },
  },
  discrepancyTolerancePct: {
    value: 5,
    label: "Tolerance between the contractor's figures and the recomputed ones (%)",
    source: { kind: 'common_practice', text: 'Common practice, no source' },
  },
  cautionMarginPct: {
    value: 10,
    label: 'Caution when within this margin of a limit (%)',
    source: { kind: 'common_practice', text: 'Common practice, no source' },
  },
  minBlockClearanceM: {
    value: 1,
    label: 'Minimum clearance between hook block and boom tip (m)',
    source: { kind: 'common_practice', text: 'Common practice, no source (keep clear of two-blocking)' },
  },
  backwardCrawlerCgPct: {
    value: 70,
    label:
      "Backward stability, crawlers: unloaded crane's CG at most this share of the distance to the backward fulcrum (%)",
    source: {
      kind: 'from_memory',
      text: 'ASME B30.5 §5-1.1.2 (from memory; the same test read in ASME B30.4-2020 §4-1.3.4 with 60% for portal cranes)',
    },
  },
  backwardBoomSideSupportPct: {
    value: 15,
    label:
      "Backward stability, outriggers or wheels: unloaded crane's weight on the boom-side supports at least (%)",
    source: { kind: 'from_memory', text: 'ASME B30.5 §5-1.1.2 (from memory)' },
  },
  criticalGrossLoadN: {
    value: null,
    label: 'Site rule: gross loads at or above this weight are critical (N)',
    source: { kind: 'common_practice', text: 'Site rule; none by default' },
  },
} as const satisfies Record<string, { value: unknown; label: string; source: DefaultSource }>;

const D = POLICY_DEFAULTS;

export const TandemMargin = z.object({
  twoCranes: pct('tandemMarginPct.twoCranes', 0, 200).default(D.tandemMarginPct.value.twoCranes),
  threeCranes: pct('tandemMarginPct.threeCranes', 0, 200).default(D.tandemMarginPct.value.threeCranes),
  fourOrMore: pct('tandemMarginPct.fourOrMore', 0, 200).default(D.tandemMarginPct.value.fourOrMore),
});

export const SitePolicy = z.object({
  criticalThresholdPct: pct('criticalThresholdPct', 1, 100).default(D.criticalThresholdPct.value),
  maxChartUsePct: pct('maxChartUsePct', 1, 100).default(D.maxChartUsePct.value),
  minStabilityRatio: z
    .number({ error: 'minStabilityRatio must be a finite number' })
    .min(1, { error: 'minStabilityRatio must be between 1 and 5' })
    .max(5, { error: 'minStabilityRatio must be between 1 and 5' })
    .default(D.minStabilityRatio.value),
  tandemMarginPct: TandemMargin.default({ ...D.tandemMarginPct.value }),
  personnelLimitPct: pct('personnelLimitPct', 1, 50).default(D.personnelLimitPct.value),
  windLimitMps: z
    .number({ error: 'windLimitMps must be a finite number' })
    .gt(0, { error: 'windLimitMps must be greater than 0 m/s' })
    .max(40, { error: 'windLimitMps must be at most 40 m/s' })
    .default(D.windLimitMps.value),
  personnelWindLimitMps: z
    .number({ error: 'personnelWindLimitMps must be a finite number' })
    .gt(0, { error: 'personnelWindLimitMps must be greater than 0 m/s' })
    .max(40, { error: 'personnelWindLimitMps must be at most 40 m/s' })
    .default(D.personnelWindLimitMps.value),
  minSlingAngleDeg: z
    .number({ error: 'minSlingAngleDeg must be a finite number' })
    .min(15, { error: 'minSlingAngleDeg must be between 15 and 90 degrees' })
    .max(90, { error: 'minSlingAngleDeg must be between 15 and 90 degrees' })
    .default(D.minSlingAngleDeg.value),
  discrepancyTolerancePct: pct('discrepancyTolerancePct', 0, 50).default(D.discrepancyTolerancePct.value),
  cautionMarginPct: pct('cautionMarginPct', 0, 50).default(D.cautionMarginPct.value),
  minBlockClearanceM: z
    .number({ error: 'minBlockClearanceM must be a finite number' })
    .min(0, { error: 'minBlockClearanceM must be between 0 and 20 m' })
    .max(20, { error: 'minBlockClearanceM must be between 0 and 20 m' })
    .default(D.minBlockClearanceM.value),
  backwardCrawlerCgPct: pct('backwardCrawlerCgPct', 10, 100).default(D.backwardCrawlerCgPct.value),
  backwardBoomSideSupportPct: pct('backwardBoomSideSupportPct', 0, 50).default(
    D.backwardBoomSideSupportPct.value,
  ),
  criticalGrossLoadN: z
    .number({ error: 'criticalGrossLoadN must be a finite number' })
    .gt(0, { error: 'criticalGrossLoadN must be greater than 0 N' })
    .nullable()
    .default(D.criticalGrossLoadN.value),
});

export type SitePolicy = z.infer<typeof SitePolicy>;
export type SitePolicyInput = z.input<typeof SitePolicy>;

/** The default policy, fully populated. */
export const DEFAULT_POLICY: SitePolicy = SitePolicy.parse({});
