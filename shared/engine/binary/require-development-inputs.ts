import { formatSignificant } from '../../format/numbers';
import { DomainError } from '../errors';
import { requireCount } from '../helpers/domain-guards';
import { zForConfidence } from '../numerics/distributions';
import type { BinaryDevelopmentInputs } from './binary-development-inputs';
import { requireCoxSnellBelowMax } from './max-cox-snell-r2';
import { requireOutcomeProportion } from './require-binary-domain';

/**
 * Refuses development inputs outside their domain (METHODS 7b), naming the field and saying why:
 * whole P ≥ 1; 0 < phi < 1; 0 < R²_CS < max R²_CS(phi); R²_CS < S < 1 (the log in formula (i)
 * needs R²_CS < S); 0 < δ < 1; 0 < margin < 0.5; 0 < confidence < 1.
 */
export function requireDevelopmentInputs(inputs: BinaryDevelopmentInputs): void {
  requireCount('number of predictor parameters', inputs.predictorParameters, 1);
  requireOutcomeProportion('outcome proportion', inputs.outcomeProportion);
  requireCoxSnellBelowMax('anticipated Cox–Snell R²', inputs.coxSnellR2, inputs.outcomeProportion);
  if (!(inputs.targetShrinkage > inputs.coxSnellR2 && inputs.targetShrinkage < 1)) {
    throw new DomainError(
      'target shrinkage',
      inputs.targetShrinkage,
      `above the anticipated Cox–Snell R² ${formatSignificant(inputs.coxSnellR2)} and below 1 (formula (i) takes ln(1 − R²_CS/S); a shrinkage of 1 needs infinite n)`,
    );
  }
  if (!(inputs.optimismMargin > 0 && inputs.optimismMargin < 1)) {
    throw new DomainError(
      'allowed optimism in Nagelkerke R²',
      inputs.optimismMargin,
      'strictly between 0 and 1 (Nagelkerke R² lies in [0, 1])',
    );
  }
  if (!(inputs.riskMargin > 0 && inputs.riskMargin < 0.5)) {
    throw new DomainError(
      'margin for the overall risk',
      inputs.riskMargin,
      'greater than 0 and below 0.5 (a risk lies in [0, 1], so a margin of 0.5 says nothing)',
    );
  }
  zForConfidence(inputs.confidence);
}
