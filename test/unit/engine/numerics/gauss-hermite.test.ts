// Probabilists' Gauss–Hermite rules against numpy's hermegauss (an independent implementation,
// Golub–Welsch with Newton polishing) and against exact normal moments.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import fixture from '../../../fixtures/binary/binary-reference.json';
import { DomainError } from '@shared/engine/errors';
import { GAUSS_HERMITE_MAX_NODES, gaussHermiteRule } from '@shared/engine/numerics/gauss-hermite';
import { expectClose } from '../../helpers/expect-close';

interface RuleRecord {
  readonly count: number;
  readonly nodes: readonly number[];
  readonly weights: readonly number[];
  readonly source: string;
}

const rules: readonly RuleRecord[] = fixture.gaussHermite;

/** (2k − 1)!! = E[Z^(2k)] for Z ~ N(0, 1). */
function doubleFactorial(k: number): number {
  let v = 1;
  for (let j = 2 * k - 1; j > 1; j -= 2) v *= j;
  return v;
}

function expectation(count: number, g: (z: number) => number): number {
  const { nodes, weights } = gaussHermiteRule(count);
  let total = 0;
  for (let k = 0; k < nodes.length; k++) total += (weights[k] ?? 0) * g(nodes[k] ?? 0);
  return total;
}

describe('gaussHermiteRule against numpy hermegauss (computed with an independent reference implementation (numpy hermegauss))', () => {
  it('the fixture holds the 12 node counts it was generated for', () => {
    expect(rules.map((r) => r.count)).toEqual([1, 2, 3, 4, 5, 10, 20, 32, 64, 100, 200, 300]);
  });

  for (const rec of rules) {
    it(`${rec.count} nodes: every node within 1e−12·max(1, |x|) and every weight within 1e−11 relative (or 1e−300 absolute)`, () => {
      const rule = gaussHermiteRule(rec.count);
      expect(rule.converged).toBe(true);
      expect(rule.nodes.length).toBe(rec.count);
      rec.nodes.forEach((x, k) =>
        expectClose(rule.nodes[k] ?? Number.NaN, x, 1e-12 * Math.max(1, Math.abs(x)), `node ${k} of ${rec.count}`),
      );
      // Tolerance: the extreme weights (down to 1e−250) are tiny differences of huge recurrence values;
      // both implementations agree to about 1e−12 relative there.
      rec.weights.forEach((w, k) =>
        expectClose(rule.weights[k] ?? Number.NaN, w, Math.max(1e-11 * w, 1e-300), `weight ${k} of ${rec.count}`),
      );
    });
  }
});

describe('gaussHermiteRule integrates normal moments (exact by construction up to degree 2n − 1)', () => {
  it('E[Z^(2k)] = (2k − 1)!! for every 2k ≤ 2n − 1, to 1e−12 relative, for n = 5, 20, 64, 200', () => {
    for (const n of [5, 20, 64, 200]) {
      for (let k = 0; 2 * k <= Math.min(2 * n - 1, 40); k++) {
        const exact = doubleFactorial(k);
        expectClose(
          expectation(n, (z) => z ** (2 * k)),
          exact,
          1e-12 * exact,
          `E[Z^${2 * k}] with ${n} nodes`,
        );
      }
    }
  });

  it('odd moments vanish (the rule is symmetric)', () => {
    for (const n of [4, 7, 200])
      expectClose(
        expectation(n, (z) => z ** 3 + z),
        0,
        1e-13,
        `odd moment with ${n} nodes`,
      );
  });

  it('property: E[exp(tZ)] = exp(t²/2) and E[cos(tZ)] = exp(−t²/2) with 200 nodes, for |t| ≤ 3', () => {
    fc.assert(
      fc.property(fc.double({ min: -3, max: 3, noNaN: true }), (t) => {
        expectClose(
          expectation(200, (z) => Math.exp(t * z)),
          Math.exp((t * t) / 2),
          1e-12 * Math.exp((t * t) / 2),
          `E exp(${t}Z)`,
        );
        expectClose(
          expectation(200, (z) => Math.cos(t * z)),
          Math.exp((-t * t) / 2),
          1e-13,
          `E cos(${t}Z)`,
        );
      }),
      { numRuns: 50 },
    );
  });

  it('weights are positive and sum to 1, nodes strictly increasing, for every count 1…60 and 400', () => {
    for (const n of [...Array.from({ length: 60 }, (_, i) => i + 1), GAUSS_HERMITE_MAX_NODES]) {
      const rule = gaussHermiteRule(n);
      expect(rule.converged, `${n} nodes converged`).toBe(true);
      let sum = 0;
      for (let k = 0; k < n; k++) {
        sum += rule.weights[k] ?? Number.NaN;
        expect(rule.weights[k] ?? -1).toBeGreaterThanOrEqual(0);
        if (k > 0) expect(rule.nodes[k] ?? Number.NaN).toBeGreaterThan(rule.nodes[k - 1] ?? Number.NaN);
      }
      expectClose(sum, 1, 1e-12, `weight sum for ${n} nodes`);
    }
  });

  it('caches the rule per node count (the same object comes back)', () => {
    expect(gaussHermiteRule(200)).toBe(gaussHermiteRule(200));
  });

  it('refuses node counts that are not whole numbers from 1 to 400', () => {
    for (const bad of [0, -3, 2.5, 401, Number.NaN]) expect(() => gaussHermiteRule(bad)).toThrow(DomainError);
    expect(() => gaussHermiteRule(401)).toThrow(/node count = 401 .*1 to 400/);
  });
});
