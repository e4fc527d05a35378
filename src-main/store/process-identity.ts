// Who is running: enough to tell, on this computer, whether the writer of a lock, a temporary
// file or a recovery file is still alive.
import { createHash } from 'node:crypto';
import os from 'node:os';

/** A short tag for this computer, used in temporary file names (the host name may not be ASCII). */
export function hostTag(hostname: string = os.hostname()): string {
  return createHash('sha256').update(hostname).digest('hex').slice(0, 8);
}

/**
 * Whether a process with this id is running on this computer. Signal 0 checks without sending
 * anything; EPERM means it exists but belongs to another user. Ids below 1 are never alive (kill
 * would address a process group).
 */
export function isProcessAlive(pid: number): boolean {
  if (!Number.isInteger(pid) || pid < 1) return false;
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return typeof e === 'object' && e !== null && 'code' in e && e.code === 'EPERM';
  }
}
