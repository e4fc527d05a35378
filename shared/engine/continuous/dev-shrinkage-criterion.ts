// Development criterion (i): expected global shrinkage at least S* [DEV-CONT].
import { formatSignificant } from '../../format/numbers';
import type { CriterionResult, PrecisionAtN } from '../types';
import { closedFormShrinkageAtN, closedFormShrinkageN } from './closed-form-shrinkage';
import type { ContinuousDevelopmentInputs } from './continuous-inputs';
import type { CriterionText } from './criterion-result';
import { notAssessableCriterion, sizedCriterion } from './criterion-result';
import { developmentCore } from './development-inputs-check';
import { expectedShrinkage } from './expected-shrinkage';
import { adjustedR2LinkShrinkageSize, closedFormShrinkageSize, shrinkageBranchStart } from './shrinkage-sample-size';
import type { SampleSize } from './sample-size';
import { MAX_SAMPLE_SIZE } from './sample-size-limit';

const LINK_TEXT: CriterionText = {
  id: 'dev-shrinkage',
  label: 'Expected shrinkage (development)',
  purpose: 'development',
  formula:
    'S(n) = 1 + (P − 2) / (n·ln(1 − R²_app(n))), R²_app(n) = 1 − (1 − R²_adj)(n − P − 1)/(n − 1); n = smallest n from which S(n) ≥ S* (form reconstructed to reproduce the published total)',
  references: ['DEV-CONT'],
};

const CLOSED_TEXT: CriterionText = {
  id: 'dev-shrinkage',
  label: 'Expected shrinkage (development, closed form)',
  purpose: 'development',
  formula: 'n = P / ((S* − 1)·ln(1 − R²_adj/S*)) (the closed form used for binary and time-to-event outcomes)',
  references: ['DEV-CONT', 'DEV-BIN-SURV'],
};

const CLOSED_FORM_DOMAIN = 'the closed form needs the anticipated adjusted R² below the target shrinkage';

/**
 * The size of criterion (i) in the chosen form (the number only), or why it cannot be assessed.
 * @example devShrinkageSize({ predictorParameters: 25, adjustedRSquared: 0.2, targetShrinkage: 0.9, shrinkageForm: 'closed-form', … }) // { n: 995, status: 'ok' }
 */
export function devShrinkageSize(inputs: ContinuousDevelopmentInputs): SampleSize | string {
  const core = developmentCore(inputs);
  if (typeof core === 'string') return core;
  const { predictorParameters: p, adjustedRSquared: r2 } = core;
  if (inputs.shrinkageForm !== 'closed-form') return adjustedR2LinkShrinkageSize(p, r2, inputs.targetShrinkage);
  return r2 < inputs.targetShrinkage ? closedFormShrinkageSize(p, r2, inputs.targetShrinkage) : CLOSED_FORM_DOMAIN;
}

function closedFormReason(inputs: ContinuousDevelopmentInputs): string {
  const r2 = formatSignificant(inputs.adjustedRSquared ?? Number.NaN);
  return `${CLOSED_FORM_DOMAIN} (${r2} is not below ${formatSignificant(inputs.targetShrinkage)})`;
}

function targetText(inputs: ContinuousDevelopmentInputs): string {
  return `expected shrinkage factor ≥ ${formatSignificant(inputs.targetShrinkage)}`;
}

/**
 * Criterion (i) of DEV-CONT in the form chosen by `shrinkageForm`: 'adjusted-r2-link' (918 for the
 * published example; see adjustedR2LinkShrinkageSize) or 'closed-form' (995; closedFormShrinkageSize).
 * Not assessable without P and R²_adj, or (closed form) when R²_adj ≥ S*.
 * @example devShrinkageCriterion({ predictorParameters: 25, adjustedRSquared: 0.2, targetShrinkage: 0.9, shrinkageForm: 'adjusted-r2-link', … }).n // 918
 */
export function devShrinkageCriterion(inputs: ContinuousDevelopmentInputs): CriterionResult {
  const text = inputs.shrinkageForm === 'closed-form' ? CLOSED_TEXT : LINK_TEXT;
  const size = devShrinkageSize(inputs);
  if (typeof size === 'string') {
    return notAssessableCriterion(text, targetText(inputs), size === CLOSED_FORM_DOMAIN ? closedFormReason(inputs) : size);
  }
  // Sized, so both P and R²_adj are known.
  const p = inputs.predictorParameters ?? 0;
  const r2 = inputs.adjustedRSquared ?? 0;
  if (inputs.shrinkageForm === 'closed-form') {
    const note =
      size.status === 'always-met' ? 'the closed form asks for no more than the smallest admissible n (P + 2)' : undefined;
    const raw = closedFormShrinkageN(p, r2, inputs.targetShrinkage);
    return sizedCriterion(text, targetText(inputs), size, [{ name: 'unrounded n', value: raw }], note);
  }
  const intermediates =
    size.n === null
      ? []
      : [
          { name: 'expected shrinkage at n', value: expectedShrinkage(size.n, p, r2) },
          ...(size.n > p + 2 ? [{ name: 'expected shrinkage at n − 1', value: expectedShrinkage(size.n - 1, p, r2) }] : []),
        ];
  const note =
    size.status !== 'always-met'
      ? undefined
      : p <= 2
        ? 'with P ≤ 2 the (P − 2) form gives an expected shrinkage of at least 1 at every n: always met'
        : 'the expected shrinkage stays at or above the target at every admissible n: always met';
  return sizedCriterion(text, targetText(inputs), size, intermediates, note);
}

/**
 * The shrinkage factor expected at a fixed n, and whether it meets S* (for the adjusted-R² link:
 * at n and every larger n, as in the forward criterion).
 * @example devShrinkagePrecisionAtN({ predictorParameters: 25, adjustedRSquared: 0.2, … }, 500).achieved // 0.832448…
 */
export function devShrinkagePrecisionAtN(inputs: ContinuousDevelopmentInputs, n: number): PrecisionAtN {
  const text = inputs.shrinkageForm === 'closed-form' ? CLOSED_TEXT : LINK_TEXT;
  const base = {
    id: text.id,
    label: text.label,
    n,
    targetValue: inputs.targetShrinkage,
    scale: 'expected shrinkage factor',
    se: null,
  };
  const core = developmentCore(inputs);
  if (typeof core === 'string') return { ...base, achieved: null, meets: null, reason: core };
  const { predictorParameters: p, adjustedRSquared: r2 } = core;
  if (n < p + 2)
    return { ...base, achieved: null, meets: false, reason: `a model with P = ${p} needs at least P + 2 participants` };
  if (inputs.shrinkageForm === 'closed-form') {
    const achieved = closedFormShrinkageAtN(n, p, r2);
    if (achieved === null)
      return { ...base, achieved: null, meets: null, reason: 'the closed-form shrinkage could not be solved at this n' };
    if (!(r2 < inputs.targetShrinkage)) return { ...base, achieved, meets: null, reason: CLOSED_FORM_DOMAIN };
    // Met once n reaches the closed form's own (guarded) n: comparing the solved S with S* instead
    // would amplify its last-digit error by dn/dS, which is ~1e8 for S* near 1 at large n.
    const required = closedFormShrinkageSize(p, r2, inputs.targetShrinkage).n;
    return { ...base, achieved, meets: required !== null && n >= required };
  }
  const achieved = expectedShrinkage(n, p, r2);
  if (p <= 2) return { ...base, achieved, meets: true };
  const worstFromHere = expectedShrinkage(Math.max(n, shrinkageBranchStart(p, r2, MAX_SAMPLE_SIZE - 1)), p, r2);
  return { ...base, achieved, meets: worstFromHere >= inputs.targetShrinkage };
}
