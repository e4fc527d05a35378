import { continuousPlanner } from '@shared/engine/plan/continuous-planner';
import { isContinuousPopulation } from '@shared/engine/plan/plan-project';
import type { ContinuousPopulation } from '@shared/model/project';
import type { Planner } from '@shared/summary/comparison';

function continuousOnly(population: { readonly outcome: string }): asserts population is ContinuousPopulation {
  if (!isContinuousPopulation(population)) {
    throw new Error(`a population with a ${population.outcome} outcome is not planned by the continuous engine`);
  }
}

/**
 * The planner behind the command line's comparison rows: the continuous engine, refusing (with
 * the reason, which the row shows) populations of another outcome type.
 */
export const cliPlanner: Planner = {
  plan: (population, project) => {
    continuousOnly(population);
    return continuousPlanner.plan(population, project);
  },
  worstCase: (population, project) =>
    isContinuousPopulation(population) ? continuousPlanner.worstCase(population, project) : null,
  sensitivity: (population, project) =>
    isContinuousPopulation(population) ? continuousPlanner.sensitivity(population, project) : [],
};
