// What each figure a contractor may state in the lift plan is called: the editor's field labels,
// the calculation sheet's inputs and the comparison's rows read the same words.
import type { StatedFigure } from '@shared/engineering/types';

export const STATED_FIGURE_LABELS: Record<StatedFigure, string> = {
  grossLoad: 'Gross load',
  radius: 'Radius',
  boomAngle: 'Boom angle',
  chartCapacity: 'Chart capacity',
  percentOfChart: 'Percent of chart',
  overturningMoment: 'Overturning moment',
  resistingMoment: 'Resisting moment',
  stabilityRatio: 'Stability ratio',
  maxSupportReaction: 'Largest support reaction',
  groundPressure: 'Ground bearing pressure',
  maxSlingTension: 'Largest sling tension',
  linePull: 'Line pull',
};
