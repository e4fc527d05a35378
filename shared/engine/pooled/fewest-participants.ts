import { smallestIntegerMeeting } from '../numerics/integer-search';
import type { AllocationProblem } from './allocation-problem';
import { marginalAllocation } from './marginal-allocation';

/** Outcome of the fewest-participants search. */
export interface FewestParticipantsResult {
  /** Per-site n (whole numbers within [floor, cap]); null when the search failed. */
  readonly allocation: readonly number[] | null;
  readonly reason?: string;
}

/**
 * An allocation meeting every measure in `measureIndices` with few participants, each site's n
 * within [floors_i, caps_i], starting from `start` (default: the floors). The caps must suffice.
 *
 * Method: marginal allocation (marginalAllocation) in phases. While some measures are unmet, the
 * value of a site's next participant is Σ_{m unmet} Δw_im/R_m, with w_im = 1/(s_im² + τ_m²) and
 * R_m the total weight measure m needs (each measure counted by the share of its need the
 * participant covers); a phase ends when one more measure is met. Then every site, least useful
 * last participant first, is lowered to the smallest n that still meets every target.
 *
 * Why this is the fewest for one measure. When s² = a/(n − c) (+ b, b ≥ 0) — the form of the
 * closed-form per-site SEs on their decreasing branch — w(n) = 1/(s² + τ²) is increasing with
 * non-increasing increments (concave). For a separable concave objective under a total budget N
 * and box constraints, the greedy increment sequence is optimal for every N: if an optimum at
 * budget N lacked the greedy's next increment, swapping its smallest-gain increment for that one
 * cannot lower Σw, since a site's gains only fall as it grows. The best Σw at total N therefore
 * rises with N along the greedy sequence, and the first N at which it reaches R_m is the smallest
 * total that meets the target. With several measures the phases are a heuristic; the planner
 * compares the result with lower bounds and says whether it is proven the fewest.
 * Domain: as AllocationProblem. Source: marginal analysis (Gross 1956; Fox, Management Science
 * 1966 — from memory; common practice).
 * @example fewestParticipants(problem, [0]).allocation // [105, 105, 100] (problem as in makeAllocationProblem's example)
 */
export function fewestParticipants(
  problem: AllocationProblem,
  measureIndices: readonly number[],
  start: readonly number[] = problem.floors,
): FewestParticipantsResult {
  const { floors, caps } = problem;
  let x = [...start];
  let unmet = measureIndices.filter((m) => !problem.meets(x, m));
  for (let phase = 0; phase <= measureIndices.length && unmet.length > 0; phase++) {
    const active = unmet;
    const run = marginalAllocation(
      x,
      caps,
      (site, n) => active.reduce((g, m) => g + problem.weightGain(site, m, n) / (problem.requiredWeight[m] ?? 1), 0),
      (allocation) => active.some((m) => problem.meets(allocation, m)),
    );
    if (run.allocation === null) return { allocation: null, reason: run.reason ?? 'the marginal allocation failed' };
    x = [...run.allocation];
    unmet = active.filter((m) => !problem.meets(x, m));
  }
  if (unmet.length > 0) return { allocation: null, reason: 'the phases ended with a measure still unmet' };

  const allMet = (allocation: readonly number[]): boolean => measureIndices.every((m) => problem.meets(allocation, m));
  const lastGain = (site: number): number => {
    const n = x[site] ?? 0;
    if (n <= (floors[site] ?? n)) return Number.POSITIVE_INFINITY;
    return measureIndices.reduce((g, m) => g + problem.weightGain(site, m, n - 1) / (problem.requiredWeight[m] ?? 1), 0);
  };
  const trimOrder = x
    .map((_, site) => ({ site, g: lastGain(site) }))
    .filter((e) => e.g !== Number.POSITIVE_INFINITY)
    .sort((a, b) => a.g - b.g || a.site - b.site);
  for (const { site } of trimOrder) {
    const found = smallestIntegerMeeting((v) => allMet(x.map((n, s) => (s === site ? v : n))), floors[site] ?? 0, x[site] ?? 0);
    if (found.n !== null) x[site] = found.n;
  }
  return { allocation: x };
}
