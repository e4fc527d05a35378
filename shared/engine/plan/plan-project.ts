import type { ContinuousPopulation, Project } from '../../model/project';
import type { BinaryWorstCase } from '../ranges/binary-worst-case';
import type { WorstCase } from '../ranges/worst-case';
import { worstCase } from '../ranges/worst-case';
import { binaryPlanner } from './binary-planner';
import type { PopulationPlan } from './plan-population';
import { planPopulation } from './plan-population';

/** A population's plan together with the worst case across its assumption ranges. */
export interface PopulationPlanWithRanges extends PopulationPlan {
  /** Null when the population states no low/high range. */
  readonly worstCase: WorstCase | BinaryWorstCase | null;
}

export interface ProjectPlan {
  readonly populations: readonly PopulationPlanWithRanges[];
  /** Sum of the required n over populations; null if any population's requirement is unknown. */
  readonly totalRequiredN: number | null;
}

/** True for a population with a continuous outcome. */
export function isContinuousPopulation(population: { readonly outcome: string }): population is ContinuousPopulation {
  return population.outcome === 'continuous';
}

/**
 * Plans every population of a project by its outcome type (planPopulation or the binary planner)
 * and adds each one's worst case across its ranges. Pure; the project is expected to have passed
 * projectSchema (which gives every population the plan's outcome type).
 * @example planProject(project).populations.map((p) => p.requiredN) // [879, 1424, 961, 246, 904] for the demo
 */
export function planProject(project: Project): ProjectPlan {
  const populations = project.populations.map((population) =>
    isContinuousPopulation(population)
      ? { ...planPopulation(population, project), worstCase: worstCase(population, project) }
      : { ...binaryPlanner.plan(population, project), worstCase: binaryPlanner.worstCase(population, project) },
  );
  const total = populations.reduce<number | null>(
    (sum, p) => (sum === null || p.requiredN === null ? null : sum + p.requiredN),
    0,
  );
  return { populations, totalRequiredN: total };
}
