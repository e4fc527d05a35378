import type { LpSummary } from '../binary/plan-binary-population';
import { developmentPrecisionAtN, validationPrecisionAtN } from '../continuous/evaluate-continuous';
import type { CriterionResult, PrecisionAtN } from '../types';
import type { ContinuousPopulation, Project } from '../../model/project';
import { populationCriteria } from './population-criteria';
import { developmentInputsOf, validationInputsOf } from './population-inputs';
import { purposeSizes } from './required-size';

/** Everything the plan says about one population. */
export interface PopulationPlan {
  readonly id: string;
  readonly name: string;
  /** Validation criteria, then development criteria when updating is on. */
  readonly criteria: readonly CriterionResult[];
  /** Largest n over all criteria (null if a criterion's target is out of reach; see binding). */
  readonly requiredN: number | null;
  readonly binding: string | null;
  readonly validationN: number | null;
  /** Largest n over the development criteria; null when updating is off or none is assessable. */
  readonly developmentN: number | null;
  /** The stated fixed cohort size (recruitment.availableN), if any. */
  readonly availableN: number | null;
  /** Precision each measure would reach at availableN; null when no availableN is stated. */
  readonly precisionAtAvailableN: readonly PrecisionAtN[] | null;
  /** Criteria whose target was not reached, each with its reason, for display beside the number. */
  readonly problems: readonly string[];
  /** Binary outcomes (absent for continuous): expected events at the required n, exact and rounded up. */
  readonly events?: { readonly exact: number; readonly whole: number } | null;
  /** Binary outcomes with model updating: events per predictor parameter at the required n. */
  readonly eventsPerParameter?: number | null;
  /** Binary outcomes: the linear-predictor distribution used (given, or fitted to proportion and C). */
  readonly lp?: LpSummary | null;
  /** Binary outcomes: cautions about the plan (few events; a given LP implying another proportion). */
  readonly warnings?: readonly string[];
}

/**
 * Plans one population of a project: every criterion, the required n and its binding criterion,
 * the validation and development minimums, and the precision at the stated available n.
 * Pure: the same inputs always give the same plan.
 * @example planPopulation(population, project).requiredN // 762
 */
export function planPopulation(population: ContinuousPopulation, project: Pick<Project, 'updating'>): PopulationPlan {
  const criteria = populationCriteria(population, project);
  const sizes = purposeSizes(criteria, project.updating.enabled);
  const availableN = population.recruitment.availableN ?? null;
  const precisionAtAvailableN =
    availableN === null
      ? null
      : [
          ...validationPrecisionAtN(validationInputsOf(population), availableN),
          ...(project.updating.enabled
            ? developmentPrecisionAtN(developmentInputsOf(population, project.updating), availableN)
            : []),
        ];
  return {
    id: population.id,
    name: population.name,
    criteria,
    ...sizes,
    availableN,
    precisionAtAvailableN,
    problems: criteria.filter((c) => c.status === 'not-converged').map((c) => `${c.label}: ${c.reason ?? 'not reached'}`),
  };
}
