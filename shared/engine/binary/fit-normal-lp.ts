import { DomainError } from '../errors';
import { normalQuantile } from '../numerics/distributions';
import { solveTwo } from '../numerics/solve-two';
import { formatSignificant } from '../../format/numbers';
import { logit } from './logistic';
import { lpCStatisticAndProportion } from './lp-c-statistic';
import type { NormalLp } from './lp-distribution';
import { WELL_CALIBRATED } from './lp-distribution';
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
/**
 * Fits are remembered per (phi, C): a plan is recomputed whenever any other input changes, and a
 * project holds at most a few thousand populations; the memory is cleared when full.
 */
const REMEMBERED_FITS = 4096;
const remembered = new Map<string, NormalLpFit>();

/** Forgets every remembered fit (for benchmarks that time the solve itself). */
export function forgetNormalLpFits(): void {
  remembered.clear();
}

/** The two equations are solved to this residual (the C integral itself is accurate to about 2e−11). */
const FIT_TOLERANCE = 1e-10;

/**
 * The normal LP ~ N(μ, σ²) of a well-calibrated model with outcome proportion phi and C-statistic C:
 * solves E[expit(LP)] = phi and C(μ, σ) = C (METHODS 5.2 [DERIVED]; [VAL-BIN] do this by
 * simulation) with the damped Newton solver in (μ, ln σ), so σ stays positive. Both equations are
 * evaluated in one pass over the C-statistic grid (lpCStatisticAndProportion), so they share one
 * smooth discretisation with no switch of quadrature rule during the solve.
 * Start: σ₀ = √2·Φ⁻¹(C) (for a rare outcome the event LPs are shifted by σ², so C ≈ Φ(σ/√2)) and
 * μ₀ = logit(phi) − σ₀²/2·(1 − phi); the start only affects speed, not the answer.
 * Domain: 0 < phi < 1 and 0.5 < C < 0.99; otherwise DomainError explaining why.
 * Accuracy: residual ≤ 1e−10; μ and σ agree to 1e−8 with a fit whose C is integrated by scipy
 * adaptive quadrature, and to 1e−6 with the 6001-point version of METHODS 5.2 (whose C is biased by
 * −1.3e−7).
 * Non-convergence is reported (converged = false and a reason), never returned as a fit.
 * Results are remembered per (phi, C) (a pure function of the two).
 * @example fitNormalLp(0.1, 0.8).lp // { mean: −2.776997, sd: 1.288256 }
 */
export function fitNormalLp(outcomeProportion: number, cStatistic: number): NormalLpFit {
  requireOutcomeProportion('outcome proportion', outcomeProportion);
  requireCStatistic('C-statistic', cStatistic);
  const key = `${outcomeProportion}|${cStatistic}`;
  const known = remembered.get(key);
  if (known !== undefined) return known;
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
    const both = lpCStatisticAndProportion(lp, WELL_CALIBRATED);
    return [both.outcomeProportion - outcomeProportion, both.cStatistic - cStatistic];
  };
  const solved = solveTwo(equations, [mean0, Math.log(sd0)], { tolerance: FIT_TOLERANCE, maxIterations: 60 });
  const lp = { mean: solved.x, sd: Math.exp(solved.y) };
  const base = { lp, converged: solved.converged, iterations: solved.iterations, residual: solved.residual };
  const fit = solved.reason === undefined ? base : { ...base, reason: `LP fit did not converge: ${solved.reason}` };
  if (remembered.size >= REMEMBERED_FITS) remembered.clear();
  remembered.set(key, fit);
  return fit;
}
