// Plan files on disk: read and check one (never changing it), or write one atomically with the
// previous version kept as `<name>.plumb.bak` beside it.
import { readFile, stat } from 'node:fs/promises';
import path from 'node:path';
import { parsePlanText, preparePlanText } from '@shared/model/plan-file';
import type { Project } from '@shared/model/project';
import { cleanLeftoverTemps, writeFileAtomic } from './atomic-write';
import { lockPathFor } from './lock';
import { done, failed, fileFailure } from './store-error';
import type { StoreResult } from './store-error';

/** Larger files are refused before reading: a real plan is a few megabytes at most. */
export const MAX_PLAN_BYTES = 64 * 1024 * 1024;

/** `<name>.plumb` → `<name>.plumb.bak`, beside it. */
export function backupPathFor(planPath: string): string {
  return `${planPath}.bak`;
}

/** The names of the files that live beside a plan: itself, its backup and its lock. */
function companionNames(planPath: string): Set<string> {
  return new Set([planPath, backupPathFor(planPath), lockPathFor(planPath)].map((p) => path.basename(p)));
}

/** Refuses anything but an absolute path as text (a relative one would depend on the working folder). */
export function checkPath(filePath: unknown, what = 'file'): StoreResult<string> {
  if (typeof filePath !== 'string' || filePath === '') return failed('bad-path', `No ${what} path was given.`);
  if (filePath.includes('\0')) return failed('bad-path', `The ${what} path contains a NUL character.`);
  if (!path.isAbsolute(filePath)) return failed('bad-path', `The ${what} path "${filePath}" is not absolute.`);
  return done(path.resolve(filePath));
}

const utf8 = new TextDecoder('utf-8', { fatal: true });

/** The file's bytes as text; plans are UTF-8 (a byte-order mark is allowed and dropped later). */
function decode(bytes: Uint8Array): StoreResult<string> {
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    return failed(
      'unreadable-json',
      'The file is saved as UTF-16 text; Plumbline plans are UTF-8. It may have been re-saved by another program.',
    );
  }
  try {
    return done(utf8.decode(bytes));
  } catch {
    return failed('unreadable-json', 'The file is not UTF-8 text: it may be another kind of file, or damaged.');
  }
}

export interface ReadPlan {
  readonly path: string;
  readonly project: Project;
  /** The schema version the file was written in, when it was older and has been updated in memory. */
  readonly migratedFrom: number | null;
  readonly bytes: number;
  /** The file's modification time (ISO 8601), to notice later changes by others. */
  readonly modifiedAt: string;
}

/**
 * Reads and checks a plan file. The file is never modified, whatever is wrong with it; failures
 * keep the code and message of parsePlanText ('empty', 'unreadable-json', 'not-a-plan',
 * 'future-version', 'invalid' with problems) or name the file-system problem.
 * Abandoned temporary files of an interrupted save beside it are removed (best effort).
 */
export async function readPlanFile(planPath: string): Promise<StoreResult<ReadPlan>> {
  const checked = checkPath(planPath, 'plan');
  if (!checked.ok) return checked;
  const file = checked.value;
  let size: number;
  let modifiedAt: string;
  try {
    const info = await stat(file);
    if (info.isDirectory()) return failed('is-directory', `Could not open "${file}": it is a folder, not a plan file.`);
    size = info.size;
    modifiedAt = info.mtime.toISOString();
  } catch (e) {
    return fileFailure(e, 'open', file);
  }
  if (size > MAX_PLAN_BYTES) {
    return failed(
      'too-large',
      `Could not open "${file}": at ${Math.round(size / 1_048_576)} MB it is far larger than any plan (the limit is ${MAX_PLAN_BYTES / 1_048_576} MB).`,
    );
  }
  let bytes: Buffer;
  try {
    bytes = await readFile(file);
  } catch (e) {
    return fileFailure(e, 'open', file);
  }
  await cleanLeftoverTemps(path.dirname(file), companionNames(file));
  const text = decode(bytes);
  if (!text.ok) return text;
  const parsed = parsePlanText(text.value);
  if (!parsed.ok) return failed(parsed.error.code, parsed.error.message, parsed.error.problems);
  return done({ path: file, project: parsed.project, migratedFrom: parsed.migratedFrom, bytes: bytes.length, modifiedAt });
}

export interface WrittenPlan {
  readonly path: string;
  /** The plan as written (validated, defaults filled in). */
  readonly project: Project;
  readonly bytes: number;
  readonly backupPath: string | null;
  readonly warnings: readonly string[];
}

/**
 * Checks `project` against the schema (an invalid plan is never written: 'invalid' with
 * problems) and writes it atomically, keeping the previous version as `<path>.bak`.
 */
export async function writePlanFile(planPath: string, project: unknown): Promise<StoreResult<WrittenPlan>> {
  const checked = checkPath(planPath, 'plan');
  if (!checked.ok) return checked;
  const file = checked.value;
  const prepared = preparePlanText(project);
  if (!prepared.ok) return failed('invalid', prepared.error.message, prepared.error.problems);
  const written = await writeFileAtomic(file, prepared.value.text, {
    backupPath: backupPathFor(file),
    action: 'save the plan to',
  });
  if (!written.ok) return written;
  return done({
    path: file,
    project: prepared.value.project,
    bytes: Buffer.byteLength(prepared.value.text, 'utf8'),
    backupPath: written.value.backupPath,
    warnings: written.value.warnings,
  });
}
