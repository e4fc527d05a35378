// Validation criterion: O/E (observed over expected events) estimated precisely [VAL-BIN].
import { formatSignificant } from '../../format/numbers';
import { levelText } from '../continuous/criterion-result';
import { withinTarget } from '../continuous/precision-tolerance';
import type { SampleSize } from '../continuous/sample-size';
import { closedFormSize } from '../continuous/sample-size';
import { criticalZ } from '../helpers/critical-z';
import { requireCount, requirePositive } from '../helpers/domain-guards';
import { seLogFromRatioCiWidth, seLogFromRatioLimits } from '../helpers/se-log-from-ratio-ci';
import type { CriterionResult, PrecisionAtN } from '../types';
import type { BinaryCriterionText } from './binary-criterion-result';
import { binarySizedCriterion } from './binary-criterion-result';
import { requireOutcomeProportion } from './require-binary-domain';

/** The O/E target: a total CI width W for a ratio CI centred at 1, or CI limits L–U. */
export type OeTarget = { readonly width: number } | { readonly lower: number; readonly upper: number };

export interface OeInputs {
  readonly outcomeProportion: number;
  readonly target: OeTarget;
  readonly confidence: number;
}

const TEXT: BinaryCriterionText = {
  id: 'oe',
  label: 'Precise O/E (overall calibration)',
  purpose: 'validation',
  formula: 'n = (1 − phi) / (phi·SE*²), from SE(ln O/E) = √((1 − phi)/(n·phi))',
  references: ['VAL-BIN', 'EVAL-BMJ'],
};

/**
 * Target SE of ln(O/E) under either convention of METHODS 1.2:
 *   limits L–U:          SE* = (ln U − ln L)/(2z)       (CI 0.9–1.1 → 0.051192)
 *   width W around 1:    SE* = asinh(W/2)/z             (exp(z·SE) − exp(−z·SE) = W; W 0.2 → 0.050937)
 * Domain: W > 0, or 0 < L < U, all finite; 0 < confidence < 1; otherwise DomainError.
 * Source: METHODS 1.2 (common practice for ratio measures on the log scale; the helpers
 * seLogFromRatioCiWidth and seLogFromRatioLimits). Exact.
 * @example oeTargetSe({ width: 0.2 }, 0.95).se // 0.050937
 */
export function oeTargetSe(target: OeTarget, confidence: number): { readonly se: number; readonly convention: string } {
  if ('width' in target) {
    return {
      se: seLogFromRatioCiWidth(target.width, confidence),
      convention: `total width ${formatSignificant(target.width)} for a CI centred at O/E = 1, SE* = asinh(W/2)/z`,
    };
  }
  return {
    se: seLogFromRatioLimits(target.lower, target.upper, confidence),
    convention: `limits ${formatSignificant(target.lower)}–${formatSignificant(target.upper)}, SE* = (ln U − ln L)/(2z)`,
  };
}

/**
 * SE of ln(O/E) at n by the delta method on ln(Ō), E treated as fixed:
 *   SE = √((1 − phi)/(n·phi))
 * Domain: 0 < phi < 1, whole n ≥ 1. Source: VAL-BIN (METHODS 5.1 [DERIVED]). Exact.
 * @example seLnOe(0.1, 1000) // 0.094868
 */
export function seLnOe(outcomeProportion: number, n: number): number {
  requireOutcomeProportion('outcome proportion', outcomeProportion);
  requireCount('n', n, 1);
  return Math.sqrt((1 - outcomeProportion) / (n * outcomeProportion));
}

/**
 * Smallest n with SE(ln O/E) ≤ SE*: n = ⌈(1 − phi)/(phi·SE*²)⌉ (guarded ceiling, METHODS 1.4).
 * Domain: 0 < phi < 1, SE* > 0. Source: VAL-BIN (METHODS 5.1 [DERIVED]). Exact closed form.
 * @example oeSampleSize(0.1, 0.051).n // 3461
 */
export function oeSampleSize(outcomeProportion: number, targetSe: number): SampleSize {
  requireOutcomeProportion('outcome proportion', outcomeProportion);
  requirePositive('target SE of ln(O/E)', targetSe);
  return closedFormSize((1 - outcomeProportion) / (outcomeProportion * targetSe * targetSe), 1);
}

function targetText(inputs: OeInputs, se: number, convention: string): string {
  return `${levelText(inputs.confidence)} CI for O/E: ${convention} (SE of ln O/E ≤ ${formatSignificant(se)})`;
}

/**
 * The O/E criterion as a CriterionResult; its target text names the CI convention used.
 * @example oeCriterion({ outcomeProportion: 0.1, target: { lower: 0.9, upper: 1.1 }, confidence: 0.95 }).n // 3435
 */
export function oeCriterion(inputs: OeInputs): CriterionResult {
  const { se, convention } = oeTargetSe(inputs.target, inputs.confidence);
  const size = oeSampleSize(inputs.outcomeProportion, se);
  return binarySizedCriterion(
    TEXT,
    targetText(inputs, se, convention),
    size,
    [{ name: 'target SE of ln(O/E)', value: se }],
    inputs.outcomeProportion,
  );
}

/**
 * What a fixed n delivers for O/E. Width convention: the CI width exp(z·SE) − exp(−z·SE) around 1;
 * limits convention: the multiplicative margin exp(z·SE) (CI = O/E ×/÷ margin), target √(U/L).
 * Either way it meets the target when SE(ln O/E) ≤ SE*.
 * @example oePrecisionAtN({ outcomeProportion: 0.1, target: { width: 0.2 }, confidence: 0.95 }, 1000).se // 0.094868
 */
export function oePrecisionAtN(inputs: OeInputs, n: number): PrecisionAtN {
  const se = seLnOe(inputs.outcomeProportion, n);
  const targetSe = oeTargetSe(inputs.target, inputs.confidence).se;
  const z = criticalZ(inputs.confidence);
  const level = levelText(inputs.confidence);
  const base = { id: TEXT.id, label: TEXT.label, n, se, meets: withinTarget(se, targetSe) };
  if ('width' in inputs.target) {
    const achieved = 2 * Math.sinh(z * se);
    return {
      ...base,
      achieved,
      targetValue: inputs.target.width,
      scale: `${level} CI width for O/E around 1`,
    };
  }
  return {
    ...base,
    achieved: Math.exp(z * se),
    targetValue: Math.sqrt(inputs.target.upper / inputs.target.lower),
    scale: `${level} CI multiplicative margin for O/E (×/÷)`,
  };
}
