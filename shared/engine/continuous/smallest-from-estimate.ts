import type { IntegerSearchResult } from '../numerics/integer-search';
import { smallestIntegerMeeting } from '../numerics/integer-search';

/**
 * Smallest n in [lowest, upper] with `meets(n)`, for a condition that is monotone there
 * (false … false true … true), starting from a close estimate of the answer. The candidate
 * c = ⌈estimate⌉ is confirmed with two evaluations (meets(c) and not meets(c − 1)); otherwise the
 * search steps away from c by doubling and bisects (smallestIntegerMeeting upwards; downwards the
 * same, mirrored), so a poor estimate costs only a few more evaluations and is never trusted.
 * Common practice (bracket by an approximation, then search integers: METHODS.md 1.4).
 * @example smallestFromEstimate((n) => n * n >= 50, 7.07, 1, 1000).n // 8
 */
export function smallestFromEstimate(
  meets: (n: number) => boolean,
  estimate: number,
  lowest: number,
  upper: number,
): IntegerSearchResult {
  if (!(lowest <= upper)) return { n: null, converged: false };
  const c = Number.isFinite(estimate) ? Math.min(upper, Math.max(lowest, Math.ceil(estimate))) : lowest;
  if (!meets(c)) return c === upper ? { n: null, converged: false } : smallestIntegerMeeting(meets, c + 1, upper);
  if (c === lowest || !meets(c - 1)) return { n: c, converged: true };
  // meets(c − 1) holds: walk down by doubling steps to a value that fails, then bisect.
  let hi = c - 1;
  let step = 1;
  let lo = hi - step;
  while (lo > lowest && meets(lo)) {
    hi = lo;
    step *= 2;
    lo = Math.max(lowest, hi - step);
  }
  if (lo <= lowest) {
    if (meets(lowest)) return { n: lowest, converged: true };
    lo = lowest;
  }
  while (hi - lo > 1) {
    const mid = lo + Math.floor((hi - lo) / 2);
    if (meets(mid)) hi = mid;
    else lo = mid;
  }
  return { n: hi, converged: true };
}
