import { readdir, readFile } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import { MIGRATIONS, checkMigrationTable, migratePlan, oldestReadableVersion } from '@shared/model/migrations';
import type { Migration, PlanData } from '@shared/model/migrations';
import { parsePlanText } from '@shared/model/plan-file';
import { SCHEMA_VERSION } from '@shared/model/project';

// A made-up history used only here, to drive the runner: 0 → 1 renames `title` to `name`,
// 1 → 2 wraps `sites` into `populations`, 2 → 3 adds `tags`.
const history: Migration[] = [
  { from: 0, summary: 'title becomes name', migrate: ({ title, ...rest }) => ({ ...rest, name: title }) },
  { from: 1, summary: 'sites become populations', migrate: ({ sites, ...rest }) => ({ ...rest, populations: sites }) },
  {
    from: 2,
    summary: 'tags added',
    migrate: (plan) => {
      plan['tags'] = []; // steps may modify their argument: it is the runner's private copy
      return plan;
    },
  },
];

describe('checkMigrationTable', () => {
  it('accepts an unbroken chain ending just below the current version, and an empty table', () => {
    expect(checkMigrationTable(history, 3)).toEqual([]);
    expect(checkMigrationTable([], 3)).toEqual([]);
  });

  it('finds gaps, duplicates and steps outside the version range', () => {
    const step = (from: number): Migration => ({ from, summary: `step ${from}`, migrate: (p) => p });
    expect(checkMigrationTable([step(0), step(2)], 3)).toEqual(['no migration from version 1 to 2']);
    expect(checkMigrationTable([step(1), step(1), step(2)], 3)).toEqual(['two migrations start from version 1']);
    expect(checkMigrationTable([step(3)], 3)).toEqual([
      'a migration starts from version 3, which is not a whole number from 0 to 2',
    ]);
    expect(checkMigrationTable([step(0.5)], 3)).toHaveLength(1);
    // a chain that stops short of the current version leaves files of its last version unreadable
    expect(checkMigrationTable([step(0)], 3)).toEqual(['no migration from version 1 to 2', 'no migration from version 2 to 3']);
  });

  it('the shipped table is a complete chain up to SCHEMA_VERSION', () => {
    expect(checkMigrationTable(MIGRATIONS, SCHEMA_VERSION)).toEqual([]);
  });
});

describe('oldestReadableVersion', () => {
  it('walks the chain back from the current version', () => {
    expect(oldestReadableVersion(history, 3)).toBe(0);
    expect(oldestReadableVersion(history.slice(1), 3)).toBe(1);
    expect(oldestReadableVersion([], 3)).toBe(3);
  });
});

describe('migratePlan', () => {
  const v0: PlanData = { schemaVersion: 0, title: 'Old', sites: [{ id: 'a' }] };

  it('applies each step in order, sets schemaVersion itself, and leaves the input untouched', () => {
    const before = structuredClone(v0);
    const result = migratePlan(v0, { from: 0, to: 3, migrations: history });
    expect(result).toEqual({
      ok: true,
      value: { plan: { schemaVersion: 3, name: 'Old', populations: [{ id: 'a' }], tags: [] }, steps: history },
    });
    expect(v0).toEqual(before);
  });

  it('starts from the file version, not from the oldest step', () => {
    const result = migratePlan({ schemaVersion: 2, name: 'x', populations: [] }, { from: 2, to: 3, migrations: history });
    expect(result.ok && result.value.steps.map((s) => s.from)).toEqual([2]);
  });

  it('does nothing for a plan already at the target version', () => {
    expect(migratePlan({ schemaVersion: 3 }, { from: 3, to: 3, migrations: history })).toEqual({
      ok: true,
      value: { plan: { schemaVersion: 3 }, steps: [] },
    });
  });

  it('fails with "no-migration" when the chain does not reach back to the file version', () => {
    expect(migratePlan(v0, { from: 0, to: 3, migrations: history.slice(1) })).toEqual({
      ok: false,
      error: { code: 'no-migration', message: 'There is no way to bring a plan of schema 0 up to schema 1.' },
    });
  });

  it('fails with "migration-failed" when a step throws or returns something other than an object', () => {
    const throwing: Migration = {
      from: 0,
      summary: 'boom',
      migrate: () => {
        throw new Error('field x missing');
      },
    };
    expect(migratePlan(v0, { from: 0, to: 1, migrations: [throwing] })).toEqual({
      ok: false,
      error: { code: 'migration-failed', message: 'Updating the plan from schema 0 to 1 failed: field x missing' },
    });
    const returnsList: Migration = { from: 0, summary: 'wrong', migrate: () => [] as unknown as PlanData };
    expect(migratePlan(v0, { from: 0, to: 1, migrations: [returnsList] })).toMatchObject({
      ok: false,
      error: { code: 'migration-failed' },
    });
  });

  it('fails with "bad-table" instead of running a broken table', () => {
    const result = migratePlan(v0, {
      from: 0,
      to: 3,
      migrations: [history[0], history[0], history[2]].filter((m) => m !== undefined),
    });
    expect(result).toMatchObject({ ok: false, error: { code: 'bad-table' } });
  });
});

describe('plan files of every readable version', () => {
  it('has a fixture schema-N.plumb for each version from the oldest readable to the current, and each opens', async () => {
    const oldest = oldestReadableVersion(MIGRATIONS, SCHEMA_VERSION);
    const files = (await readdir(new URL('./fixtures/', import.meta.url))).filter((f) => /^schema-\d+\.plumb$/.test(f));
    const versions = files.map((f) => Number(/\d+/.exec(f)?.[0])).sort((a, b) => a - b);
    expect(versions).toEqual(Array.from({ length: SCHEMA_VERSION - oldest + 1 }, (_, i) => oldest + i));
    for (const version of versions) {
      const result = parsePlanText(await readFile(new URL(`./fixtures/schema-${version}.plumb`, import.meta.url), 'utf8'));
      expect(result, `schema-${version}.plumb`).toMatchObject({
        ok: true,
        migratedFrom: version < SCHEMA_VERSION ? version : null,
      });
    }
  });
});
