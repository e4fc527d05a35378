// Turns an edit of the across-sites settings into a candidate `pooled` object and checks it with
// the schema, so the message shown on the field is the schema's own (naming the field and its range).
import { pooledSchema, type Pooled } from '@shared/model/project';
import { fieldProblems } from '@shared/model/validation-message';
import { getAt, setAt } from './paths';

export type PooledEdit = { readonly ok: true; readonly pooled: Pooled } | { readonly ok: false; readonly message: string };

/** Drops objects left empty by removing their last field (a measure with nothing given is not kept). */
function withoutEmptyMeasures(value: Record<string, unknown>): Record<string, unknown> {
  const measures = value['measures'];
  if (measures === null || typeof measures !== 'object') return value;
  const kept = Object.fromEntries(
    Object.entries(measures as Record<string, unknown>).filter(
      ([, m]) => m !== null && typeof m === 'object' && Object.keys(m).length > 0,
    ),
  );
  return { ...value, measures: kept };
}

/**
 * Applies `value` at `path` (relative to the pooled settings, e.g. "measures.slope.tau") and
 * validates the settings. A range end typed while there is no range starts the range with the
 * other end at τ (so a half range is never stored); clearing either end removes the range.
 */
export function applyPooledEdit(current: Pooled | undefined, path: string, value: unknown): PooledEdit {
  let candidate: Record<string, unknown> = current ?? {};
  const rangeEnd = /^(measures\.[A-Za-z]+)\.tauRange\.(low|high)$/.exec(path);
  if (rangeEnd !== null) {
    const measurePath = rangeEnd[1] ?? '';
    const end = rangeEnd[2] as 'low' | 'high';
    const range = getAt(candidate, `${measurePath}.tauRange`) as { low: number; high: number } | undefined;
    if (value === undefined) {
      candidate = setAt(candidate, `${measurePath}.tauRange`, undefined);
    } else if (range === undefined) {
      const tau = getAt(candidate, `${measurePath}.tau`);
      if (typeof tau !== 'number') return { ok: false, message: 'give τ itself before its low–high range' };
      candidate = setAt(
        candidate,
        `${measurePath}.tauRange`,
        end === 'low' ? { low: value, high: tau } : { low: tau, high: value },
      );
    } else {
      candidate = setAt(candidate, path, value);
    }
  } else {
    candidate = setAt(candidate, path, value);
  }
  const parsed = pooledSchema.safeParse(withoutEmptyMeasures(candidate), { reportInput: true });
  if (parsed.success) return { ok: true, pooled: parsed.data };
  const problems = fieldProblems(parsed.error);
  const own = problems.find((p) => p.path === path || p.path.startsWith(`${path}.`));
  const problem = own ?? problems[0];
  if (problem === undefined) return { ok: false, message: 'not accepted' };
  return { ok: false, message: own ? problem.message : `${problem.message} (${problem.path})` };
}
