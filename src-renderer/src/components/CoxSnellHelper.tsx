import { coxSnellFromCStatistic } from '@shared/engine/binary/cox-snell-from-c-statistic';
import { coxSnellFromNagelkerke } from '@shared/engine/binary/cox-snell-from-nagelkerke';
import { adjustedCoxSnellFromLikelihoodRatio } from '@shared/engine/binary/cox-snell-from-likelihood-ratio';
import { MethodHelper, type HelperMethod } from './MethodHelper';

type Method = 'c' | 'nagelkerke' | 'lr';

const METHODS: readonly HelperMethod<Method>[] = [
  {
    id: 'c',
    label: 'From a reported C-statistic',
    inputs: ['C-statistic', 'outcome proportion'],
    source:
      'the Cox–Snell R² of a very large data set with that C and outcome proportion (Stat Med 2021;40(4):859–864, doi:10.1002/sim.8806)',
  },
  {
    id: 'nagelkerke',
    label: 'From a reported Nagelkerke R²',
    inputs: ['Nagelkerke R²', 'outcome proportion'],
    source:
      'Cox–Snell R² = Nagelkerke R² × its maximum at the outcome proportion (Stat Med 2019;38(7):1276–1296, doi:10.1002/sim.7992)',
  },
  {
    id: 'lr',
    label: 'From a reported likelihood-ratio statistic',
    inputs: ['LR chi-square', 'n of that model', 'its parameters'],
    source: 'apparent R² = 1 − exp(−LR/n), shrunk by 1 − P/LR (Stat Med 2019;38(7):1276–1296, doi:10.1002/sim.7992)',
  },
];

function compute(method: Method, values: readonly number[]): number {
  const [a = Number.NaN, b = Number.NaN, c = Number.NaN] = values;
  if (method === 'c') {
    const result = coxSnellFromCStatistic(a, b);
    if (!result.converged) throw new Error('the quadrature behind this value did not converge');
    return result.coxSnellR2;
  }
  if (method === 'nagelkerke') return coxSnellFromNagelkerke(a, b);
  return adjustedCoxSnellFromLikelihoodRatio(a, b, c).adjusted;
}

/**
 * Turns what a development paper reports (a C-statistic, a Nagelkerke R² or a likelihood-ratio
 * statistic) into the anticipated Cox–Snell R² the binary development minimums need, and offers
 * to use it. The outcome proportion is that of the data the reported value comes from.
 */
export function CoxSnellHelper({ onUse }: { readonly onUse: (value: number) => string | null }) {
  return (
    <MethodHelper
      legend="Anticipated Cox–Snell R² from a reported value"
      chooser="Reported as"
      methods={METHODS}
      compute={compute}
      resultLabel="Cox–Snell R²"
      useLabel="Use this value"
      onUse={(value) => onUse(Number(value.toPrecision(6)))}
      testId="cox-snell-helper"
    />
  );
}
