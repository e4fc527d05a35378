import { describe, expect, it } from 'vitest';
import { DomainError } from '@shared/engine/errors';
import { criticalZ } from '@shared/engine/helpers/critical-z';
import { hozoMean } from '@shared/engine/helpers/hozo-mean';
import { hozoVariance } from '@shared/engine/helpers/hozo-variance';
import { logNormalFromMeanSd } from '@shared/engine/helpers/log-normal-from-mean-sd';
import { logNormalFromQuartiles } from '@shared/engine/helpers/log-normal-from-quartiles';
import { logNormalMoments } from '@shared/engine/helpers/log-normal-moments';
import { logScaleTolerance } from '@shared/engine/helpers/log-scale-tolerance';
import { sdFromIqr } from '@shared/engine/helpers/sd-from-iqr';
import { seFromCiWidth } from '@shared/engine/helpers/se-from-ci-width';
import { seFromHalfWidth } from '@shared/engine/helpers/se-from-half-width';
import { seLogFromRatioCiWidth, seLogFromRatioLimits } from '@shared/engine/helpers/se-log-from-ratio-ci';
import { varianceFromSd } from '@shared/engine/helpers/variance-from-sd';
import { wanSdFromFiveNumbers } from '@shared/engine/helpers/wan-sd-from-five-numbers';
import { wanSdFromIqr } from '@shared/engine/helpers/wan-sd-from-iqr';
import { wanSdFromRange } from '@shared/engine/helpers/wan-sd-from-range';
import { expectClose } from '../../helpers/expect-close';

// Section 7 of the methods notes; every value there is computed with an independent reference
// implementation (scipy) and printed to four to six decimals, which sets each tolerance (half a
// unit in the last printed place). The full-precision fixture is checked in check-values.test.ts.
describe('input helpers against the printed check values (computed with scipy)', () => {
  it('CI width 0.1 → SE 0.025511; 0.2 → 0.051021', () => {
    expectClose(seFromCiWidth(0.1), 0.025511, 5e-7, 'SE from width 0.1');
    expectClose(seFromCiWidth(0.2), 0.051021, 5e-7, 'SE from width 0.2');
  });

  it('a ±10% original-scale tolerance is a log-scale half-width 0.0953 and SE* 0.0486 (METHODS.md 7b)', () => {
    const t = logScaleTolerance({ relative: 0.1 });
    expectClose(t.halfWidth, 0.0953, 5e-5, 'half-width');
    expectClose(t.ciWidth, 2 * 0.09531, 1e-5, 'CI width');
    expectClose(t.targetSe, 0.0486, 5e-5, 'target SE');
    expectClose(seFromHalfWidth(t.halfWidth), t.targetSe, 1e-15, 'SE from half-width agrees');
  });

  it('±1 unit around 10 is the same log half-width as ±10%: 0.09531', () => {
    expectClose(logScaleTolerance({ absolute: 1, centre: 10 }).halfWidth, 0.09531, 5e-6, '±1 at 10');
  });

  it('SD from IQR 10–20 is 7.4130; Hozo mean (0, 5, 10) is 5 and SD (0, 4, 10) 2.9011', () => {
    expectClose(sdFromIqr(10, 20), 7.413, 5e-5, 'SD from IQR');
    expectClose(hozoMean(0, 5, 10), 5, 1e-15, 'Hozo mean');
    expectClose(Math.sqrt(hozoVariance(0, 4, 10)), 2.9011, 5e-5, 'Hozo SD');
  });

  it('Wan 2014: range 10–50 (n 100) 8.0045, IQR 20–35 11.2831, five numbers 9.6438', () => {
    expectClose(wanSdFromRange(10, 50, 100), 8.0045, 5e-5, 'Wan range');
    expectClose(wanSdFromIqr(20, 35, 100), 11.2831, 5e-5, 'Wan IQR');
    expectClose(wanSdFromFiveNumbers(10, 20, 35, 50, 100), 9.6438, 5e-5, 'Wan five-number');
  });

  it('log-normal from quartiles 2, 4, 8: μ 1.3863, σ 1.0277; original scale mean 6.7825, SD 9.2875', () => {
    const p = logNormalFromQuartiles(2, 4, 8);
    expectClose(p.mu, 1.3863, 5e-5, 'μ');
    expectClose(p.sigma, 1.0277, 5e-5, 'σ');
    const m = logNormalMoments(p);
    expectClose(m.mean, 6.7825, 5e-5, 'mean');
    expectClose(m.sd, 9.2875, 5e-5, 'SD');
    expectClose(m.variance, m.sd * m.sd, 1e-12, 'variance is SD²');
  });

  it('log-normal from mean and SD inverts the moments (round trip to 1e-12)', () => {
    const back = logNormalFromMeanSd(6.782451, 9.287506);
    expectClose(back.mu, 1.386294, 1e-6, 'μ from mean & SD');
    expectClose(back.sigma, 1.027662, 1e-6, 'σ from mean & SD');
    const again = logNormalMoments(logNormalFromMeanSd(3.5, 0.7));
    expectClose(again.mean, 3.5, 1e-12, 'mean round trip');
    expectClose(again.sd, 0.7, 1e-12, 'SD round trip');
  });

  it('ratio measures on the log scale: width 0.2 → 0.050937 (asinh); limits 0.9–1.1 → 0.051192', () => {
    expectClose(seLogFromRatioCiWidth(0.2), 0.050937, 5e-7, 'asinh convention');
    expectClose(seLogFromRatioLimits(0.9, 1.1), 0.051192, 5e-7, 'limits convention');
  });

  it('the confidence level is a parameter: 90% and 99% use z = 1.6449 and 2.5758 (normal table)', () => {
    expectClose(criticalZ(0.9), 1.6449, 5e-5, 'z 90%');
    expectClose(seFromCiWidth(0.1, 0.99), 0.1 / (2 * 2.5758), 1e-6, 'SE at 99%');
    expectClose(varianceFromSd(0.6), 0.36, 1e-15, 'variance from SD');
  });
});

describe('input helpers refuse input outside their domain with the field named', () => {
  const cases: [string, () => unknown, RegExp][] = [
    ['zero CI width', () => seFromCiWidth(0), /width/],
    ['infinite CI width', () => seFromCiWidth(Number.POSITIVE_INFINITY), /width/],
    ['NaN half-width', () => seFromHalfWidth(Number.NaN), /halfWidth/],
    ['confidence 1', () => seFromCiWidth(0.1, 1), /confidence/],
    ['q3 below q1', () => sdFromIqr(20, 10), /q3/],
    ['Wan range with n = 1', () => wanSdFromRange(0, 1, 1), /\bn\b/],
    ['Wan IQR with fractional n', () => wanSdFromIqr(0, 1, 10.5), /\bn\b/],
    ['five numbers with q1 below min', () => wanSdFromFiveNumbers(10, 5, 35, 50, 100), /q1/],
    ['five numbers with q3 above max', () => wanSdFromFiveNumbers(10, 20, 60, 50, 100), /q3/],
    ['Hozo median above max', () => hozoMean(0, 11, 10), /median/],
    ['Hozo min equal to max', () => hozoVariance(3, 3, 3), /max/],
    ['log-normal with q1 = 0', () => logNormalFromQuartiles(0, 1, 2), /q1/],
    ['log-normal median outside quartiles', () => logNormalFromQuartiles(1, 3, 2), /median|q3/],
    ['log-normal moments overflowing', () => logNormalMoments({ mu: 800, sigma: 1 }), /original-scale/],
    ['log-normal with SD 0', () => logNormalFromMeanSd(1, 0), /sd/],
    ['relative tolerance 0', () => logScaleTolerance({ relative: 0 }), /relative/],
    ['absolute tolerance around a negative centre', () => logScaleTolerance({ absolute: 1, centre: -10 }), /centre/],
    ['ratio limits reversed', () => seLogFromRatioLimits(1.1, 0.9), /upper/],
    ['variance from a negative SD', () => varianceFromSd(-1), /sd/],
  ];
  it.each(cases)('%s throws a DomainError', (_label, call, field) => {
    expect(call).toThrow(DomainError);
    expect(call).toThrow(field);
  });
});
