import { fitNormalLp } from './fit-normal-lp';
import type { NormalLp } from './lp-distribution';

/** Where the LP distribution used by the slope, C-statistic and net-benefit criteria came from. */
export type LpResolution =
  | { readonly kind: 'given'; readonly lp: NormalLp }
  | { readonly kind: 'fitted'; readonly lp: NormalLp; readonly iterations: number; readonly residual: number }
  | { readonly kind: 'not-converged'; readonly reason: string }
  | { readonly kind: 'unavailable'; readonly reason: string };

/** What the anticipated inputs say about the LP (already validated). */
export interface LpAnticipation {
  readonly outcomeProportion: number;
  readonly cStatistic?: number | undefined;
  readonly lpMean?: number | undefined;
  readonly lpSd?: number | undefined;
}

/**
 * The LP distribution to use: the given normal (mean, SD) when both are stated; otherwise the one
 * fitted to (outcome proportion, C-statistic) as if the model were well calibrated (METHODS 5.2,
 * fitNormalLp); otherwise unavailable. A failed fit is reported as not-converged, never used.
 * @example resolveLp({ outcomeProportion: 0.1, cStatistic: 0.8 }).kind // 'fitted'
 */
export function resolveLp(anticipated: LpAnticipation): LpResolution {
  if (anticipated.lpMean !== undefined && anticipated.lpSd !== undefined) {
    return { kind: 'given', lp: { mean: anticipated.lpMean, sd: anticipated.lpSd } };
  }
  if (anticipated.cStatistic === undefined) {
    return {
      kind: 'unavailable',
      reason: 'needs the distribution of the linear predictor: give its mean and SD, or the anticipated C-statistic',
    };
  }
  const fit = fitNormalLp(anticipated.outcomeProportion, anticipated.cStatistic);
  if (!fit.converged) return { kind: 'not-converged', reason: fit.reason ?? 'the LP fit did not converge' };
  return { kind: 'fitted', lp: fit.lp, iterations: fit.iterations, residual: fit.residual };
}

/** Intermediates describing the LP, for the audit trail of each criterion that uses it. */
export function lpIntermediates(resolution: LpResolution): { readonly name: string; readonly value: number }[] {
  if (resolution.kind === 'given') {
    return [
      { name: 'LP mean (given)', value: resolution.lp.mean },
      { name: 'LP SD (given)', value: resolution.lp.sd },
    ];
  }
  if (resolution.kind === 'fitted') {
    return [
      { name: 'LP mean (fitted to outcome proportion and C)', value: resolution.lp.mean },
      { name: 'LP SD (fitted to outcome proportion and C)', value: resolution.lp.sd },
      { name: 'LP fit iterations', value: resolution.iterations },
    ];
  }
  return [];
}
