import type { AllocationProblem } from './allocation-problem';

/** Outcome of the shortest-recruitment search. */
export interface ShortestRecruitmentResult {
  /** The most each site can recruit in `months` (min(cap_i, ⌊rate_i·months⌋)); null when the search failed. */
  readonly allocation: readonly number[] | null;
  /** The shortest recruitment: max_i n_i/rate_i of that allocation. */
  readonly months: number | null;
  readonly converged: boolean;
  readonly reason?: string;
}

const DURATION_ITERATIONS = 200;
const DURATION_TOLERANCE = 1e-12;
const STEP_DOWN_LIMIT = 100_000;

/**
 * Shortest common recruitment duration T at which every measure meets its pooled targets when
 * each site recruits for T months: n_i(T) = min(cap_i, ⌊rate_i·T⌋), which must also reach the
 * site's minimum n. Meeting the targets is monotone in T, so a bisection on T over
 * (0, max_i cap_i/rate_i] finds it; n(T) only changes where some rate_i·T crosses a whole number,
 * so the answer is then made exact by stepping down those breakpoints: the sites that finish last
 * each give up one participant while the targets still hold. The caller then looks for the
 * fewest participants within these per-site numbers (the duration cannot get shorter).
 * Domain: rates finite > 0 (checked by planPooledAllocation); the caps must meet every target.
 * Iteration caps: 200 bisection steps (relative tolerance 1e-12), 100,000 breakpoint steps.
 * Source: bisection on a monotone condition (common practice).
 * @example shortestRecruitment(problem, [10, 20, 5]) // { allocation: [94, 188, 47], months: 9.4 } (problem as in makeAllocationProblem's example)
 */
export function shortestRecruitment(problem: AllocationProblem, rates: readonly number[]): ShortestRecruitmentResult {
  const { floors, caps } = problem;
  const allocationAt = (months: number): number[] => caps.map((cap, i) => Math.min(cap, Math.floor((rates[i] ?? 0) * months)));
  const feasible = (allocation: readonly number[]): boolean =>
    allocation.every((n, i) => n >= (floors[i] ?? 0)) && problem.measures.every((_, m) => problem.meets(allocation, m));
  const duration = (allocation: readonly number[]): number =>
    allocation.reduce((longest, n, i) => Math.max(longest, n / (rates[i] ?? 1)), 0);

  let hi = caps.reduce((longest, cap, i) => Math.max(longest, cap / (rates[i] ?? 1)), 0) * (1 + 1e-9);
  if (!feasible(allocationAt(hi)))
    return { allocation: null, months: null, converged: false, reason: 'the targets are not met even at capacity' };
  let lo = 0;
  let iterations = 0;
  while (hi - lo > DURATION_TOLERANCE * hi && iterations < DURATION_ITERATIONS) {
    const mid = (lo + hi) / 2;
    if (feasible(allocationAt(mid))) hi = mid;
    else lo = mid;
    iterations++;
  }
  let allocation = allocationAt(hi);
  for (let step = 0; step < STEP_DOWN_LIMIT; step++) {
    const longest = duration(allocation);
    const earlier = allocation.map((n, i) => (n / (rates[i] ?? 1) === longest ? n - 1 : n));
    if (!feasible(earlier)) return { allocation, months: longest, converged: true };
    allocation = earlier;
  }
  return {
    allocation: null,
    months: null,
    converged: false,
    reason: `more than ${STEP_DOWN_LIMIT} breakpoint steps were needed`,
  };
}
