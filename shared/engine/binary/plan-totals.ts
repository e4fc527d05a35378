// The totals every binary plan reports: the required n (the largest over the criteria), the
// criterion that binds, and the expected events at that n (planners think in events).
import { ceilGuarded } from '../numerics/rounding';
import type { CriterionResult } from '../types';

export interface PlanTotals {
  readonly criteria: readonly CriterionResult[];
  /** The largest n over the sized criteria; null when a criterion failed numerically or none could be sized. */
  readonly n: number | null;
  readonly bindingId: string | null;
  /** Expected events n·phi at the required n: exact, and rounded up. */
  readonly events: { readonly exact: number; readonly whole: number } | null;
  /** Events per candidate predictor parameter (EPP = n·phi/P), when P is known. */
  readonly eventsPerParameter: number | null;
}

/**
 * n = max over the sized criteria (status ok or always-met; the first on ties), E = n·phi,
 * EPP = E/P (METHODS 1.5). No n is stated when any criterion failed numerically: the minimum is
 * then unknown.
 * @example planTotals(devCriteria, 0.174, 24).eventsPerParameter // 4.7995
 */
export function planTotals(
  criteria: readonly CriterionResult[],
  outcomeProportion: number,
  predictorParameters: number | null,
): PlanTotals {
  let best: CriterionResult | null = null;
  if (!criteria.some((c) => c.status === 'not-converged')) {
    for (const c of criteria) {
      if (c.n !== null && (c.status === 'ok' || c.status === 'always-met') && (best === null || c.n > (best.n ?? 0))) best = c;
    }
  }
  const n = best?.n ?? null;
  const events = n === null ? null : n * outcomeProportion;
  return {
    criteria,
    n,
    bindingId: best?.id ?? null,
    events: events === null ? null : { exact: events, whole: ceilGuarded(events) },
    eventsPerParameter: events === null || predictorParameters === null ? null : events / predictorParameters,
  };
}
