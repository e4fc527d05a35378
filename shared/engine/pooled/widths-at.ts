import { heterogeneityFloor } from './heterogeneity-floor';
import { predictionInterval } from './prediction-interval';
import { randomEffectsSummary } from './random-effects-summary';

/** Summary-CI and prediction-interval widths at one set of per-site SEs (one point of a chart). */
export interface PooledWidths {
  readonly k: number;
  readonly summarySe: number;
  readonly summaryCiWidth: number;
  /** null when K < 3. */
  readonly predictionIntervalWidth: number | null;
  /** 2·t_{K−2}·τ, null when K < 3. */
  readonly predictionFloorWidth: number | null;
  /** 2·z·τ, the prediction floor as K grows too. */
  readonly predictionFloorManySites: number;
  /** 2·z·τ/√K. */
  readonly summaryFloorWidth: number;
}

/**
 * Summary-CI width 2·z/√Σ 1/(s_i² + τ²), prediction-interval width 2·t_{K−2}·√(τ² + SE²) (K ≥ 3)
 * and their heterogeneity floors, for the given per-site SEs. Domain: as randomEffectsSummary.
 * Sources: DerSimonian & Laird, Control Clin Trials 1986, doi:10.1016/0197-2456(86)90046-2;
 * J R Stat Soc A 2009, doi:10.1111/j.1467-985X.2008.00552.x.
 * @example widthsAt([0.1, 0.1, 0.1, 0.1], 0.1).summaryCiWidth // 0.277181 (2 · 1.959964 · 0.0707107)
 */
export function widthsAt(siteSes: readonly number[], tau: number, confidence = 0.95): PooledWidths {
  const summary = randomEffectsSummary(siteSes, tau, confidence);
  const floor = heterogeneityFloor(tau, summary.k, confidence);
  return {
    k: summary.k,
    summarySe: summary.summarySe,
    summaryCiWidth: summary.summaryCiWidth,
    predictionIntervalWidth: summary.k >= 3 ? predictionInterval(summary.summarySe, tau, summary.k, confidence).width : null,
    predictionFloorWidth: floor.predictionWidthAtK,
    predictionFloorManySites: floor.predictionWidthManySites,
    summaryFloorWidth: floor.summaryWidthAtK,
  };
}
