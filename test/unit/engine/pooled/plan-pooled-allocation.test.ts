import { describe, expect, it } from 'vitest';
import { zForConfidence } from '@shared/engine/numerics/distributions';
import { planPooledAllocation } from '@shared/engine/pooled/plan-pooled-allocation';
import type { PlannerSite, PooledMeasure, SiteCapacity } from '@shared/engine/pooled/types';
import { MAX_SITE_N } from '@shared/engine/pooled/types';
import { widthsAt } from '@shared/engine/pooled/widths-at';

const z = zForConfidence(0.95);
const seA = (a: number) => (n: number) => Math.sqrt(a / n);

function sites(count: number, capacity: SiteCapacity, a = 1, extra: Partial<PlannerSite> = {}): PlannerSite[] {
  return Array.from({ length: count }, (_, i) => ({
    id: `H${i + 1}`,
    capacity,
    minimumN: 10,
    seAtN: { slope: seA(a) },
    ...extra,
  }));
}
const slope = (tau: number, maxSummaryCiWidth: number, maxPredictionIntervalWidth?: number): PooledMeasure => ({
  id: 'slope',
  label: 'Calibration slope',
  tau,
  target: { maxSummaryCiWidth, ...(maxPredictionIntervalWidth === undefined ? {} : { maxPredictionIntervalWidth }) },
});

describe('planPooledAllocation: closed-form cases', () => {
  it('τ = 0, SE² = a/n: the fewest participants is ⌈a·(2z/W)²⌉ in total, the fixed-effect requirement [DERIVED: Σ n_i/a ≥ (2z/W)²]', () => {
    const plan = planPooledAllocation({ sites: sites(4, 5000, 4), measures: [slope(0, 0.1)], objective: 'fewest-participants' });
    expect(plan.status).toBe('feasible');
    expect(plan.totalN).toBe(Math.ceil(4 * ((2 * z) / 0.1) ** 2));
    expect(plan.minimalTotalProven).toBe(true);
    expect(plan.lowerBoundTotalN).toBe(plan.totalN);
    plan.allocation.forEach((a) => expect(a.n).toBeLessThanOrEqual(5000));
  });

  it('identical sites with τ > 0 share the participants evenly (they differ by at most one)', () => {
    // w = n/(1 + τ²n) per site, 5 sites need Σw ≥ (2z/0.1)²: about 1,326–1,327 each [DERIVED]
    const plan = planPooledAllocation({
      sites: sites(5, 'unlimited'),
      measures: [slope(0.05, 0.1)],
      objective: 'fewest-participants',
    });
    const ns = plan.allocation.map((a) => a.n);
    expect(Math.max(...ns) - Math.min(...ns)).toBeLessThanOrEqual(1);
    const perSite = ((2 * z) / 0.1) ** 2 / 5; // required weight per site
    const exact = perSite / (1 - 0.05 ** 2 * perSite); // n solving n/(1 + τ²n) = perSite
    expect(Math.min(...ns)).toBeGreaterThanOrEqual(Math.floor(exact));
    expect(Math.max(...ns)).toBeLessThanOrEqual(Math.ceil(exact));
    expect(plan.precision[0]?.meetsSummary).toBe(true);
  });

  it('with an unlimited site the planner still stops at a finite n and reports months from accrual', () => {
    const plan = planPooledAllocation({
      sites: sites(3, 'unlimited', 2, { accrualPerMonth: 25 }),
      measures: [slope(0.02, 0.08)],
      objective: 'fewest-participants',
    });
    expect(plan.status).toBe('feasible');
    for (const a of plan.allocation) {
      expect(a.n).toBeLessThan(MAX_SITE_N);
      expect(a.months).toBe(a.n / 25);
    }
    expect(plan.maxMonths).toBe(Math.max(...plan.allocation.map((a) => a.n / 25)));
  });

  it('sites alike but for capacity: a small site recruits to capacity, the others share the rest evenly', () => {
    // τ = 0.03, width 0.15: Σ n/(1 + τ²n) ≥ (2z/0.15)² = 683; equal n would be 286 > 150, so 150 + two of ~366 [DERIVED]
    const mixed: PlannerSite[] = [
      { id: 'small', capacity: 150, minimumN: 10, seAtN: { slope: seA(1) } },
      { id: 'mid', capacity: 400, minimumN: 10, seAtN: { slope: seA(1) } },
      { id: 'large', capacity: 5000, minimumN: 10, seAtN: { slope: seA(1) } },
    ];
    const plan = planPooledAllocation({ sites: mixed, measures: [slope(0.03, 0.15)], objective: 'fewest-participants' });
    expect(plan.status).toBe('feasible');
    const [small, mid, large] = plan.allocation.map((a) => a.n);
    expect(small).toBe(150);
    expect(plan.allocation[0]?.atCapacity).toBe(true);
    expect(Math.abs((mid ?? 0) - (large ?? 0))).toBeLessThanOrEqual(1);
    expect(mid).toBeGreaterThan(350);
    expect(mid).toBeLessThan(380);
    expect(plan.messages.join(' ')).toContain('Recruiting to capacity: small.');
  });
});

describe('planPooledAllocation: shortest recruitment', () => {
  it('τ = 0 with rates 10, 20, 30 per month: the shortest duration is the first breakpoint k/rate at which Σ⌊rate·T⌋ reaches the total need', () => {
    const rates = [10, 20, 30];
    const need = Math.ceil(((2 * z) / 0.05) ** 2); // SE² = 1/n, τ = 0: Σn ≥ (2z/W)² [DERIVED]
    const breakpoints = rates.flatMap((r) => Array.from({ length: need + 1 }, (_, k) => (k + 1) / r)).sort((a, b) => a - b);
    const expected = breakpoints.find((t) => rates.reduce((s, r) => s + Math.floor(r * t + 1e-9), 0) >= need);
    const plan = planPooledAllocation({
      sites: rates.map((r, i) => ({
        id: `H${i + 1}`,
        capacity: 'unlimited',
        minimumN: 1,
        accrualPerMonth: r,
        seAtN: { slope: seA(1) },
      })),
      measures: [slope(0, 0.05)],
      objective: 'shortest-recruitment',
    });
    expect(plan.status).toBe('feasible');
    expect(plan.totalN).toBe(need);
    expect(plan.maxMonths).toBeCloseTo(expected ?? Number.NaN, 12);
    expect(plan.messages.join(' ')).toMatch(/Recruitment can end after \d+\.\d months, the shortest possible/);
  });

  it('a site that cannot reach its minimum quickly sets the duration even when the targets need less', () => {
    const plan = planPooledAllocation({
      sites: [
        { id: 'slow', capacity: 1000, minimumN: 60, accrualPerMonth: 5, seAtN: { slope: seA(1) } },
        { id: 'fast', capacity: 1000, minimumN: 10, accrualPerMonth: 50, seAtN: { slope: seA(1) } },
      ],
      measures: [slope(0, 1)],
      objective: 'shortest-recruitment',
    });
    expect(plan.maxMonths).toBe(12);
    expect(plan.allocation.map((a) => a.n)).toEqual([60, 10]);
  });
});

describe('planPooledAllocation: says when the targets cannot be met', () => {
  it('a prediction-interval target below 2·t_{K−2}·τ: no sample size can meet it; with more sites it could', () => {
    // floor with 5 sites: 2·t_3·0.1 = 0.636 > 0.5; 2·t_{K−2}·0.1 < 0.5 first at K = 8 (t_6 = 2.447; t-table)
    const plan = planPooledAllocation({
      sites: sites(5, 'unlimited'),
      measures: [slope(0.1, 0.3, 0.5)],
      objective: 'fewest-participants',
    });
    expect(plan.status).toBe('infeasible');
    const text = plan.messages.join(' ');
    expect(text).toContain('no sample size can meet it with these sites');
    expect(text).toContain('at least 8 sites would be needed even with unlimited participants');
    expect(plan.precision[0]?.predictionFloorWidth).toBeCloseTo(2 * 3.182446 * 0.1, 5);
  });

  it('a prediction-interval target at or below 2·z·τ: neither participants nor sites can meet it', () => {
    const plan = planPooledAllocation({
      sites: sites(5, 'unlimited'),
      measures: [slope(0.1, 0.3, 0.35)],
      objective: 'fewest-participants',
    });
    expect(plan.status).toBe('infeasible');
    expect(plan.messages.join(' ')).toContain('nor can more sites, since the width never falls below 2·z·τ = 0.392');
  });

  it('a summary target below 2·z·τ/√K: names the fewest sites that could meet it', () => {
    // 2·z·0.2/√3 = 0.4526 > 0.4; (2·z·0.2/0.4)² = 3.84, so 4 sites [DERIVED]
    const plan = planPooledAllocation({
      sites: sites(3, 'unlimited'),
      measures: [slope(0.2, 0.4)],
      objective: 'fewest-participants',
    });
    expect(plan.status).toBe('infeasible');
    expect(plan.messages.join(' ')).toMatch(/at or below 0\.4526.*at least 4 sites would be needed/);
  });

  it('targets out of reach at full capacity: the best widths at capacity are reported, and the allocation is the capacities', () => {
    const plan = planPooledAllocation({ sites: sites(4, 100), measures: [slope(0.05, 0.1)], objective: 'fewest-participants' });
    expect(plan.status).toBe('infeasible');
    expect(plan.allocation.map((a) => a.n)).toEqual([100, 100, 100, 100]);
    const best = widthsAt([0.1, 0.1, 0.1, 0.1], 0.05).summaryCiWidth;
    expect(plan.precision[0]?.summaryCiWidth).toBeCloseTo(best, 12);
    expect(plan.messages.join(' ')).toContain(
      `with every site at its capacity the summary 95% CI width is ${best.toPrecision(4)}`,
    );
    expect(plan.lowerBoundTotalN).toBeNull();
  });

  it('a prediction-interval target with 2 sites: explains that 3 are needed', () => {
    const plan = planPooledAllocation({
      sites: sites(2, 1000),
      measures: [slope(0.05, 0.5, 0.9)],
      objective: 'fewest-participants',
    });
    expect(plan.status).toBe('infeasible');
    expect(plan.messages.join(' ')).toContain('needs at least 3 sites');
  });

  it('a minimum n above the capacity is named', () => {
    const plan = planPooledAllocation({
      sites: [...sites(2, 1000), { id: 'tiny', capacity: 5, minimumN: 10, seAtN: { slope: seA(1) } }],
      measures: [slope(0.05, 0.5)],
      objective: 'fewest-participants',
    });
    expect(plan.status).toBe('infeasible');
    expect(plan.messages[0]).toBe('Site tiny: its minimum n (10) is more than it can recruit (5).');
  });
});

describe('planPooledAllocation: several measures', () => {
  it('meets both targets; reports a lower bound no larger than the total', () => {
    const twoMeasures: PlannerSite[] = [
      { id: 'A', capacity: 3000, minimumN: 20, seAtN: { slope: seA(1), oe: seA(9) } },
      { id: 'B', capacity: 3000, minimumN: 20, seAtN: { slope: seA(3), oe: seA(4) } },
      { id: 'C', capacity: 3000, minimumN: 20, seAtN: { slope: seA(2), oe: seA(12) } },
    ];
    const measures: PooledMeasure[] = [
      slope(0.05, 0.2),
      { id: 'oe', label: 'log O/E', tau: 0.1, target: { maxSummaryCiWidth: 0.3 } },
    ];
    const plan = planPooledAllocation({ sites: twoMeasures, measures, objective: 'fewest-participants' });
    expect(plan.status).toBe('feasible');
    expect(plan.precision.every((p) => p.meets)).toBe(true);
    expect(plan.lowerBoundTotalN ?? Number.POSITIVE_INFINITY).toBeLessThanOrEqual(plan.totalN);
    expect(plan.references).toContain('HIGGINS-THOMPSON-SPIEGELHALTER-2009');
  });
});
