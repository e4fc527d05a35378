import { useState } from 'react';
import { formatSignificant } from '@shared/format/numbers';
import { DomainError } from '@shared/engine/errors';
import { logScaleTolerance } from '@shared/engine/helpers/log-scale-tolerance';
import { parseNumberText } from '../state/field-edit';

/**
 * For a log-modelled outcome: turns "within ±r% on the original scale" into the CI width for
 * CITL on the log scale (conservative side, ln(1 + r)), and offers to use it.
 */
export function WidthHelper({ confidence, onUse }: { readonly confidence: number; readonly onUse: (width: number) => void }) {
  const [percent, setPercent] = useState('');
  const parsed = parseNumberText(percent);
  let result: { width: number } | { error: string } | null = null;
  if (parsed.ok && parsed.value !== undefined) {
    try {
      result = { width: logScaleTolerance({ relative: parsed.value / 100 }, confidence).ciWidth };
    } catch (error) {
      result = { error: error instanceof DomainError ? error.message : String(error) };
    }
  } else if (!parsed.ok) result = { error: parsed.message };

  return (
    <fieldset className="helper">
      <legend>CITL width from a tolerance on the original scale</legend>
      <label>
        Tolerance ±{' '}
        <input type="text" inputMode="decimal" size={5} value={percent} onChange={(event) => setPercent(event.target.value)} /> %
      </label>
      <p className="hint">For outcomes modelled on the log scale: half-width ln(1 + r), the conservative side.</p>
      {result && 'width' in result ? (
        <p>
          Log-scale CI width {formatSignificant(result.width, 5)}{' '}
          <button type="button" onClick={() => onUse(result.width)}>
            Use this width
          </button>
        </p>
      ) : null}
      {result && 'error' in result ? (
        <p className="field-error" role="alert">
          {result.error}
        </p>
      ) : null}
    </fieldset>
  );
}
