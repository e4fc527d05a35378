/** Outcome of an iterative search: the value, and whether the search converged. */
export interface RootResult {
  readonly root: number;
  readonly converged: boolean;
  readonly iterations: number;
}

/**
 * Brent's method for a root of f on [a, b]. Requires a valid bracket (f(a)·f(b) ≤ 0); without
 * one it returns converged = false rather than guessing. Stops when the bracket is narrower than
 * `tolerance` (absolute) or after `maxIterations`.
 * Source: Brent RP, Algorithms for Minimization without Derivatives, 1973, ch. 4 (common practice).
 * @example brent((x) => x * x - 2, 0, 2).root // 1.4142135623730951
 */
export function brent(
  f: (x: number) => number,
  lower: number,
  upper: number,
  tolerance = 1e-12,
  maxIterations = 200,
): RootResult {
  let a = lower;
  let b = upper;
  let fa = f(a);
  let fb = f(b);
  if (!Number.isFinite(fa) || !Number.isFinite(fb) || fa * fb > 0) {
    return { root: Number.NaN, converged: false, iterations: 0 };
  }
  if (fa === 0) return { root: a, converged: true, iterations: 0 };
  if (fb === 0) return { root: b, converged: true, iterations: 0 };
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 1; i <= maxIterations; i++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + tolerance / 2;
    const m = (c - b) / 2;
    if (Math.abs(m) <= tol || fb === 0) return { root: b, converged: true, iterations: i };
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = d;
      }
    } else {
      d = m;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    if (!Number.isFinite(fb)) return { root: Number.NaN, converged: false, iterations: i };
  }
  return { root: b, converged: false, iterations: maxIterations };
}
