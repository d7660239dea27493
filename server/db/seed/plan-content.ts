/* eslint-disable @typescript-eslint/no-explicit-any -- the demo inputs are plain JSON read from the example files */
// What a demo lift plan PDF says, read from the example input: the sections of figures and
// the sketch's few numbers (drawPlanPdf draws them).
import { si, type Quantity } from '@shared/engineering/units';
import { quantityAsEntered } from '@shared/vocabulary/units';
import { STATED_FIGURE_LABELS } from '@shared/vocabulary/stated-figures';
import { SOIL_LABELS } from '@shared/vocabulary/soil-classes';
import type { PlanSection } from './plan-pdf';

function q(v: unknown): string {
  if (v && typeof v === 'object' && 'value' in v && 'unit' in v) {
    const { value, unit } = v as { value: number; unit: string };
    return quantityAsEntered(value, unit);
  }
  return String(v);
}

export function planSections(input: Record<string, any>): PlanSection[] {
  const crane = input.crane ?? {};
  const sections: PlanSection[] = [
    {
      heading: 'Crane and configuration',
      rows: [
        ['Crane', String(crane.name ?? '')],
        ['Type', String(crane.type ?? '').replace(/_/g, ' ')],
        ...(crane.boomLength ? ([['Boom length', q(crane.boomLength)]] as [string, string][]) : []),
        ...(crane.radius ? ([['Working radius', q(crane.radius)]] as [string, string][]) : []),
        ...(crane.boomAngle ? ([['Boom angle', q(crane.boomAngle)]] as [string, string][]) : []),
        ...(crane.counterweight
          ? ([['Counterweight', q(crane.counterweight.weight)]] as [string, string][])
          : []),
        ['Load chart used', String(input.chart?.name ?? '')],
      ],
    },
    {
      heading: 'Load and rigging',
      rows: [
        ['Load', String(input.load?.description ?? '')],
        ['Load weight', q(input.load?.weight)],
        ...(input.hookBlock ? ([['Hook block', q(input.hookBlock.weight)]] as [string, string][]) : []),
        ...(input.rigging?.slings
          ? ([
              [
                'Slings',
                `${input.rigging.slings.name ?? ''} (${input.rigging.slings.hitch}, ${input.rigging.slings.material})`,
              ],
              ['Sling rated load (vertical, per leg)', q(input.rigging.slings.ratedLoadVertical)],
            ] as [string, string][])
          : []),
        ...((input.rigging?.hardware ?? []) as Array<{ name?: string; wll: unknown }>).map(
          (h) => [String(h.name ?? 'Hardware'), `WLL ${q(h.wll)}`] as [string, string],
        ),
      ],
    },
  ];
  if (input.ground) {
    sections.push({
      heading: 'Ground and mats',
      rows: [
        ...(input.ground.mat
          ? ([['Mat', `${q(input.ground.mat.length)} × ${q(input.ground.mat.width)}`]] as [string, string][])
          : []),
        ...(input.ground.allowableBearing
          ? ([['Allowable bearing', q(input.ground.allowableBearing)]] as [string, string][])
          : []),
        ...(input.ground.soilClass
          ? ([
              [
                'Soil class',
                SOIL_LABELS[input.ground.soilClass as keyof typeof SOIL_LABELS] ??
                  String(input.ground.soilClass),
              ],
            ] as [string, string][])
          : []),
      ],
    });
  }
  const stated = input.stated ?? {};
  const statedRows = Object.entries(stated).map(
    ([k, v]) => [STATED_FIGURE_LABELS[k as keyof typeof STATED_FIGURE_LABELS] ?? k, q(v)] as [string, string],
  );
  if (statedRows.length) sections.push({ heading: 'Figures stated in this plan', rows: statedRows });
  sections.push({
    heading: 'Sequence',
    rows: [
      ['1', 'Pre-lift meeting; permit and exclusion zone in place'],
      ['2', 'Set up on mats; level the crane; check radius with a tape'],
      ['3', 'Trial lift 100 mm clear; hold 5 minutes; check rigging'],
      ['4', 'Lift, slew and land under the lift director’s signals'],
    ],
  });
  return sections;
}

export function sketchOf(input: Record<string, any>) {
  const c = input.crane ?? {};
  const toM = (x: Quantity | undefined) => si(x);
  const boom = toM(c.boomLength);
  const radius = toM(c.radius);
  if (!boom || !radius) return undefined;
  const offset = toM(c.pivotOffset) ?? 0;
  const angle = (Math.acos(Math.min(1, Math.max(0, (radius - offset) / boom))) * 180) / Math.PI;
  return {
    boomLengthM: boom,
    boomAngleDeg: angle,
    radiusM: radius,
    counterweightArmM: toM(c.counterweight?.cgBehindRotation) ?? 3,
  };
}
