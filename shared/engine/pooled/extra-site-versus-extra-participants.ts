import { DomainError } from '../errors';
import { formatCount, formatPercent, formatSignificant } from '../../format/numbers';
import { ceilGuarded } from '../numerics/rounding';
import { requirePositive } from '../helpers/domain-guards';
import { requireInteger, requireStandardError } from './require-input';
import type { SeAtN } from './types';
import { widthsAt, type PooledWidths } from './widths-at';

/** More participants at every site: a fraction of each site's n (rounded up) or a fixed count. */
export type PerSiteIncrease =
  { readonly kind: 'fraction'; readonly fraction: number } | { readonly kind: 'count'; readonly count: number };

export interface SiteAtN {
  readonly n: number;
  readonly seAtN: SeAtN;
}

export interface ExtraSiteVersusParticipantsInput {
  /** Name of the measure, for the sentence. */
  readonly label: string;
  readonly sites: readonly SiteAtN[];
  readonly tau: number;
  /** The site that might join: its SE function, and its n (default: the median n of the current sites, rounded up). */
  readonly newSite: { readonly seAtN: SeAtN; readonly n?: number };
  /** Default: 10% more at each site. */
  readonly perSiteIncrease?: PerSiteIncrease;
  readonly confidence?: number;
}

/** The widths one option gives, and how they compare with the plan as it is. */
export interface PrecisionChange {
  readonly k: number;
  readonly addedParticipants: number;
  readonly summaryCiWidth: number;
  /** new width / current width − 1 (negative: narrower). */
  readonly summaryRelativeChange: number;
  readonly predictionIntervalWidth: number | null;
  /** null when either plan has fewer than 3 sites. */
  readonly predictionRelativeChange: number | null;
  /** Narrowing of the summary CI width per 100 added participants. */
  readonly summaryNarrowingPer100: number;
}

export interface ExtraSiteVersusParticipants {
  readonly current: {
    readonly k: number;
    readonly totalN: number;
    readonly summaryCiWidth: number;
    readonly predictionIntervalWidth: number | null;
  };
  readonly extraSite: PrecisionChange & { readonly newSiteN: number };
  readonly extraParticipants: PrecisionChange & { readonly perSiteN: readonly number[] };
  /** Which option narrows the summary CI more per added participant. */
  readonly moreEfficient: 'extra-site' | 'extra-participants' | 'equal';
  /** The comparison in plain words. */
  readonly sentence: string;
}

function medianRoundedUp(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  const upper = sorted[mid] ?? 0;
  return sorted.length % 2 === 1 ? upper : Math.ceil(((sorted[mid - 1] ?? 0) + upper) / 2);
}

function change(current: PooledWidths, next: PooledWidths, added: number): PrecisionChange {
  const curPi = current.predictionIntervalWidth;
  const nextPi = next.predictionIntervalWidth;
  return {
    k: next.k,
    addedParticipants: added,
    summaryCiWidth: next.summaryCiWidth,
    summaryRelativeChange: next.summaryCiWidth / current.summaryCiWidth - 1,
    predictionIntervalWidth: nextPi,
    predictionRelativeChange: curPi !== null && nextPi !== null ? nextPi / curPi - 1 : null,
    summaryNarrowingPer100: ((current.summaryCiWidth - next.summaryCiWidth) / added) * 100,
  };
}

function describe(from: number | null, to: number | null, relative: number | null): string {
  if (to === null) return 'not available (fewer than 3 sites)';
  if (from === null || relative === null) return `${formatSignificant(to, 3)} (available from 3 sites)`;
  const how =
    relative < 0 ? `${formatPercent(-relative)} narrower` : relative > 0 ? `${formatPercent(relative)} wider` : 'unchanged';
  return `from ${formatSignificant(from, 3)} to ${formatSignificant(to, 3)} (${how})`;
}

/**
 * How the pooled precision of one measure changes with one more site versus more participants at
 * every current site. Both plans are evaluated with the random-effects summary (weights
 * 1/(s_i² + τ²)) and the Higgins–Thompson–Spiegelhalter prediction interval; the comparison
 * per added participant shows where heterogeneity makes sites worth more than participants:
 * each site's weight is capped at 1/τ², however large its n.
 * Domain: at least one site; n whole numbers ≥ 1; SEs finite > 0; τ ≥ 0; fraction > 0 or count ≥ 1
 * (DomainError otherwise). Sources: DerSimonian & Laird, Control Clin Trials 1986,
 * doi:10.1016/0197-2456(86)90046-2; J R Stat Soc A 2009, doi:10.1111/j.1467-985X.2008.00552.x.
 * @example compareExtraSiteWithExtraParticipants({ label: 'Calibration slope', sites: [{ n: 100, seAtN: se }, { n: 100, seAtN: se }, { n: 100, seAtN: se }], tau: 0.1, newSite: { seAtN: se } }).extraSite.summaryCiWidth
 *   // 0.277181 with se = (n) => 1 / Math.sqrt(n) (from 0.32; 10% more per site gives 0.313), moreEfficient 'extra-site'
 */
export function compareExtraSiteWithExtraParticipants(input: ExtraSiteVersusParticipantsInput): ExtraSiteVersusParticipants {
  const { sites, tau } = input;
  if (sites.length === 0) throw new DomainError('sites', '[]', 'at least one site');
  const increase = input.perSiteIncrease ?? { kind: 'fraction', fraction: 0.1 };
  if (increase.kind === 'fraction') requirePositive('perSiteIncrease.fraction', increase.fraction);
  else requireInteger('perSiteIncrease.count', increase.count, 1, 100_000_000);
  sites.forEach((s, i) => requireInteger(`sites[${i}].n`, s.n, 1, 100_000_000));
  const newSiteN = input.newSite.n ?? medianRoundedUp(sites.map((s) => s.n));
  requireInteger('newSite.n', newSiteN, 1, 100_000_000);

  const seAt = (seAtN: SeAtN, n: number, field: string): number => requireStandardError(field, seAtN(n), n);
  const currentSes = sites.map((s, i) => seAt(s.seAtN, s.n, `sites[${i}].seAtN`));
  const current = widthsAt(currentSes, tau, input.confidence);
  const withSite = widthsAt([...currentSes, seAt(input.newSite.seAtN, newSiteN, 'newSite.seAtN')], tau, input.confidence);
  const perSiteN = sites.map((s) => s.n + (increase.kind === 'fraction' ? ceilGuarded(increase.fraction * s.n) : increase.count));
  const withMore = widthsAt(
    sites.map((s, i) => seAt(s.seAtN, perSiteN[i] ?? s.n, `sites[${i}].seAtN`)),
    tau,
    input.confidence,
  );
  const totalN = sites.reduce((sum, s) => sum + s.n, 0);
  const addedMore = perSiteN.reduce((sum, n) => sum + n, 0) - totalN;
  const extraSite = { ...change(current, withSite, newSiteN), newSiteN };
  const extraParticipants = { ...change(current, withMore, addedMore), perSiteN };

  const gap = extraSite.summaryNarrowingPer100 - extraParticipants.summaryNarrowingPer100;
  const scale = Math.max(Math.abs(extraSite.summaryNarrowingPer100), Math.abs(extraParticipants.summaryNarrowingPer100));
  const moreEfficient = Math.abs(gap) <= 1e-9 * scale ? 'equal' : gap > 0 ? 'extra-site' : 'extra-participants';

  const level = formatPercent(input.confidence ?? 0.95, 0);
  const more =
    increase.kind === 'fraction'
      ? `${formatPercent(increase.fraction)} more participants at each of the ${formatCount(sites.length)} sites`
      : `${formatCount(increase.count)} more participants at each of the ${formatCount(sites.length)} sites`;
  const verdict =
    moreEfficient === 'equal'
      ? 'Per participant added, both narrow the summary CI equally.'
      : `Per participant added, ${moreEfficient === 'extra-site' ? 'the extra site' : 'more participants per site'} narrows the summary CI more.`;
  const sentence =
    `${input.label}: one more site with ${formatCount(newSiteN)} participants changes the summary ${level} CI width ` +
    `${describe(current.summaryCiWidth, withSite.summaryCiWidth, extraSite.summaryRelativeChange)} and the prediction-interval width ` +
    `${describe(current.predictionIntervalWidth, withSite.predictionIntervalWidth, extraSite.predictionRelativeChange)}; ` +
    `${more} (${formatCount(addedMore)} in all) changes the summary width ` +
    `${describe(current.summaryCiWidth, withMore.summaryCiWidth, extraParticipants.summaryRelativeChange)} and the prediction-interval width ` +
    `${describe(current.predictionIntervalWidth, withMore.predictionIntervalWidth, extraParticipants.predictionRelativeChange)}. ${verdict}`;

  return {
    current: {
      k: current.k,
      totalN,
      summaryCiWidth: current.summaryCiWidth,
      predictionIntervalWidth: current.predictionIntervalWidth,
    },
    extraSite,
    extraParticipants,
    moreEfficient,
    sentence,
  };
}
