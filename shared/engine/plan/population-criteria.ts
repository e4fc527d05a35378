import { evaluateContinuousDevelopment, evaluateContinuousValidation } from '../continuous/evaluate-continuous';
import type { CriterionResult } from '../types';
import type { ContinuousPopulation, Project } from '../../model/project';
import { developmentInputsOf, validationInputsOf } from './population-inputs';

/**
 * Every criterion for one population: the five validation criteria, then the four development
 * criteria when the project's model-updating toggle is on.
 * @example populationCriteria(population, project).map((c) => c.id) // ['r2', 'citl', 'slope', 'residual-sd-citl', 'residual-sd-slope']
 */
export function populationCriteria(population: ContinuousPopulation, project: Pick<Project, 'updating'>): CriterionResult[] {
  const validation = evaluateContinuousValidation(validationInputsOf(population));
  if (!project.updating.enabled) return validation;
  return [...validation, ...evaluateContinuousDevelopment(developmentInputsOf(population, project.updating))];
}
