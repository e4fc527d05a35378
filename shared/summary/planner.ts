import { planPopulation } from '../engine/plan/plan-population';
import { sensitivityCurves } from '../engine/ranges/sensitivity-curves';
import { worstCase } from '../engine/ranges/worst-case';
import type { Planner } from './comparison';

/** The engine's planner as the comparison table, exports, report and command line use it. */
export const enginePlanner: Planner = {
  plan: planPopulation,
  worstCase,
  sensitivity: sensitivityCurves,
};
