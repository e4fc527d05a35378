import { binaryPlanner } from '../engine/plan/binary-planner';
import { continuousPlanner } from '../engine/plan/continuous-planner';
import { DomainError } from '../engine/errors';
import type { Population, Project } from '../model/project';
import type { Planner } from './comparison';

/**
 * Refuses a population whose outcome type is not the plan's: one model predicts one outcome type
 * (the schema refuses such a plan too; this guards plans built in memory).
 */
function requirePlanOutcome(population: Population, project: Partial<Pick<Project, 'outcome'>>): void {
  if (project.outcome !== undefined && population.outcome !== project.outcome) {
    throw new DomainError(
      `outcome of population "${population.name}"`,
      population.outcome,
      `"${project.outcome}", the plan's outcome type (one model predicts one outcome type)`,
    );
  }
}

/**
 * The engine's planner as the comparison table, exports, report and command line use it: each
 * population goes to the continuous or the binary engine by its outcome type.
 */
export const enginePlanner = {
  plan: (population, project) => {
    requirePlanOutcome(population, project);
    return population.outcome === 'binary'
      ? binaryPlanner.plan(population, project)
      : continuousPlanner.plan(population, project);
  },
  worstCase: (population, project) => {
    requirePlanOutcome(population, project);
    return population.outcome === 'binary'
      ? binaryPlanner.worstCase(population, project)
      : continuousPlanner.worstCase(population, project);
  },
  sensitivity: (population, project) =>
    population.outcome === 'binary'
      ? binaryPlanner.sensitivity(population, project)
      : continuousPlanner.sensitivity(population, project),
} satisfies Planner;
