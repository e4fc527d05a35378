// The continuous criteria as the app and the command line see them (CriterionResult and the
// inverse at a fixed n), against the published worked example and the check values of the
// methods notes, plus the statuses, reasons and domain errors the engine promises.
import { describe, expect, it } from 'vitest';
import type { ContinuousDevelopmentInputs, ContinuousValidationInputs } from '@shared/engine/continuous/continuous-inputs';
import { developmentSizes, validationSizes } from '@shared/engine/continuous/continuous-sizes';
import { criticalT, CRITICAL_T_TABLE_DF } from '@shared/engine/continuous/critical-t';
import {
  developmentPrecisionAtN,
  evaluateContinuousDevelopment,
  evaluateContinuousValidation,
  validationPrecisionAtN,
} from '@shared/engine/continuous/evaluate-continuous';
import { expectedShrinkage } from '@shared/engine/continuous/expected-shrinkage';
import { r2SampleSize } from '@shared/engine/continuous/r2-criterion';
import { adjustedR2LinkShrinkageSize, shrinkageBranchStart } from '@shared/engine/continuous/shrinkage-sample-size';
import { slopeSampleSize } from '@shared/engine/continuous/slope-criterion';
import { citlSampleSize } from '@shared/engine/continuous/citl-criterion';
import { interceptSampleSize } from '@shared/engine/continuous/dev-intercept-criterion';
import { closedFormShrinkageN } from '@shared/engine/continuous/closed-form-shrinkage';
import { DomainError } from '@shared/engine/errors';
import { seFromCiWidth } from '@shared/engine/helpers/se-from-ci-width';
import { tQuantile } from '@shared/engine/numerics/distributions';
import { REFERENCES } from '@shared/engine/references';
import { expectClose } from '../../helpers/expect-close';

const DEV_CONT_PAPER = 'Stat Med 2019;38(7):1262–1275, doi:10.1002/sim.7993';
const SCIPY = 'computed with an independent reference implementation (scipy)';

/** Validation defaults of the methods notes: R² 0.5, var(Y) 100, widths 0.1 / 1 / 0.2, margin 1.1. */
const validation: ContinuousValidationInputs = {
  rSquared: 0.5,
  outcomeVariance: 100,
  rSquaredCitl: 0.8,
  rSquaredSlope: 0.8,
  slope: 1,
  confidence: 0.95,
  r2Width: 0.1,
  citlWidth: 1,
  slopeWidth: 0.2,
  residualSdMargin: 1.1,
};

/** The lung-function (FEV1) example: P 25, R²_adj 0.2, mean 1.9, SD 0.6 (inputs from memory). */
const lung: ContinuousDevelopmentInputs = {
  predictorParameters: 25,
  adjustedRSquared: 0.2,
  targetShrinkage: 0.9,
  optimismMargin: 0.05,
  residualSdMargin: 1.1,
  confidence: 0.95,
  shrinkageForm: 'adjusted-r2-link',
  outcomeMean: 1.9,
  outcomeSd: 0.6,
};

const byId = <T extends { id: string }>(items: readonly T[], id: string): T => {
  const found = items.find((x) => x.id === id);
  if (found === undefined) throw new Error(`no ${id}`);
  return found;
};

describe('published worked example: lung function in the development paper', () => {
  it(`needs 918 participants in total, 36.7 per parameter (${DEV_CONT_PAPER}); the formula of criterion (i) is reconstructed to reproduce the published total`, () => {
    const results = evaluateContinuousDevelopment(lung);
    const total = Math.max(...results.map((r) => r.n ?? 0));
    expect(total).toBe(918);
    expectClose(total / 25, 36.7, 0.05, 'subjects per parameter (printed to one decimal)');
  });

  it(`gives 918 / 401 / 259 / 38 for the four criteria (${SCIPY}; the inputs are from memory)`, () => {
    expect(evaluateContinuousDevelopment(lung).map((r) => [r.id, r.n])).toEqual([
      ['dev-shrinkage', 918],
      ['dev-optimism', 401],
      ['dev-residual-sd', 259],
      ['dev-intercept', 38],
    ]);
  });

  it(`gives 995 with the closed form of the shrinkage criterion, which does not reproduce the published 918 (${SCIPY})`, () => {
    const closed = evaluateContinuousDevelopment({ ...lung, shrinkageForm: 'closed-form' });
    expect(byId(closed, 'dev-shrinkage').n).toBe(995);
    expect(byId(closed, 'dev-shrinkage').references).toContain('DEV-BIN-SURV');
    expectClose(byId(closed, 'dev-shrinkage').intermediates[0]?.value ?? Number.NaN, 994.769786, 5e-7, 'unrounded closed form');
  });

  it(`shows the shrinkage knife edge S(917) = 0.8999990 < 0.9 ≤ S(918) = 0.9000958 as intermediates (${SCIPY})`, () => {
    const shrinkage = byId(evaluateContinuousDevelopment(lung), 'dev-shrinkage');
    expectClose(shrinkage.intermediates[0]?.value ?? Number.NaN, 0.9000958, 5e-8, 'S at n');
    expectClose(shrinkage.intermediates[1]?.value ?? Number.NaN, 0.899999, 5e-7, 'S at n − 1');
  });
});

describe('validation criteria with the default targets (computed with scipy, METHODS.md 10)', () => {
  it('R² 0.5 → 762; CITL (var 100, R² 0.8, width 1) → 308; slope (R² 0.8, width 0.2) → 98; residual SDs 234 and 235', () => {
    expect(evaluateContinuousValidation(validation).map((r) => [r.id, r.n, r.status])).toEqual([
      ['r2', 762, 'ok'],
      ['citl', 308, 'ok'],
      ['slope', 98, 'ok'],
      ['residual-sd-citl', 234, 'ok'],
      ['residual-sd-slope', 235, 'ok'],
    ]);
  });

  it('the slope criterion rounds 97.12 up to 98 at SE* 0.051 (R² 0.8; computed with scipy)', () => {
    const width = 2 * 1.959963984540054 * 0.051; // the CI width whose target SE is 0.051
    const slope = byId(evaluateContinuousValidation({ ...validation, slopeWidth: width }), 'slope');
    expectClose(
      slope.intermediates.find((x) => x.name === 'unrounded n')?.value ?? Number.NaN,
      97.12,
      0.005,
      'raw n (printed to two decimals)',
    );
    expect(slope.n).toBe(98);
  });

  it('R² 0.8 needs 190 for a CI width of 0.1 (computed with scipy)', () => {
    expect(byId(evaluateContinuousValidation({ ...validation, rSquared: 0.8 }), 'r2').n).toBe(190);
  });

  it('the slope criterion with β 0.9 and R² 0.9 needs 36 at SE 0.051 (computed with scipy)', () => {
    expect(slopeSampleSize(0.9, 0.9, 0.051).n).toBe(36);
  });

  it('CITL uses the general variance: β 0.9 gives σ²_CITL 20.988 and n = ⌈20.988/SE*²⌉ (computed with scipy)', () => {
    const citl = byId(evaluateContinuousValidation({ ...validation, slope: 0.9 }), 'citl');
    expectClose(citl.intermediates[0]?.value ?? Number.NaN, 20.987654, 5e-7, 'σ²_CITL');
    expect(citl.n).toBe(Math.ceil(20.987654320987655 / seFromCiWidth(1) ** 2));
    expect(citl.n).toBe(323);
  });

  it('the sizes alone equal the n and status of the full results', () => {
    const full = [...evaluateContinuousValidation(validation), ...evaluateContinuousDevelopment(lung)];
    const sizes = [...validationSizes(validation), ...developmentSizes(lung)];
    expect(sizes.map((s) => [s.id, s.n, s.status])).toEqual(full.map((r) => [r.id, r.n, r.status]));
  });

  it('every result states its label, target, formula and references, and the references exist', () => {
    for (const r of [...evaluateContinuousValidation(validation), ...evaluateContinuousDevelopment(lung)]) {
      expect(r.label.length, r.id).toBeGreaterThan(0);
      expect(r.target.length, r.id).toBeGreaterThan(0);
      expect(r.formula.length, r.id).toBeGreaterThan(0);
      expect(r.references.length, r.id).toBeGreaterThan(0);
      for (const key of r.references) expect(REFERENCES[key], key).toBeDefined();
    }
    expect(byId(evaluateContinuousValidation(validation), 'r2').target).toBe('95% CI width for R² ≤ 0.1');
  });
});

describe('the confidence level is a parameter everywhere', () => {
  it('99% needs more than 95% for every sized criterion, and 90% fewer', () => {
    const at = (confidence: number): (number | null)[] => [
      ...validationSizes({ ...validation, confidence }).map((s) => s.n),
      ...developmentSizes({ ...lung, confidence }).map((s) => s.n),
    ];
    const n90 = at(0.9);
    const n95 = at(0.95);
    const n99 = at(0.99);
    n95.forEach((n, i) => {
      // dev-shrinkage and dev-optimism do not involve an interval (indices 5 and 6).
      if (i === 5 || i === 6) {
        expect(n99[i]).toBe(n);
        return;
      }
      expect(n99[i] ?? 0, `criterion ${i}`).toBeGreaterThan(n ?? 0);
      expect(n90[i] ?? 0, `criterion ${i}`).toBeLessThan(n ?? 0);
    });
  });
});

describe('statuses and reasons', () => {
  it('R²: when even the hump of the SE formula (n = 7) is within the target, the criterion is always met at n = 3', () => {
    const r2 = byId(evaluateContinuousValidation({ ...validation, r2Width: 1 }), 'r2');
    expect(r2).toMatchObject({ status: 'always-met', n: 3 });
    expect(r2.reason).toMatch(/n = 7/);
  });

  it('R²: the answer lies on the decreasing branch — SE at n − 1 exceeds the target and SE at n does not', () => {
    const se = seFromCiWidth(0.1);
    for (const r2 of [0.05, 0.2, 1 / 3, 0.5, 0.9, 0.97]) {
      const { n } = r2SampleSize(r2, se);
      const at = validationPrecisionAtN({ ...validation, rSquared: r2 }, n ?? 0)[0];
      const before = validationPrecisionAtN({ ...validation, rSquared: r2 }, (n ?? 0) - 1)[0];
      expect(at?.meets, `R² ${r2}`).toBe(true);
      expect(before?.meets, `R² ${r2}`).toBe(false);
    }
  });

  it('development with P ≤ 2 is always met by the (P − 2) form, and says so', () => {
    for (const p of [1, 2]) {
      const shrinkage = byId(evaluateContinuousDevelopment({ ...lung, predictorParameters: p }), 'dev-shrinkage');
      expect(shrinkage).toMatchObject({ status: 'always-met', n: p + 2 });
      expect(shrinkage.reason).toMatch(/P ≤ 2/);
    }
  });

  it('the intercept criterion is not assessable without the outcome mean and SD, and names the fields', () => {
    const intercept = byId(evaluateContinuousDevelopment({ ...lung, outcomeMean: undefined }), 'dev-intercept');
    expect(intercept).toMatchObject({ status: 'not-assessable', n: null });
    expect(intercept.reason).toMatch(/anticipated\.outcomeMean/);
    const noSd = byId(evaluateContinuousDevelopment({ ...lung, outcomeSd: undefined }), 'dev-intercept');
    expect(noSd.status).toBe('not-assessable');
  });

  it('the intercept criterion is not assessable for a mean of 0 (a relative margin is undefined)', () => {
    const intercept = byId(evaluateContinuousDevelopment({ ...lung, outcomeMean: 0 }), 'dev-intercept');
    expect(intercept.status).toBe('not-assessable');
    expect(intercept.reason).toMatch(/mean is 0/);
  });

  it('every development criterion is not assessable without P or the adjusted R², naming the project field', () => {
    for (const r of evaluateContinuousDevelopment({ ...lung, predictorParameters: undefined })) {
      expect(r.status).toBe('not-assessable');
      expect(r.reason).toMatch(/updating\.predictorParameters/);
    }
    for (const r of evaluateContinuousDevelopment({ ...lung, adjustedRSquared: undefined })) {
      expect(r.reason).toMatch(/updating\.anticipatedAdjustedRSquared/);
    }
  });

  it('the closed form is not assessable when the adjusted R² is not below the target shrinkage', () => {
    const r = byId(
      evaluateContinuousDevelopment({ ...lung, adjustedRSquared: 0.92, shrinkageForm: 'closed-form' }),
      'dev-shrinkage',
    );
    expect(r.status).toBe('not-assessable');
    expect(r.reason).toMatch(/below the target shrinkage/);
  });

  it('a target out of reach below 100,000,000 is reported as not reached with a reason, never as Infinity', () => {
    const r = byId(evaluateContinuousValidation({ ...validation, citlWidth: 1e-5 }), 'citl');
    expect(r).toMatchObject({ status: 'not-converged', n: null });
    expect(r.reason).toMatch(/100,000,000/);
    expect(byId(evaluateContinuousValidation({ ...validation, r2Width: 1e-6 }), 'r2').status).toBe('not-converged');
    expect(byId(evaluateContinuousValidation({ ...validation, residualSdMargin: 1.00001 }), 'residual-sd-citl').n).toBeNull();
  });

  it('an outcome variance whose σ²_CITL overflows a double is out of reach, not Infinity', () => {
    const r = byId(evaluateContinuousValidation({ ...validation, outcomeVariance: 1e308, slope: 0.01 }), 'citl');
    expect(r).toMatchObject({ status: 'not-converged', n: null });
  });
});

describe('regression: the shrinkage criterion never answers on the falling part near n = P + 2', () => {
  // For P = 3, R²_adj = 0.5 the expected shrinkage starts at S(5) = 0.904 ≥ 0.9, falls below 0.9
  // and only rises for good later. Stopping at the first n that meets the target would give 5.
  it('P 3, R² 0.5: S(5) ≥ 0.9 yet the answer is 8, from which S stays at or above 0.9', () => {
    expect(expectedShrinkage(5, 3, 0.5)).toBeGreaterThanOrEqual(0.9);
    expect(expectedShrinkage(6, 3, 0.5)).toBeLessThan(0.9);
    const { n } = adjustedR2LinkShrinkageSize(3, 0.5, 0.9);
    expect(n).toBe(8);
    expect(expectedShrinkage(7, 3, 0.5)).toBeLessThan(0.9);
    for (let m = 8; m <= 5000; m++) expect(expectedShrinkage(m, 3, 0.5)).toBeGreaterThanOrEqual(0.9);
  });

  it('the falling part ends at n = 58 for the lung example (S rises from there on)', () => {
    expect(shrinkageBranchStart(25, 0.2, 10_000)).toBe(58);
    expect(expectedShrinkage(58, 25, 0.2)).toBeLessThan(expectedShrinkage(57, 25, 0.2));
    expect(expectedShrinkage(59, 25, 0.2)).toBeGreaterThanOrEqual(expectedShrinkage(58, 25, 0.2));
  });
});

describe('precision at a fixed n (computed with scipy)', () => {
  it('validation at n = 200 and 98: SE(R²) 0.049133; SE(slope) 0.050767 at n 98 with R² 0.8', () => {
    expectClose(validationPrecisionAtN(validation, 200)[0]?.se ?? Number.NaN, 0.049133, 5e-7, 'SE(R²) n 200');
    const slope = validationPrecisionAtN({ ...validation, rSquaredSlope: 0.8 }, 98)[2];
    expectClose(slope?.se ?? Number.NaN, 0.050767, 5e-7, 'SE(slope) n 98');
    expect(slope?.meets).toBe(true);
  });

  it('development at n = 500: S 0.832448, optimism 0.04008, MMOE 1.06799', () => {
    const [s, o, m] = developmentPrecisionAtN(lung, 500);
    expectClose(s?.achieved ?? Number.NaN, 0.832448, 5e-7, 'S(500)');
    expect(s?.meets).toBe(false);
    expectClose(o?.achieved ?? Number.NaN, 0.04008, 5e-6, 'optimism');
    expect(o?.meets).toBe(true);
    expectClose(m?.achieved ?? Number.NaN, 1.06799, 5e-6, 'MMOE');
  });

  it('intercept at n = 918: the 95% CI runs from 1.865237 to 1.934763', () => {
    const ci = developmentPrecisionAtN(lung, 918)[3];
    expectClose(1.9 - (ci?.achieved ?? Number.NaN) / 2, 1.865237, 5e-7, 'lower limit');
    expect(ci?.meets).toBe(true);
  });

  it('below the smallest admissible n there is no SE and the target is not met', () => {
    expect(validationPrecisionAtN(validation, 2)[0]).toMatchObject({ se: null, meets: false });
    expect(validationPrecisionAtN(validation, 5)[0]).toMatchObject({ se: null, meets: false });
    expect(developmentPrecisionAtN(lung, 20).every((p) => p.meets === false)).toBe(true);
  });
});

describe('critical t values', () => {
  it('match the printed t table (t_{0.975,10} = 2.228, t_{0.975,30} = 2.042)', () => {
    expectClose(criticalT(0.95, 10), 2.228, 5e-4, 't 10');
    expectClose(criticalT(0.95, 30), 2.042, 5e-4, 't 30');
  });

  it('agree with stdlib to 1e−12 (relative) beyond the table for levels up to 0.9999', () => {
    for (const level of [0.5, 0.8, 0.9, 0.95, 0.99, 0.999, 0.9999]) {
      for (const df of [CRITICAL_T_TABLE_DF + 1, 1500, 5000, 1e5, 1e7]) {
        const exact = tQuantile(1 - (1 - level) / 2, df);
        expectClose(criticalT(level, df), exact, 1e-12 * exact, `t ${level} df ${df}`);
      }
    }
  });

  it('are the stdlib quantiles inside the table and for levels above 0.9999', () => {
    expect(criticalT(0.95, 233)).toBe(tQuantile(0.975, 233));
    expect(criticalT(0.99999, 5000)).toBe(tQuantile(1 - 0.000005, 5000));
  });
});

describe('out-of-domain input throws a DomainError naming the field, never NaN', () => {
  const cases: [string, () => unknown, RegExp][] = [
    ['R² of 1', () => r2SampleSize(1, 0.02), /rSquared/],
    ['negative target SE', () => r2SampleSize(0.5, -1), /targetSe/],
    ['slope 0', () => slopeSampleSize(0.5, 0, 0.05), /slope/],
    ['NaN variance', () => citlSampleSize(Number.NaN, 0.1), /σ²_CITL/],
    ['fractional P', () => adjustedR2LinkShrinkageSize(2.5, 0.2, 0.9), /predictorParameters/],
    ['n below P + 2', () => expectedShrinkage(10, 25, 0.2), /\bn\b/],
    ['closed form with R² above S', () => closedFormShrinkageN(10, 0.95, 0.9), /adjustedRSquared/],
    [
      'intercept margin of 1',
      () =>
        interceptSampleSize({
          predictorParameters: 5,
          adjustedRSquared: 0.2,
          outcomeMean: 1,
          outcomeSd: 1,
          residualSdMargin: 1,
          confidence: 0.95,
        }),
      /residualSdMargin/,
    ],
    ['t with df 0', () => criticalT(0.95, 0), /df/],
    ['t with level 1', () => criticalT(1, 10), /confidence/],
    ['validation inputs with R² 1.2', () => evaluateContinuousValidation({ ...validation, rSquared: 1.2 }), /rSquared/],
  ];
  it.each(cases)('%s', (_label, call, field) => {
    expect(call).toThrow(DomainError);
    expect(call).toThrow(field);
  });
});
