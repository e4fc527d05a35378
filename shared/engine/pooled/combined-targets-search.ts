import type { AllocationProblem } from './allocation-problem';
import { fewestParticipants } from './fewest-participants';
import { measureWeightings } from './measure-weightings';
import { weightedAllocation } from './weighted-allocation';

/** What the search over weightings of the measures found. */
export interface CombinedTargetsSearch {
  /** The largest total over the weightings tried: no allocation meeting every target has fewer (with shrinking gains). */
  readonly lowerBound: number;
  /** The weighting that gave the bound; null when no weighting gave more than the floors. */
  readonly boundWeighting: readonly number[] | null;
  /** The allocation meeting every target with the fewest participants among those found. */
  readonly best: readonly number[];
  readonly weightingsTried: number;
}

const FIRST_STEP = 1 / 8;
const LAST_STEP = 1 / 128;

const sum = (allocation: readonly number[]): number => allocation.reduce((s, n) => s + n, 0);

/**
 * For several measures: tries weightings μ of the measures (measureWeightings, then a pattern
 * search from the best of them moving weight 1/8, 1/16, … 1/128 between pairs of measures while
 * the bound rises; at most 8·M further weightings). Each weighting gives, through
 * weightedAllocation, a lower bound on the fewest participants (the surrogate relaxation); at the
 * grid points and at the weighting the search ends on, its allocation is completed and trimmed by
 * fewestParticipants into a candidate meeting every target.
 * Returns the best bound and the best candidate, starting from `start` (an allocation already
 * meeting every target). The bound is a true bound only when the gains shrink (diminishingGains).
 * Source: surrogate relaxation with a search over its multipliers (common practice).
 * @example searchCombinedTargets(problem, phased).lowerBound // ≤ any allocation's total that meets every target
 */
export function searchCombinedTargets(problem: AllocationProblem, start: readonly number[]): CombinedTargetsSearch {
  const everyMeasure = problem.measures.map((_, m) => m);
  let lowerBound = sum(problem.floors);
  let boundWeighting: number[] | null = null;
  let best = [...start];
  let tried = 0;
  const evaluate = (weighting: number[], complete: boolean): number => {
    tried++;
    const relaxed = weightedAllocation(problem, weighting);
    if (relaxed.allocation === null) return Number.NEGATIVE_INFINITY;
    const total = sum(relaxed.allocation);
    if (total > lowerBound) {
      lowerBound = total;
      boundWeighting = weighting;
    }
    if (complete) {
      const candidate = fewestParticipants(problem, everyMeasure, relaxed.allocation).allocation;
      if (candidate !== null && sum(candidate) < sum(best)) best = [...candidate];
    }
    return total;
  };

  let centre: number[] | null = null;
  let centreValue = Number.NEGATIVE_INFINITY;
  for (const weighting of measureWeightings(problem.measures.length)) {
    const value = evaluate(weighting, true);
    if (value > centreValue) {
      centreValue = value;
      centre = weighting;
    }
  }
  const budget = tried + 8 * problem.measures.length;
  let point: number[] = centre ?? [];
  for (let step = FIRST_STEP; point.length > 0 && step >= LAST_STEP && tried < budget; step /= 2) {
    let improved = true;
    while (improved && tried < budget) {
      improved = false;
      for (let from = 0; from < point.length && !improved && tried < budget; from++) {
        for (let to = 0; to < point.length && !improved && tried < budget; to++) {
          if (from === to || (point[from] ?? 0) < step) continue;
          const next: number[] = point.map((mu, m) => (m === from ? mu - step : m === to ? mu + step : mu));
          const value = evaluate(next, false);
          if (value > centreValue) {
            centreValue = value;
            point = next;
            improved = true;
          }
        }
      }
    }
  }
  if (point !== centre && point.length > 0) evaluate(point, true); // complete the best weighting the search reached
  return { lowerBound, boundWeighting, best, weightingsTried: tried };
}
