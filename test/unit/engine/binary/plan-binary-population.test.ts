// The top-level binary plan: which criteria it lists, the binding one, events, the inverse at a
// fixed n, not-assessable and not-converged criteria, and warnings. Expected numbers are check
// values computed with an independent reference implementation (scipy) (METHODS 5 and section 10).
import { describe, expect, it } from 'vitest';
import type { BinaryPopulationInput, BinaryPrecision } from '@shared/engine/binary/binary-population-input';
import { DEFAULT_BINARY_PRECISION } from '@shared/engine/binary/binary-population-input';
import { calibrationSlopeCriterion } from '@shared/engine/binary/calibration-slope-criterion';
import { WELL_CALIBRATED } from '@shared/engine/binary/lp-distribution';
import { binaryPrecisionAtN, planBinaryPopulation } from '@shared/engine/binary/plan-binary-population';
import { planTotals } from '@shared/engine/binary/plan-totals';
import { criticalZ } from '@shared/engine/helpers/critical-z';
import { expectClose } from '../../helpers/expect-close';

const z = criticalZ(0.95);
/** Targets whose SE* is exactly 0.051 (O/E, slope, sNB) and a C width of 0.1, as in the check values. */
const se051: BinaryPrecision = {
  confidence: 0.95,
  oe: { width: 2 * Math.sinh(0.051 * z) },
  slope: { width: 2 * z * 0.051 },
  cStatistic: { width: 0.1 },
  netBenefit: { width: 2 * z * 0.051, standardised: true },
};
const methodsExample: BinaryPopulationInput = {
  anticipated: {
    outcomeProportion: 0.1,
    cStatistic: 0.8,
    thresholds: [{ threshold: 0.1 }, { threshold: 0.2, sensitivity: 0.6, specificity: 0.85 }],
  },
  precision: se051,
};
const nOf = (plan: { criteria: readonly { id: string; n: number | null }[] }, id: string) =>
  plan.criteria.find((c) => c.id === id)?.n;

describe('planBinaryPopulation: phi 0.1, C 0.8 (check values computed with an independent reference implementation (scipy))', () => {
  const plan = planBinaryPopulation(methodsExample);

  it('lists oe, slope, c-statistic and one net-benefit criterion per threshold, in that order', () => {
    expect(plan.criteria.map((c) => c.id)).toEqual(['oe', 'slope', 'c-statistic', 'net-benefit@0.1', 'net-benefit@0.2']);
  });

  it('O/E 3461, calibration slope 4291, C-statistic 836, sNB at 0.1 from the LP 1183: the slope binds at 4291 with 429.1 (430) events', () => {
    expect(nOf(plan, 'oe')).toBe(3461);
    expect(nOf(plan, 'slope')).toBe(4291);
    expect(nOf(plan, 'c-statistic')).toBe(836);
    expect(nOf(plan, 'net-benefit@0.1')).toBe(1183);
    expect(plan.n).toBe(4291);
    expect(plan.bindingId).toBe('slope');
    expectClose(plan.events?.exact ?? Number.NaN, 429.1, 1e-9, 'events');
    expect(plan.events?.whole).toBe(430);
    expect(plan.eventsPerParameter).toBeNull();
  });

  it('reports the fitted LP (μ −2.776997, σ 1.288256) in the plan and as intermediates of the slope criterion', () => {
    expect(plan.lp?.source).toBe('fitted');
    expectClose(plan.lp?.mean ?? Number.NaN, -2.7769973, 1e-6, 'μ');
    expectClose(plan.lp?.sd ?? Number.NaN, 1.2882557, 1e-6, 'σ');
    const names = plan.criteria.find((c) => c.id === 'slope')?.intermediates.map((i) => i.name) ?? [];
    expect(names).toEqual(
      expect.arrayContaining([
        'LP mean (fitted to outcome proportion and C)',
        'LP SD (fitted to outcome proportion and C)',
        'n·Var(slope) = [I⁻¹]₂₂',
      ]),
    );
  });

  it('every sized criterion shows its expected events at n as the last intermediate', () => {
    for (const c of plan.criteria) {
      const last = c.intermediates[c.intermediates.length - 1];
      expect(last?.name).toBe('expected events at n');
      expectClose(last?.value ?? Number.NaN, (c.n ?? Number.NaN) * 0.1, 1e-9, `${c.id} events`);
    }
  });

  it('names the O/E CI convention in the target text (width around 1 → asinh; limits → ln U − ln L)', () => {
    expect(plan.criteria[0]?.target).toMatch(/centred at O\/E = 1, SE\* = asinh\(W\/2\)\/z/);
    const limits = planBinaryPopulation({ ...methodsExample, precision: { ...se051, oe: { lower: 0.9, upper: 1.1 } } });
    expect(limits.criteria[0]?.target).toMatch(/limits 0\.9–1\.1, SE\* = \(ln U − ln L\)\/\(2z\)/);
    expect(nOf(limits, 'oe')).toBe(3435); // SE* 0.051192 (METHODS 1.2) → ⌈0.9/(0.1·0.051192²)⌉
  });

  it('entered sensitivity and specificity are used as given (no LP intermediates)', () => {
    const nb = plan.criteria.find((c) => c.id === 'net-benefit@0.2');
    expect(nb?.intermediates.some((i) => i.name.includes('from the LP'))).toBe(false);
    expect(nb?.label).toBe('Precise standardised net benefit at threshold 0.2');
  });
});

describe('planBinaryPopulation: miscalibration, given LP, and the development minimums', () => {
  it('anticipated calibration slope 0.9 on the phi 0.1 / C 0.8 LP needs 3557 for the slope (check value, scipy)', () => {
    const plan = planBinaryPopulation({
      ...methodsExample,
      anticipated: { outcomeProportion: 0.1, cStatistic: 0.8, calibrationSlope: 0.9 },
    });
    expect(nOf(plan, 'slope')).toBe(3557);
  });

  it('a given LP gives the C-statistic from the LP when none is anticipated, and shows it', () => {
    const plan = planBinaryPopulation({
      anticipated: { outcomeProportion: 0.1, lpMean: -2.7769973, lpSd: 1.2882557 },
      precision: se051,
    });
    expect(plan.lp?.source).toBe('given');
    const c = plan.criteria.find((x) => x.id === 'c-statistic');
    expectClose(
      c?.intermediates.find((i) => i.name === 'C-statistic implied by the LP distribution')?.value ?? Number.NaN,
      0.8,
      1e-7,
      'C from LP',
    );
    expect(c?.n).toBe(836);
    expect(nOf(plan, 'slope')).toBe(4291);
  });

  it('a C of 0.995 is accepted with a given LP (no fit), but refused when the LP must be fitted from it', () => {
    expect(() =>
      planBinaryPopulation({ anticipated: { outcomeProportion: 0.1, cStatistic: 0.995, lpMean: -4, lpSd: 4 }, precision: se051 }),
    ).not.toThrow();
    expect(() => planBinaryPopulation({ anticipated: { outcomeProportion: 0.1, cStatistic: 0.995 }, precision: se051 })).toThrow(
      /below 0\.99 when the LP distribution is derived/,
    );
  });

  it('with the development minimums (P 24, R²_CS 0.288, phi 0.174) the plan adds 623 / 662 / 221 and reports EPP at the overall n', () => {
    const plan = planBinaryPopulation(
      { anticipated: { outcomeProportion: 0.174, cStatistic: 0.8 }, precision: DEFAULT_BINARY_PRECISION },
      { development: { predictorParameters: 24, coxSnellR2: 0.288 } },
    );
    expect(plan.criteria.slice(-3).map((c) => [c.id, c.n])).toEqual([
      ['dev-shrinkage', 623],
      ['dev-optimism', 662],
      ['dev-overall-risk', 221],
    ]);
    expect(plan.criteria.slice(-3).every((c) => c.purpose === 'development')).toBe(true);
    expectClose(plan.eventsPerParameter ?? Number.NaN, ((plan.n ?? 0) * 0.174) / 24, 1e-9, 'EPP');
  });
});

describe('not-assessable and not-converged criteria', () => {
  it('without C or an LP: slope, C-statistic and LP-based net benefit are not assessable (reason given) and O/E alone sets n', () => {
    const plan = planBinaryPopulation({
      anticipated: { outcomeProportion: 0.1, thresholds: [{ threshold: 0.1 }] },
      precision: se051,
    });
    for (const id of ['slope', 'c-statistic', 'net-benefit@0.1']) {
      const c = plan.criteria.find((x) => x.id === id);
      expect(c?.status).toBe('not-assessable');
      expect(c?.reason).toMatch(/needs/);
    }
    expect(plan.n).toBe(3461);
    expect(plan.bindingId).toBe('oe');
    expect(plan.lp).toBeNull();
  });

  it('a failed LP fit makes the slope not-converged with the reason, and then no n is stated', () => {
    const slope = calibrationSlopeCriterion({
      lp: { kind: 'not-converged', reason: 'LP fit did not converge: no convergence within 60 iterations' },
      calibration: WELL_CALIBRATED,
      width: 0.2,
      confidence: 0.95,
      outcomeProportion: 0.1,
    });
    expect(slope.status).toBe('not-converged');
    expect(slope.n).toBeNull();
    expect(slope.reason).toMatch(/did not converge/);
    const oe = planBinaryPopulation({ anticipated: { outcomeProportion: 0.1 }, precision: se051 }).criteria[0];
    if (oe === undefined) throw new Error('no O/E criterion');
    const totals = planTotals([oe, slope], 0.1, null);
    expect(totals.n).toBeNull();
    expect(totals.bindingId).toBeNull();
  });

  it('a threshold beyond almost all predicted risks makes that net-benefit criterion not assessable, saying why', () => {
    const plan = planBinaryPopulation({
      anticipated: { outcomeProportion: 0.01, cStatistic: 0.6, thresholds: [{ threshold: 0.95 }] },
      precision: se051,
    });
    const nb = plan.criteria.find((c) => c.id === 'net-benefit@0.95');
    expect(nb?.status).toBe('not-assessable');
    expect(nb?.reason).toMatch(/almost nobody or almost everybody/);
  });
});

describe('warnings', () => {
  it('warns when fewer than 100 events are expected at the required n', () => {
    const plan = planBinaryPopulation({
      anticipated: { outcomeProportion: 0.3, cStatistic: 0.7 },
      precision: { ...DEFAULT_BINARY_PRECISION, oe: { width: 0.6 }, slope: { width: 1.2 }, cStatistic: { width: 0.3 } },
    });
    expect((plan.n ?? 0) * 0.3).toBeLessThan(100);
    expect(plan.warnings.join(' ')).toMatch(/fewer than 100 events/);
  });

  it('warns when a given LP implies an outcome proportion far from the anticipated one', () => {
    const plan = planBinaryPopulation({ anticipated: { outcomeProportion: 0.1, lpMean: -1, lpSd: 1 }, precision: se051 });
    expect(plan.warnings.join(' ')).toMatch(/imply an outcome proportion of 0\.303\d*, not the anticipated 0\.1/);
  });
});

describe('binaryPrecisionAtN: what a fixed n delivers (check values computed with an independent reference implementation (scipy))', () => {
  it('phi 0.1, C 0.8 at n 1500: SE ln(O/E) 0.07746, SE(slope) 0.086250, SE(C) 0.019038, each with its CI width and whether it meets the target', () => {
    const at = binaryPrecisionAtN(methodsExample, 1500);
    expect(at.map((p) => p.id)).toEqual(['oe', 'slope', 'c-statistic', 'net-benefit@0.1', 'net-benefit@0.2']);
    const byId = (id: string) => at.find((p) => p.id === id);
    expectClose(byId('oe')?.se ?? Number.NaN, Math.sqrt(0.9 / 150), 1e-12, 'SE ln(O/E)');
    expectClose(byId('slope')?.se ?? Number.NaN, 0.08625, 1e-6, 'SE(slope)');
    expectClose(byId('slope')?.achieved ?? Number.NaN, 2 * z * 0.0862496, 1e-6, 'slope CI width');
    expectClose(byId('c-statistic')?.se ?? Number.NaN, 0.019038, 1e-6, 'SE(C)');
    expect(at.map((p) => p.meets)).toEqual([false, false, true, true, false]);
  });

  it('at the required n each criterion (development ones included) just meets its target, and one participant fewer does not', () => {
    const options = { development: { predictorParameters: 24, coxSnellR2: 0.05 } };
    const plan = planBinaryPopulation(methodsExample, options);
    expect(plan.criteria).toHaveLength(8);
    for (const c of plan.criteria) {
      const n = c.n ?? 0;
      expect(binaryPrecisionAtN(methodsExample, n, options).find((p) => p.id === c.id)?.meets, `${c.id} at ${n}`).toBe(true);
      expect(binaryPrecisionAtN(methodsExample, n - 1, options).find((p) => p.id === c.id)?.meets, `${c.id} at ${n - 1}`).toBe(
        false,
      );
    }
  });

  it('the plan carries the same list when options.availableN is given', () => {
    const plan = planBinaryPopulation(methodsExample, { availableN: 1500 });
    expect(plan.precisionAtN).toEqual(binaryPrecisionAtN(methodsExample, 1500));
  });
});
