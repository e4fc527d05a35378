// Bringing plan files written by older versions of Plumbline up to the current schema.
//
// Every time the shape of the plan document changes, SCHEMA_VERSION in project.ts goes up by one
// and one step is added to MIGRATIONS below, taking a plan of the previous version to the new one.
// Opening a file runs the steps in order (1 → 2 → 3 …), so each step only knows its neighbour.
// A step sees plain JSON data (the file as parsed), not a typed Project: the types describe only
// the current version. The runner works on a deep copy, sets `schemaVersion` after each step
// itself, and the final result is checked against projectSchema as any freshly opened file is.
//
// To add a migration (as version 2 did for the binary outcome, see addBinaryOutcomeType):
//   1. In shared/model/project.ts, change the schema and raise SCHEMA_VERSION by one (to N).
//   2. Append one entry to MIGRATIONS: { from: N - 1, summary: '…', migrate: (plan) => … }.
//   3. Keep the older test/unit/model/fixtures/schema-K.plumb files as they are (they become the
//      inputs of the new step), add a version-N file next to them as schema-N.plumb, and add a
//      test for the step.
//   4. Run `npm run schema:write` to regenerate schema/plan.schema.json.
// The test "the shipped table is a complete chain" fails until steps 2 and 3 are done.

/** A plan as plain data, the way JSON.parse produced it. */
export type PlanData = Record<string, unknown>;

export interface Migration {
  /** The schema version this step reads. It produces version `from + 1`. */
  readonly from: number;
  /** One line saying what changed, for logs and for the message shown after a migration. */
  readonly summary: string;
  /** Returns the plan in the next version. May modify its argument (it is a private copy). */
  readonly migrate: (plan: PlanData) => PlanData;
}

/**
 * 1 → 2: version 2 adds the binary outcome type (populations become a choice on `outcome`, the
 * plan's `outcome` may be "binary", and `updating` gains the binary development settings). Every
 * version-1 plan is a continuous plan whose fields keep their names and meaning in version 2, so
 * the step states the outcome type explicitly and changes nothing else; a plan that says
 * anything other than continuous is refused, since version 1 had no other type.
 */
function addBinaryOutcomeType(plan: PlanData): PlanData {
  const outcome = plan['outcome'];
  if (outcome !== undefined && outcome !== 'continuous') {
    throw new Error(`a schema-1 plan is for a continuous outcome, but this one says "outcome": ${JSON.stringify(outcome)}`);
  }
  return { ...plan, outcome: 'continuous' };
}

/** The shipped migrations, oldest first. */
export const MIGRATIONS: readonly Migration[] = [
  {
    from: 1,
    summary: 'the binary outcome type is added; a version-1 plan is a continuous plan and keeps every field',
    migrate: addBinaryOutcomeType,
  },
];

export type MigrationErrorCode = 'no-migration' | 'migration-failed' | 'bad-table';

export type MigrationOutcome =
  | { readonly ok: true; readonly value: { readonly plan: PlanData; readonly steps: readonly Migration[] } }
  | { readonly ok: false; readonly error: { readonly code: MigrationErrorCode; readonly message: string } };

/**
 * Problems with a migration table meant to bring files up to `currentVersion`: each `from` must be
 * a whole number below the current version, appear once, and the steps must form one unbroken
 * chain ending at `currentVersion - 1`. An empty list means the table is sound.
 */
export function checkMigrationTable(migrations: readonly Migration[], currentVersion: number): string[] {
  const problems: string[] = [];
  const seen = new Set<number>();
  for (const m of migrations) {
    if (!Number.isInteger(m.from) || m.from < 0 || m.from >= currentVersion) {
      problems.push(`a migration starts from version ${m.from}, which is not a whole number from 0 to ${currentVersion - 1}`);
    } else if (seen.has(m.from)) problems.push(`two migrations start from version ${m.from}`);
    seen.add(m.from);
  }
  if (problems.length === 0 && seen.size > 0) {
    for (let v = Math.min(...seen); v < currentVersion; v += 1) {
      if (!seen.has(v)) problems.push(`no migration from version ${v} to ${v + 1}`);
    }
  }
  return problems;
}

/** The oldest schema version the table can bring up to `currentVersion`. */
export function oldestReadableVersion(migrations: readonly Migration[], currentVersion: number): number {
  let oldest = currentVersion;
  const byFrom = new Map(migrations.map((m) => [m.from, m]));
  while (byFrom.has(oldest - 1)) oldest -= 1;
  return oldest;
}

const isPlainObject = (v: unknown): v is PlanData => typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * Runs the steps that take `plan` (of schema version `from`) to version `to`. The caller's object
 * is never modified. Fails with 'bad-table' when the table is unsound, 'no-migration' when a step
 * is missing, and 'migration-failed' when a step throws or returns something that is not an object.
 */
export function migratePlan(
  plan: PlanData,
  options: { readonly from: number; readonly to: number; readonly migrations: readonly Migration[] },
): MigrationOutcome {
  const { from, to, migrations } = options;
  const tableProblems = checkMigrationTable(migrations, to);
  if (tableProblems.length > 0) {
    return { ok: false, error: { code: 'bad-table', message: `The migration table is broken: ${tableProblems.join('; ')}` } };
  }
  const byFrom = new Map(migrations.map((m) => [m.from, m]));
  const steps: Migration[] = [];
  let current: PlanData = structuredClone(plan);
  for (let version = from; version < to; version += 1) {
    const step = byFrom.get(version);
    if (step === undefined) {
      return {
        ok: false,
        error: {
          code: 'no-migration',
          message: `There is no way to bring a plan of schema ${version} up to schema ${version + 1}.`,
        },
      };
    }
    let next: unknown;
    try {
      next = step.migrate(current);
    } catch (e) {
      const why = e instanceof Error ? e.message : String(e);
      return {
        ok: false,
        error: { code: 'migration-failed', message: `Updating the plan from schema ${version} to ${version + 1} failed: ${why}` },
      };
    }
    if (!isPlainObject(next)) {
      return {
        ok: false,
        error: {
          code: 'migration-failed',
          message: `Updating the plan from schema ${version} to ${version + 1} did not produce a plan.`,
        },
      };
    }
    current = { ...next, schemaVersion: version + 1 };
    steps.push(step);
  }
  return { ok: true, value: { plan: current, steps } };
}
