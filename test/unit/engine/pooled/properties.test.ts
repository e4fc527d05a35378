// Properties of the pooled engine over many random inputs (fast-check), checked against the
// definitions and against brute force over every allocation on small cases.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fixedEffectSummary } from '@shared/engine/pooled/fixed-effect-summary';
import { heterogeneityFloor } from '@shared/engine/pooled/heterogeneity-floor';
import { planPooledAllocation, type PlannerObjective } from '@shared/engine/pooled/plan-pooled-allocation';
import { predictionInterval } from '@shared/engine/pooled/prediction-interval';
import { randomEffectsSummary } from '@shared/engine/pooled/random-effects-summary';
import type { PlannerSite, PooledMeasure } from '@shared/engine/pooled/types';
import { widthAgainstPerSiteN } from '@shared/engine/pooled/width-against-per-site-n';
import { widthAgainstSites } from '@shared/engine/pooled/width-against-sites';
import { widthsAt } from '@shared/engine/pooled/widths-at';
import { expectClose } from '../../helpers/expect-close';
import { bruteForce, meetsAll, type SmallMeasure, type SmallSite } from './brute-force';

const se = fc.double({ min: 1e-4, max: 10, noNaN: true });
const tau = fc.double({ min: 0, max: 5, noNaN: true });
const ses = fc.array(se, { minLength: 1, maxLength: 40 });

describe('summary and prediction interval: properties', () => {
  it('with τ = 0 the random-effects summary SE equals the fixed-effect SE (relative 1e-12: two summation orders)', () => {
    fc.assert(
      fc.property(ses, (s) => {
        const re = randomEffectsSummary(s, 0).summarySe;
        const fe = fixedEffectSummary(s).summarySe;
        expectClose(re, fe, 1e-12 * fe, `τ = 0, ${s.length} sites`);
      }),
    );
  });

  it('the prediction interval is never narrower than its heterogeneity floors 2·t_{K−2}·τ and 2·z·τ', () => {
    fc.assert(
      fc.property(fc.array(se, { minLength: 3, maxLength: 40 }), tau, (s, t) => {
        const summary = randomEffectsSummary(s, t);
        const pi = predictionInterval(summary.summarySe, t, s.length);
        const floor = heterogeneityFloor(t, s.length);
        expect(pi.width).toBeGreaterThanOrEqual(floor.predictionWidthAtK ?? Number.POSITIVE_INFINITY);
        expect(pi.width).toBeGreaterThanOrEqual(floor.predictionWidthManySites);
        expect(summary.summaryCiWidth).toBeGreaterThanOrEqual(floor.summaryWidthAtK);
      }),
    );
  });

  it('adding a site never widens the summary CI, whatever its SE', () => {
    fc.assert(
      fc.property(ses, se, tau, (s, extra, t) => {
        expect(randomEffectsSummary([...s, extra], t).summaryCiWidth).toBeLessThanOrEqual(
          randomEffectsSummary(s, t).summaryCiWidth,
        );
      }),
    );
  });

  it('the summary SE lies between the SE of K copies of the best and of the worst site, √((s² + τ²)/K)', () => {
    fc.assert(
      fc.property(ses, tau, (s, t) => {
        const k = s.length;
        const got = randomEffectsSummary(s, t).summarySe;
        const best = Math.sqrt((Math.min(...s) ** 2 + t * t) / k);
        const worst = Math.sqrt((Math.max(...s) ** 2 + t * t) / k);
        expect(got).toBeGreaterThanOrEqual(best * (1 - 1e-12));
        expect(got).toBeLessThanOrEqual(worst * (1 + 1e-12));
      }),
    );
  });

  it('curves: widths fall as sites are added and as per-site n grows, and stay above the floors', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 20, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (a, t) => {
        const seAtN = (n: number): number => Math.sqrt(a / n);
        const bySites = widthAgainstSites({ seAtN, n: 100, tau: t, kFrom: 3, kTo: 30 });
        for (let i = 1; i < bySites.length; i++) {
          expect(bySites[i]?.summaryCiWidth ?? 0).toBeLessThan(bySites[i - 1]?.summaryCiWidth ?? 0);
          expect(bySites[i]?.predictionIntervalWidth ?? 0).toBeLessThan(bySites[i - 1]?.predictionIntervalWidth ?? 0);
        }
        const byN = widthAgainstPerSiteN({
          siteSeAtN: [seAtN, seAtN, seAtN, seAtN],
          tau: t,
          nFrom: 10,
          nTo: 100_000,
          points: 30,
        });
        for (let i = 1; i < byN.length; i++) {
          expect(byN[i]?.summaryCiWidth ?? 0).toBeLessThan(byN[i - 1]?.summaryCiWidth ?? 0);
        }
        for (const p of byN) {
          expect(p.summaryCiWidth).toBeGreaterThanOrEqual(p.summaryFloorWidth);
          expect(p.predictionIntervalWidth ?? 0).toBeGreaterThanOrEqual(p.predictionFloorWidth ?? Number.POSITIVE_INFINITY);
        }
      }),
    );
  });
});

// Small planning problems: 2–4 sites, 1–2 measures, SE² = a/(n − c), targets between the widths
// at the floors and at capacity (sometimes out of reach).
const smallProblem = fc
  .record({
    k: fc.integer({ min: 2, max: 4 }),
    measures: fc.integer({ min: 1, max: 2 }),
    seed: fc.array(fc.double({ min: 0.2, max: 6, noNaN: true }), { minLength: 8, maxLength: 8 }),
    shift: fc.array(fc.constantFrom(0, 1), { minLength: 8, maxLength: 8 }),
    floors: fc.array(fc.integer({ min: 2, max: 6 }), { minLength: 4, maxLength: 4 }),
    spans: fc.array(fc.integer({ min: 0, max: 9 }), { minLength: 4, maxLength: 4 }),
    rates: fc.array(fc.constantFrom(1, 1.5, 2, 3, 4), { minLength: 4, maxLength: 4 }),
    taus: fc.array(fc.oneof(fc.constant(0), fc.double({ min: 0.01, max: 0.5, noNaN: true })), { minLength: 2, maxLength: 2 }),
    fractions: fc.array(fc.double({ min: -0.2, max: 1, noNaN: true }), { minLength: 4, maxLength: 4 }),
    withPi: fc.boolean(),
  })
  .map((r) => {
    const sites: SmallSite[] = Array.from({ length: r.k }, (_, i) => ({
      minimumN: r.floors[i] ?? 2,
      capacity: (r.floors[i] ?? 2) + (r.spans[i] ?? 0),
      rate: r.rates[i] ?? 1,
      se: Array.from({ length: r.measures }, (_, j) => {
        const a = r.seed[i * 2 + j] ?? 1;
        const c = r.shift[i * 2 + j] ?? 0;
        return (n: number) => Math.sqrt(a / (n - c));
      }),
    }));
    const measures: SmallMeasure[] = Array.from({ length: r.measures }, (_, j) => {
      const t = r.taus[j] ?? 0;
      const at = (pick: (s: SmallSite) => number) =>
        widthsAt(
          sites.map((s) => s.se[j]?.(pick(s)) ?? 1),
          t,
        );
      const best = at((s) => s.capacity);
      const worst = at((s) => s.minimumN);
      const f = r.fractions[j * 2] ?? 0.5;
      const g = r.fractions[j * 2 + 1] ?? 0.5;
      const pi =
        r.withPi && best.predictionIntervalWidth !== null && worst.predictionIntervalWidth !== null
          ? {
              maxPredictionIntervalWidth:
                best.predictionIntervalWidth + g * (worst.predictionIntervalWidth - best.predictionIntervalWidth),
            }
          : {};
      return { tau: t, maxSummaryCiWidth: best.summaryCiWidth + f * (worst.summaryCiWidth - best.summaryCiWidth), ...pi };
    });
    return { sites, measures };
  });

function toPlannerInput(
  sites: readonly SmallSite[],
  measures: readonly SmallMeasure[],
): { sites: PlannerSite[]; measures: PooledMeasure[] } {
  return {
    sites: sites.map((s, i) => ({
      id: `S${i + 1}`,
      capacity: s.capacity,
      minimumN: s.minimumN,
      accrualPerMonth: s.rate,
      seAtN: Object.fromEntries(s.se.map((f, j) => [`m${j}`, f])),
    })),
    measures: measures.map((m, j) => ({
      id: `m${j}`,
      label: `measure ${j}`,
      tau: m.tau,
      target: {
        maxSummaryCiWidth: m.maxSummaryCiWidth,
        ...(m.maxPredictionIntervalWidth === undefined ? {} : { maxPredictionIntervalWidth: m.maxPredictionIntervalWidth }),
      },
    })),
  };
}

describe('pooled planner: properties against brute force on small cases', () => {
  it.each<PlannerObjective>(['fewest-participants', 'shortest-recruitment'])(
    '%s: within capacity always; infeasible exactly when brute force finds nothing; feasible proposals meet every target; none beats it',
    (objective) => {
      fc.assert(
        fc.property(smallProblem, ({ sites, measures }) => {
          const plan = planPooledAllocation({ ...toPlannerInput(sites, measures), objective });
          const truth = bruteForce(sites, measures);
          const n = plan.allocation.map((a) => a.n);
          n.forEach((v, i) => expect(v).toBeLessThanOrEqual(sites[i]?.capacity ?? 0));
          expect(plan.status).toBe(truth.feasible ? 'feasible' : 'infeasible');
          if (!truth.feasible) {
            expect(plan.messages.join(' ')).toMatch(/cannot be met/);
            return;
          }
          n.forEach((v, i) => expect(v).toBeGreaterThanOrEqual(sites[i]?.minimumN ?? 0));
          expect(meetsAll(sites, measures, n)).toBe(true);
          expect(plan.lowerBoundTotalN ?? Number.POSITIVE_INFINITY).toBeLessThanOrEqual(
            (objective === 'fewest-participants' ? truth.minTotal : truth.minTotalAtMinMonths) ?? 0,
          );
          if (objective === 'shortest-recruitment') {
            expect(plan.maxMonths).toBe(truth.minMonths);
            if (measures.length === 1 || plan.minimalTotalProven) expect(plan.totalN).toBe(truth.minTotalAtMinMonths);
            else expect(plan.totalN).toBeGreaterThanOrEqual(truth.minTotalAtMinMonths ?? 0);
          } else if (measures.length === 1 || plan.minimalTotalProven) {
            expect(plan.totalN).toBe(truth.minTotal);
          } else {
            expect(plan.totalN).toBeGreaterThanOrEqual(truth.minTotal ?? 0);
          }
        }),
        { numRuns: 150 },
      );
    },
  );
});
