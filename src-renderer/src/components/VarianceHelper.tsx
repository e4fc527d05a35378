import { logNormalFromQuartiles } from '@shared/engine/helpers/log-normal-from-quartiles';
import { sdFromIqr } from '@shared/engine/helpers/sd-from-iqr';
import { varianceFromSd } from '@shared/engine/helpers/variance-from-sd';
import { wanSdFromFiveNumbers } from '@shared/engine/helpers/wan-sd-from-five-numbers';
import { wanSdFromIqr } from '@shared/engine/helpers/wan-sd-from-iqr';
import { wanSdFromRange } from '@shared/engine/helpers/wan-sd-from-range';
import { MethodHelper, type HelperMethod } from './MethodHelper';

type Method = 'sd' | 'iqr' | 'iqr-n' | 'log-quartiles' | 'range' | 'five';

const METHODS: readonly HelperMethod<Method>[] = [
  { id: 'sd', label: 'From an SD', inputs: ['SD'], source: 'variance = SD²' },
  { id: 'iqr', label: 'From the IQR (normal outcome)', inputs: ['Q1', 'Q3'], source: 'SD = IQR / 1.349 (normal quantiles)' },
  {
    id: 'iqr-n',
    label: 'From the IQR and sample size',
    inputs: ['Q1', 'Q3', 'n'],
    source: 'Wan et al., BMC Med Res Methodol 2014',
  },
  {
    id: 'range',
    label: 'From the range and sample size',
    inputs: ['minimum', 'maximum', 'n'],
    source: 'Wan et al., BMC Med Res Methodol 2014',
  },
  {
    id: 'five',
    label: 'From min, quartiles, max and sample size',
    inputs: ['minimum', 'Q1', 'Q3', 'maximum', 'n'],
    source: 'Wan et al., BMC Med Res Methodol 2014',
  },
  {
    id: 'log-quartiles',
    label: 'Log-modelled outcome: median and quartiles on the original scale',
    inputs: ['Q1', 'median', 'Q3'],
    source: 'log-normal assumption: SD of log Y = (ln Q3 − ln Q1) / 1.349; the variance is on the log scale',
  },
];

function compute(method: Method, values: readonly number[]): number {
  const [a = Number.NaN, b = Number.NaN, c = Number.NaN, d = Number.NaN, e = Number.NaN] = values;
  switch (method) {
    case 'sd':
      return varianceFromSd(a);
    case 'iqr':
      return varianceFromSd(sdFromIqr(a, b));
    case 'iqr-n':
      return varianceFromSd(wanSdFromIqr(a, b, c));
    case 'range':
      return varianceFromSd(wanSdFromRange(a, b, c));
    case 'five':
      return varianceFromSd(wanSdFromFiveNumbers(a, b, c, d, e));
    case 'log-quartiles':
      return varianceFromSd(logNormalFromQuartiles(a, b, c).sigma);
  }
}

/** Derives the outcome variance from what a paper reports, and offers to use it. */
export function VarianceHelper({ onUse }: { readonly onUse: (variance: number) => void }) {
  return (
    <MethodHelper
      legend="Derive the outcome variance"
      chooser="Method"
      methods={METHODS}
      compute={compute}
      resultLabel="Variance"
      useLabel="Use this variance"
      onUse={onUse}
    />
  );
}
