import { DomainError } from '../errors';

/** A quadrature rule for expectations over the standard normal: E[g(Z)] ≈ Σ weights[k]·g(nodes[k]). */
export interface NormalQuadratureRule {
  /** Nodes in ascending order (standard-normal scale). Shared by every caller: do not modify. */
  readonly nodes: Float64Array;
  /** Weights summing to 1 (the normal density is folded in). Shared by every caller: do not modify. */
  readonly weights: Float64Array;
  /** False when a root could not be bracketed or refined, or the weights do not sum to 1: do not use the rule. */
  readonly converged: boolean;
}

/** Node counts outside this range are refused: above it the recurrence overflows in double precision. */
export const GAUSS_HERMITE_MAX_NODES = 400;

const cache = new Map<number, NormalQuadratureRule>();
const PI_TO_MINUS_QUARTER = Math.pow(Math.PI, -0.25);
const NEWTON_CAP = 100;

/**
 * Probabilists' Gauss–Hermite rule with `count` nodes, weights divided by √(2π) so that
 * E[g(Z)] for Z ~ N(0,1) is Σ w_k g(x_k); exact for polynomials of degree ≤ 2·count − 1.
 *
 * Method: the physicists' roots t_k of H_n are found one by one, largest first, by Newton's
 * iteration on the orthonormal Hermite recurrence (p_n' = √(2n)·p_{n−1}); each root is first
 * bracketed by a downward scan with steps of a quarter of the smallest root spacing
 * (≈ π/√(2n+1)), and a Newton step that would leave the bracket is replaced by bisection, so a
 * root is never found twice (the textbook extrapolated starting values do find the same root
 * twice for 200 nodes). Then x_k = √2·t_k and w_k = 2/(√π·p_n'(t_k)²).
 * Common practice (Golub & Welsch 1969 / Numerical Recipes, "gauher").
 * Domain: integer 1 ≤ count ≤ 400 (the recurrence overflows beyond); otherwise DomainError.
 * Accuracy: nodes agree with numpy's hermegauss to 1e−12 (relative to max(1, |x|)) and weights
 * to 1e−11 relative for 1 to 300 nodes (test fixture). Expectations are exact for polynomials of
 * degree ≤ 2n − 1; for logistic integrands the error grows quickly with the spread of the LP
 * (see lpQuadratureRule in the binary engine for the node-count study).
 * Non-convergence of any root is reported as converged = false (never silently returned).
 * Rules are cached per node count.
 * @example gaussHermiteRule(2) // nodes [-1, 1], weights [0.5, 0.5]
 */
export function gaussHermiteRule(count: number): NormalQuadratureRule {
  if (!Number.isInteger(count) || count < 1 || count > GAUSS_HERMITE_MAX_NODES) {
    throw new DomainError(
      'node count',
      count,
      `a whole number from 1 to ${GAUSS_HERMITE_MAX_NODES} (more nodes overflow the Hermite recurrence)`,
    );
  }
  const cached = cache.get(count);
  if (cached) return cached;
  const rule = computeRule(count);
  cache.set(count, rule);
  return rule;
}

/** Orthonormal Hermite recurrence at t: returns [p_n(t), p_{n−1}(t)]. */
function hermitePair(n: number, t: number): [number, number] {
  let p1 = PI_TO_MINUS_QUARTER;
  let p2 = 0;
  for (let j = 1; j <= n; j++) {
    const p3 = p2;
    p2 = p1;
    p1 = t * Math.sqrt(2 / j) * p2 - Math.sqrt((j - 1) / j) * p3;
  }
  return [p1, p2];
}

function computeRule(n: number): NormalQuadratureRule {
  const half = Math.floor((n + 1) / 2);
  const roots = new Float64Array(half); // physicists' roots t ≥ 0, largest first
  const physWeights = new Float64Array(half);
  let converged = true;
  // Every root of H_n lies in (−√(2n+1), √(2n+1)) and neighbouring roots are at least about
  // π/√(2n+1) apart, so stepping down by a quarter of that never jumps over a root.
  const edge = Math.sqrt(2 * n + 1);
  const scanStep = (0.25 * Math.PI) / edge;
  let b = edge;
  let fb = hermitePair(n, b)[0];
  for (let i = 0; i < half; i++) {
    let a = b;
    let fa = fb;
    let found = false;
    const floor = n % 2 === 1 && i === half - 1 ? -scanStep : 0.5 * scanStep;
    while (a > floor) {
      a = Math.max(a - scanStep, floor);
      fa = hermitePair(n, a)[0];
      if (fa === 0 || Math.sign(fa) !== Math.sign(fb)) {
        found = true;
        break;
      }
    }
    if (!found) {
      converged = false;
      break;
    }
    const refined = refineRoot(n, a, b, fa);
    if (!refined.ok) converged = false;
    roots[i] = refined.root;
    physWeights[i] = 2 / (refined.derivative * refined.derivative);
    b = a; // the next root lies below the bracket just used
    fb = fa;
  }
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < half; i++) {
    const x = Math.SQRT2 * (roots[i] ?? Number.NaN);
    const w = (physWeights[i] ?? Number.NaN) / Math.sqrt(Math.PI);
    nodes[n - 1 - i] = x;
    nodes[i] = -x;
    weights[n - 1 - i] = w;
    weights[i] = w;
  }
  if (n % 2 === 1) nodes[half - 1] = 0; // the middle root is exactly 0 by symmetry
  // Roots must come out distinct and ordered, and the weights must sum to 1.
  for (let i = 1; i < n; i++) {
    if (!((nodes[i] ?? Number.NaN) > (nodes[i - 1] ?? Number.NaN))) converged = false;
  }
  let total = 0;
  for (let i = 0; i < n; i++) total += weights[i] ?? Number.NaN;
  if (!(Math.abs(total - 1) < 1e-12)) converged = false;
  return { nodes, weights, converged };
}

/**
 * Newton's iteration for the root of p_n in the sign-change bracket [a, b], falling back to
 * bisection whenever a Newton step would leave the bracket; stops when the step is below
 * 1e-15·max(1, |t|), then polishes with one more Newton step.
 */
function refineRoot(n: number, lower: number, upper: number, fLower: number): { root: number; derivative: number; ok: boolean } {
  let a = lower;
  let b = upper;
  const signA = Math.sign(fLower);
  let t = 0.5 * (a + b);
  for (let it = 0; it < NEWTON_CAP; it++) {
    const [pn, pn1] = hermitePair(n, t);
    if (pn === 0) return { root: t, derivative: Math.sqrt(2 * n) * pn1, ok: true };
    if (Math.sign(pn) === signA) a = t;
    else b = t;
    const derivative = Math.sqrt(2 * n) * pn1;
    let next = t - pn / derivative;
    if (!(next > a && next < b)) next = 0.5 * (a + b);
    const step = Math.abs(next - t);
    t = next;
    if (step <= 1e-15 * Math.max(1, Math.abs(t))) {
      const [qn, qn1] = hermitePair(n, t);
      const d = Math.sqrt(2 * n) * qn1;
      const polished = t - qn / d;
      const root = Math.abs(polished - t) < 1e-12 * Math.max(1, Math.abs(t)) ? polished : t;
      return { root, derivative: d, ok: Number.isFinite(root) && Number.isFinite(d) && d !== 0 };
    }
  }
  return { root: t, derivative: Number.NaN, ok: false };
}
