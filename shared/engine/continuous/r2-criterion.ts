// Validation criterion 1: R² estimated precisely [VAL-CONT].
import { formatSignificant } from '../../format/numbers';
import { requireOpenUnit, requirePositive } from '../helpers/domain-guards';
import { criticalZ } from '../helpers/critical-z';
import { seFromCiWidth } from '../helpers/se-from-ci-width';
import { smallestIntegerMeeting } from '../numerics/integer-search';
import type { CriterionResult, PrecisionAtN } from '../types';
import type { CriterionText } from './criterion-result';
import { levelText, sizedCriterion } from './criterion-result';
import { R2_SE_PEAK_N, r2StandardError } from './r2-standard-error';
import type { SampleSize } from './sample-size';
import { searchedSize } from './sample-size';
import { MAX_SAMPLE_SIZE } from './sample-size-limit';

export interface R2Target {
  readonly rSquared: number;
  readonly width: number;
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
 * meets it (always-met, n = 3). Otherwise the integer search is bracketed by the asymptotic
 * A = 4R²(1 − R²)²/SE*² (SE(n)² < A·SE*²/n for n ≥ 2, so n = ⌈A⌉ always meets it, and the answer
 * lies about 7 below A), falling back to the whole branch if the bracket's lower end already meets.
 * Domain: 0 < R² < 1, SE* > 0 finite; otherwise a DomainError. Exact (integer search).
 * Source: VAL-CONT criterion 1; METHODS.md 2.1 (the decreasing branch).
 * @example r2SampleSize(0.5, 0.1 / (2 * 1.959963984540054)).n // 762
 */
export function r2SampleSize(rSquared: number, targetSe: number): SampleSize {
  requireOpenUnit('rSquared', rSquared);
  requirePositive('targetSe', targetSe);
  const meets = (n: number): boolean => r2StandardError(rSquared, n) <= targetSe;
  if (meets(R2_SE_PEAK_N)) return { n: R2_LOWEST_N, status: 'always-met' };
  const branchStart = R2_SE_PEAK_N + 1;
  const oneMinus = 1 - rSquared;
  const asymptotic = (4 * rSquared * oneMinus * oneMinus) / (targetSe * targetSe);
  const upper = Math.min(MAX_SAMPLE_SIZE, Math.max(branchStart, Math.ceil(asymptotic)));
  let lower = Math.min(upper, Math.max(branchStart, Math.floor(asymptotic) - 16));
  if (lower > branchStart && meets(lower - 1)) lower = branchStart;
  const found = smallestIntegerMeeting(meets, lower, upper);
  if (found.converged || upper === MAX_SAMPLE_SIZE) return searchedSize(found, R2_LOWEST_N);
  return searchedSize(smallestIntegerMeeting(meets, upper, MAX_SAMPLE_SIZE), R2_LOWEST_N);
}

function targetText(t: R2Target): string {
  return `${levelText(t.confidence)} CI width for R² ≤ ${formatSignificant(t.width)}`;
}

/**
 * Criterion 1 of VAL-CONT as a CriterionResult: target CI width W for R² at the given level.
 * @example r2Criterion({ rSquared: 0.8, width: 0.1, confidence: 0.95 }).n // 190
 */
export function r2Criterion(t: R2Target): CriterionResult {
  const targetSe = seFromCiWidth(t.width, t.confidence);
  const size = r2SampleSize(t.rSquared, targetSe);
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
 * @example r2PrecisionAtN({ rSquared: 0.5, width: 0.1, confidence: 0.95 }, 200).se // 0.049133…
 */
export function r2PrecisionAtN(t: R2Target, n: number): PrecisionAtN {
  const targetSe = seFromCiWidth(t.width, t.confidence);
  const base = { id: TEXT.id, label: TEXT.label, n, targetValue: t.width, scale: `${levelText(t.confidence)} CI width` };
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
