// Inputs outside their domain are refused with a DomainError that names the field, the value, the
// allowed range and why (METHODS 7b); none of them reaches the maths.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { BinaryPlanOptions, BinaryPopulationInput } from '@shared/engine/binary/binary-population-input';
import { DEFAULT_BINARY_PRECISION } from '@shared/engine/binary/binary-population-input';
import { coxSnellFromCStatistic } from '@shared/engine/binary/cox-snell-from-c-statistic';
import { adjustedCoxSnellFromLikelihoodRatio } from '@shared/engine/binary/cox-snell-from-likelihood-ratio';
import { coxSnellFromNagelkerke } from '@shared/engine/binary/cox-snell-from-nagelkerke';
import { fitNormalLp } from '@shared/engine/binary/fit-normal-lp';
import { mapeSampleSize } from '@shared/engine/binary/mape-sample-size';
import { maxCoxSnellR2 } from '@shared/engine/binary/max-cox-snell-r2';
import { netBenefitVariance } from '@shared/engine/binary/net-benefit-variance';
import { planBinaryPopulation } from '@shared/engine/binary/plan-binary-population';
import { sensSpecFromLp } from '@shared/engine/binary/sens-spec-from-lp';
import { DomainError } from '@shared/engine/errors';

const base: BinaryPopulationInput = {
  anticipated: { outcomeProportion: 0.1, cStatistic: 0.8, thresholds: [{ threshold: 0.1 }] },
  precision: DEFAULT_BINARY_PRECISION,
};

function refusal(run: () => unknown): DomainError {
  try {
    run();
  } catch (e) {
    if (e instanceof DomainError) return e;
    throw e;
  }
  throw new Error('expected a DomainError, but the input was accepted');
}

interface Case {
  readonly what: string;
  readonly input: BinaryPopulationInput;
  readonly options?: BinaryPlanOptions;
  readonly field: string;
  /** A fragment of the explanation. */
  readonly why: RegExp;
}

const withAnticipated = (a: Partial<BinaryPopulationInput['anticipated']>): BinaryPopulationInput => ({
  ...base,
  anticipated: { ...base.anticipated, ...a },
});
const withPrecision = (p: Partial<BinaryPopulationInput['precision']>): BinaryPopulationInput => ({
  ...base,
  precision: { ...base.precision, ...p },
});

const CASES: readonly Case[] = [
  {
    what: 'outcome proportion 0',
    input: withAnticipated({ outcomeProportion: 0 }),
    field: 'anticipated.outcomeProportion',
    why: /nothing to predict/,
  },
  {
    what: 'outcome proportion 1',
    input: withAnticipated({ outcomeProportion: 1 }),
    field: 'anticipated.outcomeProportion',
    why: /strictly between 0 and 1/,
  },
  {
    what: 'outcome proportion NaN',
    input: withAnticipated({ outcomeProportion: Number.NaN }),
    field: 'anticipated.outcomeProportion',
    why: /between 0 and 1/,
  },
  {
    what: 'C-statistic 0.5',
    input: withAnticipated({ cStatistic: 0.5 }),
    field: 'anticipated.cStatistic',
    why: /no better than chance/,
  },
  {
    what: 'C-statistic 0.3',
    input: withAnticipated({ cStatistic: 0.3 }),
    field: 'anticipated.cStatistic',
    why: /no better than chance/,
  },
  {
    what: 'C-statistic 0.99 to be fitted',
    input: withAnticipated({ cStatistic: 0.99 }),
    field: 'anticipated.cStatistic',
    why: /ill-conditioned/,
  },
  { what: 'C-statistic 1', input: withAnticipated({ cStatistic: 1 }), field: 'anticipated.cStatistic', why: /perfect model/ },
  {
    what: 'LP mean without SD',
    input: withAnticipated({ lpMean: -2 }),
    field: 'anticipated.lpSd',
    why: /together with anticipated\.lpMean/,
  },
  { what: 'LP SD 0', input: withAnticipated({ lpMean: -2, lpSd: 0 }), field: 'anticipated.lpSd', why: /cannot be estimated/ },
  { what: 'LP SD 50', input: withAnticipated({ lpMean: -2, lpSd: 50 }), field: 'anticipated.lpSd', why: /risks are 0 or 1/ },
  { what: 'LP mean 40', input: withAnticipated({ lpMean: 40, lpSd: 1 }), field: 'anticipated.lpMean', why: /essentially 0 or 1/ },
  {
    what: 'calibration slope 0',
    input: withAnticipated({ calibrationSlope: 0 }),
    field: 'anticipated.calibrationSlope',
    why: /wrong way round/,
  },
  {
    what: 'calibration slope −1',
    input: withAnticipated({ calibrationSlope: -1 }),
    field: 'anticipated.calibrationSlope',
    why: /greater than 0/,
  },
  {
    what: 'calibration intercept Infinity',
    input: withAnticipated({ calibrationIntercept: Number.POSITIVE_INFINITY }),
    field: 'anticipated.calibrationIntercept',
    why: /log-odds/,
  },
  {
    what: 'threshold 0',
    input: withAnticipated({ thresholds: [{ threshold: 0 }] }),
    field: 'anticipated.thresholds[0].threshold',
    why: /nobody or everybody/,
  },
  {
    what: 'threshold 1.2',
    input: withAnticipated({ thresholds: [{ threshold: 0.1 }, { threshold: 1.2 }] }),
    field: 'anticipated.thresholds[1].threshold',
    why: /probability/,
  },
  {
    what: 'the same threshold twice',
    input: withAnticipated({ thresholds: [{ threshold: 0.1 }, { threshold: 0.1 }] }),
    field: 'anticipated.thresholds[1].threshold',
    why: /not listed before/,
  },
  {
    what: 'sensitivity 1',
    input: withAnticipated({ thresholds: [{ threshold: 0.1, sensitivity: 1, specificity: 0.7 }] }),
    field: 'anticipated.thresholds[0].sensitivity',
    why: /variance vanishes/,
  },
  {
    what: 'specificity −0.1',
    input: withAnticipated({ thresholds: [{ threshold: 0.1, sensitivity: 0.8, specificity: -0.1 }] }),
    field: 'anticipated.thresholds[0].specificity',
    why: /between 0 and 1/,
  },
  {
    what: 'sensitivity without specificity',
    input: withAnticipated({ thresholds: [{ threshold: 0.1, sensitivity: 0.8 }] }),
    field: 'anticipated.thresholds[0].specificity',
    why: /together with/,
  },
  {
    what: 'confidence 1',
    input: withPrecision({ confidence: 1 }),
    field: 'precision.confidence',
    why: /confidence level is a probability/,
  },
  { what: 'O/E width 0', input: withPrecision({ oe: { width: 0 } }), field: 'precision.oe.width', why: /greater than 0/ },
  {
    what: 'O/E lower limit 0',
    input: withPrecision({ oe: { lower: 0, upper: 1.1 } }),
    field: 'precision.oe.lower',
    why: /ratio of event counts/,
  },
  {
    what: 'O/E limits reversed',
    input: withPrecision({ oe: { lower: 1.1, upper: 0.9 } }),
    field: 'precision.oe.upper',
    why: /greater than the lower limit 1\.1/,
  },
  {
    what: 'slope width −0.2',
    input: withPrecision({ slope: { width: -0.2 } }),
    field: 'precision.slope.width',
    why: /greater than 0/,
  },
  {
    what: 'C width NaN',
    input: withPrecision({ cStatistic: { width: Number.NaN } }),
    field: 'precision.cStatistic.width',
    why: /greater than 0/,
  },
  {
    what: 'net-benefit width Infinity',
    input: withPrecision({ netBenefit: { width: Number.POSITIVE_INFINITY, standardised: true } }),
    field: 'precision.netBenefit.width',
    why: /finite/,
  },
  {
    what: 'Cox–Snell R² above its maximum',
    input: base,
    options: { development: { predictorParameters: 10, coxSnellR2: 0.5 } },
    field: 'development.coxSnellR2',
    why: /a Cox–Snell R² at or above its maximum 0\.478 for outcome proportion 0\.1 is impossible/,
  },
  {
    what: 'Cox–Snell R² 0',
    input: base,
    options: { development: { predictorParameters: 10, coxSnellR2: 0 } },
    field: 'development.coxSnellR2',
    why: /greater than 0/,
  },
  {
    what: 'P = 0',
    input: base,
    options: { development: { predictorParameters: 0, coxSnellR2: 0.1 } },
    field: 'development.predictorParameters',
    why: /at least 1/,
  },
  {
    what: 'P = 2.5',
    input: base,
    options: { development: { predictorParameters: 2.5, coxSnellR2: 0.1 } },
    field: 'development.predictorParameters',
    why: /whole number/,
  },
  {
    what: 'target shrinkage below R²_CS',
    input: base,
    options: { development: { predictorParameters: 10, coxSnellR2: 0.3, targetShrinkage: 0.2 } },
    field: 'development.targetShrinkage',
    why: /ln\(1 − R²_CS\/S\)/,
  },
  {
    what: 'optimism margin 0',
    input: base,
    options: { development: { predictorParameters: 10, coxSnellR2: 0.1, optimismMargin: 0 } },
    field: 'development.optimismMargin',
    why: /Nagelkerke/,
  },
  {
    what: 'risk margin 0.5',
    input: base,
    options: { development: { predictorParameters: 10, coxSnellR2: 0.1, riskMargin: 0.5 } },
    field: 'development.riskMargin',
    why: /says nothing/,
  },
  { what: 'available n 0', input: base, options: { availableN: 0 }, field: 'availableN', why: /at least 1/ },
  { what: 'available n 1e9', input: base, options: { availableN: 1e9 }, field: 'availableN', why: /at most/ },
  { what: 'Hermite nodes 1000', input: base, options: { hermiteNodes: 1000 }, field: 'hermiteNodes', why: /2 to 400/ },
];

describe('planBinaryPopulation refuses inputs outside their domain, naming field, value, range and why', () => {
  for (const c of CASES) {
    it(`${c.what}: ${c.field}`, () => {
      const e = refusal(() => planBinaryPopulation(c.input, c.options));
      expect(e.field).toBe(c.field);
      expect(e.message).toMatch(c.why);
      expect(e.message).toContain(`${c.field} = `);
    });
  }

  it('property: any outcome proportion outside (0, 1) is refused, never computed', () => {
    fc.assert(
      fc.property(fc.oneof(fc.double({ max: 0 }), fc.double({ min: 1 }), fc.constant(Number.NaN)), (phi) => {
        expect(refusal(() => planBinaryPopulation(withAnticipated({ outcomeProportion: phi }))).field).toBe(
          'anticipated.outcomeProportion',
        );
      }),
    );
  });
});

describe('the lower-level functions refuse out-of-domain arguments too', () => {
  it('maxCoxSnellR2, fitNormalLp, sensSpecFromLp, netBenefitVariance and the R² helpers', () => {
    expect(() => maxCoxSnellR2(0)).toThrow(DomainError);
    expect(() => fitNormalLp(0.1, 0.5)).toThrow(/no better than chance/);
    expect(() => fitNormalLp(0.1, 0.995)).toThrow(/ill-conditioned/);
    expect(() => fitNormalLp(1.5, 0.8)).toThrow(/outcome proportion/);
    expect(() => sensSpecFromLp({ mean: 0, sd: 1 }, { intercept: 0, slope: 1 }, 1)).toThrow(/risk threshold/);
    expect(() => netBenefitVariance(0.8, 0, 0.1, 0.1)).toThrow(/specificity/);
    expect(() => coxSnellFromCStatistic(0.45, 0.1)).toThrow(/reported C-statistic/);
    expect(() => coxSnellFromNagelkerke(1, 0.1)).toThrow(/Nagelkerke/);
    expect(() => adjustedCoxSnellFromLikelihoodRatio(8, 500, 10)).toThrow(/above the number of parameters 10/);
    expect(() => mapeSampleSize(24, 0.174, 0)).toThrow(/prediction error/);
  });
});
