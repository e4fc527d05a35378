// The across-sites figures of a plan, as data for the workspace panel, the command line and the
// report: for each pooled measure the per-site SEs at each site's planned n, the random-effects
// summary and prediction interval at the low, base and high between-site SD τ, the heterogeneity
// floors, one more site against more participants, chart curves; and, for the pooled and both aims,
// the pooled planner's proposal per site within each site's capacity. Pure: nothing here touches
// the DOM, the disk or the clock, and no input makes it throw (problems come back as words).
import {
  compareExtraSiteWithExtraParticipants,
  minimumSites,
  planForAim,
  pooledPrecision,
  POOLED_CAUTIONS,
  widthAgainstPerSiteN,
  widthAgainstSites,
  MAX_SITE_N,
  type AimPlan,
  type AimSite,
  type ExtraSiteVersusParticipants,
  type MinimumSites,
  type PerSiteNPoint,
  type PlannerObjective,
  type PlanningAim,
  type PooledMeasure,
  type PooledMeasurePrecision,
  type PooledTarget,
  type PooledWidths,
  type SeAtN,
} from '../engine/pooled';
import { planPopulation } from '../engine/plan/plan-population';
import { isContinuousPopulation } from '../engine/plan/plan-project';
import { DomainError } from '../engine/errors';
import type { ReferenceKey } from '../engine/types';
import { ceilGuarded } from '../engine/numerics/rounding';
import {
  enrolmentTarget,
  feasibility,
  monthlyEnrolment,
  monthsToRecruit,
  type Feasibility,
} from '../engine/recruitment/recruitment';
import { formatCount } from '../format/numbers';
import { pooledSchema, type Pooled, type Population, type Project, type Range } from '../model/project';
import { lowestUsableN, POOLED_MEASURES, seAtNOf, type PooledMeasureSpec } from './pooled-measures';

export { pooledParagraph } from './pooled-paragraph';

/** One site (population) as the pooled figures see it. */
export interface PooledSite {
  readonly id: string;
  readonly name: string;
  /** n the site needs for its own targets; null when it cannot be computed (see problem). */
  readonly requiredN: number | null;
  /** n the pooled figures use for the site as planned: its fixed available n, else its required n. */
  readonly plannedN: number | null;
  readonly plannedFrom: 'available n' | 'required n' | null;
  /** Participants with an outcome the site can contribute; null when unknown (see capacityFrom). */
  readonly capacity: number | null;
  readonly capacityFrom: string;
  /** Participants enrolled per month (accrual × eligible × consent); null without an accrual. */
  readonly perMonth: number | null;
  readonly missingOutcomeFraction: number;
  readonly problem: string | null;
}

/** The pooled precision of one measure at one value of τ. */
export interface TauCase {
  readonly which: 'low' | 'base' | 'high';
  readonly tau: number;
  readonly precision: PooledMeasurePrecision;
}

export interface PerSiteSe {
  readonly siteId: string;
  readonly name: string;
  readonly n: number;
  readonly se: number;
}

/** Chart data for one measure: widths against the number of sites and against the per-site n. */
export interface PooledCurves {
  /** The allocation the curves are drawn around. */
  readonly basis: 'proposal' | 'planned';
  readonly k: number;
  /** n of the typical site (median n of the basis allocation, rounded up). */
  readonly typicalN: number;
  /** The site whose per-site SE at its n is the median: the model for the added sites. */
  readonly typicalSite: string;
  readonly againstSites: readonly PooledWidths[];
  readonly againstPerSiteN: readonly PerSiteNPoint[];
}

export interface PooledMeasureFigures {
  readonly key: PooledMeasureSpec['key'];
  readonly criterionId: string;
  readonly name: string;
  readonly scale: string;
  /** Sources of the per-site SE formula. */
  readonly references: readonly ReferenceKey[];
  readonly tau: number;
  readonly tauRange: Range | null;
  readonly target: PooledTarget;
  /** Per-site SE at each site's planned n; null when a planned n is missing (see problem). */
  readonly perSite: readonly PerSiteSe[] | null;
  /** At the planned n: low, base and high τ (the ones given), base always present when computed. */
  readonly atPlanned: readonly TauCase[] | null;
  /** Fewest sites that could meet each target with unlimited participants per site. */
  readonly minimumSites: MinimumSites | null;
  /** At the proposal (pooled and both aims), at the low, base and high τ. */
  readonly atProposal: readonly TauCase[] | null;
  /** One more site against more participants per site, around the same allocation as the curves. */
  readonly comparison: ExtraSiteVersusParticipants | null;
  readonly curves: PooledCurves | null;
  readonly problems: readonly string[];
}

export interface ProposedSite {
  readonly siteId: string;
  readonly name: string;
  readonly n: number | null;
  readonly siteSpecificN: number | null;
  readonly capacity: number | null;
  readonly atCapacity: boolean | null;
  /** What sets the site's n: its own targets, the pooled targets, or the smallest usable n. */
  readonly setBy: 'own-targets' | 'pooled-targets' | 'minimum' | 'not-assessable' | null;
  /** Participants to enrol so that n have an outcome. */
  readonly enrolmentTarget: number | null;
  readonly months: number | null;
  readonly fitsWindow: Feasibility;
}

export interface PooledProposal {
  readonly aim: Exclude<PlanningAim, 'site-specific'>;
  readonly objective: PlannerObjective;
  readonly status: AimPlan['status'];
  readonly sites: readonly ProposedSite[];
  readonly totalN: number | null;
  readonly totalEnrolment: number | null;
  readonly longestMonths: number | null;
  readonly messages: readonly string[];
  readonly method: string | null;
  readonly minimalTotalProven: boolean;
}

export interface PooledSummary {
  readonly aim: PlanningAim;
  readonly objective: PlannerObjective;
  readonly confidence: number;
  readonly windowMonths: number | null;
  readonly k: number;
  readonly sites: readonly PooledSite[];
  /** The measures with τ and a summary target, in the order of POOLED_MEASURES. */
  readonly measures: readonly PooledMeasureFigures[];
  /** What keeps figures from being shown (incomplete measures, missing n or capacities), in words. */
  readonly notes: readonly string[];
  /** Null for the site-specific aim, or when no measure is pooled yet. */
  readonly proposal: PooledProposal | null;
  readonly cautions: readonly string[];
}

export interface PooledSummaryOptions {
  /** Each population's required n by id, when already planned (the table's rows); planned here otherwise. */
  readonly requiredN?: ReadonlyMap<string, number | null>;
}

const DEFAULT_SETTINGS: Pooled = pooledSchema.parse({});

/** The plan's pooled settings, with the defaults when the plan has none. */
export function pooledSettingsOf(project: Project): Pooled {
  return project.pooled ?? DEFAULT_SETTINGS;
}

const message = (error: unknown): string => (error instanceof Error ? error.message : String(error));

/** Largest whole number at most x, guarding against floating error just below an integer (the mirror of ceilGuarded). */
const floorGuarded = (x: number): number => Math.floor(x + 1e-9);

function siteOf(population: Population, project: Project, known: ReadonlyMap<string, number | null> | undefined): PooledSite {
  const r = population.recruitment;
  let requiredN: number | null = null;
  let problem: string | null = null;
  if (known?.has(population.id)) requiredN = known.get(population.id) ?? null;
  else {
    const outcome: string = population.outcome;
    try {
      if (isContinuousPopulation(population)) requiredN = planPopulation(population, project).requiredN;
      else problem = `a population with a ${outcome} outcome is not planned by the continuous engine`;
    } catch (error) {
      problem = message(error);
    }
  }
  if (requiredN === null && problem === null) problem = 'its own required n could not be computed (a target is out of reach)';
  const perMonth =
    r.accrualPerMonth === undefined ? null : monthlyEnrolment(r.accrualPerMonth, r.eligibleFraction, r.consentFraction);
  const window = project.study.windowMonths;
  let capacity: number | null = null;
  let capacityFrom: string;
  if (r.availableN !== undefined) {
    capacity = r.availableN;
    capacityFrom = 'its fixed available n';
  } else if (perMonth !== null && window !== undefined) {
    // Participants with an outcome: enrolment per month over the window, less the missing outcomes.
    const raw = floorGuarded(perMonth * window * (1 - r.missingOutcomeFraction));
    capacity = Math.min(raw, MAX_SITE_N);
    capacityFrom =
      raw > MAX_SITE_N
        ? `enrolment per month over the ${formatCount(window)}-month window, searched up to ${formatCount(MAX_SITE_N)}`
        : `enrolment per month over the ${formatCount(window)}-month window, less missing outcomes`;
  } else {
    capacityFrom =
      perMonth === null
        ? 'unknown: give its accrual per month, or a fixed available n'
        : "unknown: give the study's recruitment window, or a fixed available n";
  }
  const plannedFrom = r.availableN !== undefined ? 'available n' : requiredN !== null ? 'required n' : null;
  return {
    id: population.id,
    name: population.name,
    requiredN,
    plannedN: r.availableN ?? requiredN,
    plannedFrom,
    capacity,
    capacityFrom,
    perMonth,
    missingOutcomeFraction: r.missingOutcomeFraction,
    problem,
  };
}

/** A measure whose τ and summary target are both given, with its SE function at every site. */
interface ActiveMeasure {
  readonly spec: PooledMeasureSpec;
  readonly tau: number;
  readonly tauRange: Range | null;
  readonly target: PooledTarget;
  readonly seAtN: readonly SeAtN[];
  /** Per site: the smallest n at which its SE is usable; null when none is. */
  readonly lowestN: readonly (number | null)[];
  readonly problems: string[];
}

/** Stands in for a site whose SE cannot be computed (its problem is listed); refuses to be used. */
function noSe(site: string, measure: string): SeAtN {
  return (n) => {
    throw new DomainError(`${site}: SE of the ${measure} at n`, n, 'not available for this site (see the problems listed)');
  };
}

function activeMeasures(project: Project, settings: Pooled, notes: string[]): ActiveMeasure[] {
  const active: ActiveMeasure[] = [];
  for (const spec of POOLED_MEASURES) {
    const m = settings.measures[spec.key];
    if (m === undefined) continue;
    if (m.tau === undefined || m.summaryCiWidth === undefined) {
      const missing = [
        m.tau === undefined ? 'the between-site SD τ' : null,
        m.summaryCiWidth === undefined ? 'the target summary CI width' : null,
      ]
        .filter((x) => x !== null)
        .join(' and ');
      notes.push(
        `The ${spec.name} is not pooled until ${missing} ${m.tau === undefined && m.summaryCiWidth === undefined ? 'are' : 'is'} given.`,
      );
      continue;
    }
    const problems: string[] = [];
    const seAtN: SeAtN[] = [];
    const lowestN: (number | null)[] = [];
    for (const population of project.populations) {
      try {
        const atN = spec.prepare(population);
        if (atN === null) {
          problems.push(
            `${population.name}: the ${spec.name} is not pooled for a population with a ${population.outcome} outcome.`,
          );
          lowestN.push(null);
          seAtN.push(noSe(population.name, spec.name));
          continue;
        }
        const lowest = lowestUsableN(atN);
        if (lowest === null)
          problems.push(
            `${population.name}: the per-site SE of the ${spec.name} cannot be computed (${atN(1).reason ?? 'no usable n'}).`,
          );
        lowestN.push(lowest);
        seAtN.push(seAtNOf(atN, population.name, spec.name));
      } catch (error) {
        problems.push(`${population.name}: ${message(error)}`);
        lowestN.push(null);
        seAtN.push(noSe(population.name, spec.name));
      }
    }
    active.push({
      spec,
      tau: m.tau,
      tauRange: m.tauRange ?? null,
      target: {
        maxSummaryCiWidth: m.summaryCiWidth,
        ...(m.predictionIntervalWidth === undefined ? {} : { maxPredictionIntervalWidth: m.predictionIntervalWidth }),
      },
      seAtN,
      lowestN,
      problems,
    });
  }
  return active;
}

function engineMeasure(m: ActiveMeasure, tau = m.tau): PooledMeasure {
  return { id: m.spec.key, label: m.spec.name, tau, target: m.target };
}

/** Low, base and high τ (those given), each with the pooled precision at the given n. */
function byTau(m: ActiveMeasure, ns: readonly number[], confidence: number): TauCase[] {
  const ses = ns.map((n, i) => (m.seAtN[i] as SeAtN)(n));
  const cases: { which: TauCase['which']; tau: number }[] = [{ which: 'base', tau: m.tau }];
  if (m.tauRange !== null) cases.unshift({ which: 'low', tau: m.tauRange.low });
  if (m.tauRange !== null) cases.push({ which: 'high', tau: m.tauRange.high });
  return cases.map((c) => ({ ...c, precision: pooledPrecision(engineMeasure(m, c.tau), ses, confidence) }));
}

function medianIndex(values: readonly number[]): number {
  const order = values.map((v, i) => ({ v, i })).sort((a, b) => a.v - b.v || a.i - b.i);
  return order[Math.floor((order.length - 1) / 2)]?.i ?? 0;
}

function curvesAndComparison(
  m: ActiveMeasure,
  sites: readonly PooledSite[],
  ns: readonly number[],
  basis: PooledCurves['basis'],
  confidence: number,
): { curves: PooledCurves; comparison: ExtraSiteVersusParticipants } {
  const ses = ns.map((n, i) => (m.seAtN[i] as SeAtN)(n));
  const typical = medianIndex(ses);
  const typicalSe = m.seAtN[typical] as SeAtN;
  // The added site resembles the site with the median SE, with the engine's default n (the median n).
  const comparison = compareExtraSiteWithExtraParticipants({
    label: `${m.spec.name[0]?.toUpperCase() ?? ''}${m.spec.name.slice(1)}`,
    sites: ns.map((n, i) => ({ n, seAtN: m.seAtN[i] as SeAtN })),
    tau: m.tau,
    newSite: { seAtN: typicalSe },
    confidence,
  });
  const typicalN = comparison.extraSite.newSiteN;
  const k = ns.length;
  const lowest = Math.max(...m.lowestN.map((n) => n ?? 1));
  const nFrom = Math.max(lowest, ceilGuarded(typicalN / 10));
  const nTo = Math.min(MAX_SITE_N, Math.max(nFrom + 1, 10 * Math.max(...ns)));
  const curves: PooledCurves = {
    basis,
    k,
    typicalN,
    typicalSite: sites[typical]?.name ?? '',
    againstSites: widthAgainstSites({
      seAtN: typicalSe,
      n: typicalN,
      tau: m.tau,
      kFrom: 3,
      kTo: Math.min(1000, Math.max(30, 2 * k)),
      confidence,
    }),
    againstPerSiteN: widthAgainstPerSiteN({ siteSeAtN: m.seAtN, tau: m.tau, nFrom, nTo, points: 40, confidence }),
  };
  return { curves, comparison };
}

function proposalOf(
  aim: Exclude<PlanningAim, 'site-specific'>,
  settings: Pooled,
  sites: readonly PooledSite[],
  active: readonly ActiveMeasure[],
  windowMonths: number | undefined,
): { proposal: PooledProposal; plan: AimPlan | null } {
  const base = { aim, objective: settings.objective, method: null, minimalTotalProven: false } as const;
  const blank = (messages: string[], status: AimPlan['status'] = 'not-assessable'): PooledProposal => ({
    ...base,
    status,
    sites: sites.map((s) => ({
      siteId: s.id,
      name: s.name,
      n: null,
      siteSpecificN: s.requiredN,
      capacity: s.capacity,
      atCapacity: null,
      setBy: null,
      enrolmentTarget: null,
      months: null,
      fitsWindow: 'unknown',
    })),
    totalN: null,
    totalEnrolment: null,
    longestMonths: null,
    messages,
  });
  if (sites.length === 0) return { proposal: blank(['The plan has no sites to allocate participants to.']), plan: null };
  const unknownCapacity = sites.filter((s) => s.capacity === null || s.capacity < 1);
  if (unknownCapacity.length > 0) {
    return {
      proposal: blank(
        unknownCapacity.map((s) =>
          s.capacity === null
            ? `${s.name}: capacity ${s.capacityFrom}.`
            : `${s.name} can contribute no participant with an outcome within the window.`,
        ),
      ),
      plan: null,
    };
  }
  if (settings.objective === 'shortest-recruitment') {
    const noRate = sites.filter((s) => s.perMonth === null);
    if (noRate.length > 0) {
      return {
        proposal: blank([
          `The shortest recruitment needs every site's accrual per month; not given for: ${noRate.map((s) => s.name).join(', ')}.`,
        ]),
        plan: null,
      };
    }
  }
  const unusable = active.flatMap((m) => m.problems);
  if (unusable.length > 0) return { proposal: blank(unusable), plan: null };
  // Smallest n at which every pooled measure's SE is usable at the site (7 with R²).
  const minimumN = sites.map((_, i) => Math.max(...active.map((m) => m.lowestN[i] ?? 1)));
  const tooSmall = sites.filter((s, i) => (s.capacity ?? 0) < (minimumN[i] ?? 1));
  if (tooSmall.length > 0) {
    return {
      proposal: blank(
        tooSmall.map(
          (s) =>
            `${s.name}: its minimum n (${formatCount(minimumN[sites.indexOf(s)])}, the fewest at which every pooled measure's SE can be computed) is more than it can recruit (${formatCount(s.capacity)}).`,
        ),
        'infeasible',
      ),
      plan: null,
    };
  }
  // The planner's messages name sites by id: use the names when they are unique.
  const names = new Set(sites.map((s) => s.name));
  const plannerIds = names.size === sites.length ? sites.map((s) => s.name) : sites.map((s) => `${s.name} (${s.id})`);
  const aimSites: AimSite[] = sites.map((s, i) => ({
    id: plannerIds[i] ?? s.id,
    capacity: s.capacity ?? 1,
    minimumN: minimumN[i] ?? 1,
    ...(s.perMonth === null ? {} : { accrualPerMonth: s.perMonth * (1 - s.missingOutcomeFraction) }),
    seAtN: Object.fromEntries(active.map((m) => [m.spec.key, m.seAtN[i] as SeAtN])),
    siteSpecificN: s.requiredN,
  }));
  let plan: AimPlan;
  try {
    plan = planForAim({
      aim,
      sites: aimSites,
      measures: active.map((m) => engineMeasure(m)),
      objective: settings.objective,
      confidence: settings.confidence,
    });
  } catch (error) {
    return { proposal: blank([`The proposal could not be computed: ${message(error)}`]), plan: null };
  }
  const allocation = plan.pooledPlan?.allocation ?? [];
  const proposed: ProposedSite[] = sites.map((s, i) => {
    const result = plan.sites[i];
    const n = result?.n ?? null;
    const enrolment = n === null ? null : enrolmentTarget(n, s.missingOutcomeFraction);
    const months = enrolment === null || s.perMonth === null ? null : monthsToRecruit(enrolment, s.perMonth);
    return {
      siteId: s.id,
      name: s.name,
      n,
      siteSpecificN: s.requiredN,
      capacity: s.capacity,
      atCapacity: n === null ? null : (allocation[i]?.atCapacity ?? null),
      setBy: result?.setBy ?? null,
      enrolmentTarget: enrolment,
      months,
      fitsWindow: feasibility(months, windowMonths),
    };
  });
  const known = proposed.every((p) => p.n !== null);
  const monthsKnown = proposed.filter((p) => p.months !== null).map((p) => p.months as number);
  return {
    proposal: {
      ...base,
      status: plan.status,
      sites: proposed,
      totalN: plan.totalN,
      totalEnrolment: known ? proposed.reduce((sum, p) => sum + (p.enrolmentTarget ?? 0), 0) : null,
      longestMonths: known && monthsKnown.length > 0 ? Math.max(...monthsKnown) : null,
      messages: plan.messages,
      method: plan.pooledPlan?.method ?? null,
      minimalTotalProven: plan.pooledPlan?.minimalTotalProven ?? false,
    },
    plan,
  };
}

/**
 * The across-sites figures of a project. Per pooled measure (τ and a summary target given): the
 * per-site SE at each site's planned n (its fixed available n, else its own required n), the
 * random-effects summary SE and CI width and the Higgins–Thompson–Spiegelhalter prediction
 * interval (t on K − 2) at the low, base and high τ, the heterogeneity floors and the fewest sites
 * any n could do with; for the pooled and both aims the pooled planner's proposal, each site within
 * its capacity (enrolment per month × the window, less missing outcomes; or its fixed available n),
 * with the figures at the proposal; then one more site against more participants per site and the
 * chart curves, around the proposal when there is one, else around the planned n.
 * Sources: DerSimonian & Laird, Control Clin Trials 1986, doi:10.1016/0197-2456(86)90046-2;
 * J R Stat Soc A 2009, doi:10.1111/j.1467-985X.2008.00552.x; per-site SEs as the site criteria.
 * @example pooledSummary(demoWithPooledSlope).proposal?.status // 'feasible'
 */
export function pooledSummary(project: Project, options: PooledSummaryOptions = {}): PooledSummary {
  const settings = pooledSettingsOf(project);
  const { confidence } = settings;
  const sites = project.populations.map((p) => siteOf(p, project, options.requiredN));
  const notes: string[] = [];
  const active = activeMeasures(project, settings, notes);
  if (active.length === 0 && notes.length === 0) {
    notes.push('No measure is pooled yet: give the between-site SD τ and a target summary CI width for at least one measure.');
  }
  const missingPlanned = sites.filter((s) => s.plannedN === null);
  if (missingPlanned.length > 0 && active.length > 0) {
    notes.push(
      `The figures at the planned numbers need every site's n; not available for: ${missingPlanned.map((s) => `${s.name} (${s.problem ?? 'no n'})`).join('; ')}.`,
    );
  }
  const planned = missingPlanned.length === 0 ? sites.map((s) => s.plannedN as number) : null;

  let proposal: PooledProposal | null = null;
  if (settings.aim !== 'site-specific' && active.length > 0)
    proposal = proposalOf(settings.aim, settings, sites, active, project.study.windowMonths).proposal;
  const proposed =
    proposal?.status === 'feasible' && proposal.sites.every((s) => s.n !== null)
      ? proposal.sites.map((s) => s.n as number)
      : null;

  const measures = active.map((m): PooledMeasureFigures => {
    const problems = [...m.problems];
    const attempt = <T>(what: string, run: () => T): T | null => {
      try {
        return run();
      } catch (error) {
        problems.push(`${what}: ${message(error)}`);
        return null;
      }
    };
    const usable = m.problems.length === 0 && sites.length > 0;
    const perSite =
      usable && planned !== null
        ? attempt('per-site SEs at the planned n', () =>
            planned.map((n, i) => ({ siteId: sites[i]?.id ?? '', name: sites[i]?.name ?? '', n, se: (m.seAtN[i] as SeAtN)(n) })),
          )
        : null;
    const atPlanned =
      perSite !== null && planned !== null ? attempt('figures at the planned n', () => byTau(m, planned, confidence)) : null;
    const atProposal =
      usable && proposed !== null ? attempt('figures at the proposal', () => byTau(m, proposed, confidence)) : null;
    const basisNs = proposed ?? (perSite !== null ? planned : null);
    const around =
      usable && basisNs !== null
        ? attempt('curves and the one-more-site comparison', () =>
            curvesAndComparison(m, sites, basisNs, proposed !== null ? 'proposal' : 'planned', confidence),
          )
        : null;
    return {
      key: m.spec.key,
      criterionId: m.spec.criterionId,
      name: m.spec.name,
      scale: m.spec.scale,
      references: m.spec.references,
      tau: m.tau,
      tauRange: m.tauRange,
      target: m.target,
      perSite,
      atPlanned,
      minimumSites: attempt('fewest sites', () => minimumSites(m.tau, m.target, confidence)),
      atProposal,
      comparison: around?.comparison ?? null,
      curves: around?.curves ?? null,
      problems,
    };
  });

  return {
    aim: settings.aim,
    objective: settings.objective,
    confidence,
    windowMonths: project.study.windowMonths ?? null,
    k: sites.length,
    sites,
    measures,
    notes,
    proposal,
    cautions: POOLED_CAUTIONS,
  };
}

/** The base-τ case of a list of τ cases. */
export function baseCase(cases: readonly TauCase[] | null): TauCase | null {
  return cases?.find((c) => c.which === 'base') ?? null;
}
