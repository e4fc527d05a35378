import { useState } from 'react';
import { formatSignificant } from '@shared/format/numbers';
import { parseNumberText } from '../state/field-edit';

/** One way of deriving a value from what a paper reports. */
export interface HelperMethod<M extends string> {
  readonly id: M;
  readonly label: string;
  readonly inputs: readonly string[];
  readonly source: string;
}

export interface MethodHelperProps<M extends string> {
  readonly legend: string;
  /** Label of the method chooser, e.g. "Method" or "Reported as". */
  readonly chooser: string;
  readonly methods: readonly HelperMethod<M>[];
  /** The derived value from the typed inputs, in the order of the method's `inputs`; throws to refuse them. */
  readonly compute: (method: M, values: readonly number[]) => number;
  /** What the result is called ("Variance") and the button that uses it ("Use this variance"). */
  readonly resultLabel: string;
  readonly useLabel: string;
  /** Uses the value; returns a message when the plan refuses it (shown under the result). */
  readonly onUse: (value: number) => string | null | void;
  readonly testId?: string;
}

/**
 * A small calculator beside a field: choose how the source reports the quantity, type the
 * reported numbers, see the derived value (or why it cannot be derived) and use it.
 */
export function MethodHelper<M extends string>({
  legend,
  chooser,
  methods,
  compute,
  resultLabel,
  useLabel,
  onUse,
  testId,
}: MethodHelperProps<M>) {
  const [method, setMethod] = useState<M | undefined>(methods[0]?.id);
  const [texts, setTexts] = useState<Record<string, string>>({});
  const [refused, setRefused] = useState<string | null>(null);
  const spec = methods.find((m) => m.id === method) ?? methods[0];
  if (spec === undefined) return null;

  let result: { value: number } | { error: string } | null = null;
  const values: number[] = [];
  for (const name of spec.inputs) {
    const parsed = parseNumberText(texts[`${spec.id}:${name}`] ?? '');
    if (!parsed.ok) result = { error: 'Each value must be a number.' };
    else if (parsed.value !== undefined) values.push(parsed.value);
  }
  if (result === null && values.length === spec.inputs.length) {
    try {
      result = { value: compute(spec.id, values) };
    } catch (error) {
      result = { error: error instanceof Error ? error.message : String(error) };
    }
  }

  return (
    <fieldset className="helper" {...(testId === undefined ? {} : { 'data-testid': testId })}>
      <legend>{legend}</legend>
      <label>
        {chooser}{' '}
        <select
          value={spec.id}
          onChange={(event) => {
            setMethod(event.target.value as M);
            setRefused(null);
          }}
        >
          {methods.map((m) => (
            <option key={m.id} value={m.id}>
              {m.label}
            </option>
          ))}
        </select>
      </label>
      <div className="helper-inputs">
        {spec.inputs.map((name) => (
          <label key={name}>
            {name}{' '}
            <input
              type="text"
              inputMode="decimal"
              size={7}
              value={texts[`${spec.id}:${name}`] ?? ''}
              onChange={(event) => setTexts({ ...texts, [`${spec.id}:${name}`]: event.target.value })}
            />
          </label>
        ))}
      </div>
      <p className="hint">{spec.source}</p>
      {result && 'value' in result ? (
        <p>
          {resultLabel} {formatSignificant(result.value, 5)}{' '}
          <button type="button" onClick={() => setRefused(onUse(result.value) ?? null)}>
            {useLabel}
          </button>
        </p>
      ) : null}
      {refused !== null ? (
        <p className="field-error" role="alert">
          Not used: {refused}
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
