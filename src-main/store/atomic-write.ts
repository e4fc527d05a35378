// Crash-safe replacement of a file. The new content goes to a temporary file in the same folder,
// is flushed to disk, and is then renamed over the target: a rename within one folder is atomic,
// so at every instant the target is either the old file or the new one, never a mixture. The
// folder itself is flushed afterwards so the rename survives a power cut. When asked, the
// previous version is first kept as a backup beside the target, by the same temporary-file-and-
// rename route (a hard link where the file system has them, a flushed copy elsewhere).
//
// A process killed mid-save can leave its temporary file behind (never the target half-written).
// Such leftovers are named `.<file name>.<host tag>-<pid>-<random>.tmp`; the next save or open
// of the same file removes the ones whose writer is no longer running on this computer, and any
// older than an hour whoever wrote them (another computer on a shared folder, a reused pid).
import { randomBytes } from 'node:crypto';
import { constants } from 'node:fs';
import type { FileHandle } from 'node:fs/promises';
import { copyFile, link, open, readdir, rename, stat, unlink } from 'node:fs/promises';
import path from 'node:path';
import { errnoOf, failed, fileFailure, done } from './store-error';
import type { StoreResult } from './store-error';
import { hostTag, isProcessAlive } from './process-identity';
import { oneAtATime } from './one-at-a-time';

const TEMP_SUFFIX = '.tmp';
const ABANDONED_AFTER_MS = 60 * 60 * 1000;
const MY_HOST = hostTag();
/** Temporary files this process is writing right now: never cleaned away from under a save. */
const inFlight = new Set<string>();

/** A fresh temporary path beside `target`: `.<name>.<host>-<pid>-<random>.tmp`. */
export function tempPathFor(target: string): string {
  const tag = `${MY_HOST}-${process.pid}-${randomBytes(6).toString('hex')}`;
  return path.join(path.dirname(target), `.${path.basename(target)}.${tag}${TEMP_SUFFIX}`);
}

export interface TempFileName {
  /** The name of the file it was going to replace. */
  readonly base: string;
  readonly host: string;
  readonly pid: number;
}

/** Reads a temporary file name made by tempPathFor; null for any other name. */
export function parseTempName(fileName: string): TempFileName | null {
  if (!fileName.startsWith('.') || !fileName.endsWith(TEMP_SUFFIX)) return null;
  const inner = fileName.slice(1, -TEMP_SUFFIX.length);
  const dot = inner.lastIndexOf('.');
  if (dot <= 0) return null;
  const match = /^([0-9a-f]{8})-(\d+)-[0-9a-f]{12}$/.exec(inner.slice(dot + 1));
  if (match === null) return null;
  return { base: inner.slice(0, dot), host: match[1] ?? '', pid: Number(match[2]) };
}

/**
 * Removes abandoned temporary files in `dir` (for the files named in `bases`, or all), best
 * effort: a folder that cannot be read or a file that cannot be removed is skipped. Returns how
 * many were removed.
 */
export async function cleanLeftoverTemps(dir: string, bases?: ReadonlySet<string>): Promise<number> {
  let names: string[];
  try {
    names = await readdir(dir);
  } catch {
    return 0;
  }
  let removed = 0;
  for (const name of names) {
    const temp = parseTempName(name);
    if (temp === null || (bases !== undefined && !bases.has(temp.base))) continue;
    const full = path.join(dir, name);
    if (inFlight.has(full)) continue;
    let abandoned = temp.host === MY_HOST && (temp.pid === process.pid || !isProcessAlive(temp.pid));
    if (!abandoned) {
      const info = await stat(full).catch(() => null);
      abandoned = info !== null && Date.now() - info.mtimeMs > ABANDONED_AFTER_MS;
    }
    if (
      abandoned &&
      (await unlink(full).then(
        () => true,
        () => false,
      ))
    )
      removed += 1;
  }
  return removed;
}

/** Errors after which a hard link will not work here, so a copy is made instead. */
const NO_HARD_LINKS = new Set(['EPERM', 'ENOTSUP', 'EOPNOTSUPP', 'EXDEV', 'EMLINK', 'ENOSYS', 'EINVAL', 'EACCES']);

async function closeQuietly(handle: FileHandle | undefined): Promise<void> {
  await handle?.close().catch(() => undefined);
}

/** Creates `file` (which must not exist), writes `data`, and flushes it to the disk. */
async function writeDurably(file: string, data: string | Uint8Array, mode: number | undefined): Promise<void> {
  let handle: FileHandle | undefined;
  try {
    handle = await open(file, 'wx', mode ?? 0o666);
    if (mode !== undefined && process.platform !== 'win32') await handle.chmod(mode);
    await handle.writeFile(data);
    await handle.sync();
  } finally {
    await closeQuietly(handle);
  }
}

async function flushFile(file: string): Promise<void> {
  let handle: FileHandle | undefined;
  try {
    handle = await open(file, 'r+');
    await handle.sync();
  } finally {
    await closeQuietly(handle);
  }
}

/** Flushes a folder's entries (the renames). Windows cannot open folders; some shares refuse. */
async function flushFolder(dir: string): Promise<void> {
  if (process.platform === 'win32') return;
  let handle: FileHandle | undefined;
  try {
    handle = await open(dir, 'r');
    await handle.sync();
  } catch {
    // The rename has happened either way; only its survival of a power cut is less certain.
  } finally {
    await closeQuietly(handle);
  }
}

/** On Windows a virus scanner or indexer may hold the target for a moment: try a few times. */
async function renameWithRetry(from: string, to: string): Promise<void> {
  const retries = process.platform === 'win32' ? 8 : 0;
  for (let attempt = 0; ; attempt += 1) {
    try {
      await rename(from, to);
      return;
    } catch (e) {
      const code = errnoOf(e);
      if (attempt >= retries || (code !== 'EPERM' && code !== 'EACCES' && code !== 'EBUSY')) throw e;
      await new Promise((resolve) => setTimeout(resolve, 15 * (attempt + 1)));
    }
  }
}

/** Makes `dest` an exact, durable copy of `source`, replacing it atomically. */
async function replaceWithCopy(source: string, dest: string): Promise<void> {
  const temp = tempPathFor(dest);
  inFlight.add(temp);
  try {
    try {
      await link(source, temp);
    } catch (e) {
      if (!NO_HARD_LINKS.has(errnoOf(e) ?? '')) throw e;
      await copyFile(source, temp, constants.COPYFILE_EXCL);
      await flushFile(temp);
    }
    await renameWithRetry(temp, dest);
  } finally {
    inFlight.delete(temp);
    await unlink(temp).catch(() => undefined);
  }
}

export interface AtomicWriteOptions {
  /** Keep the file being replaced here (e.g. `plan.plumb.bak`). Nothing is kept when omitted. */
  readonly backupPath?: string;
  /** For messages: "Could not <action> "<path>": …". Default "save". */
  readonly action?: string;
}

export interface AtomicWriteOutcome {
  /** Where the previous version was kept, or null (no backup asked, or no previous file). */
  readonly backupPath: string | null;
  /** Things that did not stop the save but the user should know (a backup that failed). */
  readonly warnings: readonly string[];
}

const queueKey = (file: string): string => `write:${process.platform === 'win32' ? file.toLowerCase() : file}`;

/**
 * Replaces `target` with `data` atomically and durably (see the module comment). Saves of the
 * same file from this process run one after another. On failure the target is unchanged and the
 * temporary file is removed. A backup that cannot be made does not stop the save; it comes back
 * as a warning.
 */
export function writeFileAtomic(
  target: string,
  data: string | Uint8Array,
  options: AtomicWriteOptions = {},
): Promise<StoreResult<AtomicWriteOutcome>> {
  const file = path.resolve(target);
  return oneAtATime(queueKey(file), () => writeNow(file, data, options));
}

async function writeNow(
  target: string,
  data: string | Uint8Array,
  options: AtomicWriteOptions,
): Promise<StoreResult<AtomicWriteOutcome>> {
  const action = options.action ?? 'save';
  const dir = path.dirname(target);
  const bases = new Set([path.basename(target)]);
  if (options.backupPath !== undefined) bases.add(path.basename(options.backupPath));
  await cleanLeftoverTemps(dir, bases);

  let existing: { mode: number } | null = null;
  try {
    const info = await stat(target);
    if (info.isDirectory()) return failed('is-directory', `Could not ${action} "${target}": it is a folder, not a file.`);
    existing = { mode: info.mode & 0o777 };
  } catch (e) {
    if (errnoOf(e) !== 'ENOENT') return fileFailure(e, action, target);
  }

  const temp = tempPathFor(target);
  inFlight.add(temp);
  try {
    try {
      await writeDurably(temp, data, existing?.mode);
    } catch (e) {
      return fileFailure(e, action, target);
    }
    const warnings: string[] = [];
    let backupPath: string | null = null;
    if (options.backupPath !== undefined && existing !== null) {
      try {
        await replaceWithCopy(target, options.backupPath);
        backupPath = options.backupPath;
      } catch (e) {
        const failure = fileFailure(e, 'keep the previous version as', options.backupPath);
        warnings.push(`${failure.error.message} The new version was saved; no backup of the old one was kept.`);
      }
    }
    try {
      await renameWithRetry(temp, target);
    } catch (e) {
      return fileFailure(e, action, target);
    }
    await flushFolder(dir);
    return done({ backupPath, warnings });
  } finally {
    inFlight.delete(temp);
    await unlink(temp).catch(() => undefined);
  }
}
