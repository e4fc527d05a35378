import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { solveTwo } from '@shared/engine/numerics/solve-two';
import { expectClose } from '../../helpers/expect-close';

describe('solveTwo (damped Newton with a finite-difference Jacobian)', () => {
  it('solves a linear system exactly: x + y = 3, x − y = 1 → (2, 1)', () => {
    const r = solveTwo((x, y) => [x + y - 3, x - y - 1], [0, 0]);
    expect(r.converged).toBe(true);
    expectClose(r.x, 2, 1e-10, 'x');
    expectClose(r.y, 1, 1e-10, 'y');
    expect(r.residual).toBeLessThanOrEqual(1e-12);
  });

  it('finds the intersection of a circle and a line from a distant start: x² + y² = 4, y = x → (√2, √2)', () => {
    const r = solveTwo((x, y) => [x * x + y * y - 4, y - x], [10, 3]);
    expect(r.converged).toBe(true);
    expectClose(r.x, Math.SQRT2, 1e-10, 'x');
    expectClose(r.y, Math.SQRT2, 1e-10, 'y');
  });

  it('needs damping for exp: e^x = 2, e^y = 3 from (−20, 15) (a full Newton step overshoots)', () => {
    const r = solveTwo((x, y) => [Math.exp(x) - 2, Math.exp(y) - 3], [-20, 15], { maxIterations: 200 });
    expect(r.converged).toBe(true);
    expectClose(r.x, Math.log(2), 1e-10, 'x');
    expectClose(r.y, Math.log(3), 1e-10, 'y');
  });

  it('reports non-convergence with a reason when there is no root: x² + 1 = 0, y = 0', () => {
    const r = solveTwo((x, y) => [x * x + 1, y], [0.5, 0.5]);
    expect(r.converged).toBe(false);
    expect(r.reason).toMatch(/line search|singular|iterations/);
  });

  it('reports a singular Jacobian: both equations depend on x + y only', () => {
    const r = solveTwo((x, y) => [x + y - 1, 2 * (x + y) - 3], [0, 0]);
    expect(r.converged).toBe(false);
    expect(r.reason).toMatch(/singular/);
  });

  it('reports the iteration cap', () => {
    const r = solveTwo((x, y) => [Math.exp(x) - 2, Math.exp(y) - 3], [-20, 15], { maxIterations: 2 });
    expect(r.converged).toBe(false);
    expect(r.reason).toMatch(/within 2 iterations/);
    expect(r.iterations).toBe(2);
  });

  it('refuses a start where the equations are not finite', () => {
    const r = solveTwo((x, y) => [Math.log(x), y], [-1, 0]);
    expect(r.converged).toBe(false);
    expect(r.reason).toMatch(/not finite/);
  });

  it('property: recovers the root of a random well-conditioned nonlinear system', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -5, max: 5, noNaN: true }),
        fc.double({ min: -5, max: 5, noNaN: true }),
        fc.double({ min: 0.5, max: 3, noNaN: true }),
        (rx, ry, k) => {
          // F = (x − rx + 0.1·sin(y − ry), k·(y − ry) + 0.1·(x − rx)³): unique root at (rx, ry).
          const f = (x: number, y: number): readonly [number, number] => [
            x - rx + 0.1 * Math.sin(y - ry),
            k * (y - ry) + 0.1 * (x - rx) ** 3,
          ];
          const r = solveTwo(f, [0, 0], { maxIterations: 200 });
          expect(r.converged).toBe(true);
          expectClose(r.x, rx, 1e-9, 'x');
          expectClose(r.y, ry, 1e-9, 'y');
        },
      ),
      { numRuns: 100 },
    );
  });
});
