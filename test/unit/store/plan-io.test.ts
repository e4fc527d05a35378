import { spawnSync } from 'node:child_process';
import { chmod, mkdir, mkdtemp, readFile, readdir, rm, stat, truncate, utimes, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { cleanLeftoverTemps, parseTempName, tempPathFor, writeFileAtomic } from '../../../src-main/store/atomic-write';
import { MAX_PLAN_BYTES, readPlanFile, writePlanFile } from '../../../src-main/store/plan-io';
import { hostTag } from '../../../src-main/store/process-identity';
import { serialisePlan } from '@shared/model/plan-file';
import { SCHEMA_VERSION, projectSchema } from '@shared/model/project';
import { newEmptyProject } from '@shared/model/new-project';
import { projectInputArbitrary } from '../model/helpers/project-arbitrary';
import { largePlan } from './helpers/large-plan';

let root = '';
let folder = '';
let target = '';

beforeAll(async () => {
  root = await mkdtemp(path.join(os.tmpdir(), 'plumbline-io-'));
});
afterAll(async () => {
  await rm(root, { recursive: true, force: true });
});
beforeEach(async (ctx) => {
  // a fresh folder per test, with a space and non-ASCII letters in every part of the path
  folder = path.join(root, `Études cliniques ${ctx.task.id}`);
  await mkdir(folder, { recursive: true });
  target = path.join(folder, 'plan ü 1.plumb');
});

/** The bytes and modification time of a file, and the folder's listing, to prove nothing changed. */
async function snapshot(file: string): Promise<{ bytes: Buffer; mtimeMs: number; listing: string[] }> {
  const [bytes, info, listing] = await Promise.all([readFile(file), stat(file), readdir(path.dirname(file))]);
  return { bytes, mtimeMs: info.mtimeMs, listing: listing.sort() };
}

const valid = serialisePlan(largePlan(3, 'T'));
const plan = (fields: Record<string, unknown>): string =>
  JSON.stringify({ ...(JSON.parse(valid) as object), ...fields }, null, 2);

describe('readPlanFile refuses damaged files with a clear message and leaves them untouched', () => {
  const cases: [string, string | Buffer, string, RegExp][] = [
    ['empty', '', 'empty', /^The file is empty: it holds no plan\.$/],
    ['blank', '\n\n  \n', 'empty', /^The file holds only blank space/],
    [
      'truncated',
      valid.slice(0, 700),
      'unreadable-json',
      /^The file is not readable JSON at line \d+, column \d+: .* The file looks cut short\./,
    ],
    [
      'corrupted',
      valid.replace('"populations": [', '"populations": [}'),
      'unreadable-json',
      /^The file is not readable JSON at line \d+, column \d+: expected a value or '\]' but found '\}'/,
    ],
    ['binary garbage', Buffer.from([0x00, 0xff, 0xfe, 0x13, 0x80, 0x81]), 'unreadable-json', /^The file is not UTF-8 text/],
    [
      'UTF-16',
      Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(valid, 'utf16le')]),
      'unreadable-json',
      /^The file is saved as UTF-16 text/,
    ],
    ['zero-filled', Buffer.alloc(4096), 'unreadable-json', /found the control character U\+0000/],
    ['wrong type (array)', '[1, 2, 3]\n', 'not-a-plan', /^This is not a Plumbline plan: the file holds a list \(JSON array\)/],
    ['wrong type (text)', '"a plan"\n', 'not-a-plan', /^This is not a Plumbline plan: the file holds a piece of text/],
    ['wrong tag', plan({ format: 'other-tool' }), 'not-a-plan', /^This is not a Plumbline plan: it has "format": "other-tool"/],
    [
      'future version',
      plan({ schemaVersion: SCHEMA_VERSION + 5 }),
      'future-version',
      new RegExp(
        `newer version of Plumbline \\(schema ${SCHEMA_VERSION + 5}\\); this version reads up to schema ${SCHEMA_VERSION} — the file was not changed`,
      ),
    ],
    ['schema violation', plan({ name: 7 }), 'invalid', /^The plan has 1 problem:\nname: /],
  ];

  it.each(cases)('%s', async (_label, content, code, message) => {
    await writeFile(target, content);
    const past = new Date('2030-06-01T12:00:00Z');
    await utimes(target, past, past); // any rewrite would move the modification time
    const before = await snapshot(target);
    const result = await readPlanFile(target);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.error.code).toBe(code);
    expect(result.error.message).toMatch(message);
    expect(await snapshot(target)).toEqual(before);
  });

  it('names the field of each schema violation', async () => {
    await writeFile(target, plan({ name: 7 }));
    const result = await readPlanFile(target);
    expect(!result.ok && result.error.problems).toEqual([
      { path: 'name', message: 'Invalid input: expected string, received number (got 7)' },
    ]);
  });

  it('refuses a file far larger than any plan without reading it', async () => {
    await writeFile(target, '');
    await truncate(target, MAX_PLAN_BYTES + 1); // sparse: costs no disk space
    const result = await readPlanFile(target);
    expect(result).toMatchObject({ ok: false, error: { code: 'too-large' } });
  });

  it.each([
    ['a missing file', (): string => path.join(folder, 'nothing here.plumb'), 'not-found'],
    ['a folder', (): string => folder, 'is-directory'],
    ['a relative path', (): string => 'plan.plumb', 'bad-path'],
    ['a path with a NUL', (): string => `${folder}/a\0b.plumb`, 'bad-path'],
  ] as const)('refuses %s', async (_label, where, code) => {
    const result = await readPlanFile(where());
    expect(result).toMatchObject({ ok: false, error: { code } });
  });

  it('opens a valid plan and reports its size and modification time', async () => {
    await writeFile(target, valid);
    const result = await readPlanFile(target);
    if (!result.ok) throw new Error(result.error.message);
    expect(result.value).toMatchObject({ path: target, migratedFrom: null, bytes: Buffer.byteLength(valid) });
    expect(result.value.project.populations).toHaveLength(3);
  });
});

describe('writePlanFile', () => {
  it('round-trips random valid plans through the disk', async () => {
    await fc.assert(
      fc.asyncProperty(projectInputArbitrary(3), async (input) => {
        const written = await writePlanFile(target, input);
        if (!written.ok) throw new Error(written.error.message);
        const reopened = await readPlanFile(target);
        if (!reopened.ok) throw new Error(reopened.error.message);
        expect(reopened.value.project).toEqual(projectSchema.parse(input));
      }),
      { numRuns: 60 },
    );
  });

  it('writes the exact serialised text, and keeps the previous version as .bak', async () => {
    const first = largePlan(2, 'first');
    const second = largePlan(2, 'second');
    const a = await writePlanFile(target, first);
    expect(a).toMatchObject({ ok: true, value: { backupPath: null, warnings: [] } });
    const b = await writePlanFile(target, second);
    expect(b).toMatchObject({ ok: true, value: { backupPath: `${target}.bak`, warnings: [] } });
    expect(await readFile(target, 'utf8')).toBe(serialisePlan(second));
    expect(await readFile(`${target}.bak`, 'utf8')).toBe(serialisePlan(first));
    expect((await readdir(folder)).sort()).toEqual(['plan ü 1.plumb', 'plan ü 1.plumb.bak']);
  });

  it('refuses an invalid plan with the field problems and does not touch the file', async () => {
    await writePlanFile(target, newEmptyProject());
    const before = await snapshot(target);
    const result = await writePlanFile(target, { ...newEmptyProject(), populations: [{ id: 'x', outcome: 'continuous' }] });
    expect(result).toMatchObject({ ok: false, error: { code: 'invalid' } });
    expect(!result.ok && result.error.problems?.map((p) => p.path)).toEqual(expect.arrayContaining(['populations[0].name']));
    expect(await snapshot(target)).toEqual(before);
  });

  it('fails with "not-found" for a missing folder and leaves no temporary file', async () => {
    const result = await writePlanFile(path.join(folder, 'no such folder', 'p.plumb'), newEmptyProject());
    expect(result).toMatchObject({ ok: false, error: { code: 'not-found' } });
    expect(await readdir(folder)).toEqual([]);
  });

  it('fails with "is-directory" when the target is a folder', async () => {
    await mkdir(target);
    expect(await writePlanFile(target, newEmptyProject())).toMatchObject({ ok: false, error: { code: 'is-directory' } });
  });

  it('finishes concurrent saves of one file in the order they were asked for', async () => {
    const plans = ['1', '2', '3', '4'].map((v) => largePlan(50, v));
    const results = await Promise.all(plans.map((p) => writePlanFile(target, p)));
    expect(results.every((r) => r.ok)).toBe(true);
    expect(await readFile(target, 'utf8')).toBe(serialisePlan(largePlan(50, '4')));
    expect(await readFile(`${target}.bak`, 'utf8')).toBe(serialisePlan(largePlan(50, '3')));
  });

  it('keeps the file mode of the plan it replaces', async () => {
    await writePlanFile(target, newEmptyProject());
    await chmod(target, 0o640);
    await writePlanFile(target, largePlan(1, 'm'));
    expect((await stat(target)).mode & 0o777).toBe(0o640);
  });
});

describe('leftover temporary files', () => {
  /** A pid that certainly belongs to no running process: one that has just exited. */
  function deadPid(): number {
    const child = spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' });
    return Number(child.stdout);
  }

  it('parses only names made by tempPathFor', () => {
    const made = path.basename(tempPathFor(target));
    expect(parseTempName(made)).toEqual({ base: 'plan ü 1.plumb', host: hostTag(), pid: process.pid });
    for (const other of ['plan.plumb', '.plan.plumb.tmp', '.plan.plumb.123.tmp', 'x.abcdef12-1-aaaaaaaaaaaa.tmp']) {
      expect(parseTempName(other), other).toBeNull();
    }
  });

  it("removes those of dead writers and old ones, keeps live writers', recent foreign ones and other files", async () => {
    const base = 'plan ü 1.plumb';
    const dead = `.${base}.${hostTag()}-${deadPid()}-aaaaaaaaaaaa.tmp`;
    const deadBackup = `.${base}.bak.${hostTag()}-${deadPid()}-bbbbbbbbbbbb.tmp`;
    const live = `.${base}.${hostTag()}-${process.ppid}-cccccccccccc.tmp`; // our parent is alive
    const foreignRecent = `.${base}.0badc0de-${process.pid}-dddddddddddd.tmp`;
    const foreignOld = `.${base}.0badc0de-${process.pid}-eeeeeeeeeeee.tmp`;
    const otherPlan = `.other.plumb.${hostTag()}-${deadPid()}-ffffffffffff.tmp`;
    for (const name of [dead, deadBackup, live, foreignRecent, foreignOld, otherPlan, 'notes.txt'])
      await writeFile(path.join(folder, name), 'x');
    const old = new Date(Date.now() - 2 * 60 * 60 * 1000);
    await utimes(path.join(folder, foreignOld), old, old);

    const removed = await cleanLeftoverTemps(folder, new Set([base, `${base}.bak`]));
    expect(removed).toBe(3);
    expect((await readdir(folder)).sort()).toEqual([foreignRecent, live, otherPlan, 'notes.txt'].sort());
  });

  it('are cleaned by the next save and by the next open', async () => {
    await writePlanFile(target, newEmptyProject());
    const leftover = path.join(folder, `.plan ü 1.plumb.${hostTag()}-${deadPid()}-aaaaaaaaaaaa.tmp`);
    await writeFile(leftover, '{"half": ');
    await readPlanFile(target);
    await expect(stat(leftover)).rejects.toThrow();
    await writeFile(leftover, '{"half": ');
    await writePlanFile(target, newEmptyProject());
    await expect(stat(leftover)).rejects.toThrow();
  });
});

describe('writeFileAtomic', () => {
  it('writes bytes as given and reports no backup when none is asked for', async () => {
    const file = path.join(folder, 'data.bin');
    const result = await writeFileAtomic(file, Uint8Array.from([1, 2, 3]));
    expect(result).toEqual({ ok: true, value: { backupPath: null, warnings: [] } });
    expect([...(await readFile(file))]).toEqual([1, 2, 3]);
  });

  it('saves anyway, with a warning, when the backup cannot be kept', async () => {
    const file = path.join(folder, 'p.plumb');
    await writeFile(file, 'old');
    await mkdir(`${file}.bak`); // a folder where the backup should go: it cannot be replaced by a file
    const result = await writeFileAtomic(file, 'new', { backupPath: `${file}.bak` });
    if (!result.ok) throw new Error(result.error.message);
    expect(result.value.backupPath).toBeNull();
    expect(result.value.warnings).toHaveLength(1);
    expect(result.value.warnings[0]).toMatch(
      /^Could not keep the previous version as ".*p\.plumb\.bak": .* The new version was saved; no backup of the old one was kept\.$/,
    );
    expect(await readFile(file, 'utf8')).toBe('new');
    expect((await readdir(folder)).sort()).toEqual(['p.plumb', 'p.plumb.bak']);
  });
});
