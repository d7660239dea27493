// What each crane type is called on screen and on paper.
import type { CRANE_TYPES } from '@shared/schemas/lift-input';

export const CRANE_TYPE_LABELS: Record<(typeof CRANE_TYPES)[number], string> = {
  mobile_outriggers: 'Mobile crane on outriggers',
  mobile_crawler: 'Crawler crane',
  gantry_a_frame: 'Gantry or A-frame',
};
