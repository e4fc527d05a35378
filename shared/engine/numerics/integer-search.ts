/** Outcome of a search for the smallest integer meeting a condition. */
export interface IntegerSearchResult {
  /** The smallest n in [lower, upper] with meets(n) true; null when none was found. */
  readonly n: number | null;
  readonly converged: boolean;
}

/**
 * Smallest integer n in [lower, upper] with `meets(n)` true, for a condition that is monotone
 * (false … false true … true) on that range. Doubling from `lower` finds a bracket, then bisection
 * on integers; at most about 2·log2(upper) evaluations. When `meets(upper)` is false it reports
 * converged = false and n = null instead of returning a wrong number.
 * Common practice (bisection on integers; METHODS.md 1.4 says search integers directly).
 * @example smallestIntegerMeeting((n) => n * n >= 50, 1, 1e6).n // 8
 */
export function smallestIntegerMeeting(meets: (n: number) => boolean, lower: number, upper: number): IntegerSearchResult {
  if (!Number.isInteger(lower) || !Number.isInteger(upper) || lower > upper) {
    return { n: null, converged: false };
  }
  if (meets(lower)) return { n: lower, converged: true };
  let lo = lower; // meets(lo) is false
  let step = 1;
  let hi = lower + step;
  while (hi < upper && !meets(hi)) {
    lo = hi;
    step *= 2;
    hi = lower + step;
  }
  if (hi >= upper) {
    hi = upper;
    if (!meets(hi)) return { n: null, converged: false };
  }
  while (hi - lo > 1) {
    const mid = lo + Math.floor((hi - lo) / 2);
    if (meets(mid)) hi = mid;
    else lo = mid;
  }
  return { n: hi, converged: true };
}
