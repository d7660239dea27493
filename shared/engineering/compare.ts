// The one comparison every check uses to hold a value against its limit. Values and limits are SI
// (or plain ratios, percentages, degrees). Unit conversion factors are exact definitions, but the
// same quantity typed in two units reaches the engine through different floating-point products,
// and a ratio worked out to exactly 1.5 may come out as 1.4999999999999998. A value within REL_TOL
// (relative to the larger magnitude) of its limit is at the limit: it neither breaks a maximum nor
// falls short of a minimum. REL_TOL is far below any precision a contractor types (a millimetre in
// a kilometre is 1e-6) and far above the round-off of a few dozen operations (~1e-15).

/** Relative tolerance of every limit comparison. */
export const REL_TOL = 1e-9;

const slack = (a: number, b: number) => REL_TOL * Math.max(Math.abs(a), Math.abs(b));

/** value does not exceed limit (false for NaN). */
export function atMost(value: number, limit: number): boolean {
  if (Number.isNaN(value) || Number.isNaN(limit)) return false;
  if (value <= limit) return true;
  return Number.isFinite(value) && value - limit <= slack(value, limit);
}

/** value reaches limit (false for NaN). */
export function atLeast(value: number, limit: number): boolean {
  if (Number.isNaN(value) || Number.isNaN(limit)) return false;
  if (value >= limit) return true;
  return Number.isFinite(value) && limit - value <= slack(value, limit);
}

/** value is past limit by more than the tolerance (the opposite of atMost; true for NaN). */
export const exceeds = (value: number, limit: number): boolean => !atMost(value, limit);

/** value falls short of limit by more than the tolerance (true for NaN). */
export const fallsShort = (value: number, limit: number): boolean => !atLeast(value, limit);

/** a and b are the same within the tolerance. */
export const same = (a: number, b: number): boolean => atMost(a, b) && atLeast(a, b);
