import { planPopulation } from '@shared/engine/plan/plan-population';
import { sensitivityCurves } from '@shared/engine/ranges/sensitivity-curves';
import { worstCase } from '@shared/engine/ranges/worst-case';
import type { Planner } from '@shared/summary/comparison';

/** The continuous engine behind the comparison rows (the same planner the app uses). */
export const continuousPlanner = {
  plan: planPopulation,
  worstCase,
  sensitivity: sensitivityCurves,
} satisfies Planner;
