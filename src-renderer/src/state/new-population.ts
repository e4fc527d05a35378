import { continuousPopulationSchema, type ContinuousPopulation, type Project } from '@shared/model/project';
import { issueId } from '@shared/model/population-ops';

/**
 * A new population with neutral starting values the user is expected to replace: R² 0.5,
 * outcome variance 1, CITL width 0.5 (half the SD). Every value is shown and editable.
 */
export function newPopulation(project: Project): ContinuousPopulation {
  const taken = new Set(project.populations.map((p) => p.name));
  let number = project.populations.length + 1;
  while (taken.has(`Site ${number}`)) number += 1;
  return continuousPopulationSchema.parse({
    id: issueId(new Set(project.populations.map((p) => p.id)), `site-${number}`),
    name: `Site ${number}`,
    outcome: 'continuous',
    anticipated: { rSquared: 0.5, outcomeVariance: 1 },
    precision: { citl: { width: 0.5 } },
  });
}
