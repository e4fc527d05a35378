// The across-sites summary of a plan, checked against values worked by hand from the published
// formulas (random-effects weights 1/(s² + τ²), Control Clin Trials 1986,
// doi:10.1016/0197-2456(86)90046-2; prediction interval with t on K − 2 degrees of freedom,
// J R Stat Soc A 2009, doi:10.1111/j.1467-985X.2008.00552.x; per-site SE of the calibration slope
// √(β²(1 − R²)/(R²(n − 1))), Stat Med 2021, doi:10.1002/sim.8766), with z = 1.959963984540054 and
// t(0.975; 2 df) = 4.302652729749462 computed with an independent reference implementation (scipy),
// and against the engine's own functions.
import { describe, expect, it } from 'vitest';
import { slopePrecisionAtN } from '@shared/engine/continuous/slope-criterion';
import { fixedEffectSummary, pooledPrecision } from '@shared/engine/pooled';
import { validationInputsOf } from '@shared/engine/plan/population-inputs';
import type { ContinuousPopulation } from '@shared/model/project';
import { referenceSource } from '@shared/summary/pooled-paragraph';
import { baseCase, pooledParagraph, pooledSummary, type PooledSummary } from '@shared/summary/pooled-summary';
import { REFERENCES } from '@shared/engine/references';
import type { ReferenceKey } from '@shared/engine/types';
import { formatCount, formatMonths, formatPercent, formatSignificant } from '@shared/format/numbers';
import { expectClose } from '../helpers/expect-close';
import { plan } from './pooled-test-plans';

// Closed forms and scipy quantiles agree to ~1e-12 relative; 1e-9 leaves room for summation order.
const REL = 1e-9;
const close = (actual: number | null | undefined, expected: number, label: string): void =>
  expectClose(actual ?? Number.NaN, expected, REL * Math.max(1, Math.abs(expected)), label);

/** Four clinics with R² 0.5 and a fixed n of 101: the slope SE is 1/√(n − 1) = 0.1 at each. */
const fourClinics = (slope: Record<string, unknown>, extra: Record<string, unknown> = {}) =>
  plan(
    ['a', 'b', 'c', 'd'].map((id) => ({ id, availableN: 101 })),
    { aim: 'site-specific', measures: { slope }, ...extra },
  );

function measure(summary: PooledSummary, key = 'slope') {
  const m = summary.measures.find((x) => x.key === key);
  if (m === undefined) throw new Error(`measure ${key} is not pooled`);
  return m;
}

describe('pooled figures at the planned n, worked by hand', () => {
  const summary = pooledSummary(
    fourClinics({ tau: 0.1, tauRange: { low: 0.05, high: 0.2 }, summaryCiWidth: 0.3, predictionIntervalWidth: 1.2 }),
  );
  const slope = measure(summary);

  it('per-site SE 0.1 at each clinic, from its fixed available n of 101', () => {
    expect(summary.sites.map((s) => [s.plannedN, s.plannedFrom])).toEqual(Array(4).fill([101, 'available n']));
    for (const s of slope.perSite ?? []) close(s.se, 0.1, `SE at ${s.name}`);
    expect(slope.perSite).toHaveLength(4);
  });

  it('τ = 0.1: Σw = 4/(0.01 + 0.01) = 200, SE = 1/√200, CI width 2z·SE, PI width 2·t₂·√(τ² + SE²)', () => {
    const base = baseCase(slope.atPlanned)?.precision;
    close(base?.summarySe, 0.07071067811865477, 'summary SE');
    close(base?.summaryCiWidth, 0.2771807648699356, 'summary CI width');
    close(base?.predictionIntervalWidth, 1.053930372827935, 'prediction-interval width');
    expect(base?.meetsSummary).toBe(true);
    expect(base?.meetsPrediction).toBe(true);
  });

  it('the heterogeneity floors: 2zτ/√K = 0.196, 2·t₂·τ = 0.861, 2zτ = 0.392', () => {
    const base = baseCase(slope.atPlanned)?.precision;
    close(base?.summaryFloorWidth, 0.1959963984540054, 'summary floor');
    close(base?.predictionFloorWidth, 0.8605305459498924, 'prediction floor with 4 sites');
    close(base?.predictionFloorManySites, 0.3919927969080108, 'prediction floor with any number of sites');
  });

  it('low τ 0.05 (Σw = 320) and high τ 0.2 (Σw = 80) bracket the base case', () => {
    const [low, base, high] = slope.atPlanned ?? [];
    expect([low?.which, base?.which, high?.which]).toEqual(['low', 'base', 'high']);
    close(low?.precision.summaryCiWidth, 0.21913063514414538, 'CI width at low τ');
    close(low?.precision.predictionIntervalWidth, 0.6453979094624193, 'PI width at low τ');
    close(high?.precision.summaryCiWidth, 0.4382612702882908, 'CI width at high τ');
    close(high?.precision.predictionIntervalWidth, 1.9717231823185284, 'PI width at high τ');
    expect(high?.precision.meetsSummary).toBe(false);
  });

  it('the site-specific aim gives figures but no proposal', () => {
    expect(summary.aim).toBe('site-specific');
    expect(summary.proposal).toBeNull();
  });
});

describe('τ = 0 reduces to the fixed-effect summary', () => {
  it('four SEs of 0.1: SE 0.05 = √(1/Σ 1/s²), CI width 0.196, PI width 2·t₂·0.05', () => {
    const slope = measure(pooledSummary(fourClinics({ tau: 0, summaryCiWidth: 0.3 })));
    const base = baseCase(slope.atPlanned)?.precision;
    close(base?.summarySe, 0.05, 'summary SE');
    close(base?.summarySe, fixedEffectSummary((slope.perSite ?? []).map((s) => s.se)).summarySe, 'fixed-effect SE');
    close(base?.summaryCiWidth, 0.1959963984540054, 'summary CI width');
    close(base?.predictionIntervalWidth, 0.4302652729749462, 'PI width');
  });

  it('unequal clinics: the τ = 0 summary equals the engine fixed-effect summary of the per-site SEs', () => {
    const project = plan(
      [
        { id: 'a', availableN: 60, rSquared: 0.3 },
        { id: 'b', availableN: 250, rSquared: 0.6 },
        { id: 'c', availableN: 900, rSquared: 0.45 },
      ],
      { measures: { slope: { tau: 0, summaryCiWidth: 0.2 } } },
    );
    const slope = measure(pooledSummary(project));
    const ses = (slope.perSite ?? []).map((s) => s.se);
    project.populations.forEach((p, i) => {
      const n = p.recruitment.availableN ?? 0;
      close(ses[i], slopePrecisionAtN(validationInputsOf(p as ContinuousPopulation), n).se ?? Number.NaN, `SE at ${p.name}`);
    });
    close(baseCase(slope.atPlanned)?.precision.summarySe, fixedEffectSummary(ses).summarySe, 'summary SE');
  });
});

describe('site capacity for the planner', () => {
  it('accrual 50 × eligible 0.8 × consent 0.5 = 20 a month, × 12 months × (1 − 0.1 missing) = 216; a fixed n is its own capacity', () => {
    const summary = pooledSummary(
      plan(
        [
          { id: 'a', accrualPerMonth: 50, eligibleFraction: 0.8, consentFraction: 0.5, missingOutcomeFraction: 0.1 },
          { id: 'b', availableN: 300 },
          { id: 'c', accrualPerMonth: 40 },
        ],
        { aim: 'pooled', measures: { slope: { tau: 0.05, summaryCiWidth: 0.2 } } },
        12,
      ),
    );
    expect(summary.sites.map((s) => s.capacity)).toEqual([216, 300, 480]);
    close(summary.sites[0]?.perMonth, 20, 'enrolment per month');
  });

  it('without an accrual (or a window) the capacity is unknown, and the proposal says which site needs one', () => {
    const summary = pooledSummary(
      plan([{ id: 'a', accrualPerMonth: 30 }, { id: 'b' }, { id: 'c', availableN: 200 }], {
        aim: 'pooled',
        measures: { slope: { tau: 0.05, summaryCiWidth: 0.2 } },
      }),
    );
    expect(summary.sites.map((s) => s.capacity)).toEqual([null, null, 200]);
    expect(summary.proposal?.status).toBe('not-assessable');
    expect(summary.proposal?.messages.join(' ')).toContain('Clinic b: capacity unknown: give its accrual per month');
    expect(summary.proposal?.messages.join(' ')).toContain("Clinic a: capacity unknown: give the study's recruitment window");
  });
});

describe('the proposal for the pooled aim', () => {
  const clinics = ['a', 'b', 'c', 'd'].map((id) => ({ id, accrualPerMonth: 100 }));

  it('four like clinics, τ 0.1, CI width 0.3: between 302 and 304 participants in all (concavity bound, worked by hand)', () => {
    // Σ 1/(1/(n_i − 1) + τ²) ≥ (2z/0.3)² = 170.73; the terms are concave in n, so the mean n is at least
    // 1/(4/170.73 − 0.01) + 1 = 75.47: a total of at least 302; 76 at each clinic (304) meets the target.
    const summary = pooledSummary(plan(clinics, { aim: 'pooled', measures: { slope: { tau: 0.1, summaryCiWidth: 0.3 } } }, 24));
    const proposal = summary.proposal;
    expect(proposal?.status).toBe('feasible');
    expect(proposal?.totalN).toBeGreaterThanOrEqual(302);
    expect(proposal?.totalN).toBeLessThanOrEqual(304);
    expect(proposal?.sites.reduce((sum, s) => sum + (s.n ?? 0), 0)).toBe(proposal?.totalN);
    expect(baseCase(measure(summary).atProposal)?.precision.meetsSummary).toBe(true);
    // The figures at the proposal are the engine's at the proposed n.
    const ses = (proposal?.sites ?? []).map((s) => 1 / Math.sqrt((s.n ?? 0) - 1));
    const engine = pooledPrecision({ id: 'slope', label: 'slope', tau: 0.1, target: { maxSummaryCiWidth: 0.3 } }, ses);
    close(baseCase(measure(summary).atProposal)?.precision.summaryCiWidth, engine.summaryCiWidth, 'CI width at the proposal');
    expect(measure(summary).curves?.basis).toBe('proposal');
  });

  it('months to recruit: enrolment / (accrual × eligible × consent), checked against the window', () => {
    const summary = pooledSummary(plan(clinics, { aim: 'pooled', measures: { slope: { tau: 0.1, summaryCiWidth: 0.3 } } }, 24));
    for (const s of summary.proposal?.sites ?? []) {
      close(s.months, (s.enrolmentTarget ?? Number.NaN) / 100, `months at ${s.name}`);
      expect(s.fitsWindow).toBe('fits');
    }
  });

  it('a prediction-interval target below the heterogeneity floor 2·t₂·τ = 0.861 is infeasible, and says why', () => {
    const summary = pooledSummary(
      plan(clinics, { aim: 'pooled', measures: { slope: { tau: 0.1, summaryCiWidth: 0.3, predictionIntervalWidth: 0.8 } } }, 24),
    );
    expect(summary.proposal?.status).toBe('infeasible');
    expect(summary.proposal?.sites.every((s) => s.n === null)).toBe(true);
    expect(summary.proposal?.messages.join(' ')).toContain('heterogeneity floor');
    expect(pooledParagraph(summary)).toContain('No allocation of participants to the sites meets the pooled targets');
  });

  it('the both aim never gives a clinic fewer than its own required n', () => {
    const summary = pooledSummary(plan(clinics, { aim: 'both', measures: { slope: { tau: 0.1, summaryCiWidth: 0.3 } } }, 36));
    expect(summary.proposal?.status).toBe('feasible');
    for (const s of summary.proposal?.sites ?? [])
      expect(s.n).toBeGreaterThanOrEqual(s.siteSpecificN ?? Number.POSITIVE_INFINITY);
  });

  it('the shortest recruitment never takes longer than the fewest-participants proposal', () => {
    const mixed = [
      { id: 'a', accrualPerMonth: 10 },
      { id: 'b', accrualPerMonth: 40 },
      { id: 'c', accrualPerMonth: 25, rSquared: 0.3 },
    ];
    const pooled = (objective: string) => ({
      aim: 'pooled',
      objective,
      measures: { slope: { tau: 0.05, summaryCiWidth: 0.25 } },
    });
    const fewest = pooledSummary(plan(mixed, pooled('fewest-participants'), 24)).proposal;
    const fastest = pooledSummary(plan(mixed, pooled('shortest-recruitment'), 24)).proposal;
    expect(fastest?.status).toBe('feasible');
    expect(fastest?.longestMonths).toBeLessThanOrEqual((fewest?.longestMonths ?? 0) + 1e-9);
    expect(fastest?.totalN).toBeGreaterThanOrEqual(fewest?.totalN ?? Number.POSITIVE_INFINITY);
  });

  it("the shortest recruitment needs every clinic's accrual, and names the one without", () => {
    const summary = pooledSummary(
      plan(
        [
          { id: 'a', accrualPerMonth: 10 },
          { id: 'b', availableN: 400 },
          { id: 'c', accrualPerMonth: 20 },
        ],
        {
          aim: 'pooled',
          objective: 'shortest-recruitment',
          measures: { slope: { tau: 0.05, summaryCiWidth: 0.25 } },
        },
        24,
      ),
    );
    expect(summary.proposal?.status).toBe('not-assessable');
    expect(summary.proposal?.messages[0]).toContain('accrual per month; not given for: Clinic b');
  });
});

describe('what keeps figures from being shown', () => {
  it('a measure with τ but no summary target is named as not pooled yet', () => {
    const summary = pooledSummary(fourClinics({ tau: 0.1 }));
    expect(summary.measures).toEqual([]);
    expect(summary.notes).toEqual(['The calibration slope is not pooled until the target summary CI width is given.']);
  });

  it('no pooled measure at all is said so', () => {
    const summary = pooledSummary(plan([{ id: 'a', availableN: 50 }], { aim: 'pooled' }));
    expect(summary.proposal).toBeNull();
    expect(summary.notes[0]).toContain('No measure is pooled yet');
  });

  it('a planned n below the smallest n the R² formula admits (7) is reported, not computed', () => {
    const summary = pooledSummary(
      plan(
        [
          { id: 'a', availableN: 5 },
          { id: 'b', availableN: 200 },
          { id: 'c', availableN: 300 },
        ],
        { aim: 'pooled', measures: { rSquared: { tau: 0.02, summaryCiWidth: 0.2 } } },
      ),
    );
    const r2 = measure(summary, 'rSquared');
    expect(r2.perSite).toBeNull();
    expect(r2.problems.join(' ')).toContain('not usable below n = 7');
    // The planner starts every site at 7, where the R² SE is usable; a fixed n of 5 cannot reach it.
    expect(summary.proposal?.status).toBe('infeasible');
    expect(summary.proposal?.messages.join(' ')).toContain(
      "Clinic a: its minimum n (7, the fewest at which every pooled measure's SE",
    );
    expect(summary.proposal?.messages.join(' ')).toContain('is more than it can recruit (5)');
  });
});

describe('pooledParagraph', () => {
  const project = plan(
    [
      { id: 'a', accrualPerMonth: 60, missingOutcomeFraction: 0.05 },
      { id: 'b', accrualPerMonth: 35, rSquared: 0.35 },
      { id: 'c', availableN: 420, rSquared: 0.6 },
      { id: 'd', accrualPerMonth: 20, consentFraction: 0.8 },
      { id: 'e', accrualPerMonth: 80, rSquared: 0.45 },
    ],
    {
      aim: 'pooled',
      measures: {
        slope: { tau: 0.05, tauRange: { low: 0.02, high: 0.08 }, summaryCiWidth: 0.15, predictionIntervalWidth: 0.45 },
        rSquared: { tau: 0.03, summaryCiWidth: 0.1 },
      },
    },
    24,
  );
  const summary = pooledSummary(project);
  const text = pooledParagraph(summary);
  const f3 = (x: number | null | undefined) => formatSignificant(x, 3);

  it('cites τ, its range, the targets, the figures, the floors and each proposed n', () => {
    expect(summary.proposal?.status).toBe('feasible');
    for (const m of summary.measures) {
      const base = baseCase(m.atPlanned)?.precision;
      expect(text).toContain(`τ = ${m.tau}`);
      expect(text).toContain(`summary 95% CI width of at most ${m.target.maxSummaryCiWidth}`);
      expect(text).toContain(`a summary SE of ${f3(base?.summarySe)}`);
      expect(text).toContain(`CI width of ${f3(base?.summaryCiWidth)}`);
      expect(text).toContain(`prediction-interval width of ${f3(base?.predictionIntervalWidth)}`);
      expect(text).toContain(`above ${f3(base?.summaryFloorWidth)} with 5 sites`);
    }
    expect(text).toContain('plausible range 0.02 to 0.08');
    expect(text).toContain('prediction-interval width of at most 0.45');
    for (const s of summary.proposal?.sites ?? []) expect(text).toContain(`${s.name} ${(s.n ?? 0).toLocaleString('en-GB')}`);
    expect(text).toContain(`${(summary.proposal?.totalN ?? 0).toLocaleString('en-GB')} in all`);
    expect(text).toContain('t on K − 2 = 3 degrees of freedom');
    for (const caution of summary.cautions) expect(text).toContain(caution.slice(1));
  });

  it('holds no number that is not in the summary (every number it gives comes from the figures or their words)', () => {
    const known = new Set<string>(['1', '2']); // the digits of the formulas 1/(SE² + τ²), 2·t·τ and K − 2
    // The sources cited (DOIs, journal and year) are not figures.
    const sources = Object.keys(REFERENCES).map((key) => referenceSource(key as ReferenceKey));
    const tokens = (s: string): string[] =>
      sources.reduce((t, source) => t.split(source).join(''), s).match(/\d+(?:,\d{3})*(?:\.\d+)?%?/g) ?? [];
    const walk = (value: unknown): void => {
      if (typeof value === 'number' && Number.isFinite(value)) {
        known.add(formatSignificant(value, 3));
        known.add(formatSignificant(value, 6));
        known.add(formatCount(value));
        known.add(formatMonths(value).replace(' months', ''));
        known.add(formatPercent(value, 1));
      } else if (typeof value === 'string') for (const t of tokens(value)) known.add(t);
      else if (Array.isArray(value)) for (const v of value) walk(v);
      else if (value !== null && typeof value === 'object') for (const v of Object.values(value)) walk(v);
    };
    walk(summary);
    known.add(String(summary.k - 2));
    const strangers = tokens(text).filter((t) => !known.has(t));
    expect(strangers).toEqual([]);
    expect(tokens(text).length).toBeGreaterThan(40);
  });

  it('writes no NaN, Infinity, undefined or empty figure', () => {
    expect(text).not.toMatch(/NaN|Infinity|undefined|—/);
  });

  it('cites its sources by DOI, or journal and year, unless a report gives its own citation marks', () => {
    expect(text).toContain('(doi:10.1016/0197-2456(86)90046-2)');
    expect(text).toContain('(doi:10.1111/j.1467-985X.2008.00552.x)');
    expect(text).toContain('(doi:10.1002/sim.8766; Biometrika 1931;22:353–361; Psychol Bull 1995;118:155–164)');
    const cited: string[] = [];
    const marked = pooledParagraph(summary, (keys) => {
      cited.push(...keys);
      return `[${keys.join(', ')}]`;
    });
    expect(marked).toContain('1/(SE² + τ²) [DERSIMONIAN-LAIRD-1986]');
    expect(marked).not.toContain('doi:');
    expect(new Set(cited)).toEqual(
      new Set(['DERSIMONIAN-LAIRD-1986', 'HIGGINS-THOMPSON-SPIEGELHALTER-2009', 'VAL-CONT', 'WISHART-1931', 'OLKIN-FINN-1995']),
    );
  });
});
