// Domain checks for binary-outcome inputs. Each refusal names the field, the value and the
// allowed range, and says why the range is what it is.
import { DomainError } from '../errors';

/** Throws unless lower < value < upper, with `why` explaining the range. */
function requireBetween(field: string, value: number, lower: number, upper: number, why: string): void {
  if (!(value > lower && value < upper))
    throw new DomainError(
      field,
      value,
      `${lower === 0 && upper === 1 ? 'strictly between 0 and 1' : `greater than ${lower} and less than ${upper}`} (${why})`,
    );
}

/** 0 < value < 1 for an outcome proportion. */
export function requireOutcomeProportion(field: string, value: number): void {
  requireBetween(field, value, 0, 1, 'with a proportion of 0 or 1 there is nothing to predict');
}

/** 0.5 < C < 1 for an anticipated C-statistic. */
export function requireCStatistic(field: string, value: number): void {
  requireBetween(field, value, 0.5, 1, '0.5 or less means the model discriminates no better than chance; 1 is a perfect model');
}

/** 0 < t < 1 for a risk threshold. */
export function requireThreshold(field: string, value: number): void {
  requireBetween(field, value, 0, 1, 'a risk threshold is a probability; at 0 or 1 nobody or everybody is treated');
}

/** 0 < value < 1 for an anticipated sensitivity or specificity. */
export function requireSensSpec(field: string, value: number): void {
  requireBetween(
    field,
    value,
    0,
    1,
    'at exactly 0 or 1 its binomial variance vanishes and the net-benefit variance formula breaks down',
  );
}
