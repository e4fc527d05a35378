/** What the development (model-updating) criteria need for one binary-outcome population. */
export interface BinaryDevelopmentInputs {
  /** Candidate predictor parameters P (every dummy, spline and interaction term). */
  readonly predictorParameters: number;
  /** Anticipated optimism-adjusted Cox–Snell R² (see the cox-snell-from-* helpers). */
  readonly coxSnellR2: number;
  readonly outcomeProportion: number;
  /** Target expected shrinkage S (default 0.9). */
  readonly targetShrinkage: number;
  /** Allowed optimism in Nagelkerke R², δ (default 0.05). */
  readonly optimismMargin: number;
  /** Allowed margin of error of the overall risk (default 0.05). */
  readonly riskMargin: number;
  readonly confidence: number;
}

/** Defaults of DEV-BIN-SURV (Part II abstract): S 0.9, Nagelkerke optimism 0.05, overall-risk margin 0.05. */
export const BINARY_DEVELOPMENT_DEFAULTS = { targetShrinkage: 0.9, optimismMargin: 0.05, riskMargin: 0.05 } as const;

/** The smallest admissible n for a development criterion: more participants than parameters. */
export function lowestDevelopmentN(inputs: BinaryDevelopmentInputs): number {
  return inputs.predictorParameters + 1;
}
