import type { ContinuousPopulation, Project } from '../../model/project';
import type { WorstCase } from '../ranges/worst-case';
import { worstCase } from '../ranges/worst-case';
import type { PopulationPlan } from './plan-population';
import { planPopulation } from './plan-population';

/** A population's plan together with the worst case across its assumption ranges. */
export interface PopulationPlanWithRanges extends PopulationPlan {
  /** Null when the population states no low/high range. */
  readonly worstCase: WorstCase | null;
}

export interface ProjectPlan {
  readonly populations: readonly PopulationPlanWithRanges[];
  /** Sum of the required n over populations; null if any population's requirement is unknown. */
  readonly totalRequiredN: number | null;
}

/** True for a population with a continuous outcome (the only kind this engine plans). */
export function isContinuousPopulation(population: { readonly outcome: string }): population is ContinuousPopulation {
  return population.outcome === 'continuous';
}

/** A population of another outcome type: listed, not planned, with the reason. */
function notPlannedHere(population: {
  readonly id: string;
  readonly name: string;
  readonly outcome: string;
}): PopulationPlanWithRanges {
  return {
    id: population.id,
    name: population.name,
    criteria: [],
    requiredN: null,
    binding: null,
    validationN: null,
    developmentN: null,
    availableN: null,
    precisionAtAvailableN: null,
    problems: [`a population with a ${population.outcome} outcome is not planned by the continuous engine`],
    worstCase: null,
  };
}

/**
 * Plans every continuous population of a project (planPopulation) and adds each one's worst case
 * across its ranges (worstCase); populations of another outcome type are listed with the reason
 * and no n. Pure; the project is expected to have passed projectSchema.
 * @example planProject(project).populations.map((p) => p.requiredN) // [879, 1424, 961, 246, 904] for the demo
 */
export function planProject(project: Project): ProjectPlan {
  const populations = project.populations.map((population) =>
    isContinuousPopulation(population)
      ? { ...planPopulation(population, project), worstCase: worstCase(population, project) }
      : notPlannedHere(population),
  );
  const total = populations.reduce<number | null>(
    (sum, p) => (sum === null || p.requiredN === null ? null : sum + p.requiredN),
    0,
  );
  return { populations, totalRequiredN: total };
}
