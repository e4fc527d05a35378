import { requireCount, requireOpenUnit } from '../helpers/domain-guards';

/** For one predictor the large-sample SE(R²) rises from 0 at n = 2 to a hump at n = 7, then falls. */
export const R2_SE_PEAK_N = 7;

/**
 * Large-sample standard error of the squared correlation R² with k = 1 predictor (the model's
 * linear predictor, in validation):
 *   SE(R²)² = 4R²(1 − R²)²(n − k − 1)² / ((n² − 1)(n + 3)).
 * Domain: 0 < R² < 1, whole n ≥ 3; otherwise a DomainError. The formula is asymptotic: it is 0
 * at n = 2, peaks at n = 7 and only then behaves like a standard error (decays as 1/√n).
 * Source: WISHART-1931, OLKIN-FINN-1995 (used by VAL-CONT criterion 1). Accuracy: a few ulps.
 * @example r2StandardError(0.5, 200) // 0.049133…
 */
export function r2StandardError(rSquared: number, n: number): number {
  requireOpenUnit('rSquared', rSquared);
  requireCount('n', n, 3);
  return r2StandardErrorKernel(rSquared, n);
}

/**
 * The formula of r2StandardError without the domain checks, for searches that checked once.
 * @example r2StandardErrorKernel(0.5, 200) // 0.049133…
 */
export function r2StandardErrorKernel(rSquared: number, n: number): number {
  const oneMinus = 1 - rSquared;
  return Math.sqrt((4 * rSquared * oneMinus * oneMinus * (n - 2) * (n - 2)) / ((n * n - 1) * (n + 3)));
}
