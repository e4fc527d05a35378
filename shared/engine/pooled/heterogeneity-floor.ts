import { DomainError } from '../errors';
import { tQuantile, zForConfidence } from '../numerics/distributions';
import { requireNonNegative } from './require-input';

/** The widths that between-site heterogeneity alone imposes, whatever the per-site n. */
export interface HeterogeneityFloor {
  readonly k: number;
  readonly tau: number;
  /** Prediction-interval width as per-site n → ∞ (SE → 0) with these K sites: 2·t_{K−2}·τ; null when K < 3. */
  readonly predictionWidthAtK: number | null;
  /** Prediction-interval width as K and per-site n both grow: 2·z·τ. */
  readonly predictionWidthManySites: number;
  /** Summary-CI width as per-site n → ∞ with these K sites: 2·z·τ/√K (summary variance → τ²/K). */
  readonly summaryWidthAtK: number;
}

/**
 * Heterogeneity floors. As every per-site SE → 0, the summary variance 1/Σ1/(s_i² + τ²) → τ²/K,
 * so the summary CI width falls towards 2·z·τ/√K and the prediction interval width towards
 * 2·t_{K−2}·τ; as K grows too, t_{K−2} → z and the prediction width falls towards 2·z·τ.
 * The widths approach these floors from above and never reach them with finite n (when τ > 0):
 * a prediction-interval target at or below the floor cannot be met by any sample size.
 * Domain: τ finite ≥ 0; k a whole number ≥ 1; 0 < confidence < 1 (DomainError otherwise).
 * Source: limits of the Higgins–Thompson–Spiegelhalter interval, J R Stat Soc A 2009,
 * doi:10.1111/j.1467-985X.2008.00552.x. Accuracy: that of tQuantile (~1e-12).
 * @example heterogeneityFloor(0.1, 10).predictionWidthAtK // 0.4612008 (2 · 2.306004 · 0.1)
 */
export function heterogeneityFloor(tau: number, k: number, confidence = 0.95): HeterogeneityFloor {
  requireNonNegative('tau', tau);
  if (!(Number.isInteger(k) && k >= 1)) throw new DomainError('k (number of sites)', k, 'a whole number ≥ 1');
  const z = zForConfidence(confidence);
  const predictionWidthAtK = k >= 3 ? 2 * tQuantile(1 - (1 - confidence) / 2, k - 2) * tau : null; // SE → 0 in HTS 2009
  return {
    k,
    tau,
    predictionWidthAtK,
    predictionWidthManySites: 2 * z * tau, // t_{K−2} → z as K → ∞
    summaryWidthAtK: (2 * z * tau) / Math.sqrt(k), // 1/Σ 1/τ² = τ²/K
  };
}
