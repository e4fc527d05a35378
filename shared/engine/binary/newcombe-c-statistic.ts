import type { SampleSize } from '../continuous/sample-size';
import { NOT_REACHED } from '../continuous/sample-size';
import { MAX_SAMPLE_SIZE } from '../continuous/sample-size-limit';
import { requireCount, requirePositive } from '../helpers/domain-guards';
import { requireCStatistic, requireOutcomeProportion } from './require-binary-domain';

/** A C-statistic needs at least one event and one non-event: the formula is used from n = 2. */
export const C_STATISTIC_LOWEST_N = 2;

/**
 * SE of the C-statistic at n by Newcombe's variance (Hanley–McNeil with both group sizes n/2):
 *   SE² = C(1 − C)[1 + (n/2 − 1)(1 − C)/(2 − C) + (n/2 − 1)·C/(1 + C)] / (n²·phi(1 − phi))
 * Domain: 0.5 < C < 1, 0 < phi < 1, whole n ≥ 2; otherwise DomainError.
 * Source: Newcombe, Stat Med 2006 (NEWCOMBE-2006); Hanley & McNeil 1982; as used by VAL-BIN
 * (METHODS 5.3 [DERIVED] algebra). A planning approximation: within 1% of simulation (METHODS 9.10).
 * @example newcombeCStatisticSe(0.8, 0.1, 1500) // 0.019038
 */
export function newcombeCStatisticSe(cStatistic: number, outcomeProportion: number, n: number): number {
  requireCStatistic('C-statistic', cStatistic);
  requireOutcomeProportion('outcome proportion', outcomeProportion);
  requireCount('n', n, C_STATISTIC_LOWEST_N);
  const c = cStatistic;
  const m = n / 2 - 1;
  const bracket = 1 + (m * (1 - c)) / (2 - c) + (m * c) / (1 + c);
  return Math.sqrt((c * (1 - c) * bracket) / (n * n * outcomeProportion * (1 - outcomeProportion)));
}

/**
 * Smallest n with Newcombe's SE(C) ≤ SE*. SE² decreases in n, and SE(C)² = SE*² is the quadratic
 * a·n² − b·n − c = 0 with Q = (1 − C)/(2 − C) + C/(1 + C), a = phi(1 − phi)SE*², b = C(1 − C)Q/2,
 * c = C(1 − C)(1 − Q); so n = ⌈(b + √(b² + 4ac))/(2a)⌉, then checked against the SE itself one
 * integer either side (floating guard).
 * Domain: as newcombeCStatisticSe, SE* > 0. Source: METHODS 5.3 [DERIVED] (verified identical to an
 * integer search). Exact.
 * @example newcombeSampleSize(0.8, 0.1, 0.025511).n // 836
 */
export function newcombeSampleSize(cStatistic: number, outcomeProportion: number, targetSe: number): SampleSize {
  requireCStatistic('C-statistic', cStatistic);
  requireOutcomeProportion('outcome proportion', outcomeProportion);
  requirePositive('target SE of the C-statistic', targetSe);
  const c = cStatistic;
  const q = (1 - c) / (2 - c) + c / (1 + c);
  const a = outcomeProportion * (1 - outcomeProportion) * targetSe * targetSe;
  const b = (c * (1 - c) * q) / 2;
  const k = c * (1 - c) * (1 - q);
  const root = (b + Math.sqrt(b * b + 4 * a * k)) / (2 * a);
  if (!(root <= MAX_SAMPLE_SIZE)) return NOT_REACHED;
  let n = Math.max(C_STATISTIC_LOWEST_N, Math.ceil(root));
  const meets = (m: number): boolean => newcombeCStatisticSe(c, outcomeProportion, m) <= targetSe;
  if (!meets(n)) n += 1;
  if (n > C_STATISTIC_LOWEST_N && meets(n - 1)) n -= 1;
  if (!meets(n)) return NOT_REACHED;
  return { n, status: n === C_STATISTIC_LOWEST_N ? 'always-met' : 'ok' };
}
