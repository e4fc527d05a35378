// Development criterion (iii) for a binary outcome: the overall risk estimated within a margin [DEV-BIN-SURV].
import { formatSignificant } from '../../format/numbers';
import { levelText } from '../continuous/criterion-result';
import { withinTarget } from '../continuous/precision-tolerance';
import { closedFormSize } from '../continuous/sample-size';
import { criticalZ } from '../helpers/critical-z';
import { requireCount } from '../helpers/domain-guards';
import type { CriterionResult, PrecisionAtN } from '../types';
import type { BinaryCriterionText } from './binary-criterion-result';
import { binarySizedCriterion } from './binary-criterion-result';
import type { BinaryDevelopmentInputs } from './binary-development-inputs';
import { requireDevelopmentInputs } from './require-development-inputs';

export const TEXT: BinaryCriterionText = {
  id: 'dev-overall-risk',
  label: 'Precise overall risk (development)',
  purpose: 'development',
  formula: 'n = (z/margin)²·phi(1 − phi)',
  references: ['DEV-BIN-SURV', 'DEV-BMJ'],
};

/**
 * Criterion (iii): smallest n with z·√(phi(1 − phi)/n) ≤ margin, n = ⌈(z/margin)²·phi(1 − phi)⌉
 * (guarded), at least 1 (METHODS 4 (iii)). phi 0.174, margin 0.05 → 221.
 * @example overallRiskCriterion({ outcomeProportion: 0.174, riskMargin: 0.05, confidence: 0.95, … }).n // 221
 */
export function overallRiskCriterion(inputs: BinaryDevelopmentInputs): CriterionResult {
  requireDevelopmentInputs(inputs);
  const z = criticalZ(inputs.confidence);
  const phi = inputs.outcomeProportion;
  const raw = (z / inputs.riskMargin) ** 2 * phi * (1 - phi);
  const target = `${levelText(inputs.confidence)} CI for the overall risk within ± ${formatSignificant(inputs.riskMargin)}`;
  return binarySizedCriterion(TEXT, target, closedFormSize(raw, 1), [{ name: 'unrounded n', value: raw }], phi);
}

/**
 * Margin of error of the overall risk at a fixed n: z·√(phi(1 − phi)/n). phi 0.174, n 400 → 0.037152.
 * @example overallRiskPrecisionAtN({ outcomeProportion: 0.174, riskMargin: 0.05, confidence: 0.95, … }, 400).achieved // 0.037152
 */
export function overallRiskPrecisionAtN(inputs: BinaryDevelopmentInputs, n: number): PrecisionAtN {
  requireDevelopmentInputs(inputs);
  requireCount('n', n, 1);
  const phi = inputs.outcomeProportion;
  const se = Math.sqrt((phi * (1 - phi)) / n);
  const achieved = criticalZ(inputs.confidence) * se;
  return {
    id: TEXT.id,
    label: TEXT.label,
    n,
    se,
    achieved,
    targetValue: inputs.riskMargin,
    scale: `${levelText(inputs.confidence)} CI half-width (margin) for the overall risk`,
    meets: withinTarget(achieved, inputs.riskMargin),
  };
}
