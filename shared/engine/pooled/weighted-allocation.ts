import type { AllocationProblem } from './allocation-problem';
import { marginalAllocation, type MarginalAllocationResult } from './marginal-allocation';

/** Relative slack on the combined target, so that the bound it gives is never above the truth through rounding. */
const SLACK = 1e-12;

/**
 * Fewest participants for a single combined target: Σ_m μ_m · (Σ_i w_im)/R_m ≥ 1, where
 * w_im = 1/(s_im² + τ_m²) and R_m is the total weight measure m needs. Every allocation meeting
 * all targets (Σ_i w_im ≥ R_m for each m) meets this combined one, so — the weights being
 * concave, as in fewestParticipants — its total is a lower bound on the fewest participants
 * that meet all targets, for every weighting μ; and when the allocation happens to meet every
 * target, it is the fewest possible. One marginal-allocation run from the floors.
 * Domain: μ_m ≥ 0 with at least one μ_m > 0 on measures with finite R_m (not checked: internal).
 * Source: a surrogate (weighted-sum) relaxation of the multi-target problem (common practice).
 * @example weightedAllocation(problem, [1]).allocation // [105, 105, 100] (problem as in makeAllocationProblem's example)
 */
export function weightedAllocation(problem: AllocationProblem, weighting: readonly number[]): MarginalAllocationResult {
  const used = weighting.flatMap((mu, m) => (mu > 0 ? [{ m, scale: mu / (problem.requiredWeight[m] ?? 1) }] : []));
  return marginalAllocation(
    problem.floors,
    problem.caps,
    (site, n) => used.reduce((g, { m, scale }) => g + scale * problem.weightGain(site, m, n), 0),
    (allocation) => used.reduce((v, { m, scale }) => v + scale * problem.totalWeight(allocation, m), 0) >= 1 - SLACK,
  );
}
