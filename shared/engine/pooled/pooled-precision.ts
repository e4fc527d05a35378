import { requirePositive } from '../helpers/domain-guards';
import type { PooledMeasure } from './types';
import { widthsAt } from './widths-at';

/** What a set of per-site standard errors delivers for one pooled measure, against its targets. */
export interface PooledMeasurePrecision {
  readonly measureId: string;
  readonly label: string;
  readonly k: number;
  readonly tau: number;
  readonly summarySe: number;
  readonly summaryCiWidth: number;
  readonly targetSummaryCiWidth: number;
  readonly meetsSummary: boolean;
  /** null when K < 3 (see predictionReason). */
  readonly predictionIntervalWidth: number | null;
  readonly targetPredictionIntervalWidth: number | null;
  /** null when no prediction-interval target was set; false when one was set but K < 3. */
  readonly meetsPrediction: boolean | null;
  readonly predictionReason?: string;
  /** 2·t_{K−2}·τ (null when K < 3): the prediction width that no per-site n can go below. */
  readonly predictionFloorWidth: number | null;
  /** 2·z·τ: the prediction width that no number of sites can go below. */
  readonly predictionFloorManySites: number;
  /** 2·z·τ/√K: the summary width that no per-site n can go below with these K sites. */
  readonly summaryFloorWidth: number;
  /** Both targets met (a missing prediction target counts as met). */
  readonly meets: boolean;
}

export const PREDICTION_NEEDS_THREE_SITES =
  'the prediction interval needs at least 3 sites (it uses t with K − 2 degrees of freedom)';

/**
 * Summary SE and CI width, prediction interval width and heterogeneity floors for one measure at
 * the given per-site SEs, compared with the measure's targets (met when width ≤ target).
 * This is the one place where "meets the pooled target" is decided; the planner uses it too.
 * Domain: as randomEffectsSummary and predictionInterval; target widths finite > 0 (DomainError otherwise).
 * Sources: DerSimonian & Laird, Control Clin Trials 1986, doi:10.1016/0197-2456(86)90046-2 (weights);
 * J R Stat Soc A 2009, doi:10.1111/j.1467-985X.2008.00552.x (prediction interval).
 * @example pooledPrecision({ id: 'slope', label: 'slope', tau: 0.05, target: { maxSummaryCiWidth: 0.3 } }, [0.1, 0.1, 0.1]).summaryCiWidth // 0.25303 (meets: true)
 */
export function pooledPrecision(measure: PooledMeasure, siteSes: readonly number[], confidence = 0.95): PooledMeasurePrecision {
  const { target } = measure;
  requirePositive(`measures.${measure.id}.target.maxSummaryCiWidth`, target.maxSummaryCiWidth);
  if (target.maxPredictionIntervalWidth !== undefined) {
    requirePositive(`measures.${measure.id}.target.maxPredictionIntervalWidth`, target.maxPredictionIntervalWidth);
  }
  const widths = widthsAt(siteSes, measure.tau, confidence);
  const meetsSummary = widths.summaryCiWidth <= target.maxSummaryCiWidth;
  const targetPi = target.maxPredictionIntervalWidth ?? null;
  const piWidth = widths.predictionIntervalWidth;
  const meetsPrediction = targetPi === null ? null : piWidth !== null && piWidth <= targetPi;
  return {
    measureId: measure.id,
    label: measure.label,
    k: widths.k,
    tau: measure.tau,
    summarySe: widths.summarySe,
    summaryCiWidth: widths.summaryCiWidth,
    targetSummaryCiWidth: target.maxSummaryCiWidth,
    meetsSummary,
    predictionIntervalWidth: piWidth,
    targetPredictionIntervalWidth: targetPi,
    meetsPrediction,
    ...(piWidth === null ? { predictionReason: PREDICTION_NEEDS_THREE_SITES } : {}),
    predictionFloorWidth: widths.predictionFloorWidth,
    predictionFloorManySites: widths.predictionFloorManySites,
    summaryFloorWidth: widths.summaryFloorWidth,
    meets: meetsSummary && meetsPrediction !== false,
  };
}
