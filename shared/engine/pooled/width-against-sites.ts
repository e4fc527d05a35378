import { requireStandardError, requireInteger } from './require-input';
import type { SeAtN } from './types';
import { widthsAt, type PooledWidths } from './widths-at';

export interface WidthAgainstSitesInput {
  /** SE of a typical site's estimate at n. */
  readonly seAtN: SeAtN;
  /** Participants per site (the same at every site). */
  readonly n: number;
  readonly tau: number;
  /** First and last number of sites on the curve (defaults 3 and 30). */
  readonly kFrom?: number;
  readonly kTo?: number;
  readonly confidence?: number;
}

/**
 * Chart data: summary-CI and prediction-interval widths against the number of sites K, every site
 * recruiting n participants with the same per-site SE s = seAtN(n). Then SE = √((s² + τ²)/K):
 * the summary width falls like 1/√K towards 0, the prediction width towards 2·z·τ.
 * Domain: n a whole number ≥ 1; 1 ≤ kFrom ≤ kTo ≤ 1000; seAtN(n) finite > 0; τ ≥ 0 (DomainError otherwise).
 * Points with K < 3 have no prediction interval (null). Sources: see widthsAt.
 * @example widthAgainstSites({ seAtN: (n) => Math.sqrt(4 / n), n: 400, tau: 0.1, kFrom: 4, kTo: 4 })[0].summaryCiWidth // 0.277181
 */
export function widthAgainstSites(input: WidthAgainstSitesInput): PooledWidths[] {
  const kFrom = input.kFrom ?? 3;
  const kTo = input.kTo ?? 30;
  requireInteger('n', input.n, 1, Number.MAX_SAFE_INTEGER);
  requireInteger('kFrom', kFrom, 1, 1000);
  requireInteger('kTo', kTo, kFrom, 1000);
  const se = requireStandardError('seAtN', input.seAtN(input.n), input.n);
  const points: PooledWidths[] = [];
  for (let k = kFrom; k <= kTo; k++) points.push(widthsAt(new Array<number>(k).fill(se), input.tau, input.confidence));
  return points;
}
