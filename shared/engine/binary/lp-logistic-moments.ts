import type { NormalQuadratureRule } from '../numerics/gauss-hermite';
import type { Calibration, NormalLp } from './lp-distribution';

/** Expectations over LP ~ N(mean, sd²) with p = expit(α + β·LP) and w = p(1 − p). */
export interface LpLogisticMoments {
  /** E[p]. */
  readonly outcomeProportion: number;
  /** E(w), E(w·LP), E(w·LP²). */
  readonly i00: number;
  readonly i01: number;
  readonly i11: number;
}

let last: {
  readonly rule: NormalQuadratureRule;
  readonly mean: number;
  readonly sd: number;
  readonly intercept: number;
  readonly slope: number;
  readonly moments: LpLogisticMoments;
} | null = null;

/**
 * E[p], E[w], E[w·LP], E[w·LP²] for LP = mean + sd·Z, p = expit(α + β·LP), w = p(1 − p), by the
 * given quadrature rule for Z ~ N(0, 1) (see lpQuadratureRule). One exponential per node; p and w
 * are formed without cancellation in either tail. The last result is remembered (same inputs, same
 * rule object → same answer).
 * Domain: finite inputs and a converged rule (the callers check). Source: METHODS 5.2 [DERIVED].
 * Accuracy: that of the rule.
 * @example lpLogisticMoments({ mean: 0, sd: 1 }, { intercept: 0, slope: 1 }, gaussHermiteRule(200)).outcomeProportion // 0.5
 */
export function lpLogisticMoments(lp: NormalLp, calibration: Calibration, rule: NormalQuadratureRule): LpLogisticMoments {
  // A plan asks for the same moments twice (the slope criterion and the LP summary): remember the last.
  if (
    last !== null &&
    last.rule === rule &&
    last.mean === lp.mean &&
    last.sd === lp.sd &&
    last.intercept === calibration.intercept &&
    last.slope === calibration.slope
  ) {
    return last.moments;
  }
  const { nodes, weights } = rule;
  const a = calibration.intercept + calibration.slope * lp.mean;
  const b = calibration.slope * lp.sd;
  let i00 = 0;
  let i01 = 0;
  let i11 = 0;
  let phi = 0;
  for (let k = 0; k < nodes.length; k++) {
    const z = nodes[k] ?? 0;
    const wk = weights[k] ?? 0;
    const eta = a + b * z;
    const e = Math.exp(-Math.abs(eta));
    const p = eta >= 0 ? 1 / (1 + e) : e / (1 + e);
    const ww = (wk * e) / ((1 + e) * (1 + e)); // weight × p(1 − p), symmetric in the sign of eta
    const x = lp.mean + lp.sd * z;
    i00 += ww;
    i01 += ww * x;
    i11 += ww * x * x;
    phi += wk * p;
  }
  const moments = { outcomeProportion: phi, i00, i01, i11 };
  last = { rule, mean: lp.mean, sd: lp.sd, intercept: calibration.intercept, slope: calibration.slope, moments };
  return moments;
}
