import { describe, expect, it } from 'vitest';
import { r2SampleSize } from '@shared/engine/continuous/r2-criterion';
import { seFromCiWidth } from '@shared/engine/helpers/se-from-ci-width';
import { continuousPlanner } from '@shared/engine/plan/continuous-planner';
import { planPopulation } from '@shared/engine/plan/plan-population';
import { isContinuousPopulation } from '@shared/engine/plan/plan-project';
import { assumptionRanges } from '@shared/engine/ranges/assumption-ranges';
import { sensitivityCurves } from '@shared/engine/ranges/sensitivity-curves';
import { evaluateAt, sweepValues } from '@shared/engine/ranges/sweep';
import { worstCase } from '@shared/engine/ranges/worst-case';
import type { Planner } from '@shared/summary/comparison';
import { FORMAT_TAG, projectSchema, SCHEMA_VERSION } from '@shared/model/project';
import type { ContinuousPopulation, Project } from '@shared/model/project';

function setUp(
  population: Record<string, unknown>,
  updating: Record<string, unknown> = {},
): { project: Project; population: ContinuousPopulation } {
  const project = projectSchema.parse({
    format: FORMAT_TAG,
    schemaVersion: SCHEMA_VERSION,
    name: 'Ranges',
    outcome: 'continuous',
    updating,
    populations: [
      {
        id: 'p',
        name: 'Site',
        outcome: 'continuous',
        anticipated: { rSquared: 0.5, outcomeVariance: 4 },
        precision: { citl: { width: 0.5 } },
        ...population,
      },
    ],
  });
  const first = project.populations[0];
  if (first === undefined || !isContinuousPopulation(first)) throw new Error('no continuous population');
  return { project, population: first };
}

describe('evenly spaced sweep values', () => {
  it('gives count values from low to high with exact ends and tidy interior values', () => {
    const v = sweepValues(0.3, 0.48, 25);
    expect(v).toHaveLength(25);
    expect(v[0]).toBe(0.3);
    expect(v[24]).toBe(0.48);
    expect(v[4]).toBe(0.33);
    for (let i = 1; i < v.length; i++) expect(v[i] ?? 0).toBeGreaterThan(v[i - 1] ?? 0);
    expect(sweepValues(2, 2, 25)).toEqual([2]);
  });
});

describe('low, base and high of each assumption, and the worst case', () => {
  it('the R² criterion peaks inside an R² range at 1/3 (n grows with R²(1 − R²)², VAL-CONT), and the worst case finds it', () => {
    // A wide slope target keeps the calibration-slope criterion from binding at the low end.
    const { project, population } = setUp({
      precision: { citl: { width: 0.5 }, slope: { width: 0.5 } },
      ranges: { rSquared: { low: 0.2, high: 0.45 } },
    });
    const [range] = assumptionRanges(population, project);
    expect(range?.key).toBe('rSquared');
    const atThird = r2SampleSize(1 / 3, seFromCiWidth(0.1)).n;
    expect(range?.worst.requiredN).toBe(atThird);
    expect(range?.worst.requiredN ?? 0).toBeGreaterThan(Math.max(range?.low.requiredN ?? 0, range?.high.requiredN ?? 0));
    const worst = worstCase(population, project);
    expect(worst).toMatchObject({ key: 'rSquared', requiredN: atThird, binding: 'r2' });
    // Grid values next to 1/3 can tie with it; the first value reaching the maximum is reported.
    expect(worst?.value ?? 0).toBeGreaterThan(0.3);
    expect(worst?.value ?? 1).toBeLessThan(0.37);
    expect(worst?.assumption).toMatch(/^Anticipated R² at 0\.3\d* within its range$/);
  });

  it('low, base and high are the plans with that one value changed', () => {
    const { project, population } = setUp({
      precision: { citl: { width: 0.1 } },
      ranges: { outcomeVariance: { low: 2, high: 9 } },
    });
    const [range] = assumptionRanges(population, project);
    const withVariance = (v: number) =>
      planPopulation({ ...population, anticipated: { ...population.anticipated, outcomeVariance: v } }, project).requiredN;
    expect(range?.low.requiredN).toBe(withVariance(2));
    expect(range?.base?.requiredN).toBe(withVariance(4));
    expect(range?.high.requiredN).toBe(withVariance(9));
    expect(worstCase(population, project)?.assumption).toBe('Outcome variance at its high end 9');
  });

  it('names the assumption that produced the overall worst case among several ranges', () => {
    const { project, population } = setUp({
      ranges: { rSquared: { low: 0.45, high: 0.55 }, outcomeVariance: { low: 3, high: 40 }, slope: { low: 0.9, high: 1.1 } },
    });
    const ranges = assumptionRanges(population, project);
    expect(ranges.map((r) => r.key)).toEqual(['rSquared', 'outcomeVariance', 'slope']);
    const worst = worstCase(population, project);
    const largest = Math.max(...ranges.map((r) => r.worst.requiredN ?? 0));
    expect(worst?.requiredN).toBe(largest);
    expect(worst?.key).toBe('outcomeVariance');
    expect(worst?.binding).toBe('citl');
  });

  it('defaults follow the varied value: sweeping R² moves the CITL criterion when its own R² is not given', () => {
    const { project, population } = setUp({});
    const low = evaluateAt(population, project, 'rSquared', 0.3).criteria.find((c) => c.id === 'citl')?.n;
    const high = evaluateAt(population, project, 'rSquared', 0.7).criteria.find((c) => c.id === 'citl')?.n;
    expect(low ?? 0).toBeGreaterThan(high ?? 0);
  });

  it('an outcome-mean range that includes 0 makes the intercept criterion unbounded: the worst case is out of reach', () => {
    const { project, population } = setUp(
      {
        anticipated: { rSquared: 0.5, outcomeVariance: 4, outcomeMean: 1, outcomeSd: 2 },
        ranges: { outcomeMean: { low: -1, high: 2 } },
      },
      { enabled: true, predictorParameters: 5, anticipatedAdjustedRSquared: 0.4 },
    );
    const worst = worstCase(population, project);
    expect(worst).toMatchObject({ requiredN: null, binding: 'dev-intercept', key: 'outcomeMean' });
    expect(worst?.assumption).toContain('≈ 0');
  });

  it('no ranges: no worst case and no curves', () => {
    const { project, population } = setUp({});
    expect(worstCase(population, project)).toBeNull();
    expect(sensitivityCurves(population, project)).toEqual([]);
  });
});

describe('sensitivity curves', () => {
  it('give 25 points per assumption with the base value and its n marked', () => {
    const { project, population } = setUp({
      ranges: { rSquared: { low: 0.2, high: 0.8 }, outcomeVariance: { low: 1, high: 16 } },
    });
    const curves = sensitivityCurves(population, project);
    expect(curves.map((c) => c.key)).toEqual(['rSquared', 'outcomeVariance']);
    for (const c of curves) {
      expect(c.points).toHaveLength(25);
      expect(c.baseN).toBe(planPopulation(population, project).requiredN);
    }
    expect(curves[0]?.base).toBe(0.5);
  });

  it('the required n never falls as the outcome variance grows (the CITL n is proportional to it)', () => {
    const { project, population } = setUp({
      precision: { citl: { width: 0.1 } },
      ranges: { outcomeVariance: { low: 1, high: 16 } },
    });
    const points = sensitivityCurves(population, project)[0]?.points ?? [];
    for (let i = 1; i < points.length; i++) expect(points[i]?.n ?? 0).toBeGreaterThanOrEqual(points[i - 1]?.n ?? 0);
  });

  it('leave out an outcome-mean range without a base value (there is no base to mark), while the worst case still covers it', () => {
    const { project, population } = setUp(
      { anticipated: { rSquared: 0.5, outcomeVariance: 4, outcomeSd: 2 }, ranges: { outcomeMean: { low: 0.5, high: 2 } } },
      { enabled: true, predictorParameters: 5, anticipatedAdjustedRSquared: 0.4 },
    );
    expect(sensitivityCurves(population, project)).toEqual([]);
    expect(worstCase(population, project)?.key).toBe('outcomeMean');
  });

  it('with planPopulation and worstCase they make the planner the comparison table reads', () => {
    const planner: Planner = continuousPlanner satisfies Planner;
    const { project, population } = setUp({ ranges: { rSquared: { low: 0.4, high: 0.6 } } });
    expect(planner.sensitivity?.(population, project)).toHaveLength(1);
    expect(planner.plan(population, project).requiredN).toBe(planPopulation(population, project).requiredN);
  });
});
