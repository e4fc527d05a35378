import { mkdir, mkdtemp, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { MAX_RECENT, addRecent, clearRecent, readRecent, removeRecent } from '../../../src-main/store/recent';

let root = '';
let userData = '';
let plans = '';

beforeAll(async () => {
  root = await mkdtemp(path.join(os.tmpdir(), 'plumbline-recent-'));
});
afterAll(async () => {
  await rm(root, { recursive: true, force: true });
});
beforeEach(async (ctx) => {
  userData = path.join(root, `user data ${ctx.task.id}`);
  plans = path.join(root, `Études cliniques ${ctx.task.id}`);
  await mkdir(plans, { recursive: true });
});

async function makePlan(name: string): Promise<string> {
  const file = path.join(plans, name);
  await writeFile(file, '{}');
  return file;
}

const at = (minute: number): Date => new Date(Date.UTC(2031, 0, 1, 0, minute));

describe('recent projects', () => {
  it('starts empty', async () => {
    expect(await readRecent(userData)).toEqual({ ok: true, value: { entries: [], problem: null } });
  });

  it('puts the latest first and moves a reopened plan to the top instead of listing it twice', async () => {
    const a = await makePlan('plan ü a.plumb');
    const b = await makePlan('plan ü b.plumb');
    await addRecent(userData, { path: a, name: 'A' }, at(1));
    await addRecent(userData, { path: b, name: 'B' }, at(2));
    await addRecent(userData, { path: a, name: 'A renamed' }, at(3));
    const list = await readRecent(userData);
    expect(list).toEqual({
      ok: true,
      value: {
        entries: [
          { path: a, name: 'A renamed', openedAt: at(3).toISOString(), missing: false },
          { path: b, name: 'B', openedAt: at(2).toISOString(), missing: false },
        ],
        problem: null,
      },
    });
  });

  it(`keeps at most ${MAX_RECENT}`, async () => {
    for (let i = 0; i < MAX_RECENT + 3; i += 1)
      await addRecent(userData, { path: await makePlan(`p${i}.plumb`), name: `P${i}` }, at(i));
    const list = await readRecent(userData);
    expect(list.ok && list.value.entries.map((e) => e.name)).toEqual(
      Array.from({ length: MAX_RECENT }, (_, i) => `P${MAX_RECENT + 2 - i}`),
    );
  });

  it('flags a plan that has gone missing instead of dropping it', async () => {
    const a = await makePlan('a.plumb');
    await addRecent(userData, { path: a, name: 'A' }, at(1));
    await rm(a);
    const list = await readRecent(userData);
    expect(list.ok && list.value.entries).toEqual([{ path: a, name: 'A', openedAt: at(1).toISOString(), missing: true }]);
  });

  it('removes one entry or all on request', async () => {
    const a = await makePlan('a.plumb');
    const b = await makePlan('b.plumb');
    await addRecent(userData, { path: a, name: 'A' });
    await addRecent(userData, { path: b, name: 'B' });
    const removed = await removeRecent(userData, a);
    expect(removed.ok && removed.value.entries.map((e) => e.name)).toEqual(['B']);
    const cleared = await clearRecent(userData);
    expect(cleared.ok && cleared.value.entries).toEqual([]);
  });

  it('sets a damaged list aside with a problem note, and starts again on the next change', async () => {
    await mkdir(userData, { recursive: true });
    await writeFile(path.join(userData, 'recent-projects.json'), '{"format": "plumbline-recent", "entr');
    const damaged = await readRecent(userData);
    expect(damaged).toMatchObject({ ok: true, value: { entries: [] } });
    expect(damaged.ok && damaged.value.problem).toMatch(/was damaged and has been set aside/);
    const a = await makePlan('a.plumb');
    await addRecent(userData, { path: a, name: 'A' });
    expect(await readRecent(userData)).toMatchObject({ ok: true, value: { entries: [{ name: 'A' }], problem: null } });
  });

  it('keeps every change when several are asked for at once', async () => {
    const files = await Promise.all(['1', '2', '3', '4', '5'].map((n) => makePlan(`${n}.plumb`)));
    await Promise.all(files.map((file, i) => addRecent(userData, { path: file, name: `P${i}` }, at(i))));
    const list = await readRecent(userData);
    expect(list.ok && list.value.entries.map((e) => e.name)).toEqual(['P4', 'P3', 'P2', 'P1', 'P0']);
  });
});
