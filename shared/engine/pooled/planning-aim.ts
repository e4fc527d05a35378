import { formatCount } from '../../format/numbers';
import { DomainError } from '../errors';
import { planPooledAllocation, type PooledPlan, type PooledPlanInput } from './plan-pooled-allocation';
import { pooledPrecision, type PooledMeasurePrecision } from './pooled-precision';
import { requireStandardError } from './require-input';
import type { PlannerSite, SeAtN } from './types';

export const PLANNING_AIMS = ['site-specific', 'pooled', 'both'] as const;
/**
 * site-specific: every site meets its own precision targets; pooled: the random-effects summary
 * across sites meets the pooled targets; both: each site meets its own targets and the summary
 * meets the pooled ones.
 */
export type PlanningAim = (typeof PLANNING_AIMS)[number];

export interface AimSite extends PlannerSite {
  /** n the site needs for its own targets (from the site-specific criteria); null when not assessable. */
  readonly siteSpecificN: number | null;
}

export interface AimPlanInput extends Omit<PooledPlanInput, 'sites'> {
  readonly aim: PlanningAim;
  /** Every site with its own requirement; the pooled measures may be empty when the aim is site-specific. */
  readonly sites: readonly AimSite[];
}

export interface AimSiteResult {
  readonly siteId: string;
  readonly n: number | null;
  readonly siteSpecificN: number | null;
  /** What sets this site's n; null when nothing is proposed (pooled targets out of reach). */
  readonly setBy: 'own-targets' | 'pooled-targets' | 'minimum' | 'not-assessable' | null;
  readonly withinCapacity: boolean | null;
}

export interface AimPlan {
  readonly aim: PlanningAim;
  readonly status: 'feasible' | 'infeasible' | 'not-assessable' | 'not-converged';
  readonly sites: readonly AimSiteResult[];
  readonly totalN: number | null;
  /**
   * Pooled precision at the proposed n (for the site-specific aim too, as information); when the
   * pooled targets are out of reach, at full capacity; null when an n is missing or there are no measures.
   */
  readonly pooled: readonly PooledMeasurePrecision[] | null;
  /** The pooled planner's full answer (pooled and both aims). */
  readonly pooledPlan: PooledPlan | null;
  readonly messages: readonly string[];
}

const withinCapacity = (site: PlannerSite, n: number): boolean => site.capacity === 'unlimited' || n <= site.capacity;

function siteSpecificPlan(input: AimPlanInput): AimPlan {
  const { sites, measures } = input;
  const results: AimSiteResult[] = sites.map((s) => ({
    siteId: s.id,
    n: s.siteSpecificN,
    siteSpecificN: s.siteSpecificN,
    setBy: s.siteSpecificN === null ? 'not-assessable' : 'own-targets',
    withinCapacity: s.siteSpecificN === null ? null : withinCapacity(s, s.siteSpecificN),
  }));
  const missing = sites.filter((s) => s.siteSpecificN === null).map((s) => s.id);
  const over = sites.filter((s) => s.siteSpecificN !== null && !withinCapacity(s, s.siteSpecificN));
  const messages = [
    ...(missing.length > 0 ? [`Not assessable until their own targets can be computed: ${missing.join(', ')}.`] : []),
    ...over.map(
      (s) =>
        `Site ${s.id} needs ${formatCount(s.siteSpecificN)} for its own targets but can recruit ${formatCount(s.capacity === 'unlimited' ? null : s.capacity)}.`,
    ),
  ];
  const known = missing.length === 0;
  const pooled =
    known && measures.length > 0
      ? measures.map((m) =>
          pooledPrecision(
            m,
            sites.map((s, i) => {
              const n = s.siteSpecificN ?? 1;
              return requireStandardError(`sites[${i}].seAtN.${m.id}`, (s.seAtN[m.id] as SeAtN)(n), n);
            }),
            input.confidence,
          ),
        )
      : null;
  if (pooled !== null) {
    const unmet = pooled.filter((p) => !p.meets).map((p) => p.label);
    messages.push(
      unmet.length === 0
        ? 'At these site-specific numbers the pooled targets are met as well.'
        : `At these site-specific numbers the pooled targets are not met for: ${unmet.join(', ')} (for information; the aim is site-specific).`,
    );
  }
  return {
    aim: 'site-specific',
    status: !known ? 'not-assessable' : over.length > 0 ? 'infeasible' : 'feasible',
    sites: results,
    totalN: known ? sites.reduce((sum, s) => sum + (s.siteSpecificN ?? 0), 0) : null,
    pooled,
    pooledPlan: null,
    messages,
  };
}

/**
 * Combines site-specific and pooled planning for the chosen aim:
 * - site-specific: n_i = the site's own requirement; pooled precision at those n shown for information;
 * - pooled: the pooled planner from each site's minimum n (planPooledAllocation);
 * - both: the pooled planner with each site's floor raised to max(minimumN, own requirement), so
 *   every site meets its own targets and the summary meets the pooled ones.
 * Says which constraint sets each site's n, and whether capacity allows it. A missing own
 * requirement makes the site-specific and both aims not assessable (never silently skipped).
 * Domain: as planPooledAllocation; siteSpecificN a whole number ≥ 1 or null (DomainError otherwise).
 * Sources: as planPooledAllocation (DerSimonian & Laird 1986; J R Stat Soc A 2009).
 * @example planForAim({ aim: 'both', sites, measures: [slope], objective: 'fewest-participants' }).sites.map((s) => s.n) // [120, 96, 95]
 *   (sites and slope as in planPooledAllocation's example, own requirements 120, 50, 80: set by own-targets, pooled-targets, pooled-targets)
 */
export function planForAim(input: AimPlanInput): AimPlan {
  const { aim, sites } = input;
  sites.forEach((s, i) => {
    if (s.siteSpecificN !== null && !(Number.isInteger(s.siteSpecificN) && s.siteSpecificN >= 1)) {
      throw new DomainError(`sites[${i}].siteSpecificN`, s.siteSpecificN, 'a whole number ≥ 1, or null when not assessable');
    }
  });
  if (aim === 'site-specific') return siteSpecificPlan(input);
  if (aim !== 'pooled' && aim !== 'both') throw new DomainError('aim', aim, PLANNING_AIMS.join(', '));
  if (aim === 'both') {
    const missing = sites.filter((s) => s.siteSpecificN === null).map((s) => s.id);
    if (missing.length > 0) {
      return {
        aim,
        status: 'not-assessable',
        sites: sites.map((s) => ({
          siteId: s.id,
          n: null,
          siteSpecificN: s.siteSpecificN,
          setBy: 'not-assessable',
          withinCapacity: null,
        })),
        totalN: null,
        pooled: null,
        pooledPlan: null,
        messages: [`Not assessable until their own targets can be computed: ${missing.join(', ')}.`],
      };
    }
  }
  const floors = sites.map((s) => (aim === 'both' ? Math.max(s.minimumN, s.siteSpecificN ?? 1) : s.minimumN));
  const plan = planPooledAllocation({
    sites: sites.map((s, i) => ({ ...s, minimumN: floors[i] ?? s.minimumN })),
    measures: input.measures,
    objective: input.objective,
    ...(input.confidence === undefined ? {} : { confidence: input.confidence }),
  });
  const results: AimSiteResult[] = plan.allocation.map((a, i) => {
    const site = sites[i] as AimSite;
    const ownSets = aim === 'both' && site.siteSpecificN !== null && site.siteSpecificN >= site.minimumN;
    return {
      siteId: a.siteId,
      n: plan.status === 'feasible' ? a.n : null,
      siteSpecificN: site.siteSpecificN,
      setBy: plan.status !== 'feasible' ? null : a.n > (floors[i] ?? 0) ? 'pooled-targets' : ownSets ? 'own-targets' : 'minimum',
      withinCapacity: withinCapacity(site, floors[i] ?? 0),
    };
  });
  const ownOver =
    aim === 'both'
      ? sites
          .filter((s) => s.siteSpecificN !== null && !withinCapacity(s, s.siteSpecificN))
          .map((s) => `Site ${s.id} needs ${formatCount(s.siteSpecificN)} for its own targets, more than it can recruit.`)
      : [];
  return {
    aim,
    status: plan.status,
    sites: results,
    totalN: plan.status === 'feasible' ? plan.totalN : null,
    pooled: plan.precision,
    pooledPlan: plan,
    messages: [...ownOver, ...plan.messages],
  };
}
