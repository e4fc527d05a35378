// Speed of the Monte Carlo check (issue 8): simulated observations per second on one core for the
// continuous case, against the target of 20 million per second, and the time one step takes
// (a worker can act on a cancel only between steps).
import { formatCount, formatDecimal, formatSignificant } from '../../shared/format/numbers';
import { createSimulation } from '../../shared/engine/simulation/create-simulation';
import type { SimulationConfigInput } from '../../shared/engine/simulation/simulation-config';

const TARGET_PER_SECOND = 20_000_000;
const RUNS = 7;
const OBSERVATIONS_PER_RUN = 12_000_000;

const TARGETS = {
  confidence: 0.95,
  rSquared: { width: 0.1 },
  citl: { width: 1 },
  slope: { width: 0.2 },
  residualSd: { marginFactor: 1.1 },
};

const BINARY_TARGETS = { confidence: 0.95, oe: { marginFactor: 1.105 }, slope: { width: 0.2 }, cStatistic: { width: 0.1 } };

function config(
  n: number,
  replicates: number,
  seed: number,
  outcome: 'continuous' | 'binary' = 'continuous',
): SimulationConfigInput {
  return outcome === 'continuous'
    ? { outcome, population: { rSquared: 0.8, outcomeVariance: 100 }, n, replicates, seed, targets: TARGETS }
    : // Outcome proportion 0.1 and C-statistic 0.8 (LP from the methods reference, section 5.2).
      { outcome, population: { lpMean: -2.776998, lpSd: 1.288257 }, n, replicates, seed, targets: BINARY_TARGETS };
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? (sorted[mid] ?? 0) : ((sorted[mid - 1] ?? 0) + (sorted[mid] ?? 0)) / 2;
}

/** Processor time of this thread in seconds where the host reports it (Node), else null. */
function cpuSeconds(): number | null {
  const host = globalThis as { process?: { cpuUsage?: () => { user: number; system: number } } };
  const usage = host.process?.cpuUsage?.();
  return usage ? (usage.user + usage.system) / 1e6 : null;
}

interface Rate {
  /** Observations per second of elapsed (wall-clock) time. */
  readonly wall: number;
  /** Observations per second of processor time: the per-core figure when other jobs share the cores. */
  readonly cpu: number | null;
}

/** Observations per second for one complete run of `replicates` studies of size n. */
function throughput(n: number, replicates: number, seed: number, outcome: 'continuous' | 'binary' = 'continuous'): Rate {
  const sim = createSimulation(config(n, replicates, seed, outcome));
  const cpuStart = cpuSeconds();
  const start = performance.now();
  while (!sim.step(Infinity).done);
  const seconds = (performance.now() - start) / 1000;
  const cpuEnd = cpuSeconds();
  const cpu = cpuStart !== null && cpuEnd !== null && cpuEnd > cpuStart ? (n * replicates) / (cpuEnd - cpuStart) : null;
  return { wall: (n * replicates) / seconds, cpu };
}

/** Durations (ms) of `steps` consecutive default-sized steps. */
function stepTimes(n: number, steps: number, outcome: 'continuous' | 'binary' = 'continuous'): number[] {
  const cap = outcome === 'continuous' ? 1e10 : 2e9;
  const sim = createSimulation(config(n, Math.min(1_000_000, Math.floor(cap / n)), 99, outcome));
  const times: number[] = [];
  for (let i = 0; i < steps; i++) {
    const start = performance.now();
    sim.step(Infinity);
    times.push(performance.now() - start);
  }
  return times;
}

export async function bench(): Promise<readonly string[]> {
  const lines: string[] = ['Monte Carlo check, continuous outcome (one core, single thread)'];
  throughput(308, 5000, 1); // warm-up: let the JIT compile the hot loops
  const millions = (x: number): string => formatSignificant(x / 1e6, 3);
  for (const n of [98, 308, 762, 5000]) {
    const replicates = Math.round(OBSERVATIONS_PER_RUN / n);
    const rates = Array.from({ length: RUNS }, (_, run) => throughput(n, replicates, run + 1));
    const wall = rates.map((r) => r.wall);
    const cpu = rates.map((r) => r.cpu).filter((r): r is number => r !== null);
    // The per-core figure is per second of processor time when the host reports it (robust to
    // other jobs on a shared machine), else per second of elapsed time.
    const perCore = cpu.length === RUNS ? median(cpu) : median(wall);
    lines.push(
      `  n = ${formatCount(n).padStart(5)}: ${millions(perCore)} million observations/s per core ` +
        `(${formatDecimal(perCore / TARGET_PER_SECOND, 2)}× the ${formatCount(TARGET_PER_SECOND / 1e6)} million/s target); ` +
        `median of ${RUNS} runs of ${formatCount(replicates)} replicates, ${cpu.length === RUNS ? 'per processor second' : 'per elapsed second'}; ` +
        `elapsed-time median ${millions(median(wall))} million/s (range ${millions(Math.min(...wall))}–${millions(Math.max(...wall))})`,
    );
  }
  // Binary outcomes have no speed target: each replicate also needs a logistic fit and a sort.
  const binary = Array.from({ length: RUNS }, (_, run) => throughput(1500, 400, run + 1, 'binary'));
  const binaryCpu = binary.map((r) => r.cpu).filter((r): r is number => r !== null);
  const binaryRate = binaryCpu.length === RUNS ? median(binaryCpu) : median(binary.map((r) => r.wall));
  lines.push(
    `  binary, n = 1,500 (phi 0.1, C 0.8): ${millions(binaryRate)} million observations/s per core ` +
      `(median of ${RUNS} runs of 400 replicates, including the Newton–Raphson fits and the C-statistic sorts; no target)`,
  );
  for (const [outcome, n] of [
    ['continuous', 308],
    ['continuous', 1_000_000],
    ['binary', 1500],
    ['binary', 100_000],
  ] as const) {
    const times = stepTimes(n, 60, outcome).slice(10); // the first steps include compilation
    lines.push(
      `  one step, ${outcome} n = ${formatCount(n)} (default budget): median ${formatDecimal(median(times), 1)} ms, ` +
        `max ${formatDecimal(Math.max(...times), 1)} ms over ${times.length} steps (elapsed time) — a cancel waits at most one step`,
    );
  }
  return lines;
}
