import type { CriterionSize } from '../continuous/continuous-sizes';
import { developmentSizes, validationSizes } from '../continuous/continuous-sizes';
import type { ContinuousPopulation, Project } from '../../model/project';
import { developmentInputsOf, validationInputsOf } from './population-inputs';

/**
 * Every criterion's n for one population without the words: what populationCriteria gives, as
 * numbers only (for sweeps over assumptions, where the text would be thrown away).
 * @example populationSizes(population, project).map((c) => c.n) // [762, 308, 98, 234, 235]
 */
export function populationSizes(population: ContinuousPopulation, project: Pick<Project, 'updating'>): CriterionSize[] {
  const validation = validationSizes(validationInputsOf(population));
  if (!project.updating.enabled) return validation;
  return [...validation, ...developmentSizes(developmentInputsOf(population, project.updating))];
}
