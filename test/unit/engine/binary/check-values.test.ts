// Every binary record (sections BD and BV) of the committed check-value fixture, recomputed by the
// binary engine. The fixture (test/fixtures/check-values/check-values.json) was generated from an
// independent reference implementation (scipy) by generate.py beside it; each record carries its
// tag and source, which the test titles repeat. Integers must match exactly; decimals to 1e−9
// unless a record's own tolerance below says why the engine differs from the reference.
import { describe, expect, it } from 'vitest';
import fixture from '../../../fixtures/check-values/check-values.json';
import type { BinaryDevelopmentInputs } from '@shared/engine/binary/binary-development-inputs';
import { calibrationSlopeInformation } from '@shared/engine/binary/calibration-slope-information';
import { calibrationSlopeSampleSize } from '@shared/engine/binary/calibration-slope-criterion';
import { coxSnellFromCStatistic } from '@shared/engine/binary/cox-snell-from-c-statistic';
import { adjustedCoxSnellFromApparent } from '@shared/engine/binary/cox-snell-from-likelihood-ratio';
import { coxSnellFromNagelkerke } from '@shared/engine/binary/cox-snell-from-nagelkerke';
import {
  developmentOptimismPrecisionAtN,
  shrinkageForNagelkerkeOptimism,
} from '@shared/engine/binary/development-optimism-criterion';
import { developmentShrinkagePrecisionAtN } from '@shared/engine/binary/development-shrinkage-criterion';
import { fitNormalLp } from '@shared/engine/binary/fit-normal-lp';
import type { NormalLp } from '@shared/engine/binary/lp-distribution';
import { WELL_CALIBRATED } from '@shared/engine/binary/lp-distribution';
import { mapeSampleSize } from '@shared/engine/binary/mape-sample-size';
import { maxCoxSnellR2 } from '@shared/engine/binary/max-cox-snell-r2';
import { netBenefitCriterion } from '@shared/engine/binary/net-benefit-criterion';
import { netBenefitVariance } from '@shared/engine/binary/net-benefit-variance';
import { newcombeCStatisticSe, newcombeSampleSize } from '@shared/engine/binary/newcombe-c-statistic';
import { oeSampleSize, seLnOe } from '@shared/engine/binary/oe-criterion';
import { overallRiskPrecisionAtN } from '@shared/engine/binary/overall-risk-criterion';
import { planBinaryDevelopment } from '@shared/engine/binary/plan-binary-development';
import { sensSpecFromLp } from '@shared/engine/binary/sens-spec-from-lp';
import { criticalZ } from '@shared/engine/helpers/critical-z';
import { seFromCiWidth } from '@shared/engine/helpers/se-from-ci-width';
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

interface Check {
  readonly compute: () => number;
  /** Absolute tolerance for decimals, with the reason it is not 1e−9. */
  readonly tolerance?: { readonly value: number; readonly why: string };
}

const binaryRecords: readonly CheckRecord[] = fixture.records.filter((r) => r.section === 'BD' || r.section === 'BV');

function development(p: number, r2: number, phi: number): BinaryDevelopmentInputs {
  return {
    predictorParameters: p,
    coxSnellR2: r2,
    outcomeProportion: phi,
    targetShrinkage: 0.9,
    optimismMargin: 0.05,
    riskMargin: 0.05,
    confidence: 0.95,
  };
}
const chagasLike = development(24, 0.288, 0.174);
const second = development(10, 0.1, 0.1);
const devN = (inputs: BinaryDevelopmentInputs, id: string): number =>
  planBinaryDevelopment(inputs).criteria.find((c) => c.id === id)?.n ?? Number.NaN;

const fits = new Map<string, NormalLp>();
function lp(phi: number, c: number): NormalLp {
  const key = `${phi}/${c}`;
  const known = fits.get(key);
  if (known) return known;
  const fit = fitNormalLp(phi, c);
  expect(fit.converged, `LP fit for ${key}`).toBe(true);
  fits.set(key, fit.lp);
  return fit.lp;
}
const slopeN = (phi: number, c: number, beta = 1): number =>
  calibrationSlopeSampleSize(calibrationSlopeInformation(lp(phi, c), { intercept: 0, slope: beta }).slopeVariance, 0.051).n ??
  Number.NaN;
const cN = (c: number, phi: number, se: number): number => newcombeSampleSize(c, phi, se).n ?? Number.NaN;
const fromLp = () => sensSpecFromLp(lp(0.1, 0.8), WELL_CALIBRATED, 0.1);

/** The net-benefit criterion at t = 0.1, phi = 0.1, for a target SE (entered sens/spec, or from the phi 0.1 / C 0.8 LP). */
function nbN(o: {
  readonly standardised: boolean;
  readonly se: number;
  readonly sensitivity?: number;
  readonly specificity?: number;
}): number {
  const criterion = netBenefitCriterion({
    threshold: 0.1,
    sensitivity: o.sensitivity,
    specificity: o.specificity,
    lp: { kind: 'fitted', lp: lp(0.1, 0.8), iterations: 0, residual: 0 },
    calibration: WELL_CALIBRATED,
    outcomeProportion: 0.1,
    width: 2 * criticalZ(0.95) * o.se,
    standardised: o.standardised,
    confidence: 0.95,
  });
  return criterion.n ?? Number.NaN;
}

const LP_FIT = {
  value: 2e-6,
  why: 'the reference fits the LP with a 6001-point trapezoid C, biased by −1.3e−7; the engine integrates C to 2e−11, which moves μ and σ by about 1e−6',
};
const SENS_SPEC = {
  value: 2e-4,
  why: 'the reference masks an 80001-point grid at the threshold (error up to 1e−4); the engine splits the integral exactly at the threshold (checked to 1e−9 against adaptive quadrature in reference-fixture.test.ts)',
};

const CHECKS: Readonly<Record<string, Check>> = {
  'P=24,R2cs=.288,phi=.174: n1': { compute: () => devN(chagasLike, 'dev-shrinkage') },
  'P=24,R2cs=.288,phi=.174: n2': { compute: () => devN(chagasLike, 'dev-optimism') },
  'P=24,R2cs=.288,phi=.174: n3': { compute: () => devN(chagasLike, 'dev-overall-risk') },
  'P=24,R2cs=.288,phi=.174: n': { compute: () => planBinaryDevelopment(chagasLike).n ?? Number.NaN },
  'P=24,R2cs=.288,phi=.174: S2': { compute: () => shrinkageForNagelkerkeOptimism(0.288, 0.174, 0.05) },
  'P=24,R2cs=.288,phi=.174: max_r2cs': { compute: () => maxCoxSnellR2(0.174) },
  'P=24,R2cs=.288,phi=.174: events': { compute: () => planBinaryDevelopment(chagasLike).events?.exact ?? Number.NaN },
  'P=24,R2cs=.288,phi=.174: epp': { compute: () => planBinaryDevelopment(chagasLike).eventsPerParameter ?? Number.NaN },
  'P=10,R2cs=.10,phi=.10: n1': { compute: () => devN(second, 'dev-shrinkage') },
  'P=10,R2cs=.10,phi=.10: n2': { compute: () => devN(second, 'dev-optimism') },
  'P=10,R2cs=.10,phi=.10: n3': { compute: () => devN(second, 'dev-overall-risk') },
  'P=10,R2cs=.10,phi=.10: n': { compute: () => planBinaryDevelopment(second).n ?? Number.NaN },
  'max R2cs phi=0.5': { compute: () => maxCoxSnellR2(0.5) },
  'max R2cs phi=0.1': { compute: () => maxCoxSnellR2(0.1) },
  'max R2cs phi=0.01': { compute: () => maxCoxSnellR2(0.01) },
  'R2cs from Nagelkerke .15 at phi=.1': { compute: () => coxSnellFromNagelkerke(0.15, 0.1) },
  'R2cs_adj from R2cs_app=.3,n=500,p=10': { compute: () => adjustedCoxSnellFromApparent(0.3, 500, 10).adjusted },
  'MAPE (van Smeden) n for P=24,phi=.174,MAPE=.05': { compute: () => mapeSampleSize(24, 0.174, 0.05).raw },
  'R2cs from C=0.7,phi=0.1': { compute: () => coxSnellFromCStatistic(0.7, 0.1).coxSnellR2 },
  'R2cs from C=0.8,phi=0.1': { compute: () => coxSnellFromCStatistic(0.8, 0.1).coxSnellR2 },
  'R2cs from C=0.8,phi=0.3': { compute: () => coxSnellFromCStatistic(0.8, 0.3).coxSnellR2 },
  'R2cs from C=0.9,phi=0.1': { compute: () => coxSnellFromCStatistic(0.9, 0.1).coxSnellR2 },
  'R2cs from C=0.75,phi=0.05': { compute: () => coxSnellFromCStatistic(0.75, 0.05).coxSnellR2 },
  'R2cs from C=0.85,phi=0.2': { compute: () => coxSnellFromCStatistic(0.85, 0.2).coxSnellR2 },
  'inverse: S at n=400 (P=24,R2cs=.288)': {
    compute: () => developmentShrinkagePrecisionAtN(chagasLike, 400).achieved ?? Number.NaN,
  },
  'inverse: Nagelkerke optimism at n=400': {
    compute: () => developmentOptimismPrecisionAtN(chagasLike, 400).achieved ?? Number.NaN,
  },
  'inverse: overall risk MOE at n=400, phi=.174': {
    compute: () => overallRiskPrecisionAtN(chagasLike, 400).achieved ?? Number.NaN,
  },
  'O/E phi=0.5 SE .051': { compute: () => oeSampleSize(0.5, 0.051).n ?? Number.NaN },
  'O/E phi=0.1 SE .051': { compute: () => oeSampleSize(0.1, 0.051).n ?? Number.NaN },
  'O/E phi=0.05 SE .051': { compute: () => oeSampleSize(0.05, 0.051).n ?? Number.NaN },
  'O/E phi=0.018 SE .051': { compute: () => oeSampleSize(0.018, 0.051).n ?? Number.NaN },
  'O/E inverse: SE ln(O/E) phi=.1 n=1000': { compute: () => seLnOe(0.1, 1000) },
  'LP N(mu,sd) for phi=0.1,C=0.8: mu': { compute: () => lp(0.1, 0.8).mean, tolerance: LP_FIT },
  'LP N(mu,sd) for phi=0.1,C=0.8: sd': { compute: () => lp(0.1, 0.8).sd, tolerance: LP_FIT },
  'cal slope n (SE .051) phi=0.1,C=0.8': { compute: () => slopeN(0.1, 0.8) },
  'C-stat n (CIwidth .1) phi=0.1,C=0.8': { compute: () => cN(0.8, 0.1, seFromCiWidth(0.1)) },
  'LP N(mu,sd) for phi=0.018,C=0.8: mu': { compute: () => lp(0.018, 0.8).mean, tolerance: LP_FIT },
  'LP N(mu,sd) for phi=0.018,C=0.8: sd': { compute: () => lp(0.018, 0.8).sd, tolerance: LP_FIT },
  'cal slope n (SE .051) phi=0.018,C=0.8': { compute: () => slopeN(0.018, 0.8) },
  'C-stat n (CIwidth .1) phi=0.018,C=0.8': { compute: () => cN(0.8, 0.018, seFromCiWidth(0.1)) },
  'LP N(mu,sd) for phi=0.05,C=0.75: mu': { compute: () => lp(0.05, 0.75).mean, tolerance: LP_FIT },
  'LP N(mu,sd) for phi=0.05,C=0.75: sd': { compute: () => lp(0.05, 0.75).sd, tolerance: LP_FIT },
  'cal slope n (SE .051) phi=0.05,C=0.75': { compute: () => slopeN(0.05, 0.75) },
  'C-stat n (CIwidth .1) phi=0.05,C=0.75': { compute: () => cN(0.75, 0.05, seFromCiWidth(0.1)) },
  'LP N(mu,sd) for phi=0.3,C=0.7: mu': { compute: () => lp(0.3, 0.7).mean, tolerance: LP_FIT },
  'LP N(mu,sd) for phi=0.3,C=0.7: sd': { compute: () => lp(0.3, 0.7).sd, tolerance: LP_FIT },
  'cal slope n (SE .051) phi=0.3,C=0.7': { compute: () => slopeN(0.3, 0.7) },
  'C-stat n (CIwidth .1) phi=0.3,C=0.7': { compute: () => cN(0.7, 0.3, seFromCiWidth(0.1)) },
  'cal slope n (SE .051), true beta=0.9 alpha=0 (phi changes)': { compute: () => slopeN(0.1, 0.8, 0.9) },
  'cal slope inverse SE at n=1500 phi=.1 C=.8': {
    compute: () => Math.sqrt(calibrationSlopeInformation(lp(0.1, 0.8), WELL_CALIBRATED).slopeVariance / 1500),
    tolerance: { value: 1e-7, why: 'the SE inherits the reference LP fit difference (relative 4e−7)' },
  },
  'C-stat inverse SE at n=1500 phi=.1 C=.8': { compute: () => newcombeCStatisticSe(0.8, 0.1, 1500) },
  'phi=.1,C=.8,t=.1: sens': { compute: () => fromLp().sensitivity, tolerance: SENS_SPEC },
  'phi=.1,C=.8,t=.1: spec': { compute: () => fromLp().specificity, tolerance: SENS_SPEC },
  'phi=.1,C=.8,t=.1: NB': {
    compute: () => netBenefitVariance(fromLp().sensitivity, fromLp().specificity, fromLp().outcomeProportion, 0.1).netBenefit,
    tolerance: { value: 2e-5, why: 'inherits the reference grid error in sens (× phi) and spec (× w(1 − phi))' },
  },
  'phi=.1,C=.8,t=.1: sNB': {
    compute: () =>
      netBenefitVariance(fromLp().sensitivity, fromLp().specificity, fromLp().outcomeProportion, 0.1).standardisedNetBenefit,
    tolerance: { value: 2e-4, why: 'NB/phi: the NB tolerance divided by phi 0.1' },
  },
  'sNB n (SE .051)': { compute: () => nbN({ standardised: true, se: 0.051 }) },
  'sNB n fixed sens=.8,spec=.7,phi=.1,t=.1,SE .051': {
    compute: () => nbN({ standardised: true, se: 0.051, sensitivity: 0.8, specificity: 0.7 }),
  },
  'NB (unstd) n fixed sens=.8,spec=.7,phi=.1,t=.1,SE .0051': {
    compute: () => nbN({ standardised: false, se: 0.0051, sensitivity: 0.8, specificity: 0.7 }),
  },
  'Newcombe SE .025 C=0.64,phi=0.3: n': { compute: () => cN(0.64, 0.3, 0.025) },
  'Newcombe SE .025 C=0.64,phi=0.3: events': { compute: () => cN(0.64, 0.3, 0.025) * 0.3 },
  'Newcombe SE .025 C=0.85,phi=0.05: n': { compute: () => cN(0.85, 0.05, 0.025) },
  'Newcombe SE .025 C=0.85,phi=0.05: events': { compute: () => cN(0.85, 0.05, 0.025) * 0.05 },
};

describe('binary check values of the reference table (test/fixtures/check-values)', () => {
  it('the fixture holds 62 binary records (27 development, 35 validation) and every one has a check here', () => {
    expect(binaryRecords.filter((r) => r.section === 'BD')).toHaveLength(27);
    expect(binaryRecords.filter((r) => r.section === 'BV')).toHaveLength(35);
    expect(binaryRecords.map((r) => r.description).sort()).toEqual(Object.keys(CHECKS).sort());
  });

  for (const record of binaryRecords) {
    const check = CHECKS[record.description];
    const note = check?.tolerance ? `; within ${check.tolerance.value} because ${check.tolerance.why}` : '';
    it(`${record.section} ${record.description} = ${record.printed} [${record.tag}] ${record.source}${note}`, () => {
      if (check === undefined) throw new Error(`no check for ${record.description}`);
      const value = check.compute();
      if (record.integer) expect(value).toBe(record.value);
      else
        expectClose(
          value,
          record.value,
          check.tolerance?.value ?? 1e-9 * Math.max(1, Math.abs(record.value)),
          record.description,
        );
    });
  }
});
