// Plans one binary-outcome population of a project: the engine's binary criteria (O/E, calibration
// slope, C-statistic, net benefit per threshold, and the development minimums when the model will
// be updated), read back in the shape every consumer of a population plan reads, plus the events.
import { planBinaryPopulation } from '../binary/plan-binary-population';
import { binaryDevelopmentNotAssessable } from '../binary/development-not-assessable';
import { DomainError } from '../errors';
import type { CriterionResult } from '../types';
import type { BinaryPopulation, Project } from '../../model/project';
import { binaryInputOf, binaryOptionsOf } from './binary-population-inputs';
import type { PopulationPlan } from './plan-population';
import { purposeSizes } from './required-size';

/** The engine's development fields and the project-file fields they come from. */
const DEVELOPMENT_FIELDS: Readonly<Record<string, string>> = {
  'development.predictorParameters': 'updating.predictorParameters',
  'development.coxSnellR2': 'updating.anticipatedCoxSnellR2',
  'development.targetShrinkage': 'updating.targetShrinkage',
  'development.optimismMargin': 'updating.optimismMargin',
  'development.riskMargin': 'updating.riskMargin',
  availableN: 'recruitment.availableN',
};

/** Runs `plan`, renaming an engine field in a DomainError to the project-file field it comes from. */
function withFileFields<T>(plan: () => T): T {
  try {
    return plan();
  } catch (error) {
    if (error instanceof DomainError && DEVELOPMENT_FIELDS[error.field] !== undefined) {
      throw new DomainError(DEVELOPMENT_FIELDS[error.field] ?? error.field, error.value, error.allowed);
    }
    throw error;
  }
}

/**
 * Every criterion of one binary population, validation then development (when updating is on:
 * sized, or not-assessable naming the missing project fields), with the engine's totals.
 */
function binaryCriteria(population: BinaryPopulation, project: Pick<Project, 'updating'>) {
  const { options, missing, targets } = binaryOptionsOf(population, project.updating);
  const plan = withFileFields(() => planBinaryPopulation(binaryInputOf(population), options));
  const criteria: readonly CriterionResult[] =
    missing === null ? plan.criteria : [...plan.criteria, ...binaryDevelopmentNotAssessable(missing, targets)];
  return { plan, criteria };
}

/**
 * The criteria of one binary population as numbers for sweeps over assumptions.
 * @example binarySizes(population, project).map((c) => c.id) // ['oe', 'slope', 'c-statistic', 'net-benefit@0.1']
 */
export function binarySizes(population: BinaryPopulation, project: Pick<Project, 'updating'>): readonly CriterionResult[] {
  return binaryCriteria(population, project).criteria;
}

/**
 * Plans one binary population: the engine's criteria and totals (planBinaryPopulation; VAL-BIN,
 * DEV-BIN-SURV), the required n and binding criterion by the same rule as for continuous outcomes
 * (the largest n, the first on ties; unknown when a criterion failed numerically), the validation
 * and development minimums, the precision at the available n, and the expected events at the
 * required n (exact and whole) with events per predictor parameter when the model is updated.
 * Domain: a population that passed the schema; otherwise a DomainError naming the field.
 * @example planBinary(population, project).events // { exact: 429.1, whole: 430 } for phi 0.1 at n 4291
 */
export function planBinary(population: BinaryPopulation, project: Pick<Project, 'updating'>): PopulationPlan {
  const { plan, criteria } = binaryCriteria(population, project);
  const sizes = purposeSizes(criteria, project.updating.enabled);
  return {
    id: population.id,
    name: population.name,
    criteria,
    ...sizes,
    availableN: population.recruitment.availableN ?? null,
    precisionAtAvailableN: plan.precisionAtN,
    problems: criteria.filter((c) => c.status === 'not-converged').map((c) => `${c.label}: ${c.reason ?? 'not reached'}`),
    events: plan.events,
    eventsPerParameter: plan.eventsPerParameter,
    lp: plan.lp,
    warnings: plan.warnings,
  };
}
