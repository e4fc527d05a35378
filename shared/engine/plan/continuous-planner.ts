import { sensitivityCurves } from '../ranges/sensitivity-curves';
import { worstCase } from '../ranges/worst-case';
import { planPopulation } from './plan-population';

/**
 * The continuous engine as one object: the plan of a population, its worst case across the
 * assumption ranges and its sensitivity curves. Shaped for the comparison table's Planner
 * (shared/summary/comparison.ts), which the app, the reports and the command line read.
 */
export const continuousPlanner = {
  plan: planPopulation,
  worstCase,
  sensitivity: sensitivityCurves,
} as const;
