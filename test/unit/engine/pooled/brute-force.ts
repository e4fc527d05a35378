// Brute force for small pooled-planning problems, written from the formulas directly (not through
// the engine's pooled functions): summary width 2·z/√Σ 1/(s_i² + τ²), prediction width
// 2·t_{K−2}·√(τ² + 1/Σw). Used to check the planner's answers on small cases.
import { normalQuantile, tQuantile } from '@shared/engine/numerics/distributions';
import type { SeAtN } from '@shared/engine/pooled/types';

export interface SmallSite {
  readonly minimumN: number;
  readonly capacity: number;
  readonly rate: number;
  readonly se: readonly SeAtN[];
}

export interface SmallMeasure {
  readonly tau: number;
  readonly maxSummaryCiWidth: number;
  readonly maxPredictionIntervalWidth?: number;
}

export function meetsAll(sites: readonly SmallSite[], measures: readonly SmallMeasure[], n: readonly number[]): boolean {
  const z = normalQuantile(0.975);
  const k = sites.length;
  return measures.every((m, j) => {
    let total = 0;
    sites.forEach((s, i) => {
      const se = s.se[j]?.(n[i] ?? 0) ?? Number.NaN;
      total += 1 / (se * se + m.tau * m.tau);
    });
    const se = 1 / Math.sqrt(total);
    if (2 * z * se > m.maxSummaryCiWidth) return false;
    if (m.maxPredictionIntervalWidth === undefined) return true;
    if (k < 3) return false;
    return 2 * tQuantile(0.975, k - 2) * Math.sqrt(m.tau * m.tau + se * se) <= m.maxPredictionIntervalWidth;
  });
}

export interface BruteForceAnswer {
  readonly feasible: boolean;
  readonly minTotal: number | null;
  readonly minMonths: number | null;
  readonly minTotalAtMinMonths: number | null;
}

/** Every whole-number allocation in the box [minimumN, capacity]. */
export function bruteForce(sites: readonly SmallSite[], measures: readonly SmallMeasure[]): BruteForceAnswer {
  let minTotal: number | null = null;
  let minMonths: number | null = null;
  let minTotalAtMinMonths: number | null = null;
  const n = sites.map((s) => s.minimumN);
  const visit = (i: number): void => {
    if (i === sites.length) {
      if (!meetsAll(sites, measures, n)) return;
      const total = n.reduce((a, b) => a + b, 0);
      const months = n.reduce((m, v, j) => Math.max(m, v / (sites[j]?.rate ?? 1)), 0);
      if (minTotal === null || total < minTotal) minTotal = total;
      if (minMonths === null || months < minMonths) {
        minMonths = months;
        minTotalAtMinMonths = total;
      } else if (months === minMonths && total < (minTotalAtMinMonths ?? Number.POSITIVE_INFINITY)) {
        minTotalAtMinMonths = total;
      }
      return;
    }
    const site = sites[i];
    if (site === undefined) return;
    for (let v = site.minimumN; v <= site.capacity; v++) {
      n[i] = v;
      visit(i + 1);
    }
    n[i] = site.minimumN;
  };
  visit(0);
  return { feasible: minTotal !== null, minTotal, minMonths, minTotalAtMinMonths };
}
