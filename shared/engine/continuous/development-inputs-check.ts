import type { ContinuousDevelopmentInputs } from './continuous-inputs';

/** P and R²_adj, once both are known. */
export interface DevelopmentCore {
  readonly predictorParameters: number;
  readonly adjustedRSquared: number;
}

const NEEDS_P = 'the number of predictor parameters (updating.predictorParameters)';
const NEEDS_R2 = 'the anticipated adjusted R² (updating.anticipatedAdjustedRSquared)';
const MISSING_P = `needs ${NEEDS_P}`;
const MISSING_R2 = `needs ${NEEDS_R2}`;
const MISSING_BOTH = `needs ${NEEDS_P} and ${NEEDS_R2}`;

/** Development inputs with P and R²_adj known. */
export type CompleteDevelopmentInputs = ContinuousDevelopmentInputs & DevelopmentCore;

/**
 * The inputs themselves once the two that every development criterion needs are known, or the
 * reason the criteria cannot be assessed (named after the project fields so the user knows what
 * to fill in). No copy is made: this runs four times per population in every sweep.
 */
export function developmentCore(inputs: ContinuousDevelopmentInputs): CompleteDevelopmentInputs | string {
  const p = inputs.predictorParameters;
  const r2 = inputs.adjustedRSquared;
  if (p === undefined) return r2 === undefined ? MISSING_BOTH : MISSING_P;
  if (r2 === undefined) return MISSING_R2;
  return inputs as CompleteDevelopmentInputs; // both fields were just checked
}
