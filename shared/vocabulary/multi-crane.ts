// How the shares of a lift with several cranes were found, in the product's words: read by the
// live check, the package page, the review workspace and the calculation sheet.
import type { LiftResult } from '../engineering/types';

export const SHARE_METHOD_WORDS: Record<NonNullable<LiftResult['multiCrane']>['method'], string> = {
  two: 'Shares from statics: the centre of gravity between the two picks.',
  three: 'Shares from statics: the plan position of the centre of gravity within the three picks.',
  stated: 'Shares as stated in the plan, checked against force and moment balance.',
  none: 'The shares could not be found: see the multi-crane check.',
};
