import type { Project } from '../../model/project';
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

/**
 * Plans every population of a project (planPopulation) and adds each one's worst case across its
 * ranges (worstCase). Pure; the project is expected to have passed projectSchema.
 * @example planProject(project).populations.map((p) => p.requiredN) // [762, 1040, …]
 */
export function planProject(project: Project): ProjectPlan {
  const populations = project.populations.map((population) => ({
    ...planPopulation(population, project),
    worstCase: worstCase(population, project),
  }));
  const total = populations.reduce<number | null>(
    (sum, p) => (sum === null || p.requiredN === null ? null : sum + p.requiredN),
    0,
  );
  return { populations, totalRequiredN: total };
}
