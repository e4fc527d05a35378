// Crash safety of saving: a child process saves two large versions of a plan in turn (see
// helpers/save-loop-child.ts) and is killed with SIGKILL at random moments. After every kill the plan (and its backup) must be
// exactly one of the two complete versions, and the only debris allowed is the killed child's
// own temporary files, which the next save or open removes.
import { spawn } from 'node:child_process';
import { mkdir, mkdtemp, readFile, readdir, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { build } from 'vite';
import { parseTempName } from '../../../src-main/store/atomic-write';
import { readPlanFile, writePlanFile } from '../../../src-main/store/plan-io';
import { serialisePlan } from '@shared/model/plan-file';
import { killTestPlans } from './helpers/kill-test-versions';

const KILLS = 110;
/** Seed of the kill-delay generator; printed on failure so a run can be repeated. */
const SEED = 20_240_917;
/** Kills land uniformly in this many milliseconds after the child says it is ready. */
const KILL_WINDOW_MS = 50;

const repoRoot = fileURLToPath(new URL('../../../', import.meta.url));
let workDir = '';
let childScript = '';
let versionFiles: string[] = [];

/** xorshift32: small, seeded, good enough to spread kill moments. */
function delays(seed: number): () => number {
  let state = seed >>> 0 || 1;
  return () => {
    state ^= state << 13;
    state >>>= 0;
    state ^= state >>> 17;
    state ^= state << 5;
    state >>>= 0;
    return (state / 0x1_0000_0000) * KILL_WINDOW_MS;
  };
}

beforeAll(async () => {
  workDir = await mkdtemp(path.join(os.tmpdir(), 'plumbline-kill-'));
  const outDir = path.join(workDir, 'child');
  await build({
    configFile: false,
    root: repoRoot,
    logLevel: 'silent',
    resolve: { alias: { '@shared': path.join(repoRoot, 'shared') } },
    ssr: { noExternal: true },
    build: {
      ssr: path.join(repoRoot, 'test/unit/store/helpers/save-loop-child.ts'),
      outDir,
      emptyOutDir: true,
      target: 'node20',
      minify: false,
      rolldownOptions: { output: { format: 'es', entryFileNames: 'save-loop-child.mjs' } },
    },
  });
  childScript = path.join(outDir, 'save-loop-child.mjs');
  versionFiles = killTestPlans().map((_, i) => path.join(workDir, `version-${i}.plumb`));
  await Promise.all(killTestPlans().map((plan, i) => writeFile(versionFiles[i] ?? '', serialisePlan(plan))));
}, 60_000);

afterAll(async () => {
  if (workDir !== '') await rm(workDir, { recursive: true, force: true });
});

/** Starts the child, waits until it starts saving, kills it `delayMs` later, waits for it to die. */
function runAndKill(target: string, firstVersion: number, delayMs: number): Promise<{ readonly pid: number }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [childScript, target, String(firstVersion), ...versionFiles], {
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let stderr = '';
    let killed = false;
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    child.stdout.on('data', (chunk: Buffer) => {
      if (!killed && chunk.toString().includes('ready')) {
        killed = true;
        setTimeout(() => child.kill('SIGKILL'), delayMs);
      }
    });
    child.on('error', reject);
    child.on('exit', (code, signal) => {
      if (signal !== 'SIGKILL') reject(new Error(`child ended by itself (code ${code}): ${stderr}`));
      else resolve({ pid: child.pid ?? -1 });
    });
  });
}

interface LaneReport {
  /** How often each version (by index) was the one found after a kill. */
  readonly survivors: ReadonlyMap<number, number>;
  /** Kills that left a temporary file, i.e. landed while a save was writing. */
  readonly killsMidWrite: number;
}

/**
 * One folder, one plan, `kills` rounds of start-save-kill-check. Two lanes run side by side on
 * separate folders so the test uses both cores while a child starts up.
 */
async function lane(name: string, kills: number, seed: number): Promise<LaneReport> {
  const folder = path.join(workDir, name, 'Études cliniques');
  const target = path.join(folder, 'plan ü 1.plumb');
  const plans = killTestPlans();
  const versions = plans.map((p) => Buffer.from(serialisePlan(p), 'utf8'));
  await mkdir(folder, { recursive: true });
  // two saves first, so that the plan and its backup both exist before the kills begin
  for (const plan of [...plans].reverse()) expect((await writePlanFile(target, plan)).ok).toBe(true);

  const next = delays(seed);
  const killedPids = new Set<number>();
  const survivors = new Map<number, number>();
  let killsMidWrite = 0;
  for (let round = 0; round < kills; round += 1) {
    const delay = next();
    const { pid } = await runAndKill(target, round % versions.length, delay);
    killedPids.add(pid);
    const context = `${name}, round ${round}, kill after ${delay.toFixed(1)} ms (seed ${seed})`;

    const bytes = await readFile(target);
    const which = versions.findIndex((v) => v.equals(bytes));
    expect(which, `${context}: the plan is neither complete version (${bytes.length} bytes)`).toBeGreaterThanOrEqual(0);
    survivors.set(which, (survivors.get(which) ?? 0) + 1);
    const backup = await readFile(`${target}.bak`);
    expect(
      versions.some((v) => v.equals(backup)),
      `${context}: the backup is damaged`,
    ).toBe(true);

    const names = await readdir(folder);
    const temps = names.map((n) => ({ name: n, temp: parseTempName(n) })).filter((t) => t.temp !== null);
    const others = names.filter((n) => parseTempName(n) === null).sort();
    expect(others, context).toEqual(['plan ü 1.plumb', 'plan ü 1.plumb.bak']);
    for (const { name: file, temp } of temps)
      expect(killedPids.has(temp?.pid ?? -1), `${context}: ${file} is not from a killed save`).toBe(true);
    const fromThisKill = temps.filter((t) => t.temp?.pid === pid);
    expect(fromThisKill.length, `${context}: at most the plan's and the backup's temporary file`).toBeLessThanOrEqual(2);
    if (fromThisKill.length > 0) killsMidWrite += 1;
  }

  // Opening cleans up what the killed saves left behind.
  expect((await readPlanFile(target)).ok).toBe(true);
  expect((await readdir(folder)).sort()).toEqual(['plan ü 1.plumb', 'plan ü 1.plumb.bak']);
  return { survivors, killsMidWrite };
}

describe('a save killed at a random moment', () => {
  it(`leaves the old or the new complete version, ${KILLS} kills`, async () => {
    const lanes = await Promise.all([lane('lane 1', KILLS / 2, SEED), lane('lane 2', KILLS / 2, SEED + 1)]);
    const survivors = new Map<number, number>();
    for (const report of lanes)
      for (const [version, count] of report.survivors) survivors.set(version, (survivors.get(version) ?? 0) + count);
    const killsMidWrite = lanes.reduce((sum, report) => sum + report.killsMidWrite, 0);
    console.info(
      `${KILLS} kills: survivors by version ${JSON.stringify(Object.fromEntries(survivors))}, ${killsMidWrite} landed mid-write`,
    );
    // Both versions survived some kills (saves really completed), and kills did hit writes.
    expect(survivors.size).toBe(2);
    expect(killsMidWrite).toBeGreaterThan(KILLS / 10);
  }, 120_000);
});
