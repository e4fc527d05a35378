import { formatCount, formatSignificant } from '@shared/format/numbers';
import type { PrecisionAtN } from '@shared/engine/types';

/** For a fixed available n (an existing cohort): what each measure's CI will be, and which targets it misses. */
export function PrecisionPanel({
  availableN,
  precision,
}: {
  readonly availableN: number;
  readonly precision: readonly PrecisionAtN[];
}) {
  const misses = precision.filter((p) => p.meets === false);
  return (
    <section className="precision" aria-labelledby="precision-title">
      <h3 id="precision-title">What the available {formatCount(availableN)} participants give</h3>
      <table className="plain" data-testid="precision-table">
        <thead>
          <tr>
            <th scope="col">Measure</th>
            <th scope="col">SE</th>
            <th scope="col">Achieved</th>
            <th scope="col">Target</th>
            <th scope="col">Met?</th>
          </tr>
        </thead>
        <tbody>
          {precision.map((p) => (
            <tr key={p.id}>
              <th scope="row">{p.label}</th>
              <td>{formatSignificant(p.se, 4)}</td>
              <td>
                {formatSignificant(p.achieved, 4)} <span className="muted small">{p.scale}</span>
              </td>
              <td>{formatSignificant(p.targetValue, 4)}</td>
              <td className={p.meets === false ? 'bad' : p.meets ? 'good' : 'muted'}>
                {p.meets === null ? (p.reason ?? 'n/a') : p.meets ? '✓ met' : '✗ missed'}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <p>
        {misses.length === 0
          ? 'Every precision target is met at this n.'
          : `Targets missed at this n: ${misses.map((m) => m.label).join(', ')}.`}
      </p>
    </section>
  );
}
