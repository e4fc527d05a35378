// Reading and writing the text of a plan file (.plumb). Pure: no file system here, so the same
// checks run in the main process, in the loopback host, and in tests. The order of the checks is
// chosen so that each damaged file gets the one message that helps most: empty, then not JSON,
// then not a plan at all, then a newer version, then (after migrating older versions) the fields.
import { FORMAT_TAG, SCHEMA_VERSION, projectSchema } from './project';
import type { Project } from './project';
import { locateJsonSyntaxError } from './json-syntax-error';
import { MIGRATIONS, migratePlan, oldestReadableVersion } from './migrations';
import type { Migration, PlanData } from './migrations';
import { fieldProblems } from './validation-message';
import type { FieldProblem } from './validation-message';

export type PlanFileErrorCode = 'empty' | 'unreadable-json' | 'not-a-plan' | 'future-version' | 'invalid';

export interface PlanFileError {
  readonly code: PlanFileErrorCode;
  /** One or more sentences for people; for 'invalid', the first problems are listed too. */
  readonly message: string;
  /** Each field that is wrong, with its path (e.g. populations[2].anticipated.rSquared). */
  readonly problems: readonly FieldProblem[];
}

export type PlanParseResult =
  | { readonly ok: true; readonly project: Project; readonly migratedFrom: number | null }
  | { readonly ok: false; readonly error: PlanFileError };

export interface PlanParseOptions {
  /** The migration table; tests pass their own. Defaults to the shipped MIGRATIONS. */
  readonly migrations?: readonly Migration[];
}

/** How many problems the message spells out; `problems` always holds all of them. */
const PROBLEMS_IN_MESSAGE = 10;

const failure = (code: PlanFileErrorCode, message: string, problems: readonly FieldProblem[] = []): PlanParseResult => ({
  ok: false,
  error: { code, message, problems },
});

function describeJsonType(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'a list (JSON array)';
  if (typeof value === 'string') return 'a piece of text';
  if (typeof value === 'number') return 'a number';
  if (typeof value === 'boolean') return 'true or false';
  return typeof value;
}

/** Longest message kept per problem: a quoted value can be a whole population or more. */
const PROBLEM_MESSAGE_MAX = 300;

/**
 * Checks `value` against projectSchema, keeping the offending value in each message (zod leaves
 * it out unless asked) but cutting very long ones short.
 */
export function checkProject(value: unknown): { ok: true; project: Project } | { ok: false; problems: FieldProblem[] } {
  const parsed = projectSchema.safeParse(value, { reportInput: true });
  if (parsed.success) return { ok: true, project: parsed.data };
  const problems = fieldProblems(parsed.error).map((p) =>
    p.message.length > PROBLEM_MESSAGE_MAX ? { ...p, message: `${p.message.slice(0, PROBLEM_MESSAGE_MAX - 1)}…` } : p,
  );
  return { ok: false, problems };
}

/** The problems as readable lines, the first few spelled out and the rest counted. */
export function listProblems(problems: readonly FieldProblem[]): string {
  const shown = problems.slice(0, PROBLEMS_IN_MESSAGE).map((p) => `${p.path}: ${p.message}`);
  const more = problems.length - shown.length;
  return more > 0 ? [...shown, `… and ${more} more`].join('\n') : shown.join('\n');
}

/**
 * Checks an already parsed JSON value as a plan: format tag, schema version (older versions are
 * migrated, newer ones refused), then every field against projectSchema. Also used for recovery
 * files, which hold the plan as a JSON value rather than as text.
 */
export function parsePlanValue(value: unknown, options: PlanParseOptions = {}): PlanParseResult {
  const migrations = options.migrations ?? MIGRATIONS;
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    return failure(
      'not-a-plan',
      `This is not a Plumbline plan: the file holds ${describeJsonType(value)}, not a plan (a JSON object with "format": "${FORMAT_TAG}").`,
    );
  }
  const data = value as PlanData;
  if (data['format'] !== FORMAT_TAG) {
    const found = data['format'] === undefined ? 'has no "format" field' : `has "format": ${JSON.stringify(data['format'])}`;
    return failure('not-a-plan', `This is not a Plumbline plan: it ${found}, and a plan has "format": "${FORMAT_TAG}".`, [
      { path: 'format', message: `must be "${FORMAT_TAG}"` },
    ]);
  }
  const version = data['schemaVersion'];
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 0) {
    const problem = { path: 'schemaVersion', message: `must be a whole number (got ${JSON.stringify(version) ?? 'nothing'})` };
    return failure('invalid', `The plan's schema version is missing or unreadable.\n${listProblems([problem])}`, [problem]);
  }
  if (version > SCHEMA_VERSION) {
    return failure(
      'future-version',
      `This plan was made by a newer version of Plumbline (schema ${version}); this version reads up to schema ${SCHEMA_VERSION} — the file was not changed. Open it with an up-to-date Plumbline.`,
      [{ path: 'schemaVersion', message: `${version} is newer than ${SCHEMA_VERSION}, the newest this version reads` }],
    );
  }
  let current: PlanData = data;
  if (version < SCHEMA_VERSION) {
    const oldest = oldestReadableVersion(migrations, SCHEMA_VERSION);
    if (version < oldest) {
      const problem = { path: 'schemaVersion', message: `must be from ${oldest} to ${SCHEMA_VERSION} (got ${version})` };
      return failure(
        'invalid',
        `This plan says it uses schema ${version}, which this version of Plumbline cannot read (it reads schemas ${oldest} to ${SCHEMA_VERSION}).`,
        [problem],
      );
    }
    const migrated = migratePlan(data, { from: version, to: SCHEMA_VERSION, migrations });
    if (!migrated.ok) return failure('invalid', migrated.error.message);
    current = migrated.value.plan;
  }
  const checked = checkProject(current);
  if (!checked.ok) {
    const { problems } = checked;
    const count = problems.length === 1 ? '1 problem' : `${problems.length} problems`;
    const after = version < SCHEMA_VERSION ? ` after updating it from schema ${version}` : '';
    return failure('invalid', `The plan has ${count}${after}:\n${listProblems(problems)}`, problems);
  }
  return { ok: true, project: checked.project, migratedFrom: version < SCHEMA_VERSION ? version : null };
}

/**
 * Reads the text of a plan file. A leading byte-order mark (which some Windows editors add) is
 * ignored. Never throws: every failure comes back as a PlanFileError with a code and a message;
 * unreadable JSON is located by line and column.
 *
 * @example parsePlanText('{"format": "plumbline-plan", "schemaVersion": 99}') // error code 'future-version'
 */
export function parsePlanText(text: string, options: PlanParseOptions = {}): PlanParseResult {
  const body = text.startsWith('\uFEFF') ? text.slice(1) : text;
  if (body.trim() === '') {
    return failure(
      'empty',
      body === '' ? 'The file is empty: it holds no plan.' : 'The file holds only blank space: it holds no plan.',
    );
  }
  let value: unknown;
  try {
    value = JSON.parse(body);
  } catch {
    const at = locateJsonSyntaxError(body);
    const where = at === null ? '' : ` at line ${at.line}, column ${at.column}: expected ${at.expected} but found ${at.found}`;
    const truncated = at !== null && at.offset >= body.trimEnd().length ? ' The file looks cut short.' : '';
    return failure('unreadable-json', `The file is not readable JSON${where}.${truncated} It may be damaged.`);
  }
  return parsePlanValue(value, options);
}

/**
 * The text of a plan file: JSON indented by two spaces, keys in the schema's order whatever order
 * the caller built the objects in, and a final newline, so that saving an unchanged plan gives the
 * same bytes and a changed plan gives a small diff. Expects a Project that passed projectSchema
 * (use preparePlanText for anything else); throws a TypeError naming the fields otherwise.
 */
export function serialisePlan(project: Project): string {
  const prepared = preparePlanText(project);
  if (!prepared.ok) throw new TypeError(prepared.error.message);
  return prepared.value.text;
}

export type PreparedPlan =
  | { readonly ok: true; readonly value: { readonly project: Project; readonly text: string } }
  | { readonly ok: false; readonly error: PlanFileError };

/**
 * Validates a value as a current-version plan and, when it is one, gives its file text. What the
 * store calls before writing, so that an invalid plan is never written.
 */
export function preparePlanText(value: unknown): PreparedPlan {
  const checked = checkProject(value);
  if (!checked.ok) {
    const { problems } = checked;
    return { ok: false, error: { code: 'invalid', message: `The plan cannot be saved:\n${listProblems(problems)}`, problems } };
  }
  // Re-reading through projectSchema puts keys in schema order; JSON.stringify keeps that order.
  return { ok: true, value: { project: checked.project, text: `${JSON.stringify(checked.project, null, 2)}\n` } };
}
