// Speed of the continuous engine: 100,000 random valid scenarios, each with every criterion (five
// validation and four development criteria), against the target of 50 ms on one core. The timed
// figure is the sizes (validationSizes/developmentSizes: the same per-criterion functions the
// results are built from, without the words); full CriterionResults with their target text and
// intermediates are timed too, for information. Scenarios are drawn once from a seeded generator
// and reused in every run. Confidence levels and margin factors are drawn from the few values
// planners use (their quantile searches are remembered per level, as in the app); every other
// input is drawn from a continuous range.
import { availableParallelism, loadavg } from 'node:os';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import type { ContinuousDevelopmentInputs, ContinuousValidationInputs } from '../../shared/engine/continuous/continuous-inputs';
import { developmentSizes, validationSizes } from '../../shared/engine/continuous/continuous-sizes';
import { evaluateContinuousDevelopment, evaluateContinuousValidation } from '../../shared/engine/continuous/evaluate-continuous';
import { formatCount, formatDecimal } from '../../shared/format/numbers';

const SCENARIOS = 100_000;
const RUNS = 9;
const TARGET_MS = 50;
const SEED = 20_260_302;

const CONFIDENCE_LEVELS = [0.9, 0.95, 0.99] as const;
const MARGIN_FACTORS = [1.05, 1.1, 1.15, 1.2] as const;

interface Scenario {
  readonly validation: ContinuousValidationInputs;
  readonly development: ContinuousDevelopmentInputs;
}

function scenarios(count: number, seed: number): Scenario[] {
  const rng = xoroshiro128plus(seed);
  const u = (lo: number, hi: number): number => lo + (hi - lo) * uniformFloat64(rng);
  const logU = (lo: number, hi: number): number => Math.exp(u(Math.log(lo), Math.log(hi)));
  const pick = <T>(values: readonly T[]): T => values[Math.floor(uniformFloat64(rng) * values.length)] as T;
  const out: Scenario[] = [];
  for (let i = 0; i < count; i++) {
    const rSquared = u(0.05, 0.95);
    const outcomeVariance = logU(0.01, 100);
    const sd = Math.sqrt(outcomeVariance);
    const confidence = pick(CONFIDENCE_LEVELS);
    const residualSdMargin = pick(MARGIN_FACTORS);
    const mean = (uniformFloat64(rng) < 0.5 ? -1 : 1) * logU(0.5, 50);
    out.push({
      validation: {
        rSquared,
        outcomeVariance,
        rSquaredCitl: uniformFloat64(rng) < 0.5 ? rSquared : u(0.05, 0.95),
        rSquaredSlope: uniformFloat64(rng) < 0.5 ? rSquared : u(0.05, 0.95),
        slope: u(0.7, 1.3),
        confidence,
        r2Width: u(0.05, 0.2),
        citlWidth: u(0.05, 0.5) * sd,
        slopeWidth: u(0.1, 0.4),
        residualSdMargin,
      },
      development: {
        predictorParameters: 1 + Math.floor(u(0, 60)),
        adjustedRSquared: u(0.05, 0.85),
        targetShrinkage: u(0.85, 0.95),
        optimismMargin: u(0.02, 0.1),
        residualSdMargin,
        confidence,
        shrinkageForm: uniformFloat64(rng) < 0.8 ? 'adjusted-r2-link' : 'closed-form',
        outcomeMean: mean,
        outcomeSd: u(0.1, 2) * Math.abs(mean),
      },
    });
  }
  return out;
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? (sorted[mid] ?? 0) : ((sorted[mid - 1] ?? 0) + (sorted[mid] ?? 0)) / 2;
}

type Evaluate = (s: Scenario) => readonly { readonly n: number | null }[][];

const sizesOnly: Evaluate = (s) => [validationSizes(s.validation), developmentSizes(s.development)];
const fullResults: Evaluate = (s) => [evaluateContinuousValidation(s.validation), evaluateContinuousDevelopment(s.development)];

/** Processor time of this process in ms (user + system): the per-core figure when other jobs share the cores. */
function cpuMs(): number {
  const usage = process.cpuUsage();
  return (usage.user + usage.system) / 1000;
}

interface Run {
  readonly ms: number;
  readonly cpu: number;
  readonly checksum: number;
  readonly unsized: number;
}

/** One run: every criterion of every scenario. Returns wall and processor ms and a checksum of the n. */
function run(all: readonly Scenario[], evaluate: Evaluate): Run {
  let checksum = 0;
  let unsized = 0;
  const cpuStart = cpuMs();
  const start = performance.now();
  for (const s of all) {
    for (const group of evaluate(s)) {
      for (const c of group) {
        if (c.n === null) unsized++;
        else checksum += c.n;
      }
    }
  }
  return { ms: performance.now() - start, cpu: cpuMs() - cpuStart, checksum, unsized };
}

interface Timing {
  readonly wall: { readonly median: number; readonly min: number; readonly max: number };
  readonly cpu: { readonly median: number; readonly min: number; readonly max: number };
  readonly checksum: number;
  readonly unsized: number;
}

const spread = (values: readonly number[]): Timing['wall'] => ({
  median: median(values),
  min: Math.min(...values),
  max: Math.max(...values),
});

/** Median, min and max over RUNS runs after a warm-up run (which fills the per-level quantile tables). */
function time(all: readonly Scenario[], evaluate: Evaluate): Timing {
  const warm = run(all, evaluate);
  const runs: Run[] = [];
  for (let i = 0; i < RUNS; i++) {
    const r = run(all, evaluate);
    if (r.checksum !== warm.checksum) throw new Error('the engine gave different answers on the same scenarios');
    runs.push(r);
  }
  return {
    wall: spread(runs.map((r) => r.ms)),
    cpu: spread(runs.map((r) => r.cpu)),
    checksum: warm.checksum,
    unsized: warm.unsized,
  };
}

const ms = (x: number): string => formatDecimal(x, 1);
const describe = (t: Timing['wall']): string => `median ${ms(t.median)} ms (min ${ms(t.min)}, max ${ms(t.max)})`;

export async function bench(): Promise<readonly string[]> {
  const all = scenarios(SCENARIOS, SEED);
  const sizes = time(all, sizesOnly);
  const full = time(all, fullResults);
  if (full.checksum !== sizes.checksum) throw new Error('the sizes and the full results disagree');
  const perCriterion = (x: number): string => formatDecimal((x * 1e6) / SCENARIOS / 9, 0);
  const verdict = (x: number): string =>
    `${formatDecimal(x / TARGET_MS, 2)} × the target (${x <= TARGET_MS ? 'met' : 'not met'})`;
  return [
    `${formatCount(SCENARIOS)} random continuous scenarios × 9 criteria (seed ${SEED}), ${RUNS} runs each after a warm-up run`,
    `sizes, processor time: ${describe(sizes.cpu)}, ${perCriterion(sizes.cpu.median)} ns per criterion`,
    `sizes, elapsed time:   ${describe(sizes.wall)}`,
    `target ${TARGET_MS} ms on one core: processor-time median ${verdict(sizes.cpu.median)}; elapsed median ${verdict(sizes.wall.median)}`,
    `full results (labels, target text, intermediates), processor time: ${describe(full.cpu)}; elapsed ${describe(full.wall)}`,
    `sum of n ${formatCount(sizes.checksum)}; criteria without an n (not assessable or out of reach): ${formatCount(sizes.unsized)}`,
    `machine: ${availableParallelism()} cores, load average ${loadavg()
      .map((x) => formatDecimal(x, 1))
      .join(' / ')} (1/5/15 min) — other jobs inflate both times`,
  ];
}
