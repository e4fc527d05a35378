import { smallestIntegerMeeting } from '../numerics/integer-search';

/** Outcome of one marginal-allocation run. */
export interface MarginalAllocationResult {
  /** Per-site n; null when the search failed (reason says why). */
  readonly allocation: readonly number[] | null;
  readonly reason?: string;
}

/** Bisection on the price λ stops when hi/lo ≤ 1 + this. */
const PRICE_TOLERANCE = 1e-12;
const PRICE_ITERATIONS = 300;

/**
 * Greedy marginal allocation: starting from `start`, give participants one at a time to the site
 * whose next participant has the largest `gain`, never beyond `caps`, and stop at the first
 * allocation where `done` holds. `gain(site, n)` is the value of the site's participant n + 1 and
 * must not increase with n; `done` must be monotone (once true, adding participants keeps it true)
 * and true at `caps`.
 *
 * The one-at-a-time sequence is computed in bulk. With non-increasing gains, the greedy's first
 * steps are exactly "every increment whose gain is ≥ λ" for some price λ, so A(λ) (each site grown,
 * by integer bisection, while its next gain is ≥ λ) is a prefix of the greedy sequence. A geometric
 * bisection on λ (relative tolerance 1e-12, at most 300 steps) brackets the step at which `done`
 * first holds; the increments whose gains tie inside the bracket are then added site by site
 * (largest gain first) with an integer search, so no increment beyond the first point where `done`
 * holds is added. Cost: about 50 bisection steps × K integer searches, each confined to the
 * range between the allocations at the current bracket's ends (a few gains once it is narrow).
 * Source: marginal analysis for separable concave resource allocation (Gross 1956; Fox,
 * Management Science 1966 — from memory; common practice).
 * @example marginalAllocation([1, 1], [10, 10], (_s, n) => 1 / (n + 1), (a) => a[0] + a[1] >= 6).allocation // [3, 3]
 */
export function marginalAllocation(
  start: readonly number[],
  caps: readonly number[],
  gain: (site: number, n: number) => number,
  done: (allocation: readonly number[]) => boolean,
): MarginalAllocationResult {
  if (done(start)) return { allocation: [...start] };
  const memo = start.map(() => new Map<number, number>());
  const gainOf = (site: number, n: number): number => {
    const known = memo[site]?.get(n);
    if (known !== undefined) return known;
    const g = gain(site, n);
    memo[site]?.set(n, g);
    return g;
  };
  // A(λ): every site grows while its next participant's gain is ≥ λ (gains fall with n). A(λ) falls
  // as λ rises, so for hi > λ > lo each site's answer lies in [A(hi), A(lo)]: search only there.
  const atPrice = (price: number, lower: readonly number[], upper: readonly number[]): number[] =>
    lower.map((from, site) => {
      const to = upper[site] ?? from;
      if (from >= to) return from;
      return smallestIntegerMeeting((n) => n >= to || gainOf(site, n) < price, from, to).n ?? to;
    });
  let hi = 0;
  start.forEach((n, site) => {
    if (n < (caps[site] ?? n)) hi = Math.max(hi, gainOf(site, n));
  });
  if (!(hi > 0)) return { allocation: null, reason: 'no site can add precision where it is still needed' };
  hi *= 2; // A(hi) adds nobody, and done(start) is false
  let atHi: number[] = [...start];
  let atLo: number[] = [...caps];
  let lo = hi;
  let loDone = false;
  for (let i = 0; i < 110 && !loDone; i++) {
    lo /= 1024;
    const a = atPrice(lo, atHi, caps);
    loDone = done(a);
    if (loDone) atLo = a;
    else {
      hi = lo;
      atHi = a;
    }
  }
  if (!loDone) return { allocation: null, reason: 'no price was found at which the targets are met' };
  let iterations = 0;
  while (hi / lo > 1 + PRICE_TOLERANCE && iterations < PRICE_ITERATIONS) {
    const mid = Math.sqrt(lo * hi);
    const a = atPrice(mid, atHi, atLo);
    if (done(a)) {
      lo = mid;
      atLo = a;
    } else {
      hi = mid;
      atHi = a;
    }
    iterations++;
  }
  if (hi / lo > 1 + PRICE_TOLERANCE)
    return { allocation: null, reason: `the price bisection did not converge in ${PRICE_ITERATIONS} steps` };
  // Increments with gains in [lo, hi) tie at this price: add them site by site, largest gain first.
  const below = atHi;
  const above = atLo;
  const order = below
    .map((n, site) => ({ site, g: n < (above[site] ?? n) ? gainOf(site, n) : -1 }))
    .filter((e) => e.g >= 0)
    .sort((a, b) => b.g - a.g || a.site - b.site);
  const y = [...below];
  for (const { site } of order) {
    const from = below[site] ?? 0;
    const to = above[site] ?? from;
    y[site] = to;
    if (done(y)) {
      y[site] = smallestIntegerMeeting((v) => done(y.map((n, s) => (s === site ? v : n))), from, to).n ?? to;
      break;
    }
  }
  return { allocation: y };
}
