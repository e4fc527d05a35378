import { DomainError } from '../errors';
import { formatCount, formatMonths, formatPercent, formatSignificant } from '../../format/numbers';
import type { ReferenceKey } from '../types';
import { makeAllocationProblem, type AllocationProblem } from './allocation-problem';
import { searchCombinedTargets } from './combined-targets-search';
import { diminishingGains } from './diminishing-gains';
import { fewestParticipants } from './fewest-participants';
import { minimumSites } from './minimum-sites';
import { PREDICTION_NEEDS_THREE_SITES, type PooledMeasurePrecision } from './pooled-precision';
import { requirePositive } from '../helpers/domain-guards';
import { requireInteger, requireNonNegative } from './require-input';
import { shortestRecruitment } from './shortest-recruitment';
import { MAX_SITE_N, type PlannerSite, type PooledMeasure, type SeAtN, type SiteCapacity } from './types';

export const PLANNER_OBJECTIVES = ['fewest-participants', 'shortest-recruitment'] as const;
/** Fewest participants in total, or the shortest recruitment (the last site to finish finishes first). */
export type PlannerObjective = (typeof PLANNER_OBJECTIVES)[number];

export interface PooledPlanInput {
  /** Every listed site takes part (K is their number); remove a site to plan without it. */
  readonly sites: readonly PlannerSite[];
  readonly measures: readonly PooledMeasure[];
  readonly objective: PlannerObjective;
  readonly confidence?: number;
}

export interface SiteAllocation {
  readonly siteId: string;
  readonly n: number;
  readonly minimumN: number;
  readonly capacity: SiteCapacity;
  readonly atCapacity: boolean;
  /** n / accrual per month; null when the site's accrual is not given. */
  readonly months: number | null;
}

export type PooledPlanStatus = 'feasible' | 'infeasible' | 'not-converged';

export interface PooledPlan {
  readonly status: PooledPlanStatus;
  readonly objective: PlannerObjective;
  /** The proposal when feasible; otherwise every site at its capacity (the best the sites can do). */
  readonly allocation: readonly SiteAllocation[];
  readonly totalN: number;
  /** Longest recruitment among the sites; null unless every site's accrual is given. */
  readonly maxMonths: number | null;
  /** Pooled precision of each measure at `allocation`. */
  readonly precision: readonly PooledMeasurePrecision[];
  /** No allocation meeting the targets (within the shortest duration, for that objective) has fewer participants; null unless feasible. */
  readonly lowerBoundTotalN: number | null;
  /** totalN equals lowerBoundTotalN and the gains shrank steadily, so no allocation uses fewer participants. */
  readonly minimalTotalProven: boolean;
  /** What was found, in plain words. */
  readonly messages: readonly string[];
  /** How the proposal was found, in plain words. */
  readonly method: string;
  readonly references: readonly ReferenceKey[];
}

const REFERENCES: readonly ReferenceKey[] = ['DERSIMONIAN-LAIRD-1986', 'HIGGINS-THOMPSON-SPIEGELHALTER-2009', 'COMMON-PRACTICE'];

const METHOD_FEWEST =
  'Participants are given one at a time to the site where one more participant narrows the pooled intervals most ' +
  '(random-effects weights 1/(SE² + τ²); with several measures, each counted by the share of its remaining need that ' +
  "the participant covers), never beyond a site's capacity or below its minimum, until every target is met; then each " +
  'site is lowered as far as the targets allow. With several measures this is repeated for a range of weightings of ' +
  'the measures, which also gives a total that no allocation can go below. With one measure, and precision gains that ' +
  'shrink as a site grows, the result is the fewest participants possible.';
const METHOD_SHORTEST =
  'All sites recruit for the same number of months, each up to its capacity; the shortest such duration that meets ' +
  'every target is found by bisection and made exact at the whole-participant steps. Within that duration the ' +
  'participants are then spread as for the fewest-participants plan, so no site recruits more than it needs.';

function validate(input: PooledPlanInput): void {
  const { sites, measures, objective } = input;
  if (!PLANNER_OBJECTIVES.includes(objective)) throw new DomainError('objective', objective, PLANNER_OBJECTIVES.join(' or '));
  if (sites.length < 1 || sites.length > 10_000) throw new DomainError('sites', sites.length, 'from 1 to 10,000 sites');
  if (measures.length < 1 || measures.length > 100) throw new DomainError('measures', measures.length, 'from 1 to 100 measures');
  const measureIds = new Set<string>();
  measures.forEach((m, j) => {
    if (measureIds.has(m.id)) throw new DomainError(`measures[${j}].id`, m.id, 'an id used by no other measure');
    measureIds.add(m.id);
    requireNonNegative(`measures[${j}].tau`, m.tau);
    requirePositive(`measures[${j}].target.maxSummaryCiWidth`, m.target.maxSummaryCiWidth);
    if (m.target.maxPredictionIntervalWidth !== undefined) {
      requirePositive(`measures[${j}].target.maxPredictionIntervalWidth`, m.target.maxPredictionIntervalWidth);
    }
  });
  const siteIds = new Set<string>();
  sites.forEach((s, i) => {
    if (siteIds.has(s.id)) throw new DomainError(`sites[${i}].id`, s.id, 'an id used by no other site');
    siteIds.add(s.id);
    const capacity: unknown = s.capacity;
    if (capacity !== 'unlimited') {
      if (typeof capacity !== 'number') {
        throw new DomainError(
          `sites[${i}].capacity`,
          capacity,
          `a whole number from 1 to ${formatCount(MAX_SITE_N)}, or "unlimited" stated explicitly`,
        );
      }
      requireInteger(`sites[${i}].capacity`, capacity, 1, MAX_SITE_N);
    }
    requireInteger(`sites[${i}].minimumN`, s.minimumN, 1, MAX_SITE_N);
    if (s.accrualPerMonth !== undefined || objective === 'shortest-recruitment') {
      requirePositive(`sites[${i}].accrualPerMonth`, s.accrualPerMonth ?? Number.NaN);
    }
    for (const m of measures) {
      if (typeof s.seAtN[m.id] !== 'function') {
        throw new DomainError(`sites[${i}].seAtN.${m.id}`, s.seAtN[m.id], 'a function giving the standard error at n');
      }
    }
  });
}

const fmt = (x: number | null): string => formatSignificant(x, 4);

function shortfallMessages(precision: readonly PooledMeasurePrecision[], confidence: number, anyUnlimited: boolean): string[] {
  const level = formatPercent(confidence, 0);
  const atCapacity = anyUnlimited
    ? `with every site at its capacity (sites without a limit at ${formatCount(MAX_SITE_N)})`
    : 'with every site at its capacity';
  const messages: string[] = [];
  for (const p of precision) {
    const bound = minimumSites(
      p.tau,
      {
        maxSummaryCiWidth: p.targetSummaryCiWidth,
        ...(p.targetPredictionIntervalWidth === null ? {} : { maxPredictionIntervalWidth: p.targetPredictionIntervalWidth }),
      },
      confidence,
    );
    if (!p.meetsSummary) {
      if (p.targetSummaryCiWidth <= p.summaryFloorWidth) {
        const more =
          bound.summary.sites !== null
            ? `at least ${formatCount(bound.summary.sites)} sites would be needed`
            : (bound.summary.reason ?? '');
        messages.push(
          `${p.label}: the summary ${level} CI width target ${fmt(p.targetSummaryCiWidth)} is at or below ${fmt(p.summaryFloorWidth)}, the width that ` +
            `between-site heterogeneity (τ = ${fmt(p.tau)}) leaves with ${formatCount(p.k)} sites however many participants each recruits; ${more}.`,
        );
      } else {
        messages.push(
          `${p.label}: ${atCapacity} the summary ${level} CI width is ${fmt(p.summaryCiWidth)}, above the target ${fmt(p.targetSummaryCiWidth)}.`,
        );
      }
    }
    if (p.meetsPrediction === false) {
      const target = p.targetPredictionIntervalWidth ?? 0;
      if (p.predictionIntervalWidth === null) {
        messages.push(
          `${p.label}: ${PREDICTION_NEEDS_THREE_SITES}; with ${formatCount(p.k)} sites the prediction-interval target cannot be assessed.`,
        );
      } else if (p.predictionFloorWidth !== null && target <= p.predictionFloorWidth) {
        const more =
          bound.prediction !== null && bound.prediction.sites !== null
            ? `at least ${formatCount(bound.prediction.sites)} sites would be needed even with unlimited participants`
            : `nor can more sites, since the width never falls below 2·z·τ = ${fmt(p.predictionFloorManySites)}`;
        messages.push(
          `${p.label}: the prediction-interval width target ${fmt(target)} is at or below the heterogeneity floor ${fmt(p.predictionFloorWidth)} ` +
            `(2·t·τ with ${formatCount(p.k - 2)} degrees of freedom): no sample size can meet it with these sites; ${more}.`,
        );
      } else {
        messages.push(
          `${p.label}: ${atCapacity} the prediction-interval width is ${fmt(p.predictionIntervalWidth)}, above the target ${fmt(target)}.`,
        );
      }
    }
  }
  return messages;
}

/**
 * Proposes per-site n meeting every pooled target (summary CI width, and prediction-interval width
 * where set) for the chosen objective, within each site's [minimumN, capacity]:
 * - fewest-participants: marginal allocation (fewestParticipants), then a check;
 * - shortest-recruitment: the shortest common duration T with n_i = min(cap_i, ⌊rate_i·T⌋)
 *   (shortestRecruitment), then the fewest participants within those n_i.
 * When even full capacity falls short it says so, measure by measure, with the best widths the
 * sites can reach, and names targets that no sample size can meet (heterogeneity floors) and the
 * fewest sites that could. Every proposal is re-checked with pooledPrecision before it is returned;
 * no site is ever given more than its capacity. τ is the anticipated between-site SD, taken as known.
 * Domain: 1–10,000 sites with distinct ids; capacity a whole number 1–100,000,000 or 'unlimited'
 * (searched up to 100,000,000); minimumN a whole number ≥ 1; accrual > 0 (required for
 * shortest-recruitment); one SE function per site and measure, finite > 0 and not increasing in n;
 * 1–100 measures with τ ≥ 0 and target widths > 0. Outside it a DomainError names the field.
 * Sources: DerSimonian & Laird, Control Clin Trials 1986, doi:10.1016/0197-2456(86)90046-2;
 * J R Stat Soc A 2009, doi:10.1111/j.1467-985X.2008.00552.x; marginal allocation (common practice).
 * @example planPooledAllocation({ sites, measures: [slope], objective: 'fewest-participants' }).allocation.map((a) => a.n) // [105, 105, 100]
 *   (se = (n) => 1 / Math.sqrt(n); slope with τ 0.05, width 0.25; sites A, B, C with minimum 10 and capacity 400, 400, 100);
 *   with accrual 10, 20, 5 per month, 'shortest-recruitment' gives [94, 188, 47] and maxMonths 9.4
 */
export function planPooledAllocation(input: PooledPlanInput): PooledPlan {
  validate(input);
  const { sites, measures, objective } = input;
  const confidence = input.confidence ?? 0.95;
  const caps = sites.map((s) => (s.capacity === 'unlimited' ? MAX_SITE_N : s.capacity));
  const floors = sites.map((s) => s.minimumN);
  const seAtN: SeAtN[][] = sites.map((s) => measures.map((m) => s.seAtN[m.id] as SeAtN));
  const siteIds = sites.map((s) => s.id);
  const build = (upper: readonly number[]): AllocationProblem =>
    makeAllocationProblem({ measures, seAtN, siteIds, floors, caps: upper, confidence });
  const rates = sites.map((s) => s.accrualPerMonth ?? null);
  const allRates = rates.every((r) => r !== null);
  const describe = (allocation: readonly number[]): SiteAllocation[] =>
    allocation.map((n, i) => {
      const site = sites[i] as PlannerSite;
      const rate = rates[i] ?? null;
      return {
        siteId: site.id,
        n,
        minimumN: site.minimumN,
        capacity: site.capacity,
        atCapacity: n >= (caps[i] ?? n),
        months: rate === null ? null : n / rate,
      };
    });
  const longest = (allocation: readonly number[]): number | null =>
    allRates ? allocation.reduce((m, n, i) => Math.max(m, n / (rates[i] ?? 1)), 0) : null;
  const sum = (allocation: readonly number[]): number => allocation.reduce((s, n) => s + n, 0);
  const method = objective === 'fewest-participants' ? METHOD_FEWEST : METHOD_SHORTEST;
  const anyUnlimited = sites.some((s) => s.capacity === 'unlimited');
  const outcome = (
    status: PooledPlanStatus,
    allocation: readonly number[],
    precision: readonly PooledMeasurePrecision[],
    messages: string[],
    lower: number | null,
    proven: boolean,
  ): PooledPlan => ({
    status,
    objective,
    allocation: describe(allocation),
    totalN: sum(allocation),
    maxMonths: longest(allocation),
    precision,
    lowerBoundTotalN: lower,
    minimalTotalProven: proven,
    messages,
    method,
    references: REFERENCES,
  });

  const full = build(caps);
  const atCaps = full.precision(caps);
  const tooSmall = sites.flatMap((s, i) =>
    s.minimumN > (caps[i] ?? 0)
      ? [`Site ${s.id}: its minimum n (${formatCount(s.minimumN)}) is more than it can recruit (${formatCount(caps[i] ?? 0)}).`]
      : [],
  );
  if (tooSmall.length > 0 || atCaps.some((p) => !p.meets)) {
    const messages = [...tooSmall, ...shortfallMessages(atCaps, confidence, anyUnlimited)];
    messages.push(
      'The pooled targets cannot be met with the sites at hand; the figures shown are the best the sites can reach at full capacity.',
    );
    return outcome('infeasible', caps, atCaps, messages, null, false);
  }

  let upper = caps;
  let durationNote: string | null = null;
  if (objective === 'shortest-recruitment') {
    const fastest = shortestRecruitment(
      full,
      rates.map((r) => r ?? 1),
    );
    if (fastest.allocation === null || fastest.months === null) {
      return outcome(
        'not-converged',
        caps,
        atCaps,
        [`The search for the shortest recruitment did not converge: ${fastest.reason ?? ''}.`],
        null,
        false,
      );
    }
    upper = [...fastest.allocation];
    const last = fastest.allocation.flatMap((n, i) => (n / (rates[i] ?? 1) === fastest.months ? [sites[i]?.id ?? ''] : []));
    durationNote = `Recruitment can end after ${formatMonths(fastest.months)}, the shortest possible at these accrual rates; the last to finish: ${last.join(', ')}.`;
  }
  const problem = objective === 'shortest-recruitment' ? build(upper) : full;
  const gains = diminishingGains(problem);
  const everyMeasure = measures.map((_, m) => m);
  const phased = fewestParticipants(problem, everyMeasure);
  if (phased.allocation === null) {
    return outcome(
      'not-converged',
      caps,
      atCaps,
      [`The allocation search did not converge: ${phased.reason ?? ''}.`],
      null,
      false,
    );
  }
  // Several measures: lower bounds and more candidates from the measures' targets combined.
  const search = measures.length > 1 ? searchCombinedTargets(problem, phased.allocation) : null;
  const allocation = search?.best ?? phased.allocation;
  // One measure: the marginal allocation itself is the fewest (when gains shrink), hence its own bound.
  const lowerBound = search?.lowerBound ?? sum(allocation);
  const boundWeighting = search === null ? null : search.boundWeighting;
  const only = boundWeighting === null ? -1 : boundWeighting.findIndex((mu) => mu === 1);
  const boundLabel =
    boundWeighting === null ? null : only >= 0 ? `what ${measures[only]?.label ?? ''} alone needs` : 'from the targets combined';
  const precision = problem.precision(allocation);
  if (!precision.every((p) => p.meets) || allocation.some((n, i) => n > (upper[i] ?? 0) || n < (floors[i] ?? 0))) {
    return outcome(
      'not-converged',
      caps,
      atCaps,
      ['The proposal failed its final check against the targets; no allocation is proposed.'],
      null,
      false,
    );
  }
  const total = sum(allocation);
  // The bounds rest on shrinking gains; without them only the sites' minimums bound the total.
  const bound = gains.holds ? lowerBound : sum(floors);
  const proven = gains.holds && total === bound;

  const messages: string[] = [
    `Every pooled target is met with ${formatCount(total)} participants across ${formatCount(sites.length)} sites.`,
  ];
  if (durationNote !== null) messages.push(durationNote);
  const within = objective === 'shortest-recruitment' ? ' that finishes in that time' : '';
  if (proven) {
    messages.push(`No allocation${within} within the sites' capacities and minimums meets the targets with fewer participants.`);
  } else if (gains.holds && total > bound) {
    messages.push(
      `No allocation${within} can meet the targets with fewer than ${formatCount(bound)} participants (${boundLabel ?? "the sites' minimums"}); ` +
        `this one uses ${formatCount(total)}: the measures favour different sites, and the balance found is not guaranteed to be the smallest.`,
    );
  }
  if (!gains.holds) {
    messages.push(
      `The precision gained per participant did not shrink steadily (${gains.where ?? ''}), so this proposal meets the targets but may not be the smallest.`,
    );
  }
  const capped = sites.filter((_, i) => (allocation[i] ?? 0) >= (caps[i] ?? 0)).map((s) => s.id);
  if (capped.length > 0) messages.push(`Recruiting to capacity: ${capped.join(', ')}.`);
  return outcome('feasible', allocation, precision, messages, bound, proven);
}
