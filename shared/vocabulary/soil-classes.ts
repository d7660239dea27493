// What each presumptive soil class is called in the editor and on paper.
import type { SOIL_CLASSES } from '@shared/schemas/lift-input';

export const SOIL_LABELS: Record<(typeof SOIL_CLASSES)[number], string> = {
  crystalline_bedrock: 'Crystalline bedrock',
  sedimentary_rock: 'Sedimentary rock',
  sandy_gravel: 'Sandy gravel or gravel',
  sand_silty_clayey: 'Sand, silty or clayey sand',
  clay_silt: 'Clay, silt',
  mud_organic_fill: 'Mud, organic soil or unprepared fill',
};
