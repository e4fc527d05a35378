import type { ContinuousDevelopmentInputs } from './continuous-inputs';

/** P and R²_adj, once both are known. */
export interface DevelopmentCore {
  readonly predictorParameters: number;
  readonly adjustedRSquared: number;
}

/**
 * The two inputs every development criterion needs, or the reason the criteria cannot be assessed
 * (named after the project fields so the user knows what to fill in).
 */
export function developmentCore(inputs: ContinuousDevelopmentInputs): DevelopmentCore | string {
  const missing: string[] = [];
  if (inputs.predictorParameters === undefined) missing.push('the number of predictor parameters (updating.predictorParameters)');
  if (inputs.adjustedRSquared === undefined) missing.push('the anticipated adjusted R² (updating.anticipatedAdjustedRSquared)');
  if (inputs.predictorParameters === undefined || inputs.adjustedRSquared === undefined) return `needs ${missing.join(' and ')}`;
  return { predictorParameters: inputs.predictorParameters, adjustedRSquared: inputs.adjustedRSquared };
}
