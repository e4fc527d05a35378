// Every record of the committed check-value fixture that belongs to the continuous engine and its
// input helpers, recomputed here. The fixture (test/fixtures/check-values/check-values.json) was
// generated from an independent reference implementation (scipy) by generate.py beside it; each
// record carries its tag and source, which the test titles repeat.
import { describe, expect, it } from 'vitest';
import fixture from '../../../fixtures/check-values/check-values.json';
import { citlResidualVariance } from '@shared/engine/continuous/citl-residual-variance';
import { citlSampleSize } from '@shared/engine/continuous/citl-criterion';
import { closedFormShrinkageAtN, closedFormShrinkageN } from '@shared/engine/continuous/closed-form-shrinkage';
import type { ContinuousDevelopmentInputs } from '@shared/engine/continuous/continuous-inputs';
import { devInterceptPrecisionAtN, interceptSampleSize } from '@shared/engine/continuous/dev-intercept-criterion';
import { devOptimismPrecisionAtN, optimismSampleSize } from '@shared/engine/continuous/dev-optimism-criterion';
import { devResidualSdPrecisionAtN } from '@shared/engine/continuous/dev-residual-sd-criterion';
import { expectedShrinkage } from '@shared/engine/continuous/expected-shrinkage';
import { r2SampleSize } from '@shared/engine/continuous/r2-criterion';
import { r2StandardError } from '@shared/engine/continuous/r2-standard-error';
import { residualSdSampleSize } from '@shared/engine/continuous/residual-sd-sample-size';
import { adjustedR2LinkShrinkageSize, closedFormShrinkageSize } from '@shared/engine/continuous/shrinkage-sample-size';
import { slopeSampleSize, slopeStandardError } from '@shared/engine/continuous/slope-criterion';
import { criticalZ } from '@shared/engine/helpers/critical-z';
import { hozoMean } from '@shared/engine/helpers/hozo-mean';
import { hozoVariance } from '@shared/engine/helpers/hozo-variance';
import { logNormalFromQuartiles } from '@shared/engine/helpers/log-normal-from-quartiles';
import { logNormalMoments } from '@shared/engine/helpers/log-normal-moments';
import { logScaleTolerance } from '@shared/engine/helpers/log-scale-tolerance';
import { sdFromIqr } from '@shared/engine/helpers/sd-from-iqr';
import { seFromCiWidth } from '@shared/engine/helpers/se-from-ci-width';
import { seLogFromRatioCiWidth, seLogFromRatioLimits } from '@shared/engine/helpers/se-log-from-ratio-ci';
import { wanSdFromFiveNumbers } from '@shared/engine/helpers/wan-sd-from-five-numbers';
import { wanSdFromIqr } from '@shared/engine/helpers/wan-sd-from-iqr';
import { wanSdFromRange } from '@shared/engine/helpers/wan-sd-from-range';
import { brent } from '@shared/engine/numerics/brent';
import { multiplicativeMarginOfError, smallestDfForMargin } from '@shared/engine/numerics/mmoe';
import { expectClose } from '../../helpers/expect-close';

interface CheckRecord {
  readonly section: string;
  readonly description: string;
  readonly value: number;
  readonly printed: string;
  readonly integer: boolean;
  readonly tag: string;
  readonly source: string;
}

const records: readonly CheckRecord[] = fixture.records;

/** The lung-function example of DEV-CONT (P 25, R²_adj 0.2, mean 1.9, SD 0.6) with the defaults. */
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

const nOf = (size: { n: number | null }): number => size.n ?? Number.NaN;
const se01 = seFromCiWidth(0.1);

/** Our computation for each record of the continuous and helper sections, keyed by its description. */
const OURS: Readonly<Record<string, () => number>> = {
  // Helpers (section 1 and 7 of the methods notes)
  'z_0.975': () => criticalZ(0.95),
  'SE from 95% CI width 0.1': () => seFromCiWidth(0.1),
  'SE from 95% CI width 0.2': () => seFromCiWidth(0.2),
  'SE(ln ratio) for ratio-CI width 0.2 (asinh)': () => seLogFromRatioCiWidth(0.2),
  'SE(ln ratio) for CI 0.9-1.1 via (ln1.1-ln0.9)/3.92': () => seLogFromRatioLimits(0.9, 1.1),
  'IQR->SD divisor 2*z_0.75': () => 1 / sdFromIqr(0, 1),
  'SD from IQR (q1=10,q3=20)': () => sdFromIqr(10, 20),
  'Wan SD range a=10,b=50,n=100': () => wanSdFromRange(10, 50, 100),
  'Wan SD IQR q1=20,q3=35,n=100': () => wanSdFromIqr(20, 35, 100),
  'Wan SD five-number a=10,q1=20,q3=35,b=50,n=100': () => wanSdFromFiveNumbers(10, 20, 35, 50, 100),
  'Hozo mean a=0,m=5,b=10': () => hozoMean(0, 5, 10),
  'Hozo SD a=0,m=4,b=10': () => Math.sqrt(hozoVariance(0, 4, 10)),
  'lognormal q1=2,med=4,q3=8: mu_log': () => logNormalFromQuartiles(2, 4, 8).mu,
  'lognormal: sd_log': () => logNormalFromQuartiles(2, 4, 8).sigma,
  'lognormal: mean (orig)': () => logNormalMoments(logNormalFromQuartiles(2, 4, 8)).mean,
  'lognormal: SD (orig)': () => logNormalMoments(logNormalFromQuartiles(2, 4, 8)).sd,
  'log tolerance for +/-10% relative': () => logScaleTolerance({ relative: 0.1 }).halfWidth,
  'log tolerance for +/-1 unit around 10': () => logScaleTolerance({ absolute: 1, centre: 10 }).halfWidth,
  // Multiplicative margin of error
  'first df with MMOE<=1.1': () => nOf(smallestDfForMargin(1.1)),
  'MMOE at df=232': () => multiplicativeMarginOfError(232),
  'MMOE at df=233': () => multiplicativeMarginOfError(233),
  'first df with MMOE<=1.2': () => nOf(smallestDfForMargin(1.2)),
  'first df with MMOE<=1.05': () => nOf(smallestDfForMargin(1.05)),
  // Continuous validation
  'crit1 R2=0.2 CIwidth 0.1 (SE 0.02551)': () => nOf(r2SampleSize(0.2, se01)),
  'crit1 R2=0.5 CIwidth 0.1 (SE 0.02551)': () => nOf(r2SampleSize(0.5, se01)),
  'crit1 R2=0.7 CIwidth 0.1 (SE 0.02551)': () => nOf(r2SampleSize(0.7, se01)),
  'crit1 R2=0.8 CIwidth 0.1 (SE 0.02551)': () => nOf(r2SampleSize(0.8, se01)),
  'crit1 R2=0.9 CIwidth 0.1 (SE 0.02551)': () => nOf(r2SampleSize(0.9, se01)),
  'crit1 SE(R2) at n=200, R2=0.5': () => r2StandardError(0.5, 200),
  'crit2 var(Y)=100,R2=0.8 -> var(Y-Yhat)': () => citlResidualVariance(100, 0.8, 1),
  'crit2 n for CITL CI width 1.0 (SE .2551)': () => nOf(citlSampleSize(citlResidualVariance(100, 0.8, 1), seFromCiWidth(1))),
  'crit2 miscal beta=0.9: var(Y-Yhat)': () => citlResidualVariance(100, 0.8, 0.9),
  'crit3 R2=0.8, beta=1, SE .051': () => nOf(slopeSampleSize(0.8, 1, 0.051)),
  'crit3 R2=0.8, beta=1, CIwidth 0.2': () => nOf(slopeSampleSize(0.8, 1, seFromCiWidth(0.2))),
  'crit3 R2=0.5, beta=1, SE .051': () => nOf(slopeSampleSize(0.5, 1, 0.051)),
  'crit3 R2=0.9, beta=0.9, SE .051': () => nOf(slopeSampleSize(0.9, 0.9, 0.051)),
  'crit3 inverse: SE slope at n=98, R2=.8': () => slopeStandardError(0.8, 1, 98),
  'crit4 n var(Y) intercept-only (df n-1)': () => nOf(residualSdSampleSize(1.1, 0.95, 1)),
  'crit4 n resid var slope model (df n-2)': () => nOf(residualSdSampleSize(1.1, 0.95, 2)),
  // Continuous development (lung-function example and further oracles)
  'crit1 reconstructed (p-2, adj-R2 link) p=25,R2=.2': () => nOf(adjustedR2LinkShrinkageSize(25, 0.2, 0.9)),
  'S(917) reconstructed': () => expectedShrinkage(917, 25, 0.2),
  'S(918) reconstructed': () => expectedShrinkage(918, 25, 0.2),
  'crit1 closed binary-type formula p=25,R2=.2 (raw)': () => closedFormShrinkageN(25, 0.2, 0.9),
  'crit2 1+p(1-R2)/0.05': () => nOf(optimismSampleSize(25, 0.2, 0.05)),
  'crit3 234+p': () => nOf(residualSdSampleSize(1.1, 0.95, 26)),
  'crit4 intercept mean 1.9 SD .6 (MMOE 1.1, t)': () =>
    nOf(
      interceptSampleSize({
        predictorParameters: 25,
        adjustedRSquared: 0.2,
        outcomeMean: 1.9,
        outcomeSd: 0.6,
        residualSdMargin: 1.1,
        confidence: 0.95,
      }),
    ),
  'R2 that makes closed formula give 918': () => brent((r) => closedFormShrinkageN(25, r, 0.9) - 917.5, 0.1, 0.5).root,
  'intercept 95% CI lower at n=918': () => 1.9 - (devInterceptPrecisionAtN(lung, 918).achieved ?? Number.NaN) / 2,
  'intercept 95% CI upper at n=918': () => 1.9 + (devInterceptPrecisionAtN(lung, 918).achieved ?? Number.NaN) / 2,
  'inverse n=500: S (recon)': () => expectedShrinkage(500, 25, 0.2),
  'inverse n=500: R2app-R2adj = p(1-R2)/(n-1)': () => devOptimismPrecisionAtN(lung, 500).achieved ?? Number.NaN,
  'inverse n=500: MMOE resid SD (df=n-p-1)': () => devResidualSdPrecisionAtN(lung, 500).achieved ?? Number.NaN,
  'crit1 recon p=10,R2=0.5': () => nOf(adjustedR2LinkShrinkageSize(10, 0.5, 0.9)),
  'crit1 closed p=10,R2=0.5': () => nOf(closedFormShrinkageSize(10, 0.5, 0.9)),
  'crit1 recon p=20,R2=0.3': () => nOf(adjustedR2LinkShrinkageSize(20, 0.3, 0.9)),
  'crit1 closed p=20,R2=0.3': () => nOf(closedFormShrinkageSize(20, 0.3, 0.9)),
  'crit1 recon p=5,R2=0.7': () => nOf(adjustedR2LinkShrinkageSize(5, 0.7, 0.9)),
  'crit1 closed p=5,R2=0.7': () => nOf(closedFormShrinkageSize(5, 0.7, 0.9)),
  // The closed-form shrinkage inverse is the same formula whatever the outcome type.
  'inverse: S at n=400 (P=24,R2cs=.288)': () => closedFormShrinkageAtN(400, 24, 0.288) ?? Number.NaN,
};

/** Sections this engine owns; the binary and survival sections are checked by their own engines. */
const OWN_SECTIONS = new Set(['H', 'MMOE', 'CV', 'CD']);

describe('check-value fixture', () => {
  it('holds all 131 records of the reference table, each with a tag and a named source', () => {
    expect(fixture.count).toBe(131);
    expect(records).toHaveLength(131);
    for (const r of records) {
      expect(['CALC', 'RECON', 'MEMORY']).toContain(r.tag);
      expect(r.source).toMatch(/computed with an independent reference implementation \(scipy\)/);
    }
  });

  it('has a computation here for every record of the continuous and helper sections (58 records)', () => {
    const own = records.filter((r) => OWN_SECTIONS.has(r.section));
    expect(own).toHaveLength(58);
    expect(own.filter((r) => OURS[r.description] === undefined).map((r) => r.description)).toEqual([]);
  });
});

// Integers must match exactly. Other values are stored at full double precision; our quantiles
// come from stdlib rather than scipy, so agreement is expected to ~1e−12 relative. 1e−9 leaves room
// for Brent's stopping tolerance in the two root-found values and is still far inside the six
// printed decimals.
const RELATIVE_TOLERANCE = 1e-9;

describe.each(records.filter((r) => OURS[r.description] !== undefined))('$section · $description', (record) => {
  it(`is ${record.printed} [${record.tag}: ${record.source}]`, () => {
    const ours = (OURS[record.description] ?? (() => Number.NaN))();
    if (record.integer) expect(ours).toBe(record.value);
    else expectClose(ours, record.value, RELATIVE_TOLERANCE * Math.max(1, Math.abs(record.value)), record.description);
  });
});
