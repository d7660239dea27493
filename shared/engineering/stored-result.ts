// The one reader of a stored result (revision.results, written by the check run with its
// resultVersion), for the server, the worker and the client alike. Results of every version the
// engine has written keep loading: version 1 (one crane) is version 2 without the optional `cranes`
// and `multiCrane`, so both read as they are; a result shape that changes adds its step here, as
// upgrade.ts does for inputs. Anything else (an object without a known version, a half-written
// row) reads as null, so a page shows no result rather than a broken one.
import type { LiftResult } from './types';

export const READABLE_RESULT_VERSIONS: readonly LiftResult['resultVersion'][] = [1, 2];

export function isLiftResult(value: unknown): value is LiftResult {
  if (!value || typeof value !== 'object') return false;
  const v = value as Partial<LiftResult>;
  return (
    READABLE_RESULT_VERSIONS.includes(v.resultVersion as LiftResult['resultVersion']) &&
    Array.isArray(v.checks) &&
    Array.isArray(v.discrepancies) &&
    typeof v.figures === 'object' &&
    v.figures !== null &&
    typeof v.policy === 'object' &&
    v.policy !== null
  );
}

/** A stored result in the current shape, or null when it is not a result of a known version. */
export function readStoredResult(value: unknown): LiftResult | null {
  if (!isLiftResult(value)) return null;
  // Version 1 → 2: nothing to convert (2 only adds optional fields for several cranes).
  return value;
}
