// Schema version 2: the binary population variant, the plan's single outcome type, the binary
// development settings, and the migration of version-1 files. Every refusal names the field and
// its allowed range; the ranges are the engine's domains (validateBinaryPopulationInput).
import { readFile } from 'node:fs/promises';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { maxCoxSnellR2 } from '@shared/engine/binary/max-cox-snell-r2';
import { MIGRATIONS, migratePlan } from '@shared/model/migrations';
import { parsePlanText, parsePlanValue } from '@shared/model/plan-file';
import { FORMAT_TAG, SCHEMA_VERSION, binaryPopulationSchema, projectSchema } from '@shared/model/project';
import { fieldProblems } from '@shared/model/validation-message';
import { binaryPopulationArbitrary } from './helpers/binary-population-arbitrary';

const fixture = (name: string): Promise<string> => readFile(new URL(`./fixtures/${name}`, import.meta.url), 'utf8');

const site = { id: 'a', name: 'Site A', outcome: 'binary', anticipated: { outcomeProportion: 0.1, cStatistic: 0.8 } };

/** The problems binaryPopulationSchema finds in `population`, as "path: message" lines. */
function problemsOf(population: unknown): string[] {
  const parsed = binaryPopulationSchema.safeParse(population, { reportInput: true });
  return parsed.success ? [] : fieldProblems(parsed.error).map((p) => `${p.path}: ${p.message}`);
}

const withAnticipated = (extra: Record<string, unknown>) => ({ ...site, anticipated: { ...site.anticipated, ...extra } });

const plan = (extra: Record<string, unknown> = {}) => ({
  format: FORMAT_TAG,
  schemaVersion: SCHEMA_VERSION,
  name: 'Plan',
  outcome: 'binary',
  populations: [site],
  ...extra,
});

describe('migration 1 → 2', () => {
  it('the version is 2 and the shipped table has the one step from 1', () => {
    expect(SCHEMA_VERSION).toBe(2);
    expect(MIGRATIONS.map((m) => m.from)).toEqual([1]);
  });

  it('brings test/unit/model/fixtures/schema-1.plumb to version 2 with every field as it was', async () => {
    const v1 = JSON.parse(await fixture('schema-1.plumb')) as Record<string, unknown>;
    const migrated = migratePlan(v1, { from: 1, to: 2, migrations: MIGRATIONS });
    expect(migrated).toEqual({
      ok: true,
      value: { plan: { ...v1, schemaVersion: 2, outcome: 'continuous' }, steps: MIGRATIONS },
    });
    const opened = parsePlanValue(v1);
    if (!opened.ok) throw new Error(opened.error.message);
    expect(opened.migratedFrom).toBe(1);
    expect(opened.project).toEqual(projectSchema.parse({ ...v1, schemaVersion: 2 }));
    expect(opened.project.outcome).toBe('continuous');
    expect(opened.project.populations.every((p) => p.outcome === 'continuous')).toBe(true);
  });

  it('refuses a version-1 plan that claims another outcome type (version 1 had only continuous outcomes)', () => {
    const result = parsePlanValue({ format: FORMAT_TAG, schemaVersion: 1, name: 'P', outcome: 'binary', populations: [] });
    expect(result).toMatchObject({
      ok: false,
      error: { code: 'invalid', message: expect.stringContaining('a schema-1 plan is for a continuous outcome') as string },
    });
  });

  it('opens test/unit/model/fixtures/schema-2.plumb (a binary plan) as it is, filling the defaults', async () => {
    const result = parsePlanText(await fixture('schema-2.plumb'));
    if (!result.ok) throw new Error(result.error.message);
    expect(result.migratedFrom).toBeNull();
    const [first, second] = result.project.populations;
    expect(result.project.outcome).toBe('binary');
    expect(first?.outcome === 'binary' && first.anticipated.thresholds.map((t) => t.threshold)).toEqual([0.05, 0.1]);
    expect(second?.outcome === 'binary' && second.precision).toEqual({
      confidence: 0.95,
      oe: { lower: 0.85, upper: 1.15 },
      slope: { width: 0.2 },
      cStatistic: { width: 0.1 },
      netBenefit: { width: 0.2, standardised: true },
    });
    expect(result.project.updating.anticipatedCoxSnellR2).toBe(0.07);
  });
});

describe('binary population fields: each refusal names the field and its allowed range', () => {
  it.each([
    [
      { outcomeProportion: 0 },
      'anticipated.outcomeProportion: anticipated outcome proportion must be greater than 0 and less than 1',
    ],
    [
      { outcomeProportion: 1 },
      'anticipated.outcomeProportion: anticipated outcome proportion must be greater than 0 and less than 1',
    ],
    [
      { cStatistic: 0.5 },
      'anticipated.cStatistic: anticipated C-statistic must be greater than 0.5 and less than 1 (0.5 is a model that ranks patients no better than chance',
    ],
    [{ cStatistic: 1 }, 'anticipated.cStatistic: anticipated C-statistic must be greater than 0.5 and less than 1'],
    [
      { cStatistic: 0.995 },
      'anticipated.cStatistic: anticipated C-statistic must be below 0.99 when the linear predictor is fitted to it',
    ],
    [{ lpMean: -2 }, 'anticipated.lpSd: give the mean and the SD of the linear predictor together'],
    [{ lpMean: -2, lpSd: 0.001 }, 'anticipated.lpSd: SD of the linear predictor must be from 0.01 to 10'],
    [{ lpMean: 31, lpSd: 1 }, 'anticipated.lpMean: mean of the linear predictor must lie between −30 and 30'],
    [
      { calibrationSlope: 0 },
      'anticipated.calibrationSlope: anticipated calibration slope must be greater than 0 and at most 10',
    ],
    [
      { calibrationIntercept: -11 },
      'anticipated.calibrationIntercept: anticipated calibration intercept must lie between −10 and 10',
    ],
    [
      { thresholds: [{ threshold: 0 }] },
      'anticipated.thresholds[0].threshold: risk threshold must be greater than 0 and less than 1',
    ],
    [
      { thresholds: [{ threshold: 1 }] },
      'anticipated.thresholds[0].threshold: risk threshold must be greater than 0 and less than 1',
    ],
    [
      { thresholds: [{ threshold: 0.1, sensitivity: 0.7 }] },
      'anticipated.thresholds[0].specificity: give the sensitivity and the specificity at this threshold together',
    ],
    [
      { thresholds: [{ threshold: 0.1 }, { threshold: 0.1 }] },
      'anticipated.thresholds[1].threshold: risk threshold is listed twice',
    ],
    [
      { thresholds: [{ threshold: 0.1, sensitivity: 1, specificity: 0.5 }] },
      'anticipated.thresholds[0].sensitivity: anticipated sensitivity at the threshold must be greater than 0 and less than 1',
    ],
  ])('anticipated %j is refused: %s', (extra, expected) => {
    const problems = problemsOf(withAnticipated(extra));
    expect(problems.length).toBeGreaterThan(0);
    expect(problems[0]).toContain(expected);
  });

  it.each([
    [
      { oe: { width: 0.2, lower: 0.9, upper: 1.1 } },
      'precision.oe.width: give the O/E target either as a CI width or as CI limits, not both',
    ],
    [
      { oe: {} },
      'precision.oe.width: give the O/E target as a total CI width around 1, or as the lower and upper limits of the CI',
    ],
    [{ oe: { lower: 0.9 } }, 'precision.oe.upper: give the lower and the upper limit of the target CI for O/E together'],
    [
      { oe: { lower: 1.05, upper: 1.2 } },
      'precision.oe.lower: the target CI for O/E must have its lower limit below 1 and its upper limit above 1',
    ],
    [{ oe: { width: -0.2 } }, 'precision.oe.width: target CI width for O/E must be greater than 0'],
    [{ slope: { width: 0 } }, 'precision.slope.width: target CI width for the calibration slope must be greater than 0'],
    [{ cStatistic: { width: 0 } }, 'precision.cStatistic.width: target CI width for the C-statistic must be greater than 0'],
    [
      { netBenefit: { width: 0.2, standardised: 'yes' } },
      'precision.netBenefit.standardised: whether the net-benefit width is standardised must be true or false',
    ],
    [{ confidence: 1 }, 'precision.confidence: confidence level must be greater than 0 and less than 1'],
  ])('precision %j is refused: %s', (precision, expected) => {
    expect(problemsOf({ ...site, precision })[0]).toContain(expected);
  });

  it('checks each end of a range with every rule (between fields too), at the range path', () => {
    expect(problemsOf({ ...site, ranges: { cStatistic: { low: 0.5, high: 0.85 } } })[0]).toContain(
      'ranges.cStatistic.low: low end of the range: anticipated C-statistic must be greater than 0.5 and less than 1',
    );
    expect(problemsOf({ ...site, ranges: { cStatistic: { low: 0.7, high: 0.995 } } })[0]).toContain(
      'ranges.cStatistic.high: high end of the range: anticipated C-statistic must be below 0.99 when the linear predictor is fitted to it',
    );
    expect(problemsOf({ ...site, ranges: { outcomeProportion: { low: 0.1, high: 0.05 } } })[0]).toContain(
      'ranges.outcomeProportion.high: low must not exceed high',
    );
    expect(problemsOf({ ...site, ranges: { lpMean: { low: -3, high: -2 } } })[0]).toContain(
      'ranges.lpMean.low: low end of the range: give the mean and the SD of the linear predictor together',
    );
  });

  it('accepts a minimal population and fills the default targets (O/E width 0.2, slope 0.2, C 0.1, standardised NB 0.2)', () => {
    expect(binaryPopulationSchema.parse(site)).toMatchObject({
      anticipated: { thresholds: [] },
      precision: {
        confidence: 0.95,
        oe: { width: 0.2 },
        slope: { width: 0.2 },
        cStatistic: { width: 0.1 },
        netBenefit: { width: 0.2, standardised: true },
      },
      ranges: {},
      recruitment: { eligibleFraction: 1 },
    });
  });

  it('accepts every population the arbitrary builds, and parsing again changes nothing', () => {
    fc.assert(
      fc.property(binaryPopulationArbitrary('p'), (input) => {
        const once = binaryPopulationSchema.parse(input);
        expect(binaryPopulationSchema.parse(once)).toEqual(once);
      }),
      { numRuns: 200 },
    );
  });

  it('refuses any outcome proportion or C-statistic outside its range, naming the field (property)', () => {
    const outside = fc.oneof(fc.double({ max: 0, noNaN: true }), fc.double({ min: 1, noNaN: true }), fc.constant(Number.NaN));
    fc.assert(
      fc.property(outside, (value) => {
        expect(problemsOf(withAnticipated({ outcomeProportion: value }))[0]).toMatch(/^anticipated\.outcomeProportion: /);
      }),
    );
    const outsideC = fc.oneof(fc.double({ max: 0.5, noNaN: true }), fc.double({ min: 1, noNaN: true }));
    fc.assert(
      fc.property(outsideC, (value) => {
        expect(problemsOf(withAnticipated({ cStatistic: value }))[0]).toMatch(/^anticipated\.cStatistic: /);
      }),
    );
  });
});

describe('one outcome type per plan', () => {
  it('is chosen as "continuous" or "binary" and refuses anything else', () => {
    expect(projectSchema.safeParse(plan()).success).toBe(true);
    const parsed = projectSchema.safeParse(plan({ outcome: 'survival', populations: [] }));
    expect(parsed.success ? [] : fieldProblems(parsed.error)).toEqual([
      { path: 'outcome', message: 'plan outcome must be "continuous" or "binary"' },
    ]);
  });

  it('refuses a population of another outcome type, naming the population', () => {
    const continuous = {
      id: 'c',
      name: 'Harbour clinic',
      outcome: 'continuous',
      anticipated: { rSquared: 0.3, outcomeVariance: 1 },
      precision: { citl: { width: 0.5 } },
    };
    const parsed = projectSchema.safeParse(plan({ populations: [site, continuous] }));
    expect(parsed.success ? [] : fieldProblems(parsed.error)).toEqual([
      {
        path: 'populations[1].outcome',
        message:
          'population "Harbour clinic" is for a continuous outcome, but the plan is for a binary outcome (one model predicts one outcome type, so every population takes the plan\'s)',
      },
    ]);
  });

  it('refuses an unknown population outcome with the allowed ones', () => {
    const parsed = projectSchema.safeParse(plan({ populations: [{ ...site, outcome: 'ordinal' }] }));
    expect(parsed.success ? [] : fieldProblems(parsed.error)).toEqual([
      { path: 'populations[0].outcome', message: 'population outcome must be "continuous" or "binary"' },
    ]);
  });
});

describe('binary development settings', () => {
  const updating = (extra: Record<string, unknown>) => ({ enabled: true, predictorParameters: 10, ...extra });

  it("refuses a Cox–Snell R² at or above its maximum at a population's outcome proportion (a range end included), naming the population", () => {
    const low = { ...site, name: 'Low-rate site', anticipated: { outcomeProportion: 0.02, cStatistic: 0.8 } };
    const max = maxCoxSnellR2(0.02);
    const parsed = projectSchema.safeParse(
      plan({ populations: [site, low], updating: updating({ anticipatedCoxSnellR2: max }) }),
    );
    expect(parsed.success ? [] : fieldProblems(parsed.error).map((p) => p.path)).toEqual(['updating.anticipatedCoxSnellR2']);
    expect(parsed.success ? '' : parsed.error.issues[0]?.message).toContain('of population "Low-rate site"');
    const ranged = { ...site, ranges: { outcomeProportion: { low: 0.02, high: 0.2 } } };
    const viaRange = projectSchema.safeParse(plan({ populations: [ranged], updating: updating({ anticipatedCoxSnellR2: max }) }));
    expect(viaRange.success ? '' : viaRange.error.issues[0]?.message).toContain('(low end of its range)');
    // with updating off, the Cox–Snell R² is not used, so it is not held against the proportions
    expect(projectSchema.safeParse(plan({ populations: [low], updating: { anticipatedCoxSnellR2: max } })).success).toBe(true);
  });

  it('refuses a target shrinkage not above the Cox–Snell R², a Cox–Snell R² of 0.75 or more, and a risk margin outside (0, 0.5)', () => {
    const shrink = projectSchema.safeParse(plan({ updating: updating({ anticipatedCoxSnellR2: 0.3, targetShrinkage: 0.3 }) }));
    expect(shrink.success ? [] : fieldProblems(shrink.error).map((p) => p.path)).toEqual(['updating.targetShrinkage']);
    const high = projectSchema.safeParse(plan({ updating: { anticipatedCoxSnellR2: 0.75 } }));
    expect(high.success ? [] : fieldProblems(high.error)).toEqual([
      {
        path: 'updating.anticipatedCoxSnellR2',
        message: 'anticipated Cox–Snell R² must be below 0.75 (no binary outcome allows more)',
      },
    ]);
    const margin = projectSchema.safeParse(plan({ updating: { riskMargin: 0.5 } }));
    expect(margin.success ? [] : fieldProblems(margin.error)[0]?.path).toBe('updating.riskMargin');
  });
});
