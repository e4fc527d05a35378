import { DomainError } from '../errors';
import { geometricGrid } from './geometric-grid';
import { requireInteger, requireStandardError } from './require-input';
import type { SeAtN } from './types';
import { widthsAt, type PooledWidths } from './widths-at';

export interface WidthAgainstPerSiteNInput {
  /** One SE function per site taking part (the K at hand). */
  readonly siteSeAtN: readonly SeAtN[];
  readonly tau: number;
  /** Smallest and largest per-site n on the curve. */
  readonly nFrom: number;
  readonly nTo: number;
  /** Number of grid points (default 40), spaced evenly on a log scale and rounded to whole numbers. */
  readonly points?: number;
  readonly confidence?: number;
}

export interface PerSiteNPoint extends PooledWidths {
  readonly n: number;
}

/**
 * Chart data: summary-CI and prediction-interval widths against the per-site n, with every one of
 * the K sites recruiting the same n. As n grows the widths fall towards the heterogeneity floors
 * (summaryFloorWidth, predictionFloorWidth), which they never cross when τ > 0.
 * Grid: geometricGrid(nFrom, nTo, points).
 * Domain: 1 ≤ nFrom < nTo whole numbers; 2 ≤ points ≤ 500; at least one site; every SE finite > 0
 * on the grid; τ ≥ 0 (DomainError otherwise). Sources: see widthsAt.
 * @example widthAgainstPerSiteN({ siteSeAtN: [(n) => 1 / Math.sqrt(n)], tau: 0, nFrom: 100, nTo: 400, points: 2 }).map((p) => p.n) // [100, 400]
 */
export function widthAgainstPerSiteN(input: WidthAgainstPerSiteNInput): PerSiteNPoint[] {
  const points = input.points ?? 40;
  if (input.siteSeAtN.length === 0) throw new DomainError('siteSeAtN', '[]', 'at least one site');
  requireInteger('nFrom', input.nFrom, 1, Number.MAX_SAFE_INTEGER - 1);
  requireInteger('nTo', input.nTo, input.nFrom + 1, Number.MAX_SAFE_INTEGER);
  requireInteger('points', points, 2, 500);
  return geometricGrid(input.nFrom, input.nTo, points).map((n) => {
    const ses = input.siteSeAtN.map((seAtN, i) => requireStandardError(`siteSeAtN[${i}]`, seAtN(n), n));
    return { n, ...widthsAt(ses, input.tau, input.confidence) };
  });
}
