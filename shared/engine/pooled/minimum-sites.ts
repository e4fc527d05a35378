import { formatCount } from '../../format/numbers';
import { smallestIntegerMeeting } from '../numerics/integer-search';
import { heterogeneityFloor } from './heterogeneity-floor';
import { requirePositive } from '../helpers/domain-guards';
import { requireNonNegative } from './require-input';
import type { PooledTarget } from './types';

/** The largest number of sites the search below looks at. */
export const MAX_SITES_SEARCHED = 1_000_000;

/** A number of sites, or null with the reason no number of sites will do. */
export interface SitesNeeded {
  readonly sites: number | null;
  readonly reason?: string;
}

/** Fewest sites that could meet each pooled target if every site had unlimited participants. */
export interface MinimumSites {
  readonly summary: SitesNeeded;
  /** null when the target has no prediction-interval width. */
  readonly prediction: SitesNeeded | null;
}

function sitesNeeded(found: number | null): SitesNeeded {
  return found !== null
    ? { sites: found }
    : { sites: null, reason: `more than ${formatCount(MAX_SITES_SEARCHED)} sites would be needed` };
}

/**
 * Necessary number of sites: however many participants each site recruits, the summary CI width
 * stays above 2·z·τ/√K and the prediction-interval width above 2·t_{K−2}·τ (heterogeneityFloor),
 * so a target W needs the smallest K whose floor is below W. These are lower bounds: finite per-site n
 * needs more sites still. A prediction target W ≤ 2·z·τ cannot be met by any K (reason given).
 * Domain: τ finite ≥ 0; widths finite > 0; 0 < confidence < 1 (DomainError otherwise).
 * Integer search over K in [1, 1,000,000] (prediction: [3, 1,000,000]); beyond that null with the reason.
 * Source: limits of the Higgins–Thompson–Spiegelhalter interval, J R Stat Soc A 2009,
 * doi:10.1111/j.1467-985X.2008.00552.x.
 * @example minimumSites(0.1, { maxSummaryCiWidth: 0.1 }).summary.sites // 16 (2·1.96·0.1/√16 = 0.098)
 */
export function minimumSites(tau: number, target: PooledTarget, confidence = 0.95): MinimumSites {
  requireNonNegative('tau', tau);
  requirePositive('target.maxSummaryCiWidth', target.maxSummaryCiWidth);
  const summaryFound = smallestIntegerMeeting(
    (k) => heterogeneityFloor(tau, k, confidence).summaryWidthAtK < target.maxSummaryCiWidth,
    1,
    MAX_SITES_SEARCHED,
  );
  const summary = sitesNeeded(summaryFound.n);
  const maxPi = target.maxPredictionIntervalWidth;
  if (maxPi === undefined) return { summary, prediction: null };
  requirePositive('target.maxPredictionIntervalWidth', maxPi);
  if (heterogeneityFloor(tau, 3, confidence).predictionWidthManySites >= maxPi) {
    return {
      summary,
      prediction: {
        sites: null,
        reason: 'the target is at or below 2·z·τ, the width heterogeneity alone gives however many sites and participants',
      },
    };
  }
  const predictionFound = smallestIntegerMeeting(
    (k) => (heterogeneityFloor(tau, k, confidence).predictionWidthAtK ?? Number.POSITIVE_INFINITY) < maxPi,
    3,
    MAX_SITES_SEARCHED,
  );
  return { summary, prediction: sitesNeeded(predictionFound.n) };
}
