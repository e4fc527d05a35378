// Development criterion (ii) for a binary outcome: small optimism in Nagelkerke R² [DEV-BIN-SURV].
import { formatSignificant } from '../../format/numbers';
import { closedFormShrinkageN } from '../continuous/closed-form-shrinkage';
import type { CriterionResult, PrecisionAtN } from '../types';
import type { BinaryCriterionText } from './binary-criterion-result';
import type { BinaryDevelopmentInputs } from './binary-development-inputs';
import { precisionFromExpectedShrinkage, sizedDevelopmentCriterion } from './development-sizing';
import { maxCoxSnellR2 } from './max-cox-snell-r2';
import { requireDevelopmentInputs } from './require-development-inputs';

export const TEXT: BinaryCriterionText = {
  id: 'dev-optimism',
  label: 'Small optimism in Nagelkerke R² (development)',
  purpose: 'development',
  formula: 'S_δ = R²_CS / (R²_CS + δ·max R²_CS), max R²_CS = 1 − exp(2·ln L_null/n); n = P / ((S_δ − 1)·ln(1 − R²_CS/S_δ))',
  references: ['DEV-BIN-SURV', 'DEV-BMJ'],
};

/**
 * The shrinkage that keeps the expected optimism in Nagelkerke R² within δ:
 *   S_δ = R²_CS / (R²_CS + δ·max R²_CS)   (METHODS 4 (ii); DEV-BIN-SURV). Exact.
 * @example shrinkageForNagelkerkeOptimism(0.288, 0.174, 0.05) // 0.905204
 */
export function shrinkageForNagelkerkeOptimism(coxSnellR2: number, outcomeProportion: number, optimismMargin: number): number {
  return coxSnellR2 / (coxSnellR2 + optimismMargin * maxCoxSnellR2(outcomeProportion));
}

/**
 * Criterion (ii): formula (i) with S = S_δ, at least P + 1; it binds only when S_δ exceeds the
 * shrinkage target of (i).
 * @example developmentOptimismCriterion({ predictorParameters: 24, coxSnellR2: 0.288, outcomeProportion: 0.174, optimismMargin: 0.05, … }).n // 662
 */
export function developmentOptimismCriterion(inputs: BinaryDevelopmentInputs): CriterionResult {
  requireDevelopmentInputs(inputs);
  const max = maxCoxSnellR2(inputs.outcomeProportion);
  const s = shrinkageForNagelkerkeOptimism(inputs.coxSnellR2, inputs.outcomeProportion, inputs.optimismMargin);
  const raw = closedFormShrinkageN(inputs.predictorParameters, inputs.coxSnellR2, s);
  const intermediates = [
    { name: 'max Cox–Snell R²', value: max },
    { name: 'shrinkage S_δ needed', value: s },
  ];
  return sizedDevelopmentCriterion(
    TEXT,
    `Nagelkerke R² optimism ≤ ${formatSignificant(inputs.optimismMargin)}`,
    raw,
    intermediates,
    inputs,
  );
}

/**
 * Expected optimism in Nagelkerke R² at a fixed n: δ(n) = R²_CS(1 − S)/(S·max R²_CS), S the expected
 * shrinkage at n (METHODS 4, inverse). P 24, R²_CS 0.288, phi 0.174, n 400 → 0.081552.
 * @example developmentOptimismPrecisionAtN({ predictorParameters: 24, coxSnellR2: 0.288, outcomeProportion: 0.174, … }, 400).achieved // 0.081552
 */
export function developmentOptimismPrecisionAtN(inputs: BinaryDevelopmentInputs, n: number): PrecisionAtN {
  requireDevelopmentInputs(inputs);
  const max = maxCoxSnellR2(inputs.outcomeProportion);
  const needed = shrinkageForNagelkerkeOptimism(inputs.coxSnellR2, inputs.outcomeProportion, inputs.optimismMargin);
  const raw = closedFormShrinkageN(inputs.predictorParameters, inputs.coxSnellR2, needed);
  const target = { value: inputs.optimismMargin, scale: 'expected optimism in Nagelkerke R²', raw };
  return precisionFromExpectedShrinkage(TEXT, inputs, n, target, (s) => (inputs.coxSnellR2 * (1 - s)) / (s * max));
}
