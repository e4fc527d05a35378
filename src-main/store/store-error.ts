// The failures the store reports, each with a stable code the renderer can act on and a message
// that names the file and says what went wrong in words (the errno is kept in brackets for
// support). Nothing in the store throws across its boundary; every public function answers
// a StoreResult.
import type { FieldProblem } from '@shared/model/validation-message';
import type { PlanFileErrorCode } from '@shared/model/plan-file';

export type FileErrorCode =
  'not-found' | 'permission-denied' | 'read-only' | 'disk-full' | 'is-directory' | 'busy' | 'too-large' | 'bad-path' | 'io-error';

export type StoreErrorCode =
  | FileErrorCode
  | PlanFileErrorCode
  | 'open-elsewhere'
  | 'bad-document-id'
  | 'no-recovery'
  | 'no-such-population'
  | 'outcome-mismatch';

export interface StoreError {
  readonly code: StoreErrorCode;
  readonly message: string;
  /** For 'invalid': each field that is wrong, with its path. */
  readonly problems?: readonly FieldProblem[];
}

export type StoreResult<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly error: StoreError };

export const done = <T>(value: T): StoreResult<T> => ({ ok: true, value });

export const failed = (
  code: StoreErrorCode,
  message: string,
  problems?: readonly FieldProblem[],
): { ok: false; error: StoreError } => ({
  ok: false,
  error: problems === undefined ? { code, message } : { code, message, problems },
});

const ERRNO: Readonly<Record<string, { code: FileErrorCode; words: string }>> = {
  ENOENT: { code: 'not-found', words: 'it or its folder does not exist' },
  ENOTDIR: { code: 'not-found', words: 'part of the path is not a folder' },
  EACCES: { code: 'permission-denied', words: 'permission denied' },
  EPERM: { code: 'permission-denied', words: 'the operation is not permitted' },
  EROFS: { code: 'read-only', words: 'the disk or share is read-only' },
  ENOSPC: { code: 'disk-full', words: 'the disk is full' },
  EDQUOT: { code: 'disk-full', words: 'the disk quota is used up' },
  EISDIR: { code: 'is-directory', words: 'it is a folder, not a file' },
  EBUSY: { code: 'busy', words: 'another program is using it' },
  ENAMETOOLONG: { code: 'bad-path', words: 'the path is too long' },
  ERR_INVALID_ARG_VALUE: { code: 'bad-path', words: 'the path contains characters that are not allowed' },
  ERR_INVALID_ARG_TYPE: { code: 'bad-path', words: 'the path is not text' },
};

/** The errno-style code of a Node error, if it has one. */
export function errnoOf(e: unknown): string | undefined {
  if (typeof e === 'object' && e !== null && 'code' in e && typeof e.code === 'string') return e.code;
  return undefined;
}

/** Maps a file-system error to a store error: `Could not <action> "<path>": <reason> (<ERRNO>).` */
export function fileFailure(e: unknown, action: string, filePath: string): { ok: false; error: StoreError } {
  const errno = errnoOf(e);
  const known = errno === undefined ? undefined : ERRNO[errno];
  const reason = known?.words ?? (e instanceof Error ? e.message : String(e));
  return failed(
    known?.code ?? 'io-error',
    `Could not ${action} "${filePath}": ${reason}${errno === undefined ? '' : ` (${errno})`}.`,
  );
}
