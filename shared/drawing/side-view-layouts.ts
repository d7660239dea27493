// The two sizes the crane side view is drawn at: on the package page (SVG pixels, roomy, with
// both axes titled and the caption under the figure) and on the calculation sheet (pdf-lib
// points, compact, the caption inside the figure's box). Only numbers: side-view-figure.ts
// draws from them, and the renderers map the roles to their colours.

/** A length drawn partly to scale: `m` metres at the drawing's scale plus `u` figure units. */
export interface Reach {
  m?: number;
  u?: number;
}

export interface LabelStyle {
  size: number;
  bold?: boolean;
  halo?: boolean;
  /** Offset of the label from the point it names (figure units, y down). */
  dx?: number;
  dy?: number;
}

export type Lean = 'falling' | 'rising';

/**
 * Where a hatch's lines fall: through the point `at` along x from the figure's origin (in phase
 * with it, as an SVG pattern is), or from the hatched part's corner (the ground line's left end,
 * the counterweight's lower-left corner).
 */
export type Phase = { from: 'origin' | 'corner'; at: number };

export interface SideViewLayout {
  margin: { left: number; right: number; top: number; bottom: number };
  /** The grid, ground line and its hatching cover the whole plot area, or only the drawing's extent. */
  span: 'plot' | 'extent';
  gridWidth: number;
  /** Distance labels under the ground (dy below it), or none. */
  xTicks: { dy: number; size: number } | null;
  /** Height labels left of the plot, ending dx from its edge. */
  yTicks: { dx: number; dy: number; size: number };
  /** "Height above ground" upright beside the axis, or "height" above it. */
  heightTitle: { place: 'beside'; x: number; size: number } | { place: 'above'; dy: number; size: number };
  /** The distance axis's title `fromBottom` above the figure's lower edge, naming the grid square. */
  distanceTitle: { fromBottom: number; size: number } | null;
  ground: {
    width: number;
    hatch: { depth: number; step: number; width: number; lean: Lean; phase: Phase };
  };
  outline: number;
  support: { width: number; height: number };
  /** The word "carrier" inside it when it is tall enough. */
  carrierLabel: { size: number; minHeight: number } | null;
  counterweightHatch: { step: number; width: number; lean: Lean; phase: Phase };
  loadHatch: { kind: 'cross'; step: number; width: number } | { kind: 'corners'; width: number };
  centreLine: { below: number; above: Reach; width: number; dash: number[]; label: LabelStyle };
  tippingLine: {
    below: number;
    above: Reach;
    width: number;
    dash: number[];
    mark: { apex: number; depth: number; half: number };
    label: LabelStyle;
  };
  boom: { width: number; core: number; coreDash: number[]; pivotRadius: number; label: LabelStyle };
  /** The hoist line stops `gap` metres above the load. */
  hoist: { width: number; gap: number };
  /** Above the load by `above`, plus `hoistShare` of the hoist line; end-anchored within `endNear` of the right. */
  loadLabel: LabelStyle & { above: number; hoistShare: number; endNear: number | null };
  /** Centred over the counterweight or starting at its corner, `above` its top. */
  counterweightLabel: LabelStyle & { at: 'centre' | 'corner'; above: Reach };
  arms: {
    /** The two dimension lines' distance below the ground. */
    below: [number, number];
    width: number;
    arrow: { length: number; half: number; overshoot: number };
    extension: { width: number; past: number; counterweightFrom: number };
    /** Centred `dy` above the line; with `beside`, past its right end when it does not fit (needs metrics). */
    label: LabelStyle & { beside: { dx: number; dy: number } | null };
    counterweightWords: string;
  };
  /** The caption's lines inside the figure (needs metrics to wrap), or null when the page shows it. */
  caption: { size: number; lineGap: number; bottom: number } | null;
  /** The caption in full sentences (under the figure on the page) or as a brief note (on paper). */
  captionWords: 'full' | 'brief';
}

export const SCREEN_SIDE_VIEW_SIZE = { width: 680, height: 470 };

export const SCREEN_SIDE_VIEW: SideViewLayout = {
  margin: { left: 54, right: 16, top: 16, bottom: 110 },
  span: 'plot',
  gridWidth: 1,
  xTicks: { dy: 24, size: 11 },
  yTicks: { dx: 6, dy: 4, size: 11 },
  heightTitle: { place: 'beside', x: 14, size: 12 },
  distanceTitle: { fromBottom: 6, size: 12 },
  // As the SVG patterns these replace drew them: lines 8 and 6 apart square to their lean, half
  // their stroke cut off by the pattern tile's edge (so half as wide, and centred half of that
  // further on); 7 apart across the load.
  ground: {
    width: 1.5,
    hatch: {
      depth: 10,
      step: 8 * Math.SQRT2,
      width: 0.5,
      lean: 'falling',
      phase: { from: 'origin', at: 0.25 * Math.SQRT2 },
    },
  },
  outline: 1.5,
  support: { width: 12, height: 5 },
  carrierLabel: null,
  counterweightHatch: {
    step: 6 * Math.SQRT2,
    width: 1.1,
    lean: 'rising',
    phase: { from: 'origin', at: 0.55 * Math.SQRT2 },
  },
  loadHatch: { kind: 'cross', step: 7, width: 0.8 },
  centreLine: {
    below: 8,
    above: { m: 6 },
    width: 1,
    dash: [10, 3, 2, 3],
    label: { size: 11, halo: true, dx: -4, dy: 4 },
  },
  tippingLine: {
    below: 84,
    above: { m: 4.5 },
    width: 1.6,
    dash: [6, 3],
    mark: { apex: -1, depth: 10, half: 6 },
    label: { size: 11, bold: true, halo: true, dx: 4, dy: 4 },
  },
  boom: { width: 5, core: 1.5, coreDash: [4, 4], pivotRadius: 3.5, label: { size: 11, dx: -4, dy: -6 } },
  hoist: { width: 1.2, gap: 0.3 },
  loadLabel: { size: 11, bold: true, halo: true, above: 4, hoistShare: 0.2, endNear: null },
  counterweightLabel: { size: 11, halo: true, at: 'centre', above: { m: 2 } },
  arms: {
    below: [48, 76],
    width: 1.2,
    // The arrow marker the SVG used: 8 units long, scaled 7/8 and by the 1.2 stroke, tip 1 past the end.
    arrow: { length: 8.4, half: 4.2, overshoot: 1.05 },
    extension: { width: 0.8, past: 6, counterweightFrom: 0.4 },
    label: { size: 11.5, bold: true, dy: 5, beside: null },
    counterweightWords: 'behind it',
  },
  caption: null,
  captionWords: 'full',
};

export const PAPER_SIDE_VIEW: SideViewLayout = {
  margin: { left: 38, right: 10, top: 14, bottom: 78 },
  span: 'extent',
  gridWidth: 0.5,
  xTicks: null,
  yTicks: { dx: 4, dy: 2.2, size: 6.5 },
  heightTitle: { place: 'above', dy: 3, size: 6.5 },
  distanceTitle: null,
  ground: {
    width: 1.4,
    hatch: { depth: 6, step: 7, width: 0.7, lean: 'falling', phase: { from: 'corner', at: 0 } },
  },
  outline: 1.2,
  support: { width: 10, height: 4 },
  carrierLabel: { size: 6, minHeight: 9 },
  counterweightHatch: { step: 3.5, width: 0.8, lean: 'falling', phase: { from: 'corner', at: 3 } },
  loadHatch: { kind: 'corners', width: 0.6 },
  centreLine: {
    below: 6,
    above: { u: 26 },
    width: 0.8,
    dash: [8, 2.5, 1.5, 2.5],
    label: { size: 6.5, halo: true, dx: -3, dy: 3 },
  },
  tippingLine: {
    below: 60,
    above: { u: 44 },
    width: 1.4,
    dash: [5, 2.5],
    mark: { apex: 0, depth: 8, half: 5 },
    label: { size: 7, bold: true, halo: true, dx: 3, dy: 4 },
  },
  boom: {
    width: 4.5,
    core: 1.2,
    coreDash: [3.5, 3.5],
    pivotRadius: 3,
    label: { size: 7, halo: true, dx: -6, dy: 2 },
  },
  hoist: { width: 1, gap: 0 },
  loadLabel: { size: 7.5, bold: true, halo: true, above: 6, hoistShare: 0, endNear: 60 },
  counterweightLabel: { size: 7, halo: true, at: 'corner', above: { u: 4 } },
  arms: {
    below: [24, 48],
    width: 0.9,
    arrow: { length: 6, half: 2.6, overshoot: 0 },
    extension: { width: 0.5, past: 5, counterweightFrom: 0 },
    label: { size: 7.5, bold: true, halo: true, dy: 4, beside: { dx: 8, dy: 2.5 } },
    counterweightWords: 'behind the tipping line',
  },
  caption: { size: 7, lineGap: 9, bottom: 4 },
  captionWords: 'brief',
};
