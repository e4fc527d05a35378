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
 * `measure` turns S into the achieved value and whether it meets the target.
 */
export function precisionFromExpectedShrinkage(
  text: BinaryCriterionText,
  inputs: BinaryDevelopmentInputs,
  n: number,
  target: { readonly value: number; readonly scale: string },
  measure: (shrinkage: number) => { readonly achieved: number; readonly meets: boolean },
): PrecisionAtN {
  requireDevelopmentInputs(inputs);
  requireCount('n', n, 1);
  const base = { id: text.id, label: text.label, n, se: null, targetValue: target.value, scale: target.scale };
  const s = closedFormShrinkageAtN(n, inputs.predictorParameters, inputs.coxSnellR2);
  if (s === null)
    return { ...base, achieved: null, meets: null, reason: 'the search for the expected shrinkage did not converge' };
  return { ...base, ...measure(s) };
}
