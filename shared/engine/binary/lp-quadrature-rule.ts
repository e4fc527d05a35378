import { gaussHermiteRule } from '../numerics/gauss-hermite';
import type { NormalQuadratureRule } from '../numerics/gauss-hermite';
import { normalPanelRule } from './gauss-legendre-panels';
import type { Calibration, NormalLp } from './lp-distribution';

/** Gauss–Hermite nodes used for expectations over the LP distribution (METHODS 1.7 uses 200). */
export const LP_GAUSS_HERMITE_NODES = 200;

/** Above this spread |slope|·SD the Gauss–Hermite rule gives way to composite Gauss–Legendre. */
export const GAUSS_HERMITE_SCALE_LIMIT = 2.5;

/**
 * The quadrature rule for expectations E[g(LP)] with LP = mean + sd·Z, where g involves
 * expit(intercept + slope·LP) and so varies on the scale 1/s, s = |slope|·sd, in Z.
 *
 * Accuracy study (relative error of the calibration-slope variance [I⁻¹]₂₂ against scipy
 * adaptive quadrature; fixtures in test/fixtures/binary): Gauss–Hermite with 64 nodes errs by
 * 3e−11 at s = 1.5, 2.5e−8 at s = 2, 2.4e−5 at s = 3, 6e−4 at s = 4; with 200 nodes by at most
 * 6e−13 for s ≤ 2.5, 1.3e−10 at s = 3, 1e−7 at s = 4, 7e−5 at s = 6 and 1.2e−2 at s = 10
 * (a narrow bump that fixed Hermite nodes cannot follow). Hence: 200 Gauss–Hermite nodes for
 * s ≤ 2.5, and for larger s composite five-point Gauss–Legendre over [−9, 9] with panels no
 * wider than 1/s (error ≤ 2e−10 up to s = 15). For a fitted C-statistic below 0.99, s stays
 * below 10. Both rules are cached.
 * Source: Gauss–Hermite for a normal LP as in METHODS 5.2 [DERIVED]; the switch is common practice.
 * @example lpQuadratureRule({ mean: -2.777, sd: 1.2883 }, { intercept: 0, slope: 1 }).nodes.length // 200
 */
export function lpQuadratureRule(
  lp: NormalLp,
  calibration: Calibration,
  hermiteNodes = LP_GAUSS_HERMITE_NODES,
): NormalQuadratureRule {
  const spread = Math.abs(calibration.slope) * lp.sd;
  if (spread <= GAUSS_HERMITE_SCALE_LIMIT) return gaussHermiteRule(hermiteNodes);
  // Panels of width ≤ 1/s over [−9, 9], with s rounded up to a multiple of 0.5 to keep the cache small.
  return normalPanelRule(9 * Math.ceil(2 * spread));
}
