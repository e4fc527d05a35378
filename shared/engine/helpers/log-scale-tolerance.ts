import { requirePositive } from './domain-guards';
import { seFromHalfWidth } from './se-from-half-width';

/** An original-scale tolerance: ±r relative (0.1 = ±10%), or ±d units around a centre value c. */
export type OriginalScaleTolerance = { readonly relative: number } | { readonly absolute: number; readonly centre: number };

/** The same tolerance on the log scale: a half-width, the CI width it implies, and the target SE. */
export interface LogScaleTolerance {
  readonly halfWidth: number;
  readonly ciWidth: number;
  readonly targetSe: number;
}

/**
 * Turns an original-scale tolerance into a symmetric log-scale one, on the conservative side: a
 * ±r band around Y maps to [ln(1 − r), ln(1 + r)] around ln Y, and the narrower side is ln(1 + r),
 * so the half-width is δ = ln(1 + r) (for r ≥ 1 the lower side is unbounded and ln(1 + r) is the
 * only constraint). For ±d around c, r = d/c. Then CI width = 2δ and SE* = δ/z.
 * Domain: r > 0, or d > 0 and c > 0 (log-modelled outcomes are positive), all finite; otherwise a
 * DomainError. Source: METHODS.md 7 (common practice). Accuracy ~1e−15 (log1p).
 * @example logScaleTolerance({ relative: 0.1 }).halfWidth // 0.0953102…
 */
export function logScaleTolerance(tolerance: OriginalScaleTolerance, confidence = 0.95): LogScaleTolerance {
  let r: number;
  if ('relative' in tolerance) {
    requirePositive('relative tolerance', tolerance.relative);
    r = tolerance.relative;
  } else {
    requirePositive('absolute tolerance', tolerance.absolute);
    requirePositive('centre', tolerance.centre);
    r = tolerance.absolute / tolerance.centre;
    requirePositive('relative tolerance', r);
  }
  const halfWidth = Math.log1p(r);
  return { halfWidth, ciWidth: 2 * halfWidth, targetSe: seFromHalfWidth(halfWidth, confidence) };
}
