import { logScaleTolerance } from '@shared/engine/helpers/log-scale-tolerance';
import { MethodHelper, type HelperMethod } from './MethodHelper';

type Method = 'relative' | 'absolute';

const METHODS: readonly HelperMethod<Method>[] = [
  {
    id: 'relative',
    label: '± a percentage of the value',
    inputs: ['tolerance ± %'],
    source: 'For outcomes modelled on the log scale: half-width ln(1 + r), the conservative side.',
  },
  {
    id: 'absolute',
    label: '± units around a typical value',
    inputs: ['tolerance ± units', 'typical value'],
    source: 'For outcomes modelled on the log scale: r = tolerance / typical value, then half-width ln(1 + r).',
  },
];

/**
 * For a log-modelled outcome: turns a tolerance on the original scale into the CI width for CITL on
 * the log scale, and offers to use it.
 */
export function WidthHelper({ confidence, onUse }: { readonly confidence: number; readonly onUse: (width: number) => void }) {
  return (
    <MethodHelper
      legend="CITL width from a tolerance on the original scale"
      chooser="Tolerance given as"
      methods={METHODS}
      compute={(method, [a = Number.NaN, b = Number.NaN]) =>
        logScaleTolerance(method === 'relative' ? { relative: a / 100 } : { absolute: a, centre: b }, confidence).ciWidth
      }
      resultLabel="Log-scale CI width"
      useLabel="Use this width"
      onUse={onUse}
    />
  );
}
