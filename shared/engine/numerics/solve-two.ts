/** Two equations in two unknowns, F(x, y) = (f₁, f₂); the solver looks for F = (0, 0). */
export type TwoEquations = (x: number, y: number) => readonly [number, number];

export interface SolveTwoOptions {
  /** Converged when max(|f₁|, |f₂|) ≤ tolerance. Default 1e-12. */
  readonly tolerance?: number;
  /** Newton iterations allowed. Default 100. */
  readonly maxIterations?: number;
  /** Finite-difference step relative to max(1, |x|). Default 1e-7. */
  readonly relativeStep?: number;
  /** Step halvings allowed per iteration in the line search. Default 40. */
  readonly maxHalvings?: number;
}

export interface SolveTwoResult {
  readonly x: number;
  readonly y: number;
  /** max(|f₁|, |f₂|) at (x, y). */
  readonly residual: number;
  readonly converged: boolean;
  readonly iterations: number;
  /** Why the solver stopped without converging. */
  readonly reason?: string;
}

/**
 * Damped Newton's method for two equations: the Jacobian is approximated by forward differences,
 * the Newton step solves J·d = −F by Cramer's rule, and the step is halved until the sum of
 * squared residuals falls (Armijo condition with constant 1e-4).
 * Common practice (Dennis & Schnabel, Numerical Methods for Unconstrained Optimization and
 * Nonlinear Equations, 1983, ch. 6).
 * Domain: a start where F is finite. Never returns a wrong root silently: it stops with
 * converged = false and a reason when the Jacobian is singular, F is not finite, the line search
 * cannot reduce the residual, or the iteration cap is reached.
 * Accuracy: the residual tolerance (default 1e-12); the root itself is as accurate as the
 * conditioning of F allows.
 * @example solveTwo((x, y) => [x + y - 3, x - y - 1], [0, 0]) // x 2, y 1, converged true
 */
export function solveTwo(f: TwoEquations, start: readonly [number, number], options: SolveTwoOptions = {}): SolveTwoResult {
  const tolerance = options.tolerance ?? 1e-12;
  const maxIterations = options.maxIterations ?? 100;
  const relativeStep = options.relativeStep ?? 1e-7;
  const maxHalvings = options.maxHalvings ?? 40;
  let x = start[0];
  let y = start[1];
  let [f1, f2] = f(x, y);
  if (!Number.isFinite(x) || !Number.isFinite(y) || !Number.isFinite(f1) || !Number.isFinite(f2)) {
    return {
      x,
      y,
      residual: Number.NaN,
      converged: false,
      iterations: 0,
      reason: 'the equations are not finite at the starting point',
    };
  }
  const stop = (iterations: number, reason?: string): SolveTwoResult => {
    const residual = Math.max(Math.abs(f1), Math.abs(f2));
    return reason === undefined
      ? { x, y, residual, converged: true, iterations }
      : { x, y, residual, converged: false, iterations, reason };
  };
  for (let iteration = 0; iteration <= maxIterations; iteration++) {
    if (Math.max(Math.abs(f1), Math.abs(f2)) <= tolerance) return stop(iteration);
    if (iteration === maxIterations) break;
    const hx = relativeStep * Math.max(1, Math.abs(x));
    const hy = relativeStep * Math.max(1, Math.abs(y));
    const [a1, a2] = f(x + hx, y);
    const [b1, b2] = f(x, y + hy);
    const j11 = (a1 - f1) / hx;
    const j21 = (a2 - f2) / hx;
    const j12 = (b1 - f1) / hy;
    const j22 = (b2 - f2) / hy;
    const det = j11 * j22 - j12 * j21;
    const scale = Math.abs(j11 * j22) + Math.abs(j12 * j21);
    if (!Number.isFinite(det) || !(Math.abs(det) > 1e-14 * scale))
      return stop(iteration, 'the Jacobian is singular or not finite');
    const dx = (-f1 * j22 + f2 * j12) / det;
    const dy = (-f2 * j11 + f1 * j21) / det;
    const current = f1 * f1 + f2 * f2;
    let lambda = 1;
    let accepted = false;
    for (let halving = 0; halving <= maxHalvings; halving++) {
      const nx = x + lambda * dx;
      const ny = y + lambda * dy;
      const [g1, g2] = f(nx, ny);
      const trial = g1 * g1 + g2 * g2;
      if (Number.isFinite(trial) && trial <= (1 - 1e-4 * lambda) * current) {
        x = nx;
        y = ny;
        f1 = g1;
        f2 = g2;
        accepted = true;
        break;
      }
      lambda /= 2;
    }
    if (!accepted)
      return stop(
        iteration + 1,
        'the line search could not reduce the residual (no root nearby, or the tolerance is below the noise in the equations)',
      );
  }
  return stop(maxIterations, `no convergence within ${maxIterations} iterations`);
}
