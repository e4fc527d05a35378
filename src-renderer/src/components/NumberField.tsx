import { useEffect, useId, useState } from 'react';
import { formatSignificant } from '@shared/format/numbers';

export interface NumberFieldProps {
  readonly label: string;
  readonly value: number | string | undefined;
  /** 'text' for dates and names: no numeric keyboard, the value shown as is. */
  readonly kind?: 'number' | 'text';
  readonly unit?: string;
  readonly allowed?: string;
  readonly defaultText?: string;
  readonly required?: boolean;
  readonly help?: string;
  /** Commits typed text; returns an error message to show, or null when accepted. */
  readonly onCommit: (text: string) => string | null;
  readonly testId?: string;
}

function display(value: number | string | undefined): string {
  if (value === undefined) return '';
  return typeof value === 'string' ? value : formatSignificant(value, 10);
}

/**
 * A labelled number input that commits on Enter or when focus leaves, shows the unit, default
 * and allowed range, and keeps a rejected entry visible with its message until it is fixed
 * (Escape restores the accepted value).
 */
export function NumberField({
  label,
  value,
  kind = 'number',
  unit,
  allowed,
  defaultText,
  required,
  help,
  onCommit,
  testId,
}: NumberFieldProps) {
  const id = useId();
  const [text, setText] = useState(display(value));
  const [error, setError] = useState<string | null>(null);

  useEffect(() => {
    if (error === null) setText(display(value));
  }, [value, error]);

  const commit = (): void => {
    if (error === null && text === display(value)) return;
    setError(onCommit(text));
  };

  const hint = [
    unit ? `unit: ${unit}` : null,
    defaultText ? `default: ${defaultText}` : required ? 'required' : 'optional',
    allowed ? `allowed: ${allowed}` : null,
  ]
    .filter((part) => part !== null)
    .join(' · ');

  return (
    <div className={`field${error ? ' field-invalid' : ''}`}>
      <label htmlFor={id}>
        {label}
        {unit ? <span className="unit"> ({unit})</span> : null}
      </label>
      <input
        id={id}
        data-testid={testId}
        type="text"
        inputMode={kind === 'number' ? 'decimal' : 'text'}
        value={text}
        placeholder={defaultText ?? ''}
        aria-invalid={error !== null}
        aria-describedby={`${id}-hint${error ? ` ${id}-error` : ''}`}
        title={help}
        onChange={(event) => setText(event.target.value)}
        onBlur={commit}
        onKeyDown={(event) => {
          if (event.key === 'Enter') commit();
          if (event.key === 'Escape') {
            setError(null);
            setText(display(value));
          }
        }}
      />
      <span id={`${id}-hint`} className="hint">
        {hint}
      </span>
      {error ? (
        <span id={`${id}-error`} className="field-error" role="alert">
          {label}: {error}
        </span>
      ) : null}
    </div>
  );
}
