import type { NetBenefitThreshold } from '@shared/model/project';
import { MAX_THRESHOLDS } from '@shared/model/project';
import { parseNumberText } from '../state/field-edit';
import { NumberField } from './NumberField';

/** Thresholds offered, in this order, when one is added (the first not yet listed). */
const SUGGESTED = [0.1, 0.2, 0.05, 0.3, 0.15, 0.25, 0.4, 0.5];

type Part = 'threshold' | 'sensitivity' | 'specificity';

const PART_LABEL: Readonly<Record<Part, string>> = {
  threshold: 'Risk threshold',
  sensitivity: 'Sensitivity at it',
  specificity: 'Specificity at it',
};

/**
 * The risk thresholds for net benefit as an editable list: one net-benefit criterion per
 * threshold; sensitivity and specificity at each are optional (both or neither) and otherwise
 * computed from the linear-predictor distribution. `onCommit` validates the whole list and returns
 * the schema's message when it refuses it.
 */
export function ThresholdList({
  thresholds,
  onCommit,
}: {
  readonly thresholds: readonly NetBenefitThreshold[];
  readonly onCommit: (next: NetBenefitThreshold[], label: string) => string | null;
}) {
  const change = (index: number, part: Part, text: string): string | null => {
    const parsed = parseNumberText(text);
    if (!parsed.ok) return parsed.message;
    if (part === 'threshold' && parsed.value === undefined) return 'give a threshold, or remove this row';
    const next = thresholds.map((t, i) => {
      if (i !== index) return { ...t };
      const edited: NetBenefitThreshold = { ...t };
      if (parsed.value === undefined) delete edited[part];
      else edited[part] = parsed.value;
      return edited;
    });
    return onCommit(next, `${PART_LABEL[part].toLowerCase()} ${index + 1}`);
  };
  const free = SUGGESTED.find((t) => !thresholds.some((x) => x.threshold === t));
  return (
    <fieldset className="helper" data-testid="threshold-list">
      <legend>Risk thresholds for net benefit</legend>
      <p className="hint">
        One net-benefit criterion per threshold. Leave sensitivity and specificity empty to compute them from the linear
        predictor; give both or neither.
      </p>
      {thresholds.length === 0 ? <p className="muted">No thresholds: net benefit is not planned for.</p> : null}
      {thresholds.map((t, index) => (
        <div className="range-row" key={`${index}-${t.threshold}`} data-testid={`threshold-${index}`}>
          {(['threshold', 'sensitivity', 'specificity'] as const).map((part) => (
            <NumberField
              key={part}
              label={`${PART_LABEL[part]} (${index + 1})`}
              value={t[part]}
              allowed="between 0 and 1 (exclusive)"
              {...(part === 'threshold' ? { required: true } : { defaultText: 'from the LP' })}
              testId={`threshold-${index}-${part}`}
              onCommit={(text) => change(index, part, text)}
            />
          ))}
          <button
            type="button"
            onClick={() =>
              onCommit(
                thresholds.filter((_, i) => i !== index).map((x) => ({ ...x })),
                `removal of threshold ${t.threshold}`,
              )
            }
          >
            Remove threshold {t.threshold}
          </button>
        </div>
      ))}
      <button
        type="button"
        disabled={free === undefined || thresholds.length >= MAX_THRESHOLDS}
        onClick={() => {
          if (free !== undefined) onCommit([...thresholds.map((x) => ({ ...x })), { threshold: free }], `threshold ${free}`);
        }}
      >
        Add a threshold
      </button>
    </fieldset>
  );
}
