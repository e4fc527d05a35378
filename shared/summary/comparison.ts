// The comparison table as data: one row per population with each criterion's n, the required n
// and its binding criterion, the enrolment target after missing outcomes, months to recruit, the
// finish date and feasibility; plus the totals row. The workspace table, its TSV copy, the CSV
// and XLSX exports, the report and the command line all read these rows.
import {
  enrolmentTarget,
  feasibility,
  finishDate,
  monthlyEnrolment,
  monthsToRecruit,
  type Feasibility,
} from '../engine/recruitment/recruitment';
import type { CriterionResult, PrecisionAtN } from '../engine/types';
import type { Project, Population } from '../model/project';

/** What planning one population yields (the engine's per-population result). */
export interface PopulationPlanLike {
  readonly criteria: readonly CriterionResult[];
  readonly requiredN: number | null;
  readonly binding: string | null;
  readonly precisionAtAvailableN?: readonly PrecisionAtN[] | null;
  /** Binary outcomes: expected events at the required n (exact and rounded up). */
  readonly events?: { readonly exact: number; readonly whole: number } | null;
  readonly eventsPerParameter?: number | null;
  /** Cautions about the plan that do not stop it (e.g. few expected events). */
  readonly warnings?: readonly string[];
}

export interface WorstCaseLike {
  readonly requiredN: number | null;
  readonly binding: string | null;
  /** The assumption that produced the worst case, in words (e.g. "anticipated R² at its low end 0.6"). */
  readonly assumption: string;
}

export interface ComparisonRow {
  readonly populationId: string;
  readonly name: string;
  readonly criteria: readonly CriterionResult[];
  readonly requiredN: number | null;
  readonly binding: string | null;
  readonly bindingLabel: string | null;
  readonly missingOutcomeFraction: number;
  readonly enrolmentTarget: number | null;
  readonly perMonth: number | null;
  readonly months: number | null;
  readonly finishDate: string | null;
  readonly feasibility: Feasibility;
  readonly worstCase: WorstCaseLike | null;
  readonly availableN: number | null;
  readonly precisionAtAvailableN: readonly PrecisionAtN[] | null;
  /** Set when the population could not be planned (the message says why). */
  readonly problem: string | null;
  /** Binary outcomes: expected events at the required n; null for continuous outcomes or no n. */
  readonly events?: { readonly exact: number; readonly whole: number } | null;
  /** Binary outcomes with model updating: events per predictor parameter at the required n. */
  readonly eventsPerParameter?: number | null;
  /** Cautions about the plan that do not stop it (e.g. few expected events). */
  readonly warnings?: readonly string[];
}

export interface ComparisonTotals {
  readonly populations: number;
  readonly enrolmentTarget: number;
  readonly longestMonths: number | null;
  readonly longestSite: string | null;
  readonly exceeding: number;
  readonly unplanned: number;
}

/** Required n across the range of one anticipated value, the others at their base values. */
export interface SensitivityCurveLike {
  readonly key: string;
  readonly label: string;
  readonly base: number;
  readonly baseN: number | null;
  readonly points: readonly { readonly value: number; readonly n: number | null }[];
}

export interface Planner {
  plan(population: Population, project: Project): PopulationPlanLike;
  worstCase?(population: Population, project: Project): WorstCaseLike | null;
  sensitivity?(population: Population, project: Pick<Project, 'updating'>): readonly SensitivityCurveLike[];
}

export function comparisonRow(population: Population, project: Project, planner: Planner): ComparisonRow {
  const recruitment = population.recruitment;
  const perMonth =
    recruitment.accrualPerMonth === undefined
      ? null
      : monthlyEnrolment(recruitment.accrualPerMonth, recruitment.eligibleFraction, recruitment.consentFraction);
  let plan: PopulationPlanLike;
  let worst: WorstCaseLike | null;
  try {
    plan = planner.plan(population, project);
    worst = planner.worstCase?.(population, project) ?? null;
  } catch (error) {
    return {
      populationId: population.id,
      name: population.name,
      criteria: [],
      requiredN: null,
      binding: null,
      bindingLabel: null,
      missingOutcomeFraction: recruitment.missingOutcomeFraction,
      enrolmentTarget: null,
      perMonth,
      months: null,
      finishDate: null,
      feasibility: 'unknown',
      worstCase: null,
      availableN: recruitment.availableN ?? null,
      precisionAtAvailableN: null,
      problem: error instanceof Error ? error.message : String(error),
      events: null,
      eventsPerParameter: null,
      warnings: [],
    };
  }
  const target = plan.requiredN === null ? null : enrolmentTarget(plan.requiredN, recruitment.missingOutcomeFraction);
  const months = target === null || perMonth === null ? null : monthsToRecruit(target, perMonth);
  const start = project.study.startDate;
  return {
    populationId: population.id,
    name: population.name,
    criteria: plan.criteria,
    requiredN: plan.requiredN,
    binding: plan.binding,
    bindingLabel: plan.criteria.find((c) => c.id === plan.binding)?.label ?? null,
    missingOutcomeFraction: recruitment.missingOutcomeFraction,
    enrolmentTarget: target,
    perMonth,
    months,
    finishDate: months === null || start === undefined ? null : finishDate(start, months),
    feasibility: feasibility(months, project.study.windowMonths),
    worstCase: worst,
    availableN: recruitment.availableN ?? null,
    precisionAtAvailableN: plan.precisionAtAvailableN ?? null,
    problem: null,
    events: plan.events ?? null,
    eventsPerParameter: plan.eventsPerParameter ?? null,
    warnings: plan.warnings ?? [],
  };
}

export function comparisonRows(project: Project, planner: Planner): ComparisonRow[] {
  return project.populations.map((population) => comparisonRow(population, project, planner));
}

export function comparisonTotals(rows: readonly ComparisonRow[]): ComparisonTotals {
  let enrolment = 0;
  let longest: number | null = null;
  let longestSite: string | null = null;
  let exceeding = 0;
  let unplanned = 0;
  for (const row of rows) {
    if (row.enrolmentTarget === null) unplanned += 1;
    else enrolment += row.enrolmentTarget;
    if (row.months !== null && (longest === null || row.months > longest)) {
      longest = row.months;
      longestSite = row.name;
    }
    if (row.feasibility === 'exceeds') exceeding += 1;
  }
  return { populations: rows.length, enrolmentTarget: enrolment, longestMonths: longest, longestSite, exceeding, unplanned };
}

/** Rows ranked by required n, largest first; unplanned rows last. The table's default order. */
export function rankByRequiredN(rows: readonly ComparisonRow[]): ComparisonRow[] {
  return [...rows].sort((a, b) => (b.requiredN ?? -1) - (a.requiredN ?? -1) || a.name.localeCompare(b.name));
}
