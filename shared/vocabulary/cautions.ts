// The caution printed wherever a result leaves the desk, declared once. The long form is the
// engine's own (`CAUTIONS`, carried in every result); the standing form runs along every page,
// message and the API's description; the short form fits the stamp block and the calculation
// sheet's footer.
export { CAUTIONS } from '@shared/engineering/evaluate';

export const STANDING_CAUTION =
  "Counterpoise checks arithmetic and consistency. Its results do not replace the crane manufacturer's load chart and instructions, a qualified person (the lift director and the engineer of record), or local codes and regulations.";

export const SHORT_CAUTION =
  "Checks arithmetic and consistency only; does not replace the manufacturer's chart, a qualified person or local codes.";
