// Runs the command line as users run it: `node scripts/plan.mjs …` in a child process.
import { execFile } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const REPO_ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
const script = path.join(REPO_ROOT, 'scripts', 'plan.mjs');

export interface PlanRun {
  readonly code: number;
  readonly stdout: string;
  readonly stderr: string;
}

/** The exit status (-1 when it was killed) and both streams of one run. */
export function runPlanCommand(...args: string[]): Promise<PlanRun> {
  return new Promise((resolve) => {
    execFile(process.execPath, [script, ...args], { cwd: REPO_ROOT, timeout: 120_000 }, (error, stdout, stderr) => {
      const code = error === null ? 0 : typeof error.code === 'number' ? error.code : -1;
      resolve({ code, stdout, stderr });
    });
  });
}
