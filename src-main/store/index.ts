// The storage layer's public face: what the IPC handlers and the loopback host import.
export { ProjectStore } from './project-store';
export type { LockOptions, OpenedPlan, ProjectStoreOptions, SavedPlan } from './project-store';
export type { StoreError, StoreErrorCode, StoreResult, FileErrorCode } from './store-error';
export type { LockHolder, LockState, LockWarning, LockWarningKind } from './lock';
export type { ReadPlan, WrittenPlan } from './plan-io';
export type { RecentList, RecentProject } from './recent';
export type { RecoverableDocument, RecoveredDocument } from './recovery';
export { MAX_PLAN_BYTES, backupPathFor, readPlanFile, writePlanFile } from './plan-io';
export { lockPathFor } from './lock';
export { MAX_RECENT } from './recent';
