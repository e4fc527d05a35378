import { DomainError } from '../errors';
import { normalQuantile } from '../numerics/distributions';
import { solveTwo } from '../numerics/solve-two';
import { formatSignificant } from '../../format/numbers';
import { logit } from './logistic';
import { lpCStatistic } from './lp-c-statistic';
import type { NormalLp } from './lp-distribution';
import { WELL_CALIBRATED } from './lp-distribution';
import { lpOutcomeProportion } from './lp-outcome-proportion';
import { requireCStatistic, requireOutcomeProportion } from './require-binary-domain';

export interface NormalLpFit {
  /** The fitted LP distribution (meaningful only when converged). */
  readonly lp: NormalLp;
  readonly converged: boolean;
  readonly iterations: number;
  /** max(|phi(μ,σ) − phi|, |C(μ,σ) − C|) at the returned values. */
  readonly residual: number;
  readonly reason?: string;
}

/** Largest C-statistic for which the LP is fitted: beyond it the two equations are ill-conditioned (METHODS 7b). */
export const MAX_C_FOR_FIT = 0.99;
/** The two equations are solved to this residual (the C integral itself is accurate to about 2e−11). */
const FIT_TOLERANCE = 1e-10;

/**
 * The normal LP ~ N(μ, σ²) of a well-calibrated model with outcome proportion phi and C-statistic C:
 * solves E[expit(LP)] = phi and C(μ, σ) = C (METHODS 5.2 [DERIVED]; [VAL-BIN] do this by
 * simulation) with the damped Newton solver in (μ, ln σ), so σ stays positive.
 * Start: σ₀ = √2·Φ⁻¹(C) (for a rare outcome the event LPs are shifted by σ², so C ≈ Φ(σ/√2)) and
 * μ₀ = logit(phi) − σ₀²/2·(1 − phi); the start only affects speed, not the answer.
 * Domain: 0 < phi < 1 and 0.5 < C < 0.99; otherwise DomainError explaining why.
 * Accuracy: residual ≤ 1e−10; μ and σ agree with scipy's 6001-point version (METHODS 5.2) to
 * 1e−6, the difference being that version's −1.3e−7 bias in C.
 * Non-convergence is reported (converged = false and a reason), never returned as a fit.
 * @example fitNormalLp(0.1, 0.8).lp // { mean: −2.776997, sd: 1.288256 }
 */
export function fitNormalLp(outcomeProportion: number, cStatistic: number): NormalLpFit {
  requireOutcomeProportion('outcome proportion', outcomeProportion);
  requireCStatistic('C-statistic', cStatistic);
  if (!(cStatistic < MAX_C_FOR_FIT)) {
    throw new DomainError(
      'C-statistic',
      cStatistic,
      `below ${formatSignificant(MAX_C_FOR_FIT)} when the LP distribution is derived from it (beyond that the two equations barely change with the SD, so the fit is ill-conditioned; give the LP mean and SD instead)`,
    );
  }
  const sd0 = Math.SQRT2 * normalQuantile(cStatistic);
  const mean0 = logit(outcomeProportion) - 0.5 * sd0 * sd0 * (1 - outcomeProportion);
  const equations = (mean: number, logSd: number): readonly [number, number] => {
    const lp = { mean, sd: Math.exp(logSd) };
    // Outside a generous box the trial point is refused, so the solver halves its step.
    if (!(lp.sd > 1e-4 && lp.sd < 50 && Math.abs(mean) < 1e3)) return [Number.NaN, Number.NaN];
    return [lpOutcomeProportion(lp, WELL_CALIBRATED) - outcomeProportion, lpCStatistic(lp, WELL_CALIBRATED) - cStatistic];
  };
  const solved = solveTwo(equations, [mean0, Math.log(sd0)], { tolerance: FIT_TOLERANCE, maxIterations: 60 });
  const lp = { mean: solved.x, sd: Math.exp(solved.y) };
  const base = { lp, converged: solved.converged, iterations: solved.iterations, residual: solved.residual };
  return solved.reason === undefined ? base : { ...base, reason: `LP fit did not converge: ${solved.reason}` };
}
