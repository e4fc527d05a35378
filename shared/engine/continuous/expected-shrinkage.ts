import { requireCount, requireOpenUnit } from '../helpers/domain-guards';

/**
 * Expected global shrinkage factor of a least-squares model with P predictor parameters fitted to
 * n participants when the anticipated adjusted R² is R²_adj:
 *   R²_app(n) = 1 − (1 − R²_adj)(n − P − 1)/(n − 1)      (the adjusted-R² identity, solved for R²_app)
 *   S(n) = 1 + (P − 2) / (n·ln(1 − R²_app(n)))            (LR = −n·ln(1 − R²_app) for a Gaussian model)
 * Domain: whole P ≥ 1, 0 < R²_adj < 1, whole n ≥ P + 2; otherwise a DomainError.
 * Source: DEV-CONT criterion (i), RECON: reconstructed to reproduce the published total (918 for
 * P = 25, R²_adj = 0.2; METHODS.md 3.1); the (P − 2) form is the least-squares shrinkage of Copas
 * (1983). For P ≤ 2 it is ≥ 1 at every n. Shape: near n = P + 2 the apparent R² tends to 1 and S
 * is high, then S dips once and rises towards 1 (checked on a grid of P and R²). Accuracy: ~1e−15
 * (1 − R²_app is formed as a product, not a difference).
 * @example expectedShrinkage(918, 25, 0.2) // 0.900096…
 */
export function expectedShrinkage(n: number, predictorParameters: number, adjustedRSquared: number): number {
  requireCount('predictorParameters', predictorParameters, 1);
  requireOpenUnit('adjustedRSquared', adjustedRSquared);
  requireCount('n', n, predictorParameters + 2);
  return expectedShrinkageKernel(n, predictorParameters, adjustedRSquared);
}

/**
 * The formula of expectedShrinkage without the domain checks, for searches that checked once.
 * @example expectedShrinkageKernel(917, 25, 0.2) // 0.8999990…
 */
export function expectedShrinkageKernel(n: number, predictorParameters: number, adjustedRSquared: number): number {
  const residualFraction = ((1 - adjustedRSquared) * (n - predictorParameters - 1)) / (n - 1);
  return 1 + (predictorParameters - 2) / (n * Math.log(residualFraction));
}
