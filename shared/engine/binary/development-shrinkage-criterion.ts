// Development criterion (i) for a binary outcome: expected global shrinkage at least S [DEV-BIN-SURV].
import { formatSignificant } from '../../format/numbers';
import { closedFormShrinkageN } from '../continuous/closed-form-shrinkage';
import type { CriterionResult, PrecisionAtN } from '../types';
import type { BinaryCriterionText } from './binary-criterion-result';
import type { BinaryDevelopmentInputs } from './binary-development-inputs';
import { precisionFromExpectedShrinkage, sizedDevelopmentCriterion } from './development-sizing';
import { requireDevelopmentInputs } from './require-development-inputs';

export const TEXT: BinaryCriterionText = {
  id: 'dev-shrinkage',
  label: 'Expected shrinkage (development)',
  purpose: 'development',
  formula: 'n = P / ((S − 1)·ln(1 − R²_CS/S)), from S_VH = 1 − P/LR, LR = −n·ln(1 − R²_CS/S)',
  references: ['DEV-BIN-SURV', 'DEV-BMJ'],
};

/**
 * Criterion (i): smallest n whose expected van Houwelingen shrinkage is at least S:
 * n = ⌈P/((S − 1)·ln(1 − R²_CS/S))⌉ (guarded), at least P + 1 (METHODS 4 (i); the closed form is
 * from memory, and with (ii) it reproduces both published EPPs).
 * @example developmentShrinkageCriterion({ predictorParameters: 24, coxSnellR2: 0.288, outcomeProportion: 0.174, targetShrinkage: 0.9, … }).n // 623
 */
export function developmentShrinkageCriterion(inputs: BinaryDevelopmentInputs): CriterionResult {
  requireDevelopmentInputs(inputs);
  const raw = closedFormShrinkageN(inputs.predictorParameters, inputs.coxSnellR2, inputs.targetShrinkage);
  return sizedDevelopmentCriterion(
    TEXT,
    `expected shrinkage factor ≥ ${formatSignificant(inputs.targetShrinkage)}`,
    raw,
    [],
    inputs,
  );
}

/**
 * The shrinkage factor expected at a fixed n: the S in (R²_CS, 1) with n = P/((S − 1)·ln(1 − R²_CS/S)),
 * by Brent's method (METHODS 4, inverse). P 24, R²_CS 0.288, n 400 → 0.854111.
 * @example developmentShrinkagePrecisionAtN({ predictorParameters: 24, coxSnellR2: 0.288, … }, 400).achieved // 0.854111
 */
export function developmentShrinkagePrecisionAtN(inputs: BinaryDevelopmentInputs, n: number): PrecisionAtN {
  const raw = closedFormShrinkageN(inputs.predictorParameters, inputs.coxSnellR2, inputs.targetShrinkage);
  const target = { value: inputs.targetShrinkage, scale: 'expected shrinkage factor (at least)', raw };
  return precisionFromExpectedShrinkage(TEXT, inputs, n, target, (s) => s);
}
