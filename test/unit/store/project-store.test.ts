import { copyFile, mkdir, mkdtemp, readFile, readdir, rm, stat } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { ProjectStore } from '../../../src-main/store/project-store';
import type { StoreResult } from '../../../src-main/store/store-error';
import { lockPathFor } from '../../../src-main/store/lock';
import { serialisePlan } from '@shared/model/plan-file';
import { largePlan } from './helpers/large-plan';

const fixturePlan = fileURLToPath(new URL('../model/fixtures/schema-1.plumb', import.meta.url));

let root = '';
let folder = '';
let planPath = '';
let store: ProjectStore;
const clock = { now: new Date('2031-04-05T06:07:08Z') };

beforeAll(async () => {
  root = await mkdtemp(path.join(os.tmpdir(), 'plumbline-store-'));
});
afterAll(async () => {
  await rm(root, { recursive: true, force: true });
});
beforeEach(async (ctx) => {
  folder = path.join(root, `Études cliniques ${ctx.task.id}`);
  await mkdir(folder, { recursive: true });
  planPath = path.join(folder, 'plan ü 1.plumb');
  store = new ProjectStore({
    userDataDir: path.join(root, `user data ${ctx.task.id}`),
    instanceId: 'instance-a',
    now: () => clock.now,
  });
});

function valueOf<T>(result: StoreResult<T>): T {
  if (!result.ok) throw new Error(`${result.error.code}: ${result.error.message}`);
  return result.value;
}

describe('ProjectStore: new, save, open, close', () => {
  it('saves a new plan, lists it as recent, and reopens it equal', async () => {
    const doc = store.newDocumentId();
    const project = { ...store.newEmpty(), name: 'Plan ü' };
    const saved = valueOf(await store.saveAs(planPath, project, doc, null));
    expect(saved).toMatchObject({
      path: planPath,
      backupPath: null,
      warnings: [],
      lock: { status: 'acquired' },
      savedAt: clock.now.toISOString(),
    });
    expect(valueOf(await store.recentProjects()).entries).toEqual([
      { path: planPath, name: 'Plan ü', openedAt: clock.now.toISOString(), missing: false },
    ]);

    const reopened = valueOf(await store.open(planPath, doc));
    expect(reopened.project).toEqual(project);
    expect(reopened.lock).toEqual({ status: 'acquired' });
  });

  it('keeps the previous version as .bak and reverts to what is on disk', async () => {
    const doc = store.newDocumentId();
    valueOf(await store.save(planPath, largePlan(2, 'one'), doc));
    const second = valueOf(await store.save(planPath, largePlan(2, 'two'), doc));
    expect(second.backupPath).toBe(`${planPath}.bak`);
    expect(await readFile(`${planPath}.bak`, 'utf8')).toBe(serialisePlan(largePlan(2, 'one')));
    expect(valueOf(await store.revert(planPath)).project).toEqual(largePlan(2, 'two'));
  });

  it('refuses to save an invalid plan, naming the field', async () => {
    const result = await store.save(planPath, { ...store.newEmpty(), name: ' ' }, store.newDocumentId());
    expect(result).toMatchObject({ ok: false, error: { code: 'invalid', problems: [{ path: 'name' }] } });
    await expect(stat(planPath)).rejects.toThrow();
  });

  it('a clean close releases the lock and removes the recovery file', async () => {
    const doc = store.newDocumentId();
    valueOf(await store.save(planPath, largePlan(1, 'x'), doc));
    valueOf(await store.autosave(doc, planPath, largePlan(1, 'y')));
    expect(valueOf(await store.close(planPath, doc))).toEqual({ lockReleased: true, recoveryDiscarded: true, warnings: [] });
    await expect(stat(lockPathFor(planPath))).rejects.toThrow();
    expect(valueOf(await store.listRecoverable())).toEqual([]);
  });

  it('closing with a plan path that cannot be used still removes the recovery file, with a warning', async () => {
    const doc = store.newDocumentId();
    valueOf(await store.autosave(doc, planPath, largePlan(1, 'y')));
    const closed = valueOf(await store.close('relative/plan.plumb', doc));
    expect(closed).toMatchObject({ lockReleased: false, recoveryDiscarded: true });
    expect(closed.warnings).toEqual(['The plan path "relative/plan.plumb" is not absolute.']);
  });

  it('saving clears the autosave of the document', async () => {
    const doc = store.newDocumentId();
    valueOf(await store.autosave(doc, null, largePlan(1, 'draft')));
    valueOf(await store.saveAs(planPath, largePlan(1, 'draft'), doc, null));
    expect(valueOf(await store.listRecoverable())).toEqual([]);
  });

  it('save as moves the lock from the old path to the new one', async () => {
    const doc = store.newDocumentId();
    valueOf(await store.save(planPath, largePlan(1, 'x'), doc));
    const other = path.join(folder, 'autre nom.plumb');
    valueOf(await store.saveAs(other, largePlan(1, 'x'), doc, planPath));
    await expect(stat(lockPathFor(planPath))).rejects.toThrow();
    expect((await stat(lockPathFor(other))).isFile()).toBe(true);
  });
});

describe('ProjectStore: open elsewhere', () => {
  it('warns when the plan is open in another window of this instance, and refuses to save over it', async () => {
    const first = store.newDocumentId();
    valueOf(await store.save(planPath, largePlan(1, 'x'), first));
    const second = store.newDocumentId();
    const opened = valueOf(await store.open(planPath, second));
    expect(opened.lock).toMatchObject({ status: 'held-elsewhere', warning: { kind: 'another-window' } });
    expect(await store.save(planPath, largePlan(1, 'y'), second)).toEqual({
      ok: false,
      error: { code: 'open-elsewhere', message: 'This plan is already open in another Plumbline window.' },
    });
    // the user chose to take over
    const taken = valueOf(await store.save(planPath, largePlan(1, 'y'), second, { takeOverLock: true }));
    expect(taken.lock).toMatchObject({ status: 'took-over' });
  });

  it('warns when another running instance has it open', async () => {
    valueOf(await store.save(planPath, largePlan(1, 'x'), store.newDocumentId()));
    const otherInstance = new ProjectStore({ userDataDir: path.join(folder, 'other user data'), instanceId: 'instance-b' });
    const opened = valueOf(await otherInstance.open(planPath, otherInstance.newDocumentId()));
    expect(opened.lock).toMatchObject({
      status: 'held-elsewhere',
      warning: { kind: 'another-instance', holder: { instanceId: 'instance-a' } },
    });
  });
});

describe('ProjectStore: recovery after a crash', () => {
  it('offers the unsaved work of a crashed session on the next start, restores it, and discards it', async () => {
    const doc = store.newDocumentId();
    valueOf(await store.save(planPath, largePlan(2, 'saved'), doc));
    valueOf(await store.autosave(doc, planPath, largePlan(2, 'unsaved')));
    // the app dies here; the next start is a new instance with the same user-data folder
    const next = new ProjectStore({ userDataDir: store.userDataDir, instanceId: 'instance-after-restart', now: () => clock.now });
    const offered = valueOf(await next.listRecoverable());
    expect(offered).toEqual([
      {
        documentId: doc,
        originalPath: planPath,
        originalExists: true,
        savedAt: clock.now.toISOString(),
        projectName: largePlan(2, 'unsaved').name,
        inUse: false,
        problem: null,
      },
    ]);
    const restored = valueOf(await next.restore(doc));
    expect(restored.project).toEqual(largePlan(2, 'unsaved'));
    // still there until the restored document is saved or closed
    expect(valueOf(await next.listRecoverable())).toHaveLength(1);
    expect(valueOf(await next.discardRecovery(doc))).toBe(true);
    expect(valueOf(await next.listRecoverable())).toEqual([]);
  });

  it('does not offer the live autosave of this instance as crash debris', async () => {
    valueOf(await store.autosave(store.newDocumentId(), null, largePlan(1, 'live')));
    expect(valueOf(await store.listRecoverable()).map((d) => d.inUse)).toEqual([true]);
  });
});

describe('ProjectStore: demo and populations', () => {
  it('starts a new document from the demo file without touching it', async () => {
    const demo = path.join(folder, 'demo', 'consortium-continuous.plumb');
    await mkdir(path.dirname(demo));
    await copyFile(fixturePlan, demo);
    const before = await stat(demo);
    const fromDemo = valueOf(await store.newFromDemo(demo));
    expect(fromDemo.project.populations.length).toBe(2);
    expect((await stat(demo)).mtimeMs).toBe(before.mtimeMs);
    expect((await readdir(path.dirname(demo))).sort()).toEqual(['consortium-continuous.plumb']);
    expect(valueOf(await store.recentProjects()).entries).toEqual([]);
  });

  it('says plainly when the demo file is missing', async () => {
    const result = await store.newFromDemo(path.join(folder, 'nowhere.plumb'));
    expect(result).toMatchObject({ ok: false, error: { code: 'not-found' } });
    expect(!result.ok && result.error.message).toMatch(/^The demo plan could not be used\. Could not open/);
  });

  it('imports populations from another plan file', async () => {
    const result = valueOf(await store.importPopulationsFromFile(largePlan(1, 'target'), fixturePlan, ['lakeside-registry']));
    expect(result.project.populations.map((p) => p.id)).toEqual(['site-target-0', 'lakeside-registry']);
    expect(await store.importPopulationsFromFile(largePlan(1, 'target'), fixturePlan, ['nowhere'])).toMatchObject({
      ok: false,
      error: { code: 'no-such-population' },
    });
    expect(await store.importPopulationsFromFile(largePlan(1, 'target'), path.join(folder, 'nope.plumb'))).toMatchObject({
      ok: false,
      error: { code: 'not-found' },
    });
  });

  it('exports one population as a plan file that opens', async () => {
    const source = largePlan(3, 'src');
    const target = path.join(folder, 'one site.plumb');
    valueOf(await store.exportPopulationToFile(source, 'site-src-1', target));
    const exported = valueOf(await store.open(target, store.newDocumentId())).project;
    expect(exported.populations).toEqual([source.populations[1]]);
    expect(exported.name).toBe(`${source.populations[1]?.name} (from ${source.name})`);
  });

  it('refuses to export over a plan that is open in a window', async () => {
    valueOf(await store.save(planPath, largePlan(1, 'open'), store.newDocumentId()));
    const result = await store.exportPopulationToFile(largePlan(3, 'src'), 'site-src-1', planPath);
    expect(result).toMatchObject({ ok: false, error: { code: 'open-elsewhere' } });
    expect(await readFile(planPath, 'utf8')).toBe(serialisePlan(largePlan(1, 'open')));
  });

  it('refuses a bad document id before touching anything', async () => {
    expect(await store.open(fixturePlan, '../x')).toMatchObject({ ok: false, error: { code: 'bad-document-id' } });
    await expect(stat(lockPathFor(fixturePlan))).rejects.toThrow();
  });
});
