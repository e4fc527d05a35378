import type { ReactNode } from 'react';
import type { FieldSpec } from '@shared/model/population-fields';
import type { OeTargetSettings } from '@shared/model/project';

/**
 * The O/E precision target in either convention, with the convention stated: a total CI width
 * around a well-calibrated O/E of 1 (SE of ln O/E = asinh(W/2)/z), or the CI limits expected
 * around 1 (SE of ln O/E = (ln U − ln L)/2z). Switching convention starts from 0.2 or 0.9–1.1.
 */
export function OeTargetFields({
  target,
  specs,
  field,
  onSwitch,
}: {
  readonly target: OeTargetSettings;
  readonly specs: readonly FieldSpec[];
  readonly field: (spec: FieldSpec) => ReactNode;
  readonly onSwitch: (next: OeTargetSettings) => void;
}) {
  const limits = target.width === undefined;
  const shown = specs.filter((s) => (limits ? s.path !== 'precision.oe.width' : s.path === 'precision.oe.width'));
  return (
    <div className="field-block" data-testid="oe-target">
      <div className="field">
        <label htmlFor="oe-convention">O/E target given as</label>
        <select
          id="oe-convention"
          value={limits ? 'limits' : 'width'}
          onChange={(event) => onSwitch(event.target.value === 'limits' ? { lower: 0.9, upper: 1.1 } : { width: 0.2 })}
        >
          <option value="width">a total CI width around O/E = 1</option>
          <option value="limits">the CI limits expected around O/E = 1</option>
        </select>
        <span className="hint" data-testid="oe-convention-text">
          {limits
            ? 'Convention: the CI for O/E should run from the lower to the upper limit when O/E is 1; the SE of ln(O/E) is (ln upper − ln lower) ÷ 2z.'
            : 'Convention: the CI for O/E, centred on 1 on the log scale, should be this wide in total (upper − lower); the SE of ln(O/E) is asinh(width ÷ 2) ÷ z.'}
        </span>
      </div>
      {shown.map((spec) => field(spec))}
    </div>
  );
}
