// Every value below is computed with an independent reference implementation (scipy):
// test/fixtures/pooled/generate_pooled_fixtures.py writes the formulas out from their published
// definitions (weights 1/(s² + τ²), DerSimonian & Laird, Control Clin Trials 1986,
// doi:10.1016/0197-2456(86)90046-2; prediction interval with t on K − 2 df, J R Stat Soc A 2009,
// doi:10.1111/j.1467-985X.2008.00552.x) and solves the planner cases by brute force.
import { describe, expect, it } from 'vitest';
import { compareExtraSiteWithExtraParticipants } from '@shared/engine/pooled/extra-site-versus-extra-participants';
import { fixedEffectSummary } from '@shared/engine/pooled/fixed-effect-summary';
import { heterogeneityFloor } from '@shared/engine/pooled/heterogeneity-floor';
import { planPooledAllocation, type PlannerObjective } from '@shared/engine/pooled/plan-pooled-allocation';
import { predictionInterval } from '@shared/engine/pooled/prediction-interval';
import { randomEffectsSummary } from '@shared/engine/pooled/random-effects-summary';
import type { PlannerSite, PooledMeasure } from '@shared/engine/pooled/types';
import { widthAgainstSites } from '@shared/engine/pooled/width-against-sites';
import { expectClose } from '../../helpers/expect-close';
import { POOLED_REFERENCE, seFrom, type ReferencePlan } from './pooled-reference';

// scipy and stdlib quantiles agree to ~1e-12 relative; closed forms otherwise: 1e-10 relative is ample.
const REL = 1e-10;
const close = (actual: number, expected: number, label: string): void =>
  expectClose(actual, expected, REL * Math.max(1, Math.abs(expected)), label);

describe('random-effects summary and prediction interval against scipy', () => {
  it('the fixture holds the 15 summary configurations it was generated with', () => {
    expect(POOLED_REFERENCE.summaries).toHaveLength(15);
  });

  it.each(POOLED_REFERENCE.summaries)('$id: summary SE, CI width, fixed-effect SE, prediction interval and floors', (r) => {
    const re = randomEffectsSummary(r.siteSes, r.tau, r.confidence);
    close(re.totalWeight, r.totalWeight, `${r.id} Σw`);
    close(re.summarySe, r.summarySe, `${r.id} summary SE`);
    close(re.summaryCiWidth, r.summaryCiWidth, `${r.id} summary CI width`);
    close(fixedEffectSummary(r.siteSes, r.confidence).summarySe, r.fixedEffectSe, `${r.id} fixed-effect SE`);
    const floor = heterogeneityFloor(r.tau, r.k, r.confidence);
    close(floor.summaryWidthAtK, r.summaryFloorAtK, `${r.id} summary floor`);
    close(floor.predictionWidthManySites, r.predictionFloorManySites, `${r.id} 2zτ`);
    if (r.predictionWidth === null) {
      expect(r.k).toBeLessThan(3);
      expect(floor.predictionWidthAtK).toBeNull();
      expect(() => predictionInterval(re.summarySe, r.tau, r.k, r.confidence)).toThrow(/at least 3 sites/);
    } else {
      const pi = predictionInterval(re.summarySe, r.tau, r.k, r.confidence, 0.8);
      close(pi.t, r.t ?? Number.NaN, `${r.id} t`);
      close(pi.halfWidth, r.predictionHalfWidth ?? Number.NaN, `${r.id} PI half-width`);
      close(pi.width, r.predictionWidth, `${r.id} PI width`);
      close(pi.lower ?? Number.NaN, 0.8 - (r.predictionHalfWidth ?? Number.NaN), `${r.id} PI lower limit`);
      close(floor.predictionWidthAtK ?? Number.NaN, r.predictionFloorAtK ?? Number.NaN, `${r.id} PI floor`);
    }
  });
});

describe('width against number of sites against scipy', () => {
  it('the fixture holds 2 curves of 28 points (K = 3 … 30)', () => {
    expect(POOLED_REFERENCE.sitesCurves).toHaveLength(56);
  });

  it('every point matches the scipy curve', () => {
    const curves = new Map<string, typeof POOLED_REFERENCE.sitesCurves>();
    for (const p of POOLED_REFERENCE.sitesCurves) curves.set(p.curve, [...(curves.get(p.curve) ?? []), p]);
    expect(curves.size).toBe(2);
    for (const [name, points] of curves) {
      const first = points[0];
      if (first === undefined) throw new Error('empty curve');
      const ours = widthAgainstSites({ seAtN: seFrom(first.se), n: first.n, tau: first.tau, kFrom: 3, kTo: 30 });
      expect(ours.map((p) => p.k)).toEqual(points.map((p) => p.k));
      ours.forEach((p, i) => {
        const ref = points[i];
        if (ref === undefined) throw new Error('missing point');
        close(p.summaryCiWidth, ref.summaryCiWidth, `${name} K=${p.k} summary`);
        close(p.predictionIntervalWidth ?? Number.NaN, ref.predictionIntervalWidth, `${name} K=${p.k} PI`);
      });
    }
  });
});

describe('one more site versus more participants per site against scipy', () => {
  it('the fixture holds 3 comparisons', () => {
    expect(POOLED_REFERENCE.marginal).toHaveLength(3);
  });

  it.each(POOLED_REFERENCE.marginal)('$id: widths, added participants and relative changes', (r) => {
    const result = compareExtraSiteWithExtraParticipants({
      label: 'Calibration slope',
      sites: r.sites.map((s) => ({ n: s.n, seAtN: seFrom(s.se) })),
      tau: r.tau,
      newSite: { seAtN: seFrom(r.newSite.se), ...(r.id === 'hetero-5-sites' ? {} : { n: r.newSite.n }) },
      perSiteIncrease: r.increase,
    });
    expect(result.extraSite.newSiteN).toBe(r.newSite.n);
    close(result.current.summaryCiWidth, r.current.summaryCiWidth, `${r.id} current summary`);
    close(result.extraSite.summaryCiWidth, r.extraSite.summaryCiWidth, `${r.id} extra site summary`);
    close(result.extraParticipants.summaryCiWidth, r.extraParticipants.summaryCiWidth, `${r.id} more participants summary`);
    close(
      result.extraSite.summaryRelativeChange,
      r.extraSite.summaryCiWidth / r.current.summaryCiWidth - 1,
      `${r.id} extra site relative change`,
    );
    expect(result.extraParticipants.perSiteN).toEqual(r.extraParticipants.perSiteN);
    expect(result.extraParticipants.addedParticipants).toBe(r.extraParticipants.addedParticipants);
    expect(result.extraSite.addedParticipants).toBe(r.extraSite.addedParticipants);
    for (const [ours, ref, what] of [
      [result.current.predictionIntervalWidth, r.current.predictionIntervalWidth, 'current PI'],
      [result.extraSite.predictionIntervalWidth, r.extraSite.predictionIntervalWidth, 'extra site PI'],
      [result.extraParticipants.predictionIntervalWidth, r.extraParticipants.predictionIntervalWidth, 'more participants PI'],
    ] as const) {
      if (ref === null) expect(ours, `${r.id} ${what}`).toBeNull();
      else close(ours ?? Number.NaN, ref, `${r.id} ${what}`);
    }
    expect(result.sentence).toContain('Calibration slope: one more site with');
  });
});

function planInput(r: ReferencePlan): { sites: PlannerSite[]; measures: PooledMeasure[] } {
  return {
    sites: r.sites.map((s) => ({
      id: s.id,
      capacity: s.capacity,
      minimumN: s.minimumN,
      accrualPerMonth: s.rate,
      seAtN: Object.fromEntries(Object.entries(s.se).map(([id, p]) => [id, seFrom(p)])),
    })),
    measures: r.measures.map((m) => ({
      id: m.id,
      label: m.id,
      tau: m.tau,
      target: {
        maxSummaryCiWidth: m.maxSummaryCiWidth,
        ...(m.maxPredictionIntervalWidth === undefined ? {} : { maxPredictionIntervalWidth: m.maxPredictionIntervalWidth }),
      },
    })),
  };
}

describe('pooled planner against brute force over every allocation (scipy/numpy)', () => {
  it('the fixture holds 48 small planning problems, 42 of them feasible', () => {
    expect(POOLED_REFERENCE.plans).toHaveLength(48);
    expect(POOLED_REFERENCE.plans.filter((p) => p.feasible)).toHaveLength(42);
  });

  it.each(POOLED_REFERENCE.plans)('$id: feasibility, fewest participants and shortest recruitment', (r) => {
    const { sites, measures } = planInput(r);
    const run = (objective: PlannerObjective) => planPooledAllocation({ sites, measures, objective, confidence: r.confidence });
    const fewest = run('fewest-participants');
    const fastest = run('shortest-recruitment');
    expect(fewest.status).toBe(r.feasible ? 'feasible' : 'infeasible');
    expect(fastest.status).toBe(r.feasible ? 'feasible' : 'infeasible');
    fewest.allocation.forEach((a, i) => expect(a.n).toBeLessThanOrEqual(r.sites[i]?.capacity ?? 0));
    if (!r.feasible) return;
    const single = measures.length === 1;
    // one measure: the marginal allocation is provably the fewest; several: never below brute force, and the bound holds
    if (single) expect(fewest.totalN).toBe(r.minTotal);
    else expect(fewest.totalN).toBeGreaterThanOrEqual(r.minTotal ?? 0);
    expect(fewest.lowerBoundTotalN ?? Number.POSITIVE_INFINITY).toBeLessThanOrEqual(r.minTotal ?? 0);
    if (fewest.minimalTotalProven) expect(fewest.totalN).toBe(r.minTotal);
    expect(fastest.maxMonths).toBe(r.minMonths);
    if (single) expect(fastest.totalN).toBe(r.minTotalAtMinMonths);
    else expect(fastest.totalN).toBeGreaterThanOrEqual(r.minTotalAtMinMonths ?? 0);
  });
});

describe('prediction-interval multipliers against the printed t table', () => {
  it('t_{K−2, 0.975} for K = 3, 5, 12 is 12.706, 3.182, 2.228 (Student t table in any statistics handbook; 3 decimals)', () => {
    for (const [k, t] of [
      [3, 12.706],
      [5, 3.182],
      [12, 2.228],
    ] as const) {
      expectClose(predictionInterval(0.05, 0.1, k).t, t, 5e-4, `t for K = ${k}`);
      expectClose(heterogeneityFloor(0.1, k).predictionWidthAtK ?? Number.NaN, 2 * t * 0.1, 1e-4, `floor for K = ${k}`);
    }
  });
});
