// The crane seen from the side, as a scene in metres (x along the boom's plane from the centre of
// rotation, positive towards the load; y up from the ground): the boom foot and tip, the load,
// the counterweight, the tipping line the stability check used and the two moment arms, and the
// extent to draw. The browser (SVG) and the calculation sheet (pdf-lib) paint it at their scale.
import { TO_SI, type AnyUnit } from '@shared/engineering/units';
import type { LiftResult } from '@shared/engineering/types';

type Obj = Record<string, unknown>;
const at = (o: unknown, ...keys: string[]): unknown =>
  keys.reduce<unknown>((v, k) => (v && typeof v === 'object' ? (v as Obj)[k] : undefined), o);

/** A raw entered quantity in SI, or null when absent or not a number. */
function si(q: unknown): number | null {
  const v = q as { value?: unknown; unit?: unknown } | undefined;
  if (!v || typeof v.value !== 'number' || !Number.isFinite(v.value)) return null;
  const f = TO_SI[v.unit as AnyUnit];
  return f === undefined ? null : v.value * f;
}

export interface SideViewScene {
  /** Tipping line's distance from the centre of rotation towards the load (the stability check's). */
  fulcrum: number;
  boomLength: number;
  /** Boom angle from horizontal, degrees. */
  angle: number;
  radius: number;
  pivotOffset: number;
  pivotHeight: number;
  tipX: number;
  tipY: number;
  /** Counterweight's centre of gravity behind rotation, and its weight (N), when entered. */
  cw: number | null;
  cwWeight: number | null;
  loadLength: number;
  loadHeight: number;
  /** How far behind rotation the carrier is drawn. */
  behind: number;
  /** Load arm (radius beyond the tipping line) and counterweight arm (behind it). */
  loadArm: number;
  cwArm: number | null;
  xMin: number;
  xMax: number;
  yMax: number;
}

/** Why the side view cannot be drawn, or null when it can. */
export function sideViewUnavailableReason(inputs: unknown, result: LiftResult): string | null {
  if (at(inputs, 'crane', 'type') === 'gantry_a_frame')
    return 'Not drawn for a gantry or A-frame: the frame, backstay and ballast moments are in the stability check above.';
  if (!result.figures.tipping)
    return 'Not drawn: the stability check found no tipping line (supports or crane weights missing).';
  if (
    si(at(inputs, 'crane', 'boomLength')) === null ||
    result.figures.boomAngleDeg === null ||
    result.figures.radius === null
  )
    return 'Not drawn: the boom length, boom angle or radius is missing.';
  return null;
}

/** The scene, or null when the inputs or result lack a tipping line, boom length, angle or radius. */
export function sideViewScene(inputs: unknown, result: LiftResult): SideViewScene | null {
  const f = result.figures;
  const crane = at(inputs, 'crane');
  const fulcrum = f.tipping?.distanceAlongBoom ?? null;
  const boomLength = si(at(crane, 'boomLength'));
  const angle = f.boomAngleDeg;
  const radius = f.radius;
  if (fulcrum === null || boomLength === null || angle === null || radius === null) return null;
  const pivotOffset = si(at(crane, 'pivotOffset')) ?? 0;
  const pivotHeight = si(at(crane, 'pivotHeight')) ?? 2;
  const cw = si(at(crane, 'counterweight', 'cgBehindRotation'));
  const cwWeight = si(at(crane, 'counterweight', 'weight'));
  const loadLength = si(at(inputs, 'load', 'length')) ?? 2;
  const loadHeight = si(at(inputs, 'load', 'height')) ?? 1.5;
  const tipX = pivotOffset + boomLength * Math.cos((angle * Math.PI) / 180);
  const tipY = pivotHeight + boomLength * Math.sin((angle * Math.PI) / 180);
  const behind = Math.max(fulcrum, (cw ?? 0) + 1.2);
  return {
    fulcrum,
    boomLength,
    angle,
    radius,
    pivotOffset,
    pivotHeight,
    tipX,
    tipY,
    cw,
    cwWeight,
    loadLength,
    loadHeight,
    behind,
    loadArm: radius - fulcrum,
    cwArm: cw !== null ? cw + fulcrum : null,
    xMin: -behind - 1.5,
    xMax: Math.max(radius + loadLength / 2, tipX) + 1.5,
    yMax: tipY + 1.5,
  };
}

export interface CraneSideView {
  key: string;
  title: string;
  /** The inputs to draw from: the lift's for crane 1, the crane's own configuration for the others. */
  inputs: Record<string, unknown>;
  /** The result with this crane's figures (its share, its tipping line). */
  result: LiftResult;
}

/**
 * One side view per crane: the lift's own for one crane; with several cranes crane 1 from the top
 * of the input and the others from multiCrane.others, each with the figures of its own share. A
 * crane entered by its chart capacity only (the version 1 form) has no figures and no tipping line,
 * so sideViewUnavailableReason says it cannot be drawn.
 */
export function craneSideViews(result: LiftResult, inputs: Record<string, unknown>): CraneSideView[] {
  if (!result.cranes) return [{ key: 'one', title: 'Side view and moment arms', inputs, result }];
  const others = at(inputs, 'multiCrane', 'others');
  const list = Array.isArray(others) ? (others as unknown[]) : [];
  return result.cranes.map((crane, k) => ({
    key: `crane-${crane.index}`,
    title: `Side view of crane ${crane.index} (${crane.name}) for its share`,
    inputs: k === 0 ? inputs : { crane: at(list[k - 1], 'crane'), load: inputs.load },
    result: crane.figures
      ? { ...result, figures: crane.figures }
      : { ...result, figures: { ...result.figures, tipping: null } },
  }));
}
