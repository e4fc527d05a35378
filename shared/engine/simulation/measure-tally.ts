import type { MeasureDefinition, MeasureSummary, MonteCarloEstimate } from './types';

/**
 * Running one-pass statistics of one measure across replicates: central moments up to the fourth
 * of the estimates (for the empirical SE and its Monte Carlo error), mean and spread of the interval
 * sizes, and counts of intervals meeting the target and covering the true value. Memory is O(1)
 * whatever the number of replicates.
 * Moment updates: Pébay P, Formulas for robust, one-pass parallel computation of covariances and
 * arbitrary-order statistical moments, Sandia report SAND2008-6212, 2008 (also mergeable, so runs
 * split across workers can be combined later).
 */
export class MeasureTally {
  count = 0;
  notEstimable = 0;
  private mean = 0;
  private m2 = 0;
  private m3 = 0;
  private m4 = 0;
  private sizeMean = 0;
  private sizeM2 = 0;
  private meets = 0;
  private covers = 0;

  constructor(private readonly definition: MeasureDefinition) {}

  /** Adds one replicate's estimate, CI limits and interval size. */
  add(estimate: number, lower: number, upper: number, size: number): void {
    const before = this.count;
    const n = before + 1;
    const delta = estimate - this.mean;
    const deltaN = delta / n;
    const deltaN2 = deltaN * deltaN;
    const term = delta * deltaN * before;
    this.mean += deltaN;
    this.m4 += term * deltaN2 * (n * n - 3 * n + 3) + 6 * deltaN2 * this.m2 - 4 * deltaN * this.m3;
    this.m3 += term * deltaN * (n - 2) - 3 * deltaN * this.m2;
    this.m2 += term;
    const sizeDelta = size - this.sizeMean;
    this.sizeMean += sizeDelta / n;
    this.sizeM2 += sizeDelta * (size - this.sizeMean);
    if (size <= this.definition.targetValue) this.meets++;
    if (lower <= this.definition.trueValue && this.definition.trueValue <= upper) this.covers++;
    this.count = n;
  }

  /**
   * The summary with Monte Carlo standard errors (Morris TP, White IR, Crowther MJ. Using simulation
   * studies to evaluate statistical methods. Stat Med 2019;38(11):2074–2102. doi:10.1002/sim.8086):
   * mean ± SD/√R; shares ± √(p(1 − p)/R); empirical SE ± √((m₄ − m₂²)/R) / (2·SD), the delta
   * method on the variance's sampling variance, which reduces to their SD/√(2(R − 1)) for normal
   * estimates but stays honest for skewed ones such as R² at small n. Null below 2 replicates.
   */
  summary(): MeasureSummary {
    const r = this.count;
    const base = { ...this.definition, replicates: r, replicatesNotEstimable: this.notEstimable };
    if (r < 2)
      return { ...base, meanEstimate: null, empiricalSe: null, meanSize: null, shareMeetingTarget: null, coverage: null };
    const variance = this.m2 / (r - 1);
    const sd = Math.sqrt(variance);
    const m2 = this.m2 / r;
    const m4 = this.m4 / r;
    const varianceOfVariance = Math.max(m4 - m2 * m2, 0) / r;
    const share = (k: number): MonteCarloEstimate => {
      const p = k / r;
      return { value: p, mcse: Math.sqrt((p * (1 - p)) / r) };
    };
    return {
      ...base,
      meanEstimate: { value: this.mean, mcse: sd / Math.sqrt(r) },
      empiricalSe: { value: sd, mcse: sd > 0 ? Math.sqrt(varianceOfVariance) / (2 * sd) : 0 },
      meanSize: { value: this.sizeMean, mcse: Math.sqrt(this.sizeM2 / (r - 1) / r) },
      shareMeetingTarget: share(this.meets),
      coverage: share(this.covers),
    };
  }
}
