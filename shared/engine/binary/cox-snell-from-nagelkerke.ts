import { DomainError } from '../errors';
import { maxCoxSnellR2 } from './max-cox-snell-r2';

/**
 * Cox–Snell R² from a reported Nagelkerke R² at the same outcome proportion:
 *   R²_CS = R²_N · max R²_CS(phi)
 * Domain: 0 < R²_N < 1 and 0 < phi < 1; otherwise DomainError. Source: DEV-BIN-SURV, DEV-BMJ
 * (METHODS 4; the default R²_N = 0.15 when nothing is known is from memory). Exact.
 * @example coxSnellFromNagelkerke(0.15, 0.1) // 0.071706
 */
export function coxSnellFromNagelkerke(nagelkerkeR2: number, outcomeProportion: number): number {
  if (!(nagelkerkeR2 > 0 && nagelkerkeR2 < 1)) {
    throw new DomainError(
      'reported Nagelkerke R²',
      nagelkerkeR2,
      'strictly between 0 and 1 (it is scaled so that 1 is a perfect model)',
    );
  }
  return nagelkerkeR2 * maxCoxSnellR2(outcomeProportion);
}
