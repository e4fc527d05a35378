import { spawn, spawnSync } from 'node:child_process';
import type { ChildProcess } from 'node:child_process';
import { mkdir, mkdtemp, readFile, readdir, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { acquireLock, lockPathFor, readLock, releaseLock } from '../../../src-main/store/lock';

let root = '';
let plan = '';
let sleeper: ChildProcess | undefined;
let livePid = 0;
let deadPid = 0;

beforeAll(async () => {
  root = await mkdtemp(path.join(os.tmpdir(), 'plumbline-lock-'));
  // A process that stays alive for the whole file: stands for another Plumbline instance.
  sleeper = spawn(process.execPath, ['-e', 'setInterval(() => {}, 1000)'], { stdio: 'ignore' });
  livePid = sleeper.pid ?? 0;
  // A process that has exited: stands for an instance that crashed.
  deadPid = Number(spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' }).stdout);
});
afterAll(async () => {
  sleeper?.kill();
  await rm(root, { recursive: true, force: true });
});
beforeEach(async (ctx) => {
  const folder = path.join(root, `Études ${ctx.task.id}`);
  await mkdir(folder, { recursive: true });
  plan = path.join(folder, 'plan ü 1.plumb');
  await writeFile(plan, '{}');
});

const me = { instanceId: 'instance-me', documentId: 'doc-1' };

describe('lockPathFor', () => {
  it('is a hidden file beside the plan: .<name>.plumb.lock', () => {
    expect(lockPathFor('/a b/c/plan ü 1.plumb')).toBe(path.join('/a b/c', '.plan ü 1.plumb.lock'));
  });
});

describe('acquireLock', () => {
  it('takes a free lock and writes pid, host, instance, document and time', async () => {
    const now = new Date('2031-02-03T04:05:06Z');
    expect(await acquireLock(plan, me, { now })).toEqual({ ok: true, value: { status: 'acquired' } });
    expect(JSON.parse(await readFile(lockPathFor(plan), 'utf8'))).toEqual({
      format: 'plumbline-lock',
      pid: process.pid,
      hostname: os.hostname(),
      instanceId: 'instance-me',
      documentId: 'doc-1',
      since: '2031-02-03T04:05:06.000Z',
    });
    expect((await readdir(path.dirname(plan))).sort()).toEqual(['.plan ü 1.plumb.lock', 'plan ü 1.plumb']);
  });

  it('answers "acquired" again for the document that already holds it', async () => {
    await acquireLock(plan, me);
    expect(await acquireLock(plan, me)).toEqual({ ok: true, value: { status: 'acquired' } });
  });

  it('warns "another-window" when another document of this instance holds it', async () => {
    await acquireLock(plan, { instanceId: 'instance-me', documentId: 'doc-other' });
    const result = await acquireLock(plan, me);
    expect(result).toMatchObject({
      ok: true,
      value: {
        status: 'held-elsewhere',
        warning: { kind: 'another-window', message: 'This plan is already open in another Plumbline window.' },
      },
    });
  });

  it('warns "another-instance" when a live process on this computer holds it', async () => {
    await acquireLock(plan, { instanceId: 'instance-other', documentId: 'doc-x', pid: livePid });
    const result = await acquireLock(plan, me);
    if (!result.ok || result.value.status !== 'held-elsewhere')
      throw new Error(`expected a warning, got ${JSON.stringify(result)}`);
    expect(result.value.warning.kind).toBe('another-instance');
    expect(result.value.warning.holder).toMatchObject({ pid: livePid, instanceId: 'instance-other' });
    expect(result.value.warning.message).toMatch(
      new RegExp(`^This plan is already open in another Plumbline on this computer \\(process ${livePid}\\) since `),
    );
    // the holder's lock is untouched
    expect(await readLock(plan)).toMatchObject({ ok: true, value: { pid: livePid, instanceId: 'instance-other' } });
  });

  it('takes over the lock of a process that no longer runs', async () => {
    await acquireLock(plan, { instanceId: 'instance-crashed', documentId: 'doc-x', pid: deadPid });
    const result = await acquireLock(plan, me);
    expect(result).toMatchObject({
      ok: true,
      value: { status: 'took-over-stale', previous: { pid: deadPid, instanceId: 'instance-crashed' } },
    });
    expect(await readLock(plan)).toMatchObject({ ok: true, value: { pid: process.pid, instanceId: 'instance-me' } });
  });

  it('takes over a damaged lock file', async () => {
    await writeFile(lockPathFor(plan), '{"format": "plumbline-lo');
    expect(await acquireLock(plan, me)).toEqual({ ok: true, value: { status: 'took-over-stale', previous: null } });
  });

  it('warns "another-computer" for a holder on another host, whose process cannot be checked', async () => {
    await acquireLock(plan, { instanceId: 'instance-far', documentId: 'doc-x', pid: deadPid, hostname: 'ward-7-pc' });
    const result = await acquireLock(plan, me);
    expect(result).toMatchObject({
      ok: true,
      value: { status: 'held-elsewhere', warning: { kind: 'another-computer', holder: { hostname: 'ward-7-pc' } } },
    });
  });

  it("takes over a live holder's lock when asked to, and says whose it was", async () => {
    await acquireLock(plan, { instanceId: 'instance-other', documentId: 'doc-x', pid: livePid });
    const result = await acquireLock(plan, me, { takeOver: true });
    expect(result).toMatchObject({ ok: true, value: { status: 'took-over', previous: { pid: livePid } } });
    expect(await readLock(plan)).toMatchObject({ ok: true, value: { instanceId: 'instance-me', documentId: 'doc-1' } });
  });

  it('is "unavailable", not an error, where no lock can be written', async () => {
    const nowhere = path.join(path.dirname(plan), 'missing folder', 'p.plumb');
    const result = await acquireLock(nowhere, me);
    expect(result).toMatchObject({ ok: true, value: { status: 'unavailable' } });
  });

  it('gives the lock to exactly one of two documents asking at once', async () => {
    const results = await Promise.all(
      ['a', 'b', 'c', 'd'].map((d) => acquireLock(plan, { instanceId: 'instance-me', documentId: `doc-${d}` })),
    );
    const statuses = results.map((r) => (r.ok ? r.value.status : r.error.code));
    expect(statuses.filter((s) => s === 'acquired')).toHaveLength(1);
    expect(statuses.filter((s) => s === 'held-elsewhere')).toHaveLength(3);
  });
});

describe('releaseLock', () => {
  it('removes the lock of its holder', async () => {
    await acquireLock(plan, me);
    expect(await releaseLock(plan, me)).toEqual({ ok: true, value: true });
    expect(await readLock(plan)).toEqual({ ok: true, value: null });
  });

  it('leaves a lock that someone else has taken over', async () => {
    await acquireLock(plan, me);
    await acquireLock(plan, { instanceId: 'instance-other', documentId: 'doc-x', pid: livePid }, { takeOver: true });
    expect(await releaseLock(plan, me)).toEqual({ ok: true, value: false });
    expect(await readLock(plan)).toMatchObject({ ok: true, value: { instanceId: 'instance-other' } });
  });

  it('answers false when there is no lock', async () => {
    expect(await releaseLock(plan, me)).toEqual({ ok: true, value: false });
  });
});
