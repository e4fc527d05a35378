// The three development minimums for a binary outcome when an input they all need is missing.
import { formatSignificant } from '../../format/numbers';
import { levelText } from '../continuous/criterion-result';
import type { CriterionResult } from '../types';
import { binaryUnsizedCriterion } from './binary-criterion-result';
import { TEXT as OPTIMISM_TEXT } from './development-optimism-criterion';
import { TEXT as SHRINKAGE_TEXT } from './development-shrinkage-criterion';
import { TEXT as OVERALL_RISK_TEXT } from './overall-risk-criterion';

/** The targets the development criteria would be sized to. */
export interface DevelopmentTargets {
  readonly targetShrinkage: number;
  readonly optimismMargin: number;
  readonly riskMargin: number;
  readonly confidence: number;
}

/**
 * dev-shrinkage, dev-optimism and dev-overall-risk as not-assessable, each with `reason` (which
 * names the missing fields), in the order planBinaryDevelopment lists them. They count towards no n.
 * @example binaryDevelopmentNotAssessable('needs P', { targetShrinkage: 0.9, optimismMargin: 0.05, riskMargin: 0.05, confidence: 0.95 })[0].status // 'not-assessable'
 */
export function binaryDevelopmentNotAssessable(reason: string, targets: DevelopmentTargets): CriterionResult[] {
  return [
    binaryUnsizedCriterion(
      SHRINKAGE_TEXT,
      `expected shrinkage factor ≥ ${formatSignificant(targets.targetShrinkage)}`,
      'not-assessable',
      reason,
    ),
    binaryUnsizedCriterion(
      OPTIMISM_TEXT,
      `Nagelkerke R² optimism ≤ ${formatSignificant(targets.optimismMargin)}`,
      'not-assessable',
      reason,
    ),
    binaryUnsizedCriterion(
      OVERALL_RISK_TEXT,
      `${levelText(targets.confidence)} CI for the overall risk within ± ${formatSignificant(targets.riskMargin)}`,
      'not-assessable',
      reason,
    ),
  ];
}
