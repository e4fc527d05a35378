// Speed of plan files (issue 4): open and save a plan with 1,000 fully filled-in populations,
// against the target of 100 ms each. Save is the whole durable path (schema check, text, temporary
// file, flush, backup, rename, folder flush); open is read, decode, JSON, migration check and
// schema check. The text-only steps are timed too, to show where the time goes.
import { mkdir, mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { formatCount, formatDecimal } from '../../shared/format/numbers';
import { parsePlanText, preparePlanText } from '../../shared/model/plan-file';
import { readPlanFile, writePlanFile } from '../../src-main/store/plan-io';
import { largePlan } from '../unit/store/helpers/large-plan';

const TARGET_MS = 100;
const POPULATIONS = 1000;
const RUNS = 21;
const WARM_UP = 3;

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? (sorted[mid] ?? 0) : ((sorted[mid - 1] ?? 0) + (sorted[mid] ?? 0)) / 2;
}

/** Durations (ms) of `RUNS` calls after `WARM_UP` untimed ones; a failed call stops the benchmark. */
async function time(task: () => Promise<boolean> | boolean): Promise<number[]> {
  const times: number[] = [];
  for (let i = 0; i < WARM_UP + RUNS; i += 1) {
    const start = performance.now();
    const ok = await task();
    const elapsed = performance.now() - start;
    if (!ok) throw new Error('a storage call failed during the benchmark');
    if (i >= WARM_UP) times.push(elapsed);
  }
  return times;
}

function line(label: string, times: readonly number[], target: number | null): string {
  const m = median(times);
  const against = target === null ? '' : `, ${formatDecimal(m / target, 2)}× the ${formatCount(target)} ms target`;
  return `  ${label}: median ${formatDecimal(m, 1)} ms (range ${formatDecimal(Math.min(...times), 1)}–${formatDecimal(Math.max(...times), 1)}, ${RUNS} runs)${against}`;
}

export async function bench(): Promise<readonly string[]> {
  const root = await mkdtemp(path.join(os.tmpdir(), 'plumbline-bench-'));
  try {
    const folder = path.join(root, 'Études cliniques');
    await mkdir(folder);
    const file = path.join(folder, 'plan ü 1.plumb');
    const plan = largePlan(POPULATIONS, 'bench');
    const prepared = preparePlanText(plan);
    if (!prepared.ok) throw new Error(prepared.error.message);
    const text = prepared.value.text;

    const save = await time(async () => (await writePlanFile(file, plan)).ok);
    const open = await time(async () => (await readPlanFile(file)).ok);
    const serialise = await time(() => preparePlanText(plan).ok);
    const parse = await time(() => parsePlanText(text).ok);

    return [
      `Plan files: ${formatCount(POPULATIONS)} populations, ${formatDecimal(Buffer.byteLength(text) / 1_048_576, 2)} MB on disk`,
      line('save (check, write, flush, backup, rename)', save, TARGET_MS),
      line('open (read, parse, check)', open, TARGET_MS),
      line('  of which text only: check and serialise', serialise, null),
      line('  of which text only: parse and check', parse, null),
    ];
  } finally {
    await rm(root, { recursive: true, force: true });
  }
}
