// "Already open elsewhere": a small lock file beside each open plan, `.<name>.plumb.lock`, saying
// who has it open (process id, computer, Plumbline instance, document, since when). Opening a
// plan that another live holder has open gives a structured warning instead of a silent second
// copy; a lock left by a process that no longer runs on this computer is stale and taken over.
// The lock is advisory: it warns people, it does not stop a determined second save.
import { hostname as osHostname } from 'node:os';
import { link, readFile, rename, unlink, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { z } from 'zod';
import { tempPathFor } from './atomic-write';
import { isProcessAlive } from './process-identity';
import { done, errnoOf, fileFailure } from './store-error';
import type { StoreResult } from './store-error';

const LOCK_FORMAT = 'plumbline-lock';

/** Who holds a plan open. */
export interface LockHolder {
  readonly pid: number;
  readonly hostname: string;
  /** The Plumbline instance (one per running app). */
  readonly instanceId: string;
  /** The open document (one per window) within that instance. */
  readonly documentId: string;
  /** When the lock was taken, ISO 8601. */
  readonly since: string;
}

const holderSchema = z.object({
  format: z.literal(LOCK_FORMAT),
  pid: z.number().int(),
  hostname: z.string(),
  instanceId: z.string(),
  documentId: z.string(),
  since: z.string(),
});

/** Who is asking: the instance and document; pid and host default to this process's. */
export interface LockRequester {
  readonly instanceId: string;
  readonly documentId: string;
  readonly pid?: number;
  readonly hostname?: string;
}

export type LockWarningKind = 'another-window' | 'another-instance' | 'another-computer';

export interface LockWarning {
  readonly kind: LockWarningKind;
  readonly holder: LockHolder;
  /** A sentence for the user, saying where the plan is open and what they can do. */
  readonly message: string;
}

export type LockState =
  /** The lock is ours (new, or already ours). */
  | { readonly status: 'acquired' }
  /** A lock of a process that no longer runs (or an unreadable lock file) was replaced by ours. */
  | { readonly status: 'took-over-stale'; readonly previous: LockHolder | null }
  /** Someone else holds it and takeOver was asked for: the lock is now ours. */
  | { readonly status: 'took-over'; readonly previous: LockHolder }
  /** Someone else holds it: the plan can still be opened, but the user should be warned. */
  | { readonly status: 'held-elsewhere'; readonly warning: LockWarning }
  /** No lock could be written (read-only folder, for instance): open works, but unprotected. */
  | { readonly status: 'unavailable'; readonly message: string };

/** `<folder>/<name>.plumb` → `<folder>/.<name>.plumb.lock`. */
export function lockPathFor(planPath: string): string {
  return path.join(path.dirname(planPath), `.${path.basename(planPath)}.lock`);
}

function holderFor(requester: LockRequester, now: Date): LockHolder {
  return {
    pid: requester.pid ?? process.pid,
    hostname: requester.hostname ?? osHostname(),
    instanceId: requester.instanceId,
    documentId: requester.documentId,
    since: now.toISOString(),
  };
}

/** The current holder, null when there is no lock file, 'unreadable' when it is damaged. */
export async function readLock(planPath: string): Promise<StoreResult<LockHolder | null | 'unreadable'>> {
  let text: string;
  try {
    text = await readFile(lockPathFor(planPath), 'utf8');
  } catch (e) {
    if (errnoOf(e) === 'ENOENT') return done(null);
    return fileFailure(e, 'read the lock file', lockPathFor(planPath));
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return done('unreadable');
  }
  const parsed = holderSchema.safeParse(value);
  if (!parsed.success) return done('unreadable');
  const { format: _format, ...holder } = parsed.data;
  return done(holder);
}

const lockText = (holder: LockHolder): string => `${JSON.stringify({ format: LOCK_FORMAT, ...holder }, null, 2)}\n`;

/** Writes the lock only if none exists: a complete temporary file linked into place (link fails if taken). */
async function createLock(lockPath: string, holder: LockHolder): Promise<'created' | 'exists'> {
  const temp = tempPathFor(lockPath);
  try {
    await writeFile(temp, lockText(holder), { flag: 'wx' });
    try {
      await link(temp, lockPath);
      return 'created';
    } catch (e) {
      if (errnoOf(e) === 'EEXIST') return 'exists';
      // No hard links here (some shares, FAT): fall back to an exclusive create.
      try {
        await writeFile(lockPath, lockText(holder), { flag: 'wx' });
        return 'created';
      } catch (inner) {
        if (errnoOf(inner) === 'EEXIST') return 'exists';
        throw inner;
      }
    }
  } finally {
    await unlink(temp).catch(() => undefined);
  }
}

/** Replaces whatever lock is there with ours, atomically. */
async function replaceLock(lockPath: string, holder: LockHolder): Promise<void> {
  const temp = tempPathFor(lockPath);
  try {
    await writeFile(temp, lockText(holder), { flag: 'wx' });
    await rename(temp, lockPath);
  } finally {
    await unlink(temp).catch(() => undefined);
  }
}

const sameHolder = (a: LockHolder, b: LockHolder): boolean =>
  a.instanceId === b.instanceId && a.documentId === b.documentId && a.pid === b.pid && a.hostname === b.hostname;

function warningFor(holder: LockHolder, me: LockHolder): LockWarning | null {
  if (holder.hostname !== me.hostname) {
    return {
      kind: 'another-computer',
      holder,
      message: `This plan may be open in Plumbline on another computer ("${holder.hostname}") since ${holder.since}. If that copy is no longer open (the computer was switched off, for instance), you can take over; otherwise changes made in both places will overwrite each other.`,
    };
  }
  if (holder.instanceId === me.instanceId) {
    if (holder.documentId === me.documentId) return null;
    return { kind: 'another-window', holder, message: 'This plan is already open in another Plumbline window.' };
  }
  if (!isProcessAlive(holder.pid)) return null;
  return {
    kind: 'another-instance',
    holder,
    message: `This plan is already open in another Plumbline on this computer (process ${holder.pid}) since ${holder.since}. Changes made in both will overwrite each other.`,
  };
}

/**
 * Takes the lock on `planPath` for `requester`, or says who holds it. A live holder elsewhere
 * gives 'held-elsewhere' with a warning, unless `takeOver` is set; a holder that is dead (same
 * computer, process gone) or an unreadable lock file is taken over silently. A folder where no
 * lock can be written gives 'unavailable', not an error: opening must still work there.
 */
export async function acquireLock(
  planPath: string,
  requester: LockRequester,
  options: { readonly takeOver?: boolean; readonly now?: Date } = {},
): Promise<StoreResult<LockState>> {
  const lockPath = lockPathFor(planPath);
  const me = holderFor(requester, options.now ?? new Date());
  try {
    // A few rounds: another process may create or remove the lock between our steps.
    for (let attempt = 0; attempt < 3; attempt += 1) {
      if ((await createLock(lockPath, me)) === 'created') return done({ status: 'acquired' });
      const current = await readLock(planPath);
      if (!current.ok) return done({ status: 'unavailable', message: current.error.message });
      const holder = current.value;
      if (holder === null) continue; // released meanwhile: try to create again
      if (holder !== 'unreadable' && sameHolder(holder, me)) return done({ status: 'acquired' });
      const warning = holder === 'unreadable' ? null : warningFor(holder, me);
      if (warning !== null && options.takeOver !== true) return done({ status: 'held-elsewhere', warning });
      await replaceLock(lockPath, me);
      // Someone else may have replaced it at the same moment: the last rename wins, so check.
      const after = await readLock(planPath);
      if (after.ok && after.value !== null && after.value !== 'unreadable' && !sameHolder(after.value, me)) {
        const lost = warningFor(after.value, me);
        if (lost !== null) return done({ status: 'held-elsewhere', warning: lost });
      }
      const previous = holder === 'unreadable' ? null : holder;
      if (warning !== null && previous !== null) return done({ status: 'took-over', previous });
      return done({ status: 'took-over-stale', previous });
    }
    return done({ status: 'unavailable', message: `The lock file "${lockPath}" kept changing; the plan is open without one.` });
  } catch (e) {
    return done({ status: 'unavailable', message: fileFailure(e, 'write the lock file', lockPath).error.message });
  }
}

/**
 * Removes the lock on `planPath` if `requester` holds it; a lock someone else has taken over
 * is left alone. Answers whether a lock was removed.
 */
export async function releaseLock(planPath: string, requester: LockRequester): Promise<StoreResult<boolean>> {
  const current = await readLock(planPath);
  if (!current.ok) return current;
  const holder = current.value;
  if (holder === null || holder === 'unreadable') return done(false);
  const me = holderFor(requester, new Date());
  if (!sameHolder(holder, me)) return done(false);
  try {
    await unlink(lockPathFor(planPath));
    return done(true);
  } catch (e) {
    if (errnoOf(e) === 'ENOENT') return done(false);
    return fileFailure(e, 'remove the lock file', lockPathFor(planPath));
  }
}
