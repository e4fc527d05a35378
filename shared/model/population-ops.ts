// Operations on the populations of a plan: duplicate one, import some from another plan, export
// one as a plan of its own. Pure functions returning new documents; every result is re-checked
// against projectSchema, so an operation can never produce a plan that would not open again.
import { continuousPopulationSchema, projectSchema } from './project';
import type { Population, Project } from './project';
import { checkProject, listProblems } from './plan-file';
import type { Result } from './result';

export type PopulationOpErrorCode = 'no-such-population' | 'outcome-mismatch' | 'invalid';
export type PopulationOpResult<T> = Result<T, PopulationOpErrorCode>;

const ID_MAX = continuousPopulationSchema.shape.id.maxLength ?? 100;
const NAME_MAX = continuousPopulationSchema.shape.name.maxLength ?? 200;
const PLAN_NAME_MAX = projectSchema.shape.name.maxLength ?? 200;

/** Cuts `text` to at most `max` UTF-16 units (what the schema counts) without splitting a character. */
function fit(text: string, max: number): string {
  if (text.length <= max) return text;
  const cut = text.slice(0, max);
  const last = cut.charCodeAt(cut.length - 1);
  return last >= 0xd800 && last <= 0xdbff ? cut.slice(0, -1) : cut;
}

/**
 * An id not in `taken`: `wanted` itself when free, else `wanted-2`, `wanted-3` … (a trailing
 * `-N` on `wanted` is replaced rather than stacked), shortened to fit the schema's id limit.
 *
 * @example issueId(new Set(['site-a', 'site-a-2']), 'site-a') // 'site-a-3'
 */
export function issueId(taken: ReadonlySet<string>, wanted: string): string {
  if (!taken.has(wanted) && wanted.length <= ID_MAX && wanted.length > 0) return wanted;
  const base = wanted.replace(/-\d+$/, '') || 'population';
  for (let n = 2; ; n += 1) {
    const suffix = `-${n}`;
    const candidate = `${fit(base, ID_MAX - suffix.length)}${suffix}`;
    if (!taken.has(candidate)) return candidate;
  }
}

/**
 * The name of a copy: "Name (copy)", then "Name (copy 2)", "Name (copy 3)" … while taken,
 * shortened to fit the schema's name limit.
 *
 * @example copyName(new Set(['Site A', 'Site A (copy)']), 'Site A') // 'Site A (copy 2)'
 */
export function copyName(taken: ReadonlySet<string>, name: string): string {
  for (let n = 1; ; n += 1) {
    const suffix = n === 1 ? ' (copy)' : ` (copy ${n})`;
    const candidate = `${fit(name, NAME_MAX - suffix.length)}${suffix}`;
    if (!taken.has(candidate)) return candidate;
  }
}

function checked(project: Project): PopulationOpResult<Project> {
  const result = checkProject(project);
  if (result.ok) return { ok: true, value: result.project };
  return {
    ok: false,
    error: { code: 'invalid', message: `The result would not be a valid plan:\n${listProblems(result.problems)}` },
  };
}

function notFound(project: Project, populationId: string): { ok: false; error: { code: 'no-such-population'; message: string } } {
  return {
    ok: false,
    error: { code: 'no-such-population', message: `The plan "${project.name}" has no population with id "${populationId}".` },
  };
}

/**
 * Adds a copy of one population right after it, with a new id and the name "… (copy)".
 * Fails with 'no-such-population' for an unknown id and 'invalid' when the plan is already at its
 * population limit.
 */
export function duplicatePopulation(
  project: Project,
  populationId: string,
): PopulationOpResult<{ readonly project: Project; readonly population: Population }> {
  const index = project.populations.findIndex((p) => p.id === populationId);
  const original = project.populations[index];
  if (original === undefined) return notFound(project, populationId);
  const copy: Population = {
    ...structuredClone(original),
    id: issueId(new Set(project.populations.map((p) => p.id)), original.id),
    name: copyName(new Set(project.populations.map((p) => p.name)), original.name),
  };
  const populations = [...project.populations.slice(0, index + 1), copy, ...project.populations.slice(index + 1)];
  const result = checked({ ...project, populations });
  if (!result.ok) return result;
  return { ok: true, value: { project: result.value, population: copy } };
}

/** What happened to one imported population. */
export interface ImportedPopulation {
  readonly sourceId: string;
  /** The id in the target plan: the source id, or a new one when the source id was taken. */
  readonly id: string;
  readonly name: string;
}

/**
 * Appends populations of `source` to `target`: all of them, or those listed in `populationIds`
 * (in the order listed). Ids that clash with the target's (or with each other's) are re-issued;
 * names are kept. The outcome types must match; fails with 'outcome-mismatch' otherwise, with
 * 'no-such-population' for an unknown id, and 'invalid' when the result would exceed the population limit.
 */
export function importPopulations(
  target: Project,
  source: Project,
  populationIds?: readonly string[],
): PopulationOpResult<{ readonly project: Project; readonly imported: readonly ImportedPopulation[] }> {
  let chosen: Population[];
  if (populationIds === undefined) chosen = [...source.populations];
  else {
    chosen = [];
    for (const id of populationIds) {
      const found = source.populations.find((p) => p.id === id);
      if (found === undefined) return notFound(source, id);
      chosen.push(found);
    }
  }
  const mismatched = chosen.find((p) => p.outcome !== target.outcome);
  if (source.outcome !== target.outcome || mismatched !== undefined) {
    const theirs = mismatched?.outcome ?? source.outcome;
    return {
      ok: false,
      error: {
        code: 'outcome-mismatch',
        message: `Cannot import: "${target.name}" plans for a ${target.outcome} outcome, and the populations of "${source.name}" are for a ${theirs} outcome.`,
      },
    };
  }
  const taken = new Set(target.populations.map((p) => p.id));
  const imported: ImportedPopulation[] = [];
  const added: Population[] = [];
  for (const population of chosen) {
    const id = issueId(taken, population.id);
    taken.add(id);
    added.push({ ...structuredClone(population), id });
    imported.push({ sourceId: population.id, id, name: population.name });
  }
  const result = checked({ ...target, populations: [...target.populations, ...added] });
  if (!result.ok) return result;
  return { ok: true, value: { project: result.value, imported } };
}

/**
 * A plan holding only one population of `project`, with the same outcome type, model, updating
 * settings and study window, named "<population> (from <plan>)" (cut to the name limit). Fails with 'no-such-population' for an
 * unknown id.
 */
export function exportPopulation(project: Project, populationId: string): PopulationOpResult<Project> {
  const population = project.populations.find((p) => p.id === populationId);
  if (population === undefined) return notFound(project, populationId);
  const name = fit(`${population.name} (from ${project.name})`, PLAN_NAME_MAX);
  return checked({ ...structuredClone(project), name, populations: [structuredClone(population)] });
}
