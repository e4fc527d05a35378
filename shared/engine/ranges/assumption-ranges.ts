import type { ContinuousAnticipatedKey, ContinuousPopulation, Project } from '../../model/project';
import { assumptionLabel, effectiveBase } from './assumption-label';
import type { SweepPoint } from './sweep';
import { asksForMore, evaluateAt, rangedAssumptions, sweepValues } from './sweep';

/** Low, base and high of one assumption, and the worst value across its range. */
export interface AssumptionRange {
  readonly key: ContinuousAnticipatedKey;
  readonly label: string;
  readonly low: SweepPoint;
  /** Null when the assumption has no base value (outcome mean or SD not given). */
  readonly base: SweepPoint | null;
  readonly high: SweepPoint;
  /** The value in [low, high] that asks for the most participants. */
  readonly worst: SweepPoint;
  /** The sweep the worst was taken over (evenly spaced values plus the points below). */
  readonly points: readonly SweepPoint[];
}

/** Number of evenly spaced values per assumption, enough for a smooth sensitivity curve. */
export const DEFAULT_SWEEP_POINTS = 25;

/**
 * Values besides the even grid where the required n can peak inside a range: the R² criterion's n
 * grows with R²(1 − R²)², largest at R² = 1/3 (VAL-CONT criterion 1); the intercept criterion's n
 * grows without bound as the mean approaches 0 (DEV-CONT criterion iv), so the smallest non-zero
 * mean is tried when 0 lies in the range.
 */
function peakCandidates(key: ContinuousAnticipatedKey, low: number, high: number): number[] {
  if (key === 'rSquared' && low < 1 / 3 && 1 / 3 < high) return [1 / 3];
  if (key === 'outcomeMean' && low <= 0 && high >= 0) return [high > 0 ? Number.MIN_VALUE : -Number.MIN_VALUE];
  return [];
}

/**
 * One-at-a-time ranges: for each assumption with a low/high range, the plan at its low end,
 * at its base value and at its high end, and the worst case across the range (the other
 * assumptions held at their base values). The worst case is the maximum over an even grid of
 * `pointCount` values, both ends, the base and the known interior peaks (peakCandidates).
 * Common practice (one-way sensitivity analysis).
 * @example assumptionRanges(population, project)[0].worst.requiredN // 801 when R² ranges over 0.25–0.45
 */
export function assumptionRanges(
  population: ContinuousPopulation,
  project: Pick<Project, 'updating'>,
  pointCount = DEFAULT_SWEEP_POINTS,
): AssumptionRange[] {
  return rangedAssumptions(population).map(({ key, low, high }) => {
    const baseValue = effectiveBase(population, key);
    const base = baseValue === undefined ? null : evaluateAt(population, project, key, baseValue);
    const points = [...sweepValues(low, high, pointCount), ...peakCandidates(key, low, high)]
      .sort((a, b) => a - b)
      .map((value) => evaluateAt(population, project, key, value));
    const lowPoint = points[0] ?? evaluateAt(population, project, key, low);
    const highPoint = points.find((p) => p.value === high) ?? evaluateAt(population, project, key, high);
    let worst = base !== null && asksForMore(base, lowPoint) ? base : lowPoint;
    for (const p of points) if (asksForMore(p, worst)) worst = p;
    return { key, label: assumptionLabel(key), low: lowPoint, base, high: highPoint, worst, points };
  });
}
