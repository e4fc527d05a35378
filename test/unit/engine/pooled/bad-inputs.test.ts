// Bad inputs never compute silently: each raises a DomainError naming the field and the allowed range.
import { describe, expect, it } from 'vitest';
import { DomainError } from '@shared/engine/errors';
import { compareExtraSiteWithExtraParticipants } from '@shared/engine/pooled/extra-site-versus-extra-participants';
import { fixedEffectSummary } from '@shared/engine/pooled/fixed-effect-summary';
import { heterogeneityFloor } from '@shared/engine/pooled/heterogeneity-floor';
import { planPooledAllocation, type PooledPlanInput } from '@shared/engine/pooled/plan-pooled-allocation';
import { planForAim } from '@shared/engine/pooled/planning-aim';
import { predictionInterval } from '@shared/engine/pooled/prediction-interval';
import { randomEffectsSummary } from '@shared/engine/pooled/random-effects-summary';
import type { PlannerSite } from '@shared/engine/pooled/types';
import { widthAgainstPerSiteN } from '@shared/engine/pooled/width-against-per-site-n';
import { widthAgainstSites } from '@shared/engine/pooled/width-against-sites';

function domainError(run: () => unknown): DomainError {
  try {
    run();
  } catch (e) {
    if (e instanceof DomainError) return e;
    throw e;
  }
  throw new Error('expected a DomainError, but nothing was thrown');
}

const seA = (a: number) => (n: number) => Math.sqrt(a / n);
const goodSite = (id: string): PlannerSite => ({
  id,
  capacity: 1000,
  minimumN: 10,
  accrualPerMonth: 20,
  seAtN: { slope: seA(1) },
});
const baseInput = (sites: PlannerSite[]): PooledPlanInput => ({
  sites,
  measures: [{ id: 'slope', label: 'Calibration slope', tau: 0.05, target: { maxSummaryCiWidth: 0.2 } }],
  objective: 'fewest-participants',
});

describe('summary, prediction interval and floors reject bad inputs', () => {
  it.each([
    ['K < 3 for the prediction interval', () => predictionInterval(0.1, 0.1, 2), 'k (number of sites)', /at least 3 sites/],
    ['K not a whole number', () => predictionInterval(0.1, 0.1, 3.5), 'k (number of sites)', /whole number ≥ 3/],
    ['negative τ', () => randomEffectsSummary([0.1, 0.2], -0.1), 'tau', /finite number ≥ 0/],
    ['τ NaN in the prediction interval', () => predictionInterval(0.1, Number.NaN, 5), 'tau', /finite number ≥ 0/],
    ['negative τ in the floor', () => heterogeneityFloor(-1, 5), 'tau', /≥ 0/],
    [
      'non-finite SE',
      () => randomEffectsSummary([0.1, Number.POSITIVE_INFINITY], 0.1),
      'siteSes[1]',
      /finite number greater than 0/,
    ],
    ['NaN SE', () => fixedEffectSummary([Number.NaN]), 'siteSes[0]', /finite number greater than 0/],
    ['zero SE', () => randomEffectsSummary([0], 0.1), 'siteSes[0]', /finite number greater than 0/],
    ['no sites', () => randomEffectsSummary([], 0.1), 'siteSes', /at least one site/],
    ['summary SE of 0', () => predictionInterval(0, 0.1, 5), 'summarySe', /finite number greater than 0/],
    ['confidence of 1', () => predictionInterval(0.1, 0.1, 5, 1), 'confidence', /strictly between 0 and 1/],
  ])('%s', (_what, run, field, allowed) => {
    const e = domainError(run);
    expect(e.field).toBe(field);
    expect(e.allowed).toMatch(allowed);
    expect(e.message).toContain(field);
  });
});

describe('curves and the marginal comparison reject bad inputs', () => {
  it.each([
    ['kFrom of 0', () => widthAgainstSites({ seAtN: seA(1), n: 100, tau: 0.1, kFrom: 0 }), 'kFrom'],
    ['kTo below kFrom', () => widthAgainstSites({ seAtN: seA(1), n: 100, tau: 0.1, kFrom: 5, kTo: 4 }), 'kTo'],
    ['SE function returning NaN', () => widthAgainstSites({ seAtN: () => Number.NaN, n: 100, tau: 0.1 }), 'seAtN'],
    ['one grid point', () => widthAgainstPerSiteN({ siteSeAtN: [seA(1)], tau: 0, nFrom: 10, nTo: 100, points: 1 }), 'points'],
    ['nTo not above nFrom', () => widthAgainstPerSiteN({ siteSeAtN: [seA(1)], tau: 0, nFrom: 10, nTo: 10 }), 'nTo'],
    ['no sites on the n curve', () => widthAgainstPerSiteN({ siteSeAtN: [], tau: 0, nFrom: 10, nTo: 100 }), 'siteSeAtN'],
    [
      'a zero fraction',
      () =>
        compareExtraSiteWithExtraParticipants({
          label: 'x',
          sites: [{ n: 10, seAtN: seA(1) }],
          tau: 0,
          newSite: { seAtN: seA(1) },
          perSiteIncrease: { kind: 'fraction', fraction: 0 },
        }),
      'perSiteIncrease.fraction',
    ],
    [
      'a fractional n',
      () =>
        compareExtraSiteWithExtraParticipants({
          label: 'x',
          sites: [{ n: 10.5, seAtN: seA(1) }],
          tau: 0,
          newSite: { seAtN: seA(1) },
        }),
      'sites[0].n',
    ],
  ])('%s', (_what, run, field) => {
    expect(domainError(run).field).toBe(field);
  });
});

describe('the planner rejects bad inputs, naming the site or measure', () => {
  it('a capacity that is not given (unknown is not unlimited)', () => {
    const site = { ...goodSite('A'), capacity: undefined } as unknown as PlannerSite;
    const e = domainError(() => planPooledAllocation(baseInput([site, goodSite('B')])));
    expect(e.field).toBe('sites[0].capacity');
    expect(e.allowed).toContain('"unlimited" stated explicitly');
  });

  it('a fractional or zero capacity', () => {
    expect(domainError(() => planPooledAllocation(baseInput([{ ...goodSite('A'), capacity: 10.5 }]))).field).toBe(
      'sites[0].capacity',
    );
    expect(domainError(() => planPooledAllocation(baseInput([{ ...goodSite('A'), capacity: 0 }]))).field).toBe(
      'sites[0].capacity',
    );
  });

  it('a negative τ or a zero target width', () => {
    const input = baseInput([goodSite('A')]);
    const negative = { ...input, measures: [{ id: 'slope', label: 'slope', tau: -0.1, target: { maxSummaryCiWidth: 0.2 } }] };
    expect(domainError(() => planPooledAllocation(negative)).field).toBe('measures[0].tau');
    const zero = {
      ...input,
      measures: [{ id: 'slope', label: 'slope', tau: 0.1, target: { maxSummaryCiWidth: 0.2, maxPredictionIntervalWidth: 0 } }],
    };
    expect(domainError(() => planPooledAllocation(zero)).field).toBe('measures[0].target.maxPredictionIntervalWidth');
  });

  it('missing accrual for the shortest-recruitment objective', () => {
    const { accrualPerMonth: _dropped, ...noRate } = goodSite('B');
    const e = domainError(() =>
      planPooledAllocation({ ...baseInput([goodSite('A'), noRate]), objective: 'shortest-recruitment' }),
    );
    expect(e.field).toBe('sites[1].accrualPerMonth');
  });

  it('a missing SE function, a non-finite SE, and an SE that grows with n', () => {
    const missing = { ...goodSite('A'), seAtN: {} };
    expect(domainError(() => planPooledAllocation(baseInput([missing]))).field).toBe('sites[0].seAtN.slope');
    const nan = { ...goodSite('A'), seAtN: { slope: (n: number) => (n > 500 ? Number.NaN : 1 / Math.sqrt(n)) } };
    const e = domainError(() => planPooledAllocation(baseInput([nan, goodSite('B'), goodSite('C')])));
    expect(e.field).toBe('sites[0] (A).seAtN.slope');
    expect(e.allowed).toMatch(/positive finite standard error \(it was asked for n = \d+\)/);
    const growing = { ...goodSite('C'), seAtN: { slope: (n: number) => 0.05 + n / 1e4 } };
    const g = domainError(() => planPooledAllocation(baseInput([goodSite('A'), goodSite('B'), growing])));
    expect(g.field).toBe('sites[2] (C).seAtN.slope');
    expect(g.allowed).toContain('does not increase with n');
  });

  it('duplicate site ids, no sites, no measures, and an unknown objective', () => {
    expect(domainError(() => planPooledAllocation(baseInput([goodSite('A'), goodSite('A')]))).field).toBe('sites[1].id');
    expect(domainError(() => planPooledAllocation(baseInput([]))).field).toBe('sites');
    expect(domainError(() => planPooledAllocation({ ...baseInput([goodSite('A')]), measures: [] })).field).toBe('measures');
    const odd = { ...baseInput([goodSite('A')]), objective: 'cheapest' } as unknown as PooledPlanInput;
    expect(domainError(() => planPooledAllocation(odd)).field).toBe('objective');
  });

  it('planForAim: a site-specific n that is not a whole number', () => {
    const e = domainError(() =>
      planForAim({
        aim: 'both',
        sites: [{ ...goodSite('A'), siteSpecificN: 12.5 }],
        measures: baseInput([]).measures,
        objective: 'fewest-participants',
      }),
    );
    expect(e.field).toBe('sites[0].siteSpecificN');
  });
});
