import {
  binaryPopulationSchema,
  continuousPopulationSchema,
  type BinaryPopulation,
  type ContinuousPopulation,
  type Population,
  type Project,
} from '@shared/model/project';
import { issueId } from '@shared/model/population-ops';

/** The next free "Site N" name and "site-N" id of a project. */
function nextSite(project: Project): { readonly id: string; readonly name: string } {
  const taken = new Set(project.populations.map((p) => p.name));
  let number = project.populations.length + 1;
  while (taken.has(`Site ${number}`)) number += 1;
  return { id: issueId(new Set(project.populations.map((p) => p.id)), `site-${number}`), name: `Site ${number}` };
}

/**
 * A new continuous population with neutral starting values the user is expected to replace: R²
 * 0.5, outcome variance 1, CITL width 0.5 (half the SD). Every value is shown and editable.
 */
export function newContinuousPopulation(project: Project): ContinuousPopulation {
  return continuousPopulationSchema.parse({
    ...nextSite(project),
    outcome: 'continuous',
    anticipated: { rSquared: 0.5, outcomeVariance: 1 },
    precision: { citl: { width: 0.5 } },
  });
}

/**
 * A new binary population with neutral starting values the user is expected to replace: outcome
 * proportion 0.1 and C-statistic 0.75 (the linear predictor is fitted to them), no risk thresholds,
 * and the schema's default precision targets.
 */
export function newBinaryPopulation(project: Project): BinaryPopulation {
  return binaryPopulationSchema.parse({
    ...nextSite(project),
    outcome: 'binary',
    anticipated: { outcomeProportion: 0.1, cStatistic: 0.75 },
  });
}

/** A new population of the plan's outcome type. */
export function newPopulation(project: Project): Population {
  return project.outcome === 'binary' ? newBinaryPopulation(project) : newContinuousPopulation(project);
}
