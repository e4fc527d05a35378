// Properties that must hold for every valid input (fast-check): a narrower target never needs
// fewer participants; n is always a finite positive integer (or explicitly out of reach); the
// precision at the computed n meets the target and at n − 1 it does not.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { ContinuousDevelopmentInputs, ContinuousValidationInputs } from '@shared/engine/continuous/continuous-inputs';
import { developmentSizes, validationSizes } from '@shared/engine/continuous/continuous-sizes';
import {
  developmentPrecisionAtN,
  evaluateContinuousDevelopment,
  evaluateContinuousValidation,
  validationPrecisionAtN,
} from '@shared/engine/continuous/evaluate-continuous';
import type { CriterionResult } from '@shared/engine/types';

const RUNS = 300;

const level = fc.constantFrom(0.8, 0.9, 0.95, 0.975, 0.99, 0.999);
const unit = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
const logUniform = (min: number, max: number) => unit(Math.log(min), Math.log(max)).map(Math.exp);

/** Realistic validation inputs: every criterion should be sizeable (no target out of reach). */
const validationArb: fc.Arbitrary<ContinuousValidationInputs> = fc
  .record({
    rSquared: unit(0.01, 0.99),
    outcomeVariance: logUniform(1e-4, 1e4),
    rSquaredCitl: unit(0.01, 0.99),
    rSquaredSlope: unit(0.01, 0.99),
    slope: fc.oneof(unit(0.2, 3), unit(-3, -0.2)),
    confidence: level,
    r2Width: unit(0.02, 0.5),
    citlFraction: unit(0.01, 2),
    slopeWidth: unit(0.02, 2),
    residualSdMargin: unit(1.02, 3),
  })
  .map(({ citlFraction, ...v }) => ({ ...v, citlWidth: citlFraction * Math.sqrt(v.outcomeVariance) }));

const developmentArb: fc.Arbitrary<ContinuousDevelopmentInputs> = fc
  .record({
    predictorParameters: fc.integer({ min: 1, max: 200 }),
    adjustedRSquared: unit(0.01, 0.95),
    targetShrinkage: unit(0.5, 0.99),
    optimismMargin: unit(0.005, 0.3),
    residualSdMargin: unit(1.02, 3),
    confidence: level,
    shrinkageForm: fc.constantFrom('adjusted-r2-link' as const, 'closed-form' as const),
    outcomeMean: fc.oneof(
      logUniform(0.01, 1e3),
      logUniform(0.01, 1e3).map((x) => -x),
    ),
    sdFraction: unit(0.05, 5),
  })
  .map(({ sdFraction, ...d }) => ({ ...d, outcomeSd: sdFraction * Math.abs(d.outcomeMean) }));

function expectSized(r: CriterionResult): void {
  if (r.status === 'not-assessable') {
    expect(r.n).toBeNull();
    expect(r.reason, r.id).toBeTruthy();
    return;
  }
  expect(['ok', 'always-met'], `${r.id}: ${r.reason ?? ''}`).toContain(r.status);
  expect(Number.isSafeInteger(r.n) && (r.n ?? 0) >= 1, `${r.id} n = ${String(r.n)}`).toBe(true);
}

describe('n is a finite positive integer for every valid input', () => {
  it('for realistic validation and development inputs every criterion is sized (or, by design, not assessable)', () => {
    fc.assert(
      fc.property(validationArb, developmentArb, (v, d) => {
        evaluateContinuousValidation(v).forEach(expectSized);
        evaluateContinuousDevelopment(d).forEach(expectSized);
      }),
      { numRuns: RUNS },
    );
  });

  it('over the whole admissible domain the answer is an integer or an explicit "not reached", never NaN, Infinity or a throw', () => {
    const anyPositive = fc.double({ min: 1e-300, max: 1e300, noNaN: true, noDefaultInfinity: true });
    const open = fc.double({ min: Number.EPSILON, max: 1 - Number.EPSILON, noNaN: true });
    const wide = fc.record({
      rSquared: open,
      outcomeVariance: anyPositive,
      rSquaredCitl: open,
      rSquaredSlope: open,
      slope: fc.oneof(fc.double({ min: 1e-300, max: 100, noNaN: true }), fc.double({ min: -100, max: -1e-300, noNaN: true })),
      confidence: open,
      r2Width: anyPositive,
      citlWidth: anyPositive,
      slopeWidth: anyPositive,
      residualSdMargin: fc.double({ min: 1 + 1e-12, max: 10, noNaN: true }),
    });
    fc.assert(
      fc.property(wide, (v) => {
        for (const r of evaluateContinuousValidation(v)) {
          if (r.status === 'not-converged') {
            expect(r.n).toBeNull();
            expect(r.reason).toMatch(/100,000,000/);
          } else expectSized(r);
          for (const x of r.intermediates) expect(Number.isFinite(x.value), `${r.id} ${x.name}`).toBe(true);
        }
      }),
      { numRuns: RUNS },
    );
  });
});

describe('n never decreases as a target narrows', () => {
  const pair = (min: number, max: number) =>
    fc.tuple(unit(min, max), unit(min, max)).map(([a, b]) => [Math.min(a, b), Math.max(a, b)] as const);
  const nAt = (sizes: readonly { id: string; n: number | null }[], id: string): number =>
    sizes.find((s) => s.id === id)?.n ?? Number.NaN;

  it('validation: narrower CI widths and a smaller margin never need fewer participants', () => {
    fc.assert(
      fc.property(validationArb, pair(0.02, 0.5), pair(0.02, 2), pair(0.01, 2), pair(1.02, 3), (v, r2w, sw, cw, m) => {
        const sd = Math.sqrt(v.outcomeVariance);
        const narrow = validationSizes({
          ...v,
          r2Width: r2w[0],
          slopeWidth: sw[0],
          citlWidth: cw[0] * sd,
          residualSdMargin: m[0],
        });
        const wide = validationSizes({ ...v, r2Width: r2w[1], slopeWidth: sw[1], citlWidth: cw[1] * sd, residualSdMargin: m[1] });
        for (const id of ['r2', 'citl', 'slope', 'residual-sd-citl', 'residual-sd-slope']) {
          expect(nAt(narrow, id), id).toBeGreaterThanOrEqual(nAt(wide, id));
        }
      }),
      { numRuns: RUNS },
    );
  });

  it('validation and development: a higher confidence level never needs fewer participants', () => {
    fc.assert(
      fc.property(validationArb, developmentArb, fc.tuple(level, level), (v, d, [a, b]) => {
        const [lo, hi] = [Math.min(a, b), Math.max(a, b)];
        const sizes = (c: number) => [...validationSizes({ ...v, confidence: c }), ...developmentSizes({ ...d, confidence: c })];
        const low = sizes(lo);
        const high = sizes(hi);
        high.forEach((s, i) => {
          if (s.n !== null && low[i]?.n !== null) expect(s.n, s.id).toBeGreaterThanOrEqual(low[i]?.n ?? 0);
        });
      }),
      { numRuns: RUNS },
    );
  });

  it('development: more shrinkage, less optimism and a smaller margin never need fewer participants', () => {
    fc.assert(
      fc.property(developmentArb, pair(0.5, 0.99), pair(0.005, 0.3), pair(1.02, 3), (d, s, o, m) => {
        const strict = developmentSizes({ ...d, targetShrinkage: s[1], optimismMargin: o[0], residualSdMargin: m[0] });
        const loose = developmentSizes({ ...d, targetShrinkage: s[0], optimismMargin: o[1], residualSdMargin: m[1] });
        strict.forEach((c, i) => {
          const other = loose[i]?.n ?? null;
          if (c.n !== null && other !== null) expect(c.n, c.id).toBeGreaterThanOrEqual(other);
          // Stricter shrinkage can push the closed form out of its domain (R² ≥ S), never the reverse.
          if (c.status === 'not-assessable') expect(c.id === 'dev-shrinkage' || loose[i]?.status === 'not-assessable').toBe(true);
        });
      }),
      { numRuns: RUNS },
    );
  });
});

describe('the precision at the computed n meets the target, and at n − 1 it does not', () => {
  const check = (results: readonly CriterionResult[], at: (n: number) => readonly { id: string; meets: boolean | null }[]) => {
    for (const r of results) {
      if (r.n === null) continue;
      const here = at(r.n).find((p) => p.id === r.id);
      expect(here?.meets, `${r.id} at n = ${r.n}`).toBe(true);
      if (r.status === 'ok') {
        const before = at(r.n - 1).find((p) => p.id === r.id);
        expect(before?.meets, `${r.id} at n − 1 = ${r.n - 1}`).toBe(false);
      }
    }
  };

  it('for every validation criterion', () => {
    fc.assert(
      fc.property(validationArb, (v) => check(evaluateContinuousValidation(v), (n) => validationPrecisionAtN(v, n))),
      { numRuns: RUNS },
    );
  });

  it('and the achieved CI widths bracket the target: within it at n, beyond it at n − 1 (to 1e−6, float slack)', () => {
    fc.assert(
      fc.property(validationArb, (v) => {
        for (const r of evaluateContinuousValidation(v).slice(0, 3)) {
          if (r.status !== 'ok' || r.n === null) continue;
          const index = ['r2', 'citl', 'slope'].indexOf(r.id);
          const at = validationPrecisionAtN(v, r.n)[index];
          const before = validationPrecisionAtN(v, r.n - 1)[index];
          expect(at?.achieved ?? Number.NaN, r.id).toBeLessThanOrEqual((at?.targetValue ?? 0) * (1 + 1e-6));
          expect(before?.achieved ?? Number.NaN, r.id).toBeGreaterThanOrEqual((before?.targetValue ?? 0) * (1 - 1e-6));
        }
      }),
      { numRuns: RUNS },
    );
  });

  it('for every development criterion, in both shrinkage forms', () => {
    fc.assert(
      fc.property(developmentArb, (d) => check(evaluateContinuousDevelopment(d), (n) => developmentPrecisionAtN(d, n))),
      { numRuns: RUNS },
    );
  });
});
