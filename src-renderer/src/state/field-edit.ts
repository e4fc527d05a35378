// Turns what a person typed into a candidate population and checks it with the schema, so the
// message shown on the field is the schema's own (naming the field and its allowed range).
import { binaryPopulationSchema, continuousPopulationSchema, type Population } from '@shared/model/project';
import { fieldProblems } from '@shared/model/validation-message';
import { setAt } from './paths';

export type FieldEdit<P extends Population = Population> =
  { readonly ok: true; readonly population: P } | { readonly ok: false; readonly message: string };

/** Parses typed text as a number: empty → undefined (use the default), otherwise a finite number. */
export function parseNumberText(text: string): { ok: true; value: number | undefined } | { ok: false; message: string } {
  const trimmed = text.trim().replace(/\u2212/g, '-');
  if (trimmed === '') return { ok: true, value: undefined };
  if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(trimmed)) return { ok: false, message: `"${text}" is not a number` };
  const value = Number(trimmed);
  return Number.isFinite(value) ? { ok: true, value } : { ok: false, message: `"${text}" is too large` };
}

/**
 * Applies `value` at `path` and validates the whole population against the schema of its outcome
 * type (which the edit keeps); the message names this field when it is at fault.
 */
export function applyFieldEdit<P extends Population>(population: P, path: string, value: unknown, label: string): FieldEdit<P> {
  const candidate = setAt(population, path, value);
  const schema = population.outcome === 'binary' ? binaryPopulationSchema : continuousPopulationSchema;
  const parsed = schema.safeParse(candidate, { reportInput: true });
  // The edit does not touch `outcome`, so the parsed population has the type it came in with.
  if (parsed.success) return { ok: true, population: parsed.data as P };
  const problems = fieldProblems(parsed.error);
  const own = problems.find(
    (problem) => problem.path === path || problem.path.startsWith(`${path}.`) || problem.path.startsWith(`${path}[`),
  );
  const problem = own ?? problems[0];
  if (problem === undefined) return { ok: false, message: `${label}: not accepted` };
  return { ok: false, message: own ? problem.message : `${problem.message} (${problem.path})` };
}
