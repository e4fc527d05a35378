// The storage API the IPC handlers and the loopback host call. Plain Node, no Electron: one
// ProjectStore per running instance, built from the user-data folder and the instance id. It
// keeps no table of open documents; the caller names the document (one id per window) and the
// path in each call. Every method answers a StoreResult and never throws.
//
//   open → lock state (warn when 'held-elsewhere') → autosave while editing → save / save as
//   (recovery cleared, recent list updated) → close (lock released, recovery cleared).
//   On start: listRecoverable → restore (then keep the same document id) or discardRecovery.
import { randomUUID } from 'node:crypto';
import path from 'node:path';
import { exportPopulation, importPopulations } from '@shared/model/population-ops';
import type { ImportedPopulation } from '@shared/model/population-ops';
import { newEmptyProject } from '@shared/model/new-project';
import type { Project } from '@shared/model/project';
import { acquireLock, releaseLock } from './lock';
import type { LockState } from './lock';
import { checkPath, readPlanFile, writePlanFile } from './plan-io';
import type { ReadPlan, WrittenPlan } from './plan-io';
import { addRecent, clearRecent, readRecent, removeRecent } from './recent';
import type { RecentList } from './recent';
import { checkDocumentId, discardRecovery, listRecovery, readRecovery, writeRecovery } from './recovery';
import type { RecoverableDocument, RecoveredDocument } from './recovery';
import { done, failed } from './store-error';
import type { StoreResult } from './store-error';

export interface ProjectStoreOptions {
  /** The per-user folder: recovery files and the recent list live here. */
  readonly userDataDir: string;
  /** Identifies this running instance, to tell "open in another window" from "another instance". */
  readonly instanceId: string;
  /** The clock, for tests. */
  readonly now?: () => Date;
}

export interface OpenedPlan extends ReadPlan {
  /** Whether this document holds the plan's lock; 'held-elsewhere' carries the warning to show. */
  readonly lock: LockState;
  /** Side matters that did not stop the open (the recent list could not be updated, say). */
  readonly warnings: readonly string[];
}

export interface SavedPlan extends WrittenPlan {
  readonly savedAt: string;
  readonly lock: LockState;
}

export interface LockOptions {
  /** Take the lock even from a live holder elsewhere (after the user has been warned). */
  readonly takeOverLock?: boolean;
}

const samePath = (a: string, b: string): boolean =>
  process.platform === 'win32' || process.platform === 'darwin' ? a.toLowerCase() === b.toLowerCase() : a === b;

export class ProjectStore {
  readonly userDataDir: string;
  readonly instanceId: string;
  private readonly now: () => Date;

  constructor(options: ProjectStoreOptions) {
    this.userDataDir = path.resolve(options.userDataDir);
    this.instanceId = options.instanceId;
    this.now = options.now ?? (() => new Date());
  }

  /** A fresh document id (one per window): random, and safe as a file name. */
  newDocumentId(): string {
    return randomUUID();
  }

  /** A new, empty, valid plan (not yet saved anywhere). */
  newEmpty(): Project {
    return newEmptyProject();
  }

  /**
   * A new plan from the demo file at `demoPath`, checked like any plan. The result is a new,
   * unsaved document: the demo file is not locked, not listed as recent, never written.
   */
  async newFromDemo(demoPath: string): Promise<StoreResult<{ readonly project: Project }>> {
    const read = await readPlanFile(demoPath);
    if (!read.ok) return failed(read.error.code, `The demo plan could not be used. ${read.error.message}`, read.error.problems);
    return done({ project: read.value.project });
  }

  /** Takes (or checks) the lock of `planPath` for a document. */
  lock(planPath: string, documentId: string, options: LockOptions = {}): Promise<StoreResult<LockState>> {
    return acquireLock(
      planPath,
      { instanceId: this.instanceId, documentId },
      { takeOver: options.takeOverLock === true, now: this.now() },
    );
  }

  /**
   * Opens a plan: reads and checks it (the file is never changed), takes its lock for this
   * document and puts it at the top of the recent list. A plan open elsewhere still opens, with
   * lock.status 'held-elsewhere' and a warning to show; open again with takeOverLock if the user
   * chooses to.
   */
  async open(planPath: string, documentId: string, options: LockOptions = {}): Promise<StoreResult<OpenedPlan>> {
    const id = checkDocumentId(documentId);
    if (!id.ok) return id;
    const read = await readPlanFile(planPath);
    if (!read.ok) return read;
    const lock = await this.lock(read.value.path, id.value, options);
    const warnings: string[] = [];
    if (!lock.ok) warnings.push(lock.error.message);
    const recent = await addRecent(this.userDataDir, { path: read.value.path, name: read.value.project.name }, this.now());
    if (!recent.ok) warnings.push(recent.error.message);
    return done({ ...read.value, lock: lock.ok ? lock.value : { status: 'unavailable', message: lock.error.message }, warnings });
  }

  /** Reads the plan again from disk, dropping unsaved changes (the lock is kept as it is). */
  revert(planPath: string): Promise<StoreResult<ReadPlan>> {
    return readPlanFile(planPath);
  }

  /**
   * Saves a plan atomically (previous version kept as `.bak`), then clears the document's
   * recovery file and updates the recent list. Refused with 'open-elsewhere' when another live
   * holder has the plan open, unless takeOverLock is set; refused with 'invalid' (and the
   * problems) for a plan that does not pass the schema. Warnings (backup, recent list) do not
   * undo the save.
   */
  async save(planPath: string, project: Project, documentId: string, options: LockOptions = {}): Promise<StoreResult<SavedPlan>> {
    const id = checkDocumentId(documentId);
    if (!id.ok) return id;
    const target = checkPath(planPath, 'plan');
    if (!target.ok) return target;
    const lock = await this.lock(target.value, id.value, options);
    if (lock.ok && lock.value.status === 'held-elsewhere') return failed('open-elsewhere', lock.value.warning.message);
    const written = await writePlanFile(target.value, project);
    if (!written.ok) return written;
    const warnings = [...written.value.warnings];
    const cleared = await discardRecovery(this.userDataDir, id.value);
    if (!cleared.ok) warnings.push(cleared.error.message);
    const recent = await addRecent(this.userDataDir, { path: written.value.path, name: written.value.project.name }, this.now());
    if (!recent.ok) warnings.push(recent.error.message);
    return done({
      ...written.value,
      warnings,
      savedAt: this.now().toISOString(),
      lock: lock.ok ? lock.value : { status: 'unavailable', message: lock.error.message },
    });
  }

  /** Saves under a new path, then lets go of the lock on the previous path (if any). */
  async saveAs(
    planPath: string,
    project: Project,
    documentId: string,
    previousPath: string | null,
    options: LockOptions = {},
  ): Promise<StoreResult<SavedPlan>> {
    const saved = await this.save(planPath, project, documentId, options);
    if (!saved.ok || previousPath === null) return saved;
    const previous = checkPath(previousPath, 'previous plan');
    if (!previous.ok || samePath(previous.value, saved.value.path)) return saved;
    const released = await releaseLock(previous.value, { instanceId: this.instanceId, documentId });
    return released.ok ? saved : done({ ...saved.value, warnings: [...saved.value.warnings, released.error.message] });
  }

  /**
   * A clean close: releases the lock (if the document had a file) and removes its recovery file.
   * A lock that cannot be released (an unreadable folder, say) is reported as a warning and does
   * not keep the recovery file; failing to remove the recovery file is an error.
   */
  async close(
    planPath: string | null,
    documentId: string,
  ): Promise<
    StoreResult<{ readonly lockReleased: boolean; readonly recoveryDiscarded: boolean; readonly warnings: readonly string[] }>
  > {
    const id = checkDocumentId(documentId);
    if (!id.ok) return id;
    let lockReleased = false;
    const warnings: string[] = [];
    if (planPath !== null) {
      const file = checkPath(planPath, 'plan');
      const released = file.ok ? await releaseLock(file.value, { instanceId: this.instanceId, documentId: id.value }) : file;
      if (released.ok) lockReleased = released.value;
      else warnings.push(released.error.message);
    }
    const discarded = await discardRecovery(this.userDataDir, id.value);
    if (!discarded.ok) return discarded;
    return done({ lockReleased, recoveryDiscarded: discarded.value, warnings });
  }

  /** Writes the document's unsaved state to its recovery file (a valid plan only). */
  autosave(
    documentId: string,
    originalPath: string | null,
    project: Project,
  ): Promise<StoreResult<{ readonly path: string; readonly savedAt: string }>> {
    return writeRecovery(this.userDataDir, { documentId, originalPath, project }, { instanceId: this.instanceId }, this.now());
  }

  /** Unsaved work left by earlier sessions, newest first (entries with inUse set belong to running ones). */
  listRecoverable(): Promise<StoreResult<readonly RecoverableDocument[]>> {
    return listRecovery(this.userDataDir, { instanceId: this.instanceId });
  }

  /** The unsaved work of one document; keep its document id, the recovery file stays until save or close. */
  restore(documentId: string): Promise<StoreResult<RecoveredDocument>> {
    return readRecovery(this.userDataDir, documentId);
  }

  discardRecovery(documentId: string): Promise<StoreResult<boolean>> {
    return discardRecovery(this.userDataDir, documentId);
  }

  recentProjects(): Promise<StoreResult<RecentList>> {
    return readRecent(this.userDataDir);
  }

  forgetRecent(planPath: string): Promise<StoreResult<RecentList>> {
    return removeRecent(this.userDataDir, planPath);
  }

  clearRecent(): Promise<StoreResult<RecentList>> {
    return clearRecent(this.userDataDir);
  }

  /**
   * Reads the plan at `sourcePath` (never changing it) and appends its populations (all, or
   * those listed) to `target`, re-issuing clashing ids. The result is the changed document, not
   * yet saved.
   */
  async importPopulationsFromFile(
    target: Project,
    sourcePath: string,
    populationIds?: readonly string[],
  ): Promise<StoreResult<{ readonly project: Project; readonly imported: readonly ImportedPopulation[] }>> {
    const source = await readPlanFile(sourcePath);
    if (!source.ok) return source;
    const result = importPopulations(target, source.value.project, populationIds);
    return result.ok ? done(result.value) : failed(result.error.code, result.error.message);
  }

  /**
   * Writes one population of `project` as a plan of its own at `targetPath` (atomically, with a
   * backup if a file is replaced). Refused with 'open-elsewhere' if that file is open somewhere,
   * unless takeOverLock is set (then it is written without touching the other holder's lock).
   */
  async exportPopulationToFile(
    project: Project,
    populationId: string,
    targetPath: string,
    options: LockOptions = {},
  ): Promise<StoreResult<WrittenPlan>> {
    const target = checkPath(targetPath, 'export');
    if (!target.ok) return target;
    const exported = exportPopulation(project, populationId);
    if (!exported.ok) return failed(exported.error.code, exported.error.message);
    if (options.takeOverLock === true) return writePlanFile(target.value, exported.value);
    // Borrow the lock for the moment of writing, so a file open in a window is not replaced unseen.
    const documentId = this.newDocumentId();
    const lock = await this.lock(target.value, documentId);
    if (lock.ok && lock.value.status === 'held-elsewhere') return failed('open-elsewhere', lock.value.warning.message);
    const written = await writePlanFile(target.value, exported.value);
    await releaseLock(target.value, { instanceId: this.instanceId, documentId });
    return written;
  }
}
