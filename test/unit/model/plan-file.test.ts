import { readFile } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parsePlanText, parsePlanValue, preparePlanText, serialisePlan } from '@shared/model/plan-file';
import type { PlanParseResult } from '@shared/model/plan-file';
import { MIGRATIONS, oldestReadableVersion } from '@shared/model/migrations';
import type { Migration } from '@shared/model/migrations';
import { FORMAT_TAG, SCHEMA_VERSION, projectSchema } from '@shared/model/project';
import type { Project } from '@shared/model/project';
import { projectInputArbitrary } from './helpers/project-arbitrary';

const fixture = (name: string): Promise<string> => readFile(new URL(`./fixtures/${name}`, import.meta.url), 'utf8');

function errorOf(result: PlanParseResult) {
  if (result.ok) throw new Error('expected the plan to be refused');
  return result.error;
}

function projectOf(result: PlanParseResult): Project {
  if (!result.ok) throw new Error(`expected a plan, got ${result.error.code}: ${result.error.message}`);
  return result.project;
}

const minimal = { format: FORMAT_TAG, schemaVersion: SCHEMA_VERSION, name: 'Plan', outcome: 'continuous', populations: [] };

describe('parsePlanText: refusals', () => {
  it.each([
    ['', 'The file is empty: it holds no plan.'],
    [' \n\t\r\n', 'The file holds only blank space: it holds no plan.'],
    ['\uFEFF', 'The file is empty: it holds no plan.'],
  ])('empty text %j is "empty"', (text, message) => {
    expect(errorOf(parsePlanText(text))).toEqual({ code: 'empty', message, problems: [] });
  });

  it('names the line and column of a JSON error', () => {
    const text = '{\n  "format": "plumbline-plan",\n  "name": "x",,\n}';
    const error = errorOf(parsePlanText(text));
    expect(error.code).toBe('unreadable-json');
    expect(error.message).toBe(
      "The file is not readable JSON at line 3, column 15: expected a property name in double quotes but found ','. It may be damaged.",
    );
  });

  it('says a truncated file looks cut short', async () => {
    const text = await fixture('schema-1.plumb');
    const error = errorOf(parsePlanText(text.slice(0, Math.floor(text.length / 2))));
    expect(error.code).toBe('unreadable-json');
    expect(error.message).toContain('The file looks cut short.');
  });

  it.each([
    ['[]', 'a list (JSON array)'],
    ['42', 'a number'],
    ['"plan"', 'a piece of text'],
    ['null', 'null'],
    ['true', 'true or false'],
  ])('a JSON %s is "not-a-plan"', (text, what) => {
    const error = errorOf(parsePlanText(text));
    expect(error.code).toBe('not-a-plan');
    expect(error.message).toBe(
      `This is not a Plumbline plan: the file holds ${what}, not a plan (a JSON object with "format": "plumbline-plan").`,
    );
  });

  it('refuses a wrong or missing format tag as "not-a-plan", quoting the tag found', () => {
    const wrong = errorOf(parsePlanText(JSON.stringify({ ...minimal, format: 'spreadsheet' })));
    expect(wrong).toMatchObject({ code: 'not-a-plan', problems: [{ path: 'format', message: 'must be "plumbline-plan"' }] });
    expect(wrong.message).toBe(
      'This is not a Plumbline plan: it has "format": "spreadsheet", and a plan has "format": "plumbline-plan".',
    );
    const { format: _omitted, ...untagged } = minimal;
    expect(errorOf(parsePlanText(JSON.stringify(untagged))).message).toContain('it has no "format" field');
  });

  it('refuses a newer schema version, saying which version made it and which this one reads', () => {
    const error = errorOf(parsePlanText(JSON.stringify({ ...minimal, schemaVersion: SCHEMA_VERSION + 1, outcome: 'binary' })));
    expect(error.code).toBe('future-version');
    expect(error.message).toBe(
      `This plan was made by a newer version of Plumbline (schema ${SCHEMA_VERSION + 1}); this version reads up to schema ${SCHEMA_VERSION} — the file was not changed. Open it with an up-to-date Plumbline.`,
    );
  });

  it.each([['"1"'], ['1.5'], ['-1'], ['null']])('refuses schemaVersion %s as "invalid" naming the field', (version) => {
    const text = JSON.stringify(minimal).replace(`"schemaVersion":${SCHEMA_VERSION}`, `"schemaVersion":${version}`);
    const error = errorOf(parsePlanText(text));
    expect(error.code).toBe('invalid');
    expect(error.problems).toEqual([{ path: 'schemaVersion', message: `must be a whole number (got ${version})` }]);
  });

  it('refuses an older version that no migration reaches', () => {
    const error = errorOf(parsePlanText(JSON.stringify({ ...minimal, schemaVersion: 0 })));
    expect(error.code).toBe('invalid');
    expect(error.message).toBe(
      `This plan says it uses schema 0, which this version of Plumbline cannot read (it reads schemas ${oldestReadableVersion(MIGRATIONS, SCHEMA_VERSION)} to ${SCHEMA_VERSION}).`,
    );
  });

  it('lists each schema violation with the path to the field', async () => {
    const plan = JSON.parse(await fixture('schema-1.plumb')) as {
      populations: { anticipated: Record<string, unknown> }[];
      name: string;
      schemaVersion: number;
    };
    plan.schemaVersion = SCHEMA_VERSION; // a version-1 continuous plan is a valid current plan too
    plan.name = '   ';
    const second = plan.populations[1];
    if (second === undefined) throw new Error('fixture has two populations');
    second.anticipated['rSquared'] = 1.5;
    const error = errorOf(parsePlanText(JSON.stringify(plan)));
    expect(error.code).toBe('invalid');
    expect(error.problems).toEqual([
      { path: 'name', message: 'project name must not be empty (got "")' },
      { path: 'populations[1].anticipated.rSquared', message: 'anticipated R² must be greater than 0 and less than 1 (got 1.5)' },
    ]);
    expect(error.message).toBe(
      'The plan has 2 problems:\nname: project name must not be empty (got "")\npopulations[1].anticipated.rSquared: anticipated R² must be greater than 0 and less than 1 (got 1.5)',
    );
  });

  it('cuts a problem message short when the offending value is long', () => {
    const populations = [
      {
        id: 'a',
        name: 'A',
        outcome: 'continuous',
        notes: 'x'.repeat(30_000),
        anticipated: { rSquared: 0.3, outcomeVariance: 1 },
        precision: { citl: { width: 1 } },
      },
    ];
    const error = errorOf(parsePlanText(JSON.stringify({ ...minimal, populations })));
    expect(error.problems).toHaveLength(1);
    expect(error.problems[0]?.path).toBe('populations[0].notes');
    expect(error.problems[0]?.message).toHaveLength(300);
    expect(error.problems[0]?.message.endsWith('…')).toBe(true);
  });

  it('spells out the first ten problems and counts the rest', () => {
    const populations = Array.from({ length: 12 }, (_, i) => ({ id: `p${i}`, name: `Site ${i}`, outcome: 'continuous' }));
    const error = errorOf(parsePlanText(JSON.stringify({ ...minimal, populations })));
    expect(error.problems.length).toBeGreaterThan(12);
    const lines = error.message.split('\n');
    expect(lines).toHaveLength(1 + 10 + 1);
    expect(lines[11]).toBe(`… and ${error.problems.length - 10} more`);
  });
});

describe('parsePlanText: acceptance', () => {
  it('opens the committed version-1 file, bringing it up to the current version', async () => {
    const result = parsePlanText(await fixture('schema-1.plumb'));
    expect(result.ok && result.migratedFrom).toBe(1);
    const project = projectOf(result);
    expect(project.populations.map((p) => p.id)).toEqual(['harbour-general', 'lakeside-registry']);
    // defaults filled in from the schema
    expect(project.populations[1]?.precision.confidence).toBe(0.95);
    expect(project.populations[1]?.recruitment.eligibleFraction).toBe(1);
  });

  it('ignores a leading byte-order mark', async () => {
    expect(projectOf(parsePlanText(`\uFEFF${await fixture('schema-1.plumb')}`)).name).toBe(
      'Northwind wound-healing score: external validation',
    );
  });

  it('runs the injected migrations for an older file and reports the version it came from', () => {
    // A test-only history: in "version 0" the plan name was called `title`.
    const table: Migration[] = [
      {
        from: 0,
        summary: 'title renamed to name',
        migrate: ({ title, ...rest }) => ({ ...rest, name: title }),
      },
    ];
    const old = { format: FORMAT_TAG, schemaVersion: 0, title: 'Old plan', outcome: 'continuous', populations: [] };
    const result = parsePlanValue(old, { migrations: [...table, ...MIGRATIONS] });
    expect(result.ok && result.migratedFrom).toBe(0);
    expect(projectOf(result)).toMatchObject({ name: 'Old plan', schemaVersion: SCHEMA_VERSION });
    expect(old).toHaveProperty('title', 'Old plan');
  });

  it('reports problems found after migrating as problems of the migrated plan', () => {
    const table: Migration[] = [{ from: 0, summary: 'no change', migrate: (plan) => plan }];
    const error = errorOf(
      parsePlanValue(
        { format: FORMAT_TAG, schemaVersion: 0, outcome: 'continuous', populations: [] },
        { migrations: [...table, ...MIGRATIONS] },
      ),
    );
    expect(error.code).toBe('invalid');
    expect(error.message).toMatch(/^The plan has 1 problem after updating it from schema 0:\nname: /);
  });

  it('reports a failing migration as "invalid" with the step that failed', () => {
    const table: Migration[] = [
      {
        from: 0,
        summary: 'needs populations',
        migrate: () => {
          throw new Error('populations missing');
        },
      },
    ];
    const error = errorOf(parsePlanValue({ ...minimal, schemaVersion: 0 }, { migrations: [...table, ...MIGRATIONS] }));
    expect(error).toEqual({
      code: 'invalid',
      message: 'Updating the plan from schema 0 to 1 failed: populations missing',
      problems: [],
    });
  });
});

describe('serialisePlan', () => {
  it('writes keys in schema order whatever order the object was built in, two-space indented, with a final newline', () => {
    const built = {
      populations: [],
      name: 'Plan',
      outcome: 'continuous',
      schemaVersion: SCHEMA_VERSION,
      format: FORMAT_TAG,
    } as const;
    const text = serialisePlan(projectSchema.parse(built));
    expect(text.endsWith('}\n')).toBe(true);
    expect(text.startsWith(`{\n  "format": "${FORMAT_TAG}",\n  "schemaVersion": ${SCHEMA_VERSION},\n  "name": "Plan",\n`)).toBe(
      true,
    );
    expect(text).toBe(serialisePlan(projectSchema.parse(minimal)));
  });

  it('throws a TypeError naming the field for a value that is not a valid plan', () => {
    const bad = { ...projectSchema.parse(minimal), name: '' };
    expect(() => serialisePlan(bad)).toThrow(TypeError);
    expect(preparePlanText(bad)).toMatchObject({ ok: false, error: { code: 'invalid', problems: [{ path: 'name' }] } });
  });

  it('round-trips every valid plan: parse(serialise(x)) equals x, and serialising again gives the same bytes', () => {
    fc.assert(
      fc.property(projectInputArbitrary(), (input) => {
        const project = projectSchema.parse(input);
        const text = serialisePlan(project);
        const reopened = projectOf(parsePlanText(text));
        expect(reopened).toEqual(project);
        expect(serialisePlan(reopened)).toBe(text);
      }),
      { numRuns: 300 },
    );
  });
});
