import { DomainError } from '../errors';
import { tQuantile, zForConfidence } from '../numerics/distributions';
import { pooledPrecision, type PooledMeasurePrecision } from './pooled-precision';
import { requireStandardError } from './require-input';
import type { PooledMeasure, SeAtN } from './types';

/**
 * A pooled allocation problem after validation: K sites with whole-number floors and (finite)
 * caps, M measures, and per-site SE functions. Shared by the fewest-participants and the
 * shortest-recruitment searches so that both decide "met" in the same way (pooledPrecision).
 */
export interface AllocationProblem {
  readonly k: number;
  readonly measures: readonly PooledMeasure[];
  readonly floors: readonly number[];
  readonly caps: readonly number[];
  readonly confidence: number;
  /**
   * Per measure, the total weight Σ 1/(s_i² + τ²) its targets need: (2z/W)² for the summary and
   * 1/((W_PI/(2t_{K−2}))² − τ²) for the prediction interval (the larger). Used only to put
   * the measures' weight gains on one footing; Infinity when the prediction target is unreachable.
   */
  readonly requiredWeight: readonly number[];
  /** Per-site SE of measure m at n (validated: finite and > 0). */
  se(site: number, measure: number, n: number): number;
  /** Increase of the site's weight 1/(s² + τ²) for measure m from n to n + 1 (≥ 0). */
  weightGain(site: number, measure: number, n: number): number;
  /** Σ_i 1/(s_im(n_i)² + τ_m²): the total random-effects weight of measure m at the allocation. */
  totalWeight(allocation: readonly number[], measure: number): number;
  /** Pooled precision of every measure at the allocation. */
  precision(allocation: readonly number[]): PooledMeasurePrecision[];
  /** Whether measure m meets its targets at the allocation. */
  meets(allocation: readonly number[], measure: number): boolean;
}

export interface AllocationProblemInput {
  readonly measures: readonly PooledMeasure[];
  /** seAtN[site][measure]. */
  readonly seAtN: readonly (readonly SeAtN[])[];
  readonly siteIds: readonly string[];
  readonly floors: readonly number[];
  readonly caps: readonly number[];
  readonly confidence: number;
}

/** Relative slack allowed when checking that an SE does not increase with n (floating-point noise). */
const MONOTONE_SLACK = 1e-12;

/**
 * Builds the problem. SE values and weight gains are cached per site and measure (the SE functions must be pure).
 * Domain: inputs already validated by planPooledAllocation; an SE function that returns a
 * non-finite or non-positive value, or an SE that grows with n, raises a DomainError naming the
 * site and measure. Sources: weights as in randomEffectsSummary (DerSimonian & Laird 1986);
 * prediction interval as in predictionInterval (J R Stat Soc A 2009).
 * @example makeAllocationProblem({ measures: [slope], seAtN: [[se], [se], [se]], siteIds: ['A', 'B', 'C'], floors: [10, 10, 10], caps: [400, 400, 100], confidence: 0.95 }).meets([400, 400, 100], 0) // true
 *   (se = (n) => 1 / Math.sqrt(n); slope with τ 0.05, width 0.25; sites A, B, C with minimum 10 and capacity 400, 400, 100)
 */
export function makeAllocationProblem(input: AllocationProblemInput): AllocationProblem {
  const { measures, floors, caps, confidence, siteIds } = input;
  const k = floors.length;
  const caches = input.seAtN.map((row) => row.map(() => new Map<number, number>()));
  const gainCaches = input.seAtN.map((row) => row.map(() => new Map<number, number>()));
  const z = zForConfidence(confidence);
  const t = k >= 3 ? tQuantile(1 - (1 - confidence) / 2, k - 2) : null;

  const se = (site: number, measure: number, n: number): number => {
    const cache = caches[site]?.[measure];
    const fn = input.seAtN[site]?.[measure];
    if (cache === undefined || fn === undefined)
      throw new DomainError('site or measure index', `${site}, ${measure}`, 'an existing site and measure');
    const hit = cache.get(n);
    if (hit !== undefined) return hit;
    const value = requireStandardError(`sites[${site}] (${siteIds[site] ?? ''}).seAtN.${measures[measure]?.id ?? ''}`, fn(n), n);
    cache.set(n, value);
    return value;
  };

  const weightGain = (site: number, measure: number, n: number): number => {
    const cache = gainCaches[site]?.[measure];
    const hit = cache?.get(n);
    if (hit !== undefined) return hit;
    const tau2 = (measures[measure]?.tau ?? 0) ** 2;
    const v0 = se(site, measure, n) ** 2;
    const v1 = se(site, measure, n + 1) ** 2;
    if (v1 > v0 * (1 + MONOTONE_SLACK)) {
      throw new DomainError(
        `sites[${site}] (${siteIds[site] ?? ''}).seAtN.${measures[measure]?.id ?? ''}`,
        `SE ${v0 ** 0.5} at n = ${n} but ${v1 ** 0.5} at n = ${n + 1}`,
        "a standard error that does not increase with n from the site's minimum n up to its capacity",
      );
    }
    // 1/(v1 + τ²) − 1/(v0 + τ²), written so that the difference v0 − v1 is taken first (less cancellation)
    const gain = Math.max(0, v0 - v1) / ((v0 + tau2) * (v1 + tau2));
    cache?.set(n, gain);
    return gain;
  };

  const requiredWeight = measures.map((m) => {
    const summary = ((2 * z) / m.target.maxSummaryCiWidth) ** 2; // SE ≤ W/(2z)  ⇔  Σw ≥ (2z/W)²
    const maxPi = m.target.maxPredictionIntervalWidth;
    if (maxPi === undefined) return summary;
    if (t === null) return Number.POSITIVE_INFINITY;
    const maxVariance = (maxPi / (2 * t)) ** 2 - m.tau ** 2; // 2t√(τ² + V) ≤ W_PI  ⇔  V ≤ (W_PI/2t)² − τ²
    return maxVariance > 0 ? Math.max(summary, 1 / maxVariance) : Number.POSITIVE_INFINITY;
  });

  const precisionOf = (allocation: readonly number[], measure: number): PooledMeasurePrecision => {
    const m = measures[measure];
    if (m === undefined) throw new DomainError('measure index', measure, `0 to ${measures.length - 1}`);
    return pooledPrecision(
      m,
      allocation.map((n, site) => se(site, measure, n)),
      confidence,
    );
  };

  const totalWeight = (allocation: readonly number[], measure: number): number => {
    const tau2 = (measures[measure]?.tau ?? 0) ** 2;
    let sum = 0;
    allocation.forEach((n, site) => (sum += 1 / (se(site, measure, n) ** 2 + tau2))); // DerSimonian–Laird weights
    return sum;
  };

  return {
    k,
    measures,
    floors,
    caps,
    confidence,
    requiredWeight,
    se,
    weightGain,
    totalWeight,
    precision: (allocation) => measures.map((_, m) => precisionOf(allocation, m)),
    meets: (allocation, measure) => precisionOf(allocation, measure).meets,
  };
}
