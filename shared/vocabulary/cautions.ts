// The caution printed wherever a result leaves the desk, declared once. The long form is the
// engine's own (`CAUTIONS`, carried in every result); the short form fits the stamp block and the
// calculation sheet's footer.
export { CAUTIONS } from '@shared/engineering/evaluate';

export const SHORT_CAUTION =
  "Checks arithmetic and consistency only; does not replace the manufacturer's chart, a qualified person or local codes.";
