// Autosave of unsaved work: one recovery file per open document in `<user data>/recovery/`,
// written atomically like a plan. A clean save or a clean close removes it; whatever is still
// there on the next start was left by a crash (or a power cut) and can be restored or discarded.
import { hostname as osHostname } from 'node:os';
import { mkdir, readFile, readdir, stat, unlink } from 'node:fs/promises';
import path from 'node:path';
import { z } from 'zod';
import { parsePlanValue, preparePlanText } from '@shared/model/plan-file';
import type { Project } from '@shared/model/project';
import { cleanLeftoverTemps, writeFileAtomic } from './atomic-write';
import { oneAtATime } from './one-at-a-time';
import { isProcessAlive } from './process-identity';
import { done, errnoOf, failed, fileFailure } from './store-error';
import type { StoreResult } from './store-error';

const RECOVERY_FORMAT = 'plumbline-recovery';
const RECOVERY_VERSION = 1;
const SUFFIX = '.recovery.json';

/** Document ids become file names, so they are kept to a safe alphabet. */
const DOCUMENT_ID = /^[A-Za-z0-9_-]{1,64}$/;

export function recoveryDir(userDataDir: string): string {
  return path.join(userDataDir, 'recovery');
}

export function checkDocumentId(documentId: unknown): StoreResult<string> {
  if (typeof documentId === 'string' && DOCUMENT_ID.test(documentId)) return done(documentId);
  return failed('bad-document-id', `The document id ${JSON.stringify(documentId)} is not 1 to 64 letters, digits, '-' or '_'.`);
}

function recoveryPath(userDataDir: string, documentId: string): string {
  return path.join(recoveryDir(userDataDir), `${documentId}${SUFFIX}`);
}

/**
 * Autosaves and discards of one document run in the order asked, so a discard after a save can
 * never be undone by an autosave that was still being written.
 */
function inOrder<T>(userDataDir: string, documentId: string, task: () => Promise<T>): Promise<T> {
  return oneAtATime(`recovery:${path.resolve(recoveryPath(userDataDir, documentId))}`, task);
}

/** Who wrote a recovery file: used to tell a crashed session's files from a running one's. */
export interface RecoveryWriter {
  readonly instanceId: string;
  readonly pid?: number;
  readonly hostname?: string;
}

const envelopeSchema = z.object({
  format: z.literal(RECOVERY_FORMAT),
  version: z.literal(RECOVERY_VERSION),
  documentId: z.string().regex(DOCUMENT_ID),
  /** The plan file this unsaved work belongs to; null for a plan never saved. */
  originalPath: z.string().nullable(),
  savedAt: z.string(),
  projectName: z.string(),
  writer: z.object({ instanceId: z.string(), pid: z.number().int(), hostname: z.string() }),
  /** The plan itself, as in a plan file (so older recovery files migrate like plans). */
  plan: z.unknown(),
});
type Envelope = z.infer<typeof envelopeSchema>;

export interface AutosaveRequest {
  readonly documentId: string;
  readonly originalPath: string | null;
  readonly project: unknown;
}

/**
 * Writes the recovery file of one document, replacing the previous one atomically. The plan
 * must be valid ('invalid' otherwise: keep the last valid autosave rather than a broken one).
 */
export async function writeRecovery(
  userDataDir: string,
  request: AutosaveRequest,
  writer: RecoveryWriter,
  now: Date = new Date(),
): Promise<StoreResult<{ readonly path: string; readonly savedAt: string }>> {
  const id = checkDocumentId(request.documentId);
  if (!id.ok) return id;
  return inOrder(userDataDir, id.value, () => writeNow(userDataDir, id.value, request, writer, now));
}

async function writeNow(
  userDataDir: string,
  documentId: string,
  request: AutosaveRequest,
  writer: RecoveryWriter,
  now: Date,
): Promise<StoreResult<{ readonly path: string; readonly savedAt: string }>> {
  const prepared = preparePlanText(request.project);
  if (!prepared.ok) return failed('invalid', prepared.error.message, prepared.error.problems);
  const envelope: Envelope = {
    format: RECOVERY_FORMAT,
    version: RECOVERY_VERSION,
    documentId,
    originalPath: request.originalPath,
    savedAt: now.toISOString(),
    projectName: prepared.value.project.name,
    writer: { instanceId: writer.instanceId, pid: writer.pid ?? process.pid, hostname: writer.hostname ?? osHostname() },
    plan: prepared.value.project,
  };
  const dir = recoveryDir(userDataDir);
  try {
    await mkdir(dir, { recursive: true });
  } catch (e) {
    return fileFailure(e, 'create the recovery folder', dir);
  }
  const file = recoveryPath(userDataDir, documentId);
  const written = await writeFileAtomic(file, `${JSON.stringify(envelope)}\n`, { action: 'write the recovery file' });
  if (!written.ok) return written;
  return done({ path: file, savedAt: envelope.savedAt });
}

export interface RecoverableDocument {
  readonly documentId: string;
  readonly originalPath: string | null;
  /** Whether the plan file it belongs to still exists (false for a never-saved plan). */
  readonly originalExists: boolean;
  readonly savedAt: string;
  readonly projectName: string;
  /**
   * True when the writer is still running (this instance, or another live one on this computer):
   * then it is live autosave, not something left by a crash, and should not be offered.
   */
  readonly inUse: boolean;
  /** Why the file cannot be restored, when it cannot (damaged); null otherwise. */
  readonly problem: string | null;
}

async function readEnvelope(file: string): Promise<StoreResult<Envelope>> {
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch (e) {
    if (errnoOf(e) === 'ENOENT')
      return failed('no-recovery', `There is no unsaved work for this document (no "${path.basename(file)}").`);
    return fileFailure(e, 'read the recovery file', file);
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return failed('unreadable-json', `The recovery file "${file}" is damaged: it is not readable JSON.`);
  }
  const parsed = envelopeSchema.safeParse(value);
  if (!parsed.success)
    return failed('not-a-plan', `The recovery file "${file}" is damaged: it is not a Plumbline recovery file.`);
  return done(parsed.data);
}

async function exists(file: string | null): Promise<boolean> {
  if (file === null) return false;
  return stat(file).then(
    () => true,
    () => false,
  );
}

/**
 * Every recovery file in the user-data folder, newest first. Damaged files are listed (with
 * `problem` set) rather than hidden, so they can be discarded. Abandoned temporary files of an
 * interrupted autosave are removed.
 */
export async function listRecovery(
  userDataDir: string,
  self: RecoveryWriter,
): Promise<StoreResult<readonly RecoverableDocument[]>> {
  const dir = recoveryDir(userDataDir);
  let names: string[];
  try {
    names = await readdir(dir);
  } catch (e) {
    if (errnoOf(e) === 'ENOENT') return done([]);
    return fileFailure(e, 'read the recovery folder', dir);
  }
  await cleanLeftoverTemps(dir);
  const myHost = self.hostname ?? osHostname();
  const found: RecoverableDocument[] = [];
  for (const name of names) {
    if (!name.endsWith(SUFFIX)) continue;
    const documentId = name.slice(0, -SUFFIX.length);
    if (!DOCUMENT_ID.test(documentId)) continue;
    const envelope = await readEnvelope(path.join(dir, name));
    if (!envelope.ok) {
      const info = await stat(path.join(dir, name)).catch(() => null);
      found.push({
        documentId,
        originalPath: null,
        originalExists: false,
        savedAt: info?.mtime.toISOString() ?? '',
        projectName: '',
        inUse: false,
        problem: envelope.error.message,
      });
      continue;
    }
    const { writer } = envelope.value;
    const inUse =
      writer.hostname === myHost &&
      (writer.instanceId === self.instanceId || (writer.pid !== process.pid && isProcessAlive(writer.pid)));
    found.push({
      documentId,
      originalPath: envelope.value.originalPath,
      originalExists: await exists(envelope.value.originalPath),
      savedAt: envelope.value.savedAt,
      projectName: envelope.value.projectName,
      inUse,
      problem: null,
    });
  }
  found.sort((a, b) => (a.savedAt < b.savedAt ? 1 : a.savedAt > b.savedAt ? -1 : 0));
  return done(found);
}

export interface RecoveredDocument {
  readonly documentId: string;
  readonly originalPath: string | null;
  readonly savedAt: string;
  readonly project: Project;
  /** Set when the unsaved work was written by an older Plumbline and has been updated. */
  readonly migratedFrom: number | null;
}

/**
 * Reads the unsaved work of one document. The recovery file stays until the restored document
 * is saved or closed (so a second crash loses nothing); keep using the same document id.
 */
export async function readRecovery(userDataDir: string, documentId: string): Promise<StoreResult<RecoveredDocument>> {
  const id = checkDocumentId(documentId);
  if (!id.ok) return id;
  const envelope = await readEnvelope(recoveryPath(userDataDir, id.value));
  if (!envelope.ok) return envelope;
  const parsed = parsePlanValue(envelope.value.plan);
  if (!parsed.ok) return failed(parsed.error.code, parsed.error.message, parsed.error.problems);
  return done({
    documentId: id.value,
    originalPath: envelope.value.originalPath,
    savedAt: envelope.value.savedAt,
    project: parsed.project,
    migratedFrom: parsed.migratedFrom,
  });
}

/**
 * Removes the recovery file of one document, after any autosave of it still being written (which
 * would otherwise bring it back). Answers whether there was one.
 */
export async function discardRecovery(userDataDir: string, documentId: string): Promise<StoreResult<boolean>> {
  const id = checkDocumentId(documentId);
  if (!id.ok) return id;
  const file = recoveryPath(userDataDir, id.value);
  return inOrder(userDataDir, id.value, async () => {
    try {
      await unlink(file);
      return done(true);
    } catch (e) {
      if (errnoOf(e) === 'ENOENT') return done(false);
      return fileFailure(e, 'remove the recovery file', file);
    }
  });
}
