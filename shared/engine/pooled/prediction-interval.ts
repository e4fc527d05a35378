import { DomainError } from '../errors';
import { tQuantile } from '../numerics/distributions';
import { requirePositive } from '../helpers/domain-guards';
import { requireNonNegative } from './require-input';

/** The prediction interval for the true value of the measure in a new site. */
export interface PredictionInterval {
  readonly k: number;
  /** Degrees of freedom of the t quantile, K − 2. */
  readonly df: number;
  /** t_{K−2} quantile at 1 − (1 − confidence)/2. */
  readonly t: number;
  /** t · √(τ² + SE²). */
  readonly halfWidth: number;
  readonly width: number;
  /** centre ± halfWidth when a centre (the anticipated summary value) was given, else null. */
  readonly lower: number | null;
  readonly upper: number | null;
}

/**
 * Prediction interval for a new site (Higgins–Thompson–Spiegelhalter form):
 * summary ± t_{K−2, 1−α/2} · √(τ² + SE²), width 2·t·√(τ² + SE²).
 * The t on K − 2 degrees of freedom allows for estimating both the mean and τ, so K ≥ 3 is
 * required: with K = 2 there are no degrees of freedom left and the interval is not defined.
 * For planning, τ is the anticipated value and SE the planned summary SE (see randomEffectsSummary).
 * Domain: summarySe finite > 0; τ finite ≥ 0; k a whole number ≥ 3; 0 < confidence < 1; centre finite
 * when given. Outside it a DomainError names the field. Accuracy: that of tQuantile (~1e-12).
 * Source: J R Stat Soc A 2009;172(1):137–159, doi:10.1111/j.1467-985X.2008.00552.x.
 * @example predictionInterval(0.05, 0.1, 10).width // 0.5156382 (2 · 2.306004 · √0.0125)
 */
export function predictionInterval(
  summarySe: number,
  tau: number,
  k: number,
  confidence = 0.95,
  centre?: number,
): PredictionInterval {
  requirePositive('summarySe', summarySe);
  requireNonNegative('tau', tau);
  if (!(Number.isInteger(k) && k >= 3)) {
    throw new DomainError(
      'k (number of sites)',
      k,
      'a whole number ≥ 3: the prediction interval uses t with K − 2 degrees of freedom, so it needs at least 3 sites',
    );
  }
  if (!(confidence > 0 && confidence < 1)) throw new DomainError('confidence', confidence, 'a level strictly between 0 and 1');
  if (centre !== undefined && !Number.isFinite(centre)) throw new DomainError('centre', centre, 'a finite number');
  const df = k - 2;
  const t = tQuantile(1 - (1 - confidence) / 2, df);
  const halfWidth = t * Math.sqrt(tau * tau + summarySe * summarySe); // HTS 2009: t_{K−2} √(τ² + SE²)
  return {
    k,
    df,
    t,
    halfWidth,
    width: 2 * halfWidth,
    lower: centre === undefined ? null : centre - halfWidth,
    upper: centre === undefined ? null : centre + halfWidth,
  };
}
