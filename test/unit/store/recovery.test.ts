import { spawnSync } from 'node:child_process';
import { mkdtemp, readdir, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import {
  checkDocumentId,
  discardRecovery,
  listRecovery,
  readRecovery,
  recoveryDir,
  writeRecovery,
} from '../../../src-main/store/recovery';
import { largePlan } from './helpers/large-plan';

let root = '';
let userData = '';
let deadPid = 0;

beforeAll(async () => {
  root = await mkdtemp(path.join(os.tmpdir(), 'plumbline-recovery-'));
  deadPid = Number(spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' }).stdout);
});
afterAll(async () => {
  await rm(root, { recursive: true, force: true });
});
beforeEach((ctx) => {
  userData = path.join(root, `Données utilisateur ${ctx.task.id}`);
});

const crashed = { instanceId: 'old-session', pid: 0 };
const running = { instanceId: 'this-session' };

describe('checkDocumentId', () => {
  it.each([
    ['abc-DEF_123', true],
    ['', false],
    ['../etc/passwd', false],
    ['a b', false],
    ['x'.repeat(65), false],
    [42, false],
  ])('%j is accepted: %s', (id, accepted) => {
    expect(checkDocumentId(id).ok).toBe(accepted);
  });
});

describe('recovery files', () => {
  it('are written, listed with the original path, time and plan name, and restored equal', async () => {
    const project = largePlan(3, 'R');
    const saved = await writeRecovery(
      userData,
      { documentId: 'doc-1', originalPath: '/plans/ü 1.plumb', project },
      { ...crashed, pid: deadPid },
      new Date('2031-05-06T07:08:09Z'),
    );
    expect(saved).toEqual({
      ok: true,
      value: { path: path.join(recoveryDir(userData), 'doc-1.recovery.json'), savedAt: '2031-05-06T07:08:09.000Z' },
    });

    const listed = await listRecovery(userData, running);
    expect(listed).toEqual({
      ok: true,
      value: [
        {
          documentId: 'doc-1',
          originalPath: '/plans/ü 1.plumb',
          originalExists: false,
          savedAt: '2031-05-06T07:08:09.000Z',
          projectName: project.name,
          inUse: false,
          problem: null,
        },
      ],
    });
    expect(await readRecovery(userData, 'doc-1')).toEqual({
      ok: true,
      value: {
        documentId: 'doc-1',
        originalPath: '/plans/ü 1.plumb',
        savedAt: '2031-05-06T07:08:09.000Z',
        project,
        migratedFrom: null,
      },
    });
  });

  it('replace the previous autosave of the same document, one file per document', async () => {
    await writeRecovery(userData, { documentId: 'doc-1', originalPath: null, project: largePlan(1, 'a') }, crashed);
    await writeRecovery(userData, { documentId: 'doc-1', originalPath: null, project: largePlan(1, 'b') }, crashed);
    await writeRecovery(userData, { documentId: 'doc-2', originalPath: null, project: largePlan(1, 'c') }, crashed);
    expect((await readdir(recoveryDir(userData))).sort()).toEqual(['doc-1.recovery.json', 'doc-2.recovery.json']);
    const restored = await readRecovery(userData, 'doc-1');
    expect(restored.ok && restored.value.project.name).toBe(largePlan(1, 'b').name);
  });

  it('are listed newest first, and marked in use when written by this instance or a live one', async () => {
    await writeRecovery(
      userData,
      { documentId: 'old', originalPath: null, project: largePlan(1, 'o') },
      { instanceId: 'gone', pid: deadPid },
      new Date('2031-01-01T00:00:00Z'),
    );
    await writeRecovery(
      userData,
      { documentId: 'mine', originalPath: null, project: largePlan(1, 'm') },
      running,
      new Date('2031-03-01T00:00:00Z'),
    );
    await writeRecovery(
      userData,
      { documentId: 'live', originalPath: null, project: largePlan(1, 'l') },
      { instanceId: 'other', pid: process.ppid },
      new Date('2031-02-01T00:00:00Z'),
    );
    const listed = await listRecovery(userData, running);
    expect(listed.ok && listed.value.map((d) => [d.documentId, d.inUse])).toEqual([
      ['mine', true],
      ['live', true],
      ['old', false],
    ]);
  });

  it('list a damaged file with its problem instead of hiding it, and refuse to restore it', async () => {
    await writeRecovery(userData, { documentId: 'doc-1', originalPath: null, project: largePlan(1, 'a') }, crashed);
    await writeFile(path.join(recoveryDir(userData), 'doc-2.recovery.json'), '{"format": "plumbline-recovery", ');
    const listed = await listRecovery(userData, running);
    if (!listed.ok) throw new Error(listed.error.message);
    const damaged = listed.value.find((d) => d.documentId === 'doc-2');
    expect(damaged?.problem).toMatch(/is damaged: it is not readable JSON/);
    expect(await readRecovery(userData, 'doc-2')).toMatchObject({ ok: false, error: { code: 'unreadable-json' } });
  });

  it('refuse an invalid plan, keeping the last valid autosave', async () => {
    await writeRecovery(userData, { documentId: 'doc-1', originalPath: null, project: largePlan(1, 'a') }, crashed);
    const bad = await writeRecovery(
      userData,
      { documentId: 'doc-1', originalPath: null, project: { ...largePlan(1, 'b'), name: '' } },
      crashed,
    );
    expect(bad).toMatchObject({ ok: false, error: { code: 'invalid', problems: [{ path: 'name' }] } });
    const restored = await readRecovery(userData, 'doc-1');
    expect(restored.ok && restored.value.project.name).toBe(largePlan(1, 'a').name);
  });

  it('refuse a document id that could escape the recovery folder', async () => {
    const result = await writeRecovery(
      userData,
      { documentId: '../../evil', originalPath: null, project: largePlan(1, 'a') },
      crashed,
    );
    expect(result).toMatchObject({ ok: false, error: { code: 'bad-document-id' } });
  });

  it('are discarded, after any autosave still being written', async () => {
    const pending = writeRecovery(userData, { documentId: 'doc-1', originalPath: null, project: largePlan(200, 'a') }, crashed);
    const discarded = discardRecovery(userData, 'doc-1');
    await pending;
    expect(await discarded).toEqual({ ok: true, value: true });
    expect(await listRecovery(userData, running)).toEqual({ ok: true, value: [] });
    expect(await discardRecovery(userData, 'doc-1')).toEqual({ ok: true, value: false });
    expect(await readRecovery(userData, 'doc-1')).toMatchObject({ ok: false, error: { code: 'no-recovery' } });
  });

  it('list nothing when the folder does not exist yet', async () => {
    expect(await listRecovery(userData, running)).toEqual({ ok: true, value: [] });
  });
});
