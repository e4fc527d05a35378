// What the shrinkage-based development criteria share: sizing from the closed form, and the
// precision at a fixed n that follows from the expected shrinkage there.
import { closedFormShrinkageAtN } from '../continuous/closed-form-shrinkage';
import { closedFormSize } from '../continuous/sample-size';
import { requireCount } from '../helpers/domain-guards';
import type { CriterionResult, Intermediate, PrecisionAtN } from '../types';
import type { BinaryCriterionText } from './binary-criterion-result';
import { binarySizedCriterion } from './binary-criterion-result';
import type { BinaryDevelopmentInputs } from './binary-development-inputs';
import { lowestDevelopmentN } from './binary-development-inputs';
import { requireDevelopmentInputs } from './require-development-inputs';

/** A development criterion sized by a closed form `raw`, at least P + 1, with the unrounded n shown. */
export function sizedDevelopmentCriterion(
  text: BinaryCriterionText,
  target: string,
  raw: number,
  intermediates: readonly Intermediate[],
  inputs: BinaryDevelopmentInputs,
): CriterionResult {
  const size = closedFormSize(raw, lowestDevelopmentN(inputs));
  return binarySizedCriterion(
    text,
    target,
    size,
    [...intermediates, { name: 'unrounded n', value: raw }],
    inputs.outcomeProportion,
  );
}

/**
 * Precision at a fixed n for a measure that follows from the expected shrinkage S(n) (the S in
 * (R²_CS, 1) with n = P/((S − 1)·ln(1 − R²_CS/S)), by Brent's method; METHODS 4, inverse).
 * `achieved` turns S into the value shown. Whether n meets the target is decided by comparing n
 * with the criterion's own rounded size ⌈raw − 1e−9⌉, not S with its target: near S = 1 a tiny
 * slack in S spans many values of n, and this way the inverse agrees with the criterion exactly.
 */
export function precisionFromExpectedShrinkage(
  text: BinaryCriterionText,
  inputs: BinaryDevelopmentInputs,
  n: number,
  target: { readonly value: number; readonly scale: string; readonly raw: number },
  achieved: (shrinkage: number) => number,
): PrecisionAtN {
  requireDevelopmentInputs(inputs);
  requireCount('n', n, 1);
  const base = { id: text.id, label: text.label, n, se: null, targetValue: target.value, scale: target.scale };
  const s = closedFormShrinkageAtN(n, inputs.predictorParameters, inputs.coxSnellR2);
  if (s === null)
    return { ...base, achieved: null, meets: null, reason: 'the search for the expected shrinkage did not converge' };
  const required = closedFormSize(target.raw, lowestDevelopmentN(inputs)).n;
  return { ...base, achieved: achieved(s), meets: required !== null && n >= required };
}
