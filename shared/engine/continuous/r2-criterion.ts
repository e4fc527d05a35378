// Validation criterion 1: R² estimated precisely [VAL-CONT].
import { formatSignificant } from '../../format/numbers';
import { requireOpenUnit, requirePositiveOrInfinite } from '../helpers/domain-guards';
import { criticalZ } from '../helpers/critical-z';
import { seFromCiWidth } from '../helpers/se-from-ci-width';
import type { CriterionResult, PrecisionAtN } from '../types';
import type { CriterionText } from './criterion-result';
import { levelText, sizedCriterion } from './criterion-result';
import { R2_SE_PEAK_N, r2StandardError, r2StandardErrorKernel } from './r2-standard-error';
import type { SampleSize } from './sample-size';
import { searchedSize } from './sample-size';
import { MAX_SAMPLE_SIZE } from './sample-size-limit';
import { smallestFromEstimate } from './smallest-from-estimate';

/** What criterion 1 reads (field names as in ContinuousValidationInputs, which satisfies it). */
export interface R2Target {
  readonly rSquared: number;
  readonly r2Width: number;
  readonly confidence: number;
}

/** The smallest n the SE(R²) formula admits (k + 2 with k = 1). */
const R2_LOWEST_N = 3;

const TEXT: CriterionText = {
  id: 'r2',
  label: 'Precise R²',
  purpose: 'validation',
  formula:
    'SE(R²)² = 4R²(1 − R²)²(n − 2)² / ((n² − 1)(n + 3)); n = smallest n on the decreasing branch (n ≥ 7) with SE(R²) ≤ W / (2z)',
  references: ['VAL-CONT', 'WISHART-1931', 'OLKIN-FINN-1995'],
};

/**
 * Smallest n with SE(R²; n) ≤ targetSe on the decreasing branch of the SE formula:
 * n = 1 + max{n ≥ 3 : SE(n) > SE*}. If even the hump at n = 7 is within the target, every n ≥ 3
 * meets it (always-met, n = 3). Otherwise SE ≤ SE* is the cubic (n² − 1)(n + 3) ≥ A(n − 2)² with
 * A = 4R²(1 − R²)²/SE*²; its largest root is near A − 7 (SE(n)² < A·SE*²/n for n ≥ 2, so n = ⌈A⌉
 * always meets the target). Two Newton steps from A − 7 give an estimate, which the integer search
 * on the decreasing branch confirms with two evaluations of SE or corrects (smallestFromEstimate).
 * Domain: 0 < R² < 1, SE* > 0 finite; otherwise a DomainError. Exact (integer search).
 * Source: VAL-CONT criterion 1; METHODS.md 2.1 (the decreasing branch).
 * @example r2SampleSize(0.5, 0.1 / (2 * 1.959963984540054)).n // 762
 */
export function r2SampleSize(rSquared: number, targetSe: number): SampleSize {
  requireOpenUnit('rSquared', rSquared);
  requirePositiveOrInfinite('targetSe', targetSe);
  const meets = (n: number): boolean => r2StandardErrorKernel(rSquared, n) <= targetSe; // n ≥ 7 here
  if (meets(R2_SE_PEAK_N)) return { n: R2_LOWEST_N, status: 'always-met' };
  const oneMinus = 1 - rSquared;
  const a = (4 * rSquared * oneMinus * oneMinus) / (targetSe * targetSe);
  let root = a - 7;
  for (let i = 0; i < 2 && root > R2_SE_PEAK_N; i++) {
    const f = (root * root - 1) * (root + 3) - a * (root - 2) * (root - 2);
    const slope = 3 * root * root + 6 * root - 1 - 2 * a * (root - 2);
    if (slope > 0) root -= f / slope;
  }
  return searchedSize(smallestFromEstimate(meets, root, R2_SE_PEAK_N + 1, MAX_SAMPLE_SIZE), R2_LOWEST_N);
}

/**
 * The size of criterion 1 for a target (the number only; r2Criterion adds the words).
 * @example r2Size({ rSquared: 0.5, r2Width: 0.1, confidence: 0.95 }) // { n: 762, status: 'ok' }
 */
export function r2Size(t: R2Target): SampleSize {
  return r2SampleSize(t.rSquared, seFromCiWidth(t.r2Width, t.confidence));
}

function targetText(t: R2Target): string {
  return `${levelText(t.confidence)} CI width for R² ≤ ${formatSignificant(t.r2Width)}`;
}

/**
 * Criterion 1 of VAL-CONT as a CriterionResult: target CI width W for R² at the given level.
 * @example r2Criterion({ rSquared: 0.8, r2Width: 0.1, confidence: 0.95 }).n // 190
 */
export function r2Criterion(t: R2Target): CriterionResult {
  const targetSe = seFromCiWidth(t.r2Width, t.confidence);
  const size = r2Size(t);
  const intermediates = [
    { name: 'target SE(R²)', value: targetSe },
    { name: 'SE(R²) at the hump (n = 7)', value: r2StandardError(t.rSquared, R2_SE_PEAK_N) },
  ];
  const note =
    size.status === 'always-met' ? 'even the largest SE(R²) the formula gives (at n = 7) is within the target' : undefined;
  return sizedCriterion(TEXT, targetText(t), size, intermediates, note);
}

/**
 * What a fixed n delivers for R²: SE(R²; n) and the CI width 2z·SE. The target counts as met when
 * SE ≤ SE* at n and at every larger n (on the rising part of the formula, below n = 7, the small
 * values are an artefact, so there the worst value at n = 7 decides and no SE is shown).
 * @example r2PrecisionAtN({ rSquared: 0.5, r2Width: 0.1, confidence: 0.95 }, 200).se // 0.049133…
 */
export function r2PrecisionAtN(t: R2Target, n: number): PrecisionAtN {
  const targetSe = seFromCiWidth(t.r2Width, t.confidence);
  const base = { id: TEXT.id, label: TEXT.label, n, targetValue: t.r2Width, scale: `${levelText(t.confidence)} CI width` };
  if (n < R2_LOWEST_N) {
    return { ...base, se: null, achieved: null, meets: false, reason: 'R² cannot be estimated from fewer than 3 participants' };
  }
  if (n < R2_SE_PEAK_N) {
    return {
      ...base,
      se: null,
      achieved: null,
      meets: r2StandardError(t.rSquared, R2_SE_PEAK_N) <= targetSe,
      reason: 'the large-sample SE(R²) formula is not usable below n = 7',
    };
  }
  const se = r2StandardError(t.rSquared, n);
  return { ...base, se, achieved: 2 * criticalZ(t.confidence) * se, meets: se <= targetSe };
}
