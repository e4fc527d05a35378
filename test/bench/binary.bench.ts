// Speed of the binary engine: evaluations per second of the full criterion set of one population
// (planBinaryPopulation: O/E, calibration slope, C-statistic, net benefit at 0–3 thresholds and,
// for half the scenarios, the three development minimums), against the target of 20,000 per
// second, for random valid scenarios drawn once from a seeded generator. Timed separately: the
// same with the LP distribution fitted to (outcome proportion, C-statistic) — the two-equation
// solve, both solved afresh and remembered — and the calibration-slope criterion alone with its quadrature. Then the node-count study:
// how often 64 Gauss–Hermite nodes would change the slope n against the engine's rule (200 nodes,
// composite Gauss–Legendre for wide LPs).
import { availableParallelism, loadavg } from 'node:os';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import type { BinaryPlanOptions, BinaryPopulationInput } from '../../shared/engine/binary/binary-population-input';
import type { CalibrationSlopeInputs } from '../../shared/engine/binary/calibration-slope-criterion';
import { calibrationSlopeCriterion } from '../../shared/engine/binary/calibration-slope-criterion';
import { forgetNormalLpFits } from '../../shared/engine/binary/fit-normal-lp';
import { maxCoxSnellR2 } from '../../shared/engine/binary/max-cox-snell-r2';
import { planBinaryPopulation } from '../../shared/engine/binary/plan-binary-population';
import { formatCount, formatDecimal } from '../../shared/format/numbers';

const RUNS = 9;
const TARGET_PER_SECOND = 20_000;
const SEED = 20_260_611;

interface Scenario {
  readonly input: BinaryPopulationInput;
  readonly options: BinaryPlanOptions;
}

/** Random valid scenarios; `fitted` leaves out the LP mean and SD so the LP is fitted to (phi, C). */
function scenarios(count: number, seed: number, fitted: boolean): Scenario[] {
  const rng = xoroshiro128plus(seed);
  const u = (lo: number, hi: number): number => lo + (hi - lo) * uniformFloat64(rng);
  const logU = (lo: number, hi: number): number => Math.exp(u(Math.log(lo), Math.log(hi)));
  const out: Scenario[] = [];
  for (let i = 0; i < count; i++) {
    const outcomeProportion = logU(0.01, 0.5);
    const sd = u(0.4, 3);
    const lpMean = Math.log(outcomeProportion / (1 - outcomeProportion)) - 0.5 * sd * sd * (1 - outcomeProportion);
    const miscalibrated = uniformFloat64(rng) < 0.3;
    const thresholds = Array.from({ length: Math.floor(u(0, 4)) }, (_, k) => {
      const threshold = Math.round(1000 * u(0.5, 2) * outcomeProportion * (k + 1)) / 1000;
      return uniformFloat64(rng) < 0.5 ? { threshold } : { threshold, sensitivity: u(0.5, 0.9), specificity: u(0.5, 0.9) };
    }).filter((t, k, all) => t.threshold > 0 && t.threshold < 1 && all.findIndex((o) => o.threshold === t.threshold) === k);
    out.push({
      input: {
        anticipated: {
          outcomeProportion,
          cStatistic: u(0.6, 0.9),
          ...(fitted ? {} : { lpMean, lpSd: sd }),
          ...(miscalibrated ? { calibrationIntercept: u(-0.3, 0.3), calibrationSlope: u(0.7, 1.2) } : {}),
          thresholds,
        },
        precision: {
          confidence: 0.95,
          oe: uniformFloat64(rng) < 0.5 ? { width: u(0.1, 0.4) } : { lower: 0.9 - u(0, 0.1), upper: 1.1 + u(0, 0.1) },
          slope: { width: u(0.1, 0.4) },
          cStatistic: { width: u(0.05, 0.2) },
          netBenefit: { width: u(0.1, 0.4), standardised: uniformFloat64(rng) < 0.5 },
        },
      },
      options:
        uniformFloat64(rng) < 0.5
          ? {}
          : {
              development: {
                predictorParameters: 1 + Math.floor(u(0, 40)),
                coxSnellR2: u(0.05, 0.6) * maxCoxSnellR2(outcomeProportion),
              },
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

/** Processor time of this process in ms (user + system): the per-core figure when other jobs share the cores. */
function cpuMs(): number {
  const usage = process.cpuUsage();
  return (usage.user + usage.system) / 1000;
}

interface Timing {
  /** Evaluations per second of processor time and of elapsed time: median, min and max over the runs. */
  readonly cpu: readonly number[];
  readonly wall: readonly number[];
  readonly checksum: number;
}

/** RUNS timed runs after a warm-up run; each run evaluates every item once. */
function time<T>(items: readonly T[], evaluate: (item: T) => number): Timing {
  const once = (): { cpu: number; wall: number; checksum: number } => {
    let checksum = 0;
    const c0 = cpuMs();
    const t0 = performance.now();
    for (const item of items) checksum += evaluate(item);
    return { cpu: cpuMs() - c0, wall: performance.now() - t0, checksum };
  };
  const warm = once();
  const cpu: number[] = [];
  const wall: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const r = once();
    if (r.checksum !== warm.checksum) throw new Error('the engine gave different answers on the same scenarios');
    cpu.push((items.length * 1000) / r.cpu);
    wall.push((items.length * 1000) / r.wall);
  }
  return { cpu, wall, checksum: warm.checksum };
}

const rate = (x: number): string => formatCount(x);
const spread = (values: readonly number[]): string =>
  `median ${rate(median(values))}/s (min ${rate(Math.min(...values))}, max ${rate(Math.max(...values))})`;
const verdict = (values: readonly number[]): string => {
  const m = median(values);
  return `${formatDecimal(m / TARGET_PER_SECOND, 2)} × the target (${m >= TARGET_PER_SECOND ? 'met' : 'not met'})`;
};

/** The sum of every criterion's n (unsized ones count −1), as a checksum and to keep the work observable. */
function planChecksum(s: Scenario): number {
  let sum = 0;
  for (const c of planBinaryPopulation(s.input, s.options).criteria) sum += c.n ?? -1;
  return sum;
}

function slopeInputs(s: Scenario, hermiteNodes?: number): CalibrationSlopeInputs {
  const a = s.input.anticipated;
  return {
    lp: { kind: 'given', lp: { mean: a.lpMean ?? 0, sd: a.lpSd ?? 1 } },
    calibration: { intercept: a.calibrationIntercept ?? 0, slope: a.calibrationSlope ?? 1 },
    width: s.input.precision.slope.width,
    confidence: s.input.precision.confidence,
    outcomeProportion: a.outcomeProportion,
    hermiteNodes,
  };
}

/** Node-count study on the given-LP scenarios: slope n with 64 nodes against the engine's rule. */
function nodeStudy(all: readonly Scenario[]): string {
  let differ = 0;
  let worst = 0;
  for (const s of all) {
    const engine = calibrationSlopeCriterion(slopeInputs(s)).n ?? 0;
    const few = calibrationSlopeCriterion(slopeInputs(s, 64)).n ?? 0;
    if (few !== engine) differ++;
    worst = Math.max(worst, Math.abs(few - engine));
  }
  return `node-count study (${formatCount(all.length)} LPs, SD 0.4–3, calibration slope 0.7–1.2): 64 Gauss–Hermite nodes change the slope n in ${formatCount(differ)} of them (largest change ${formatCount(worst)}) against 200 nodes / composite Gauss–Legendre for spreads above 2.5`;
}

export async function bench(): Promise<readonly string[]> {
  const given = scenarios(4_000, SEED, false);
  const fitted = scenarios(400, SEED + 1, true);
  const full = time(given, planChecksum);
  // Cold: every fit solved afresh (the memory of fits is cleared before each plan).
  const withFit = time(fitted, (s) => {
    forgetNormalLpFits();
    return planChecksum(s);
  });
  // Warm: the same populations planned again, as when another input changes (fits remembered).
  const warmFit = time(fitted, planChecksum);
  const slopeItems = given.map((s) => slopeInputs(s));
  const slope = time(slopeItems, (x) => calibrationSlopeCriterion(x).n ?? -1);
  const criteria = given.reduce((acc, s) => acc + planBinaryPopulation(s.input, s.options).criteria.length, 0) / given.length;
  return [
    `full criterion set of one population (${formatDecimal(criteria, 1)} criteria on average), LP given as normal(mean, SD): ${formatCount(given.length)} random scenarios (seed ${SEED}), ${RUNS} runs after a warm-up`,
    `  processor time: ${spread(full.cpu)}; elapsed: ${spread(full.wall)}`,
    `  target ${formatCount(TARGET_PER_SECOND)}/s: processor-time median ${verdict(full.cpu)}; elapsed median ${verdict(full.wall)}`,
    `full criterion set with the LP fitted to (outcome proportion, C) by the two-equation solve: ${formatCount(fitted.length)} scenarios (seed ${SEED + 1})`,
    `  every fit solved afresh: processor time ${spread(withFit.cpu)}; elapsed ${spread(withFit.wall)}; against ${formatCount(TARGET_PER_SECOND)}/s: ${verdict(withFit.cpu)}`,
    `  populations planned again (fits remembered per (phi, C)): processor time ${spread(warmFit.cpu)}; elapsed ${spread(warmFit.wall)}; ${verdict(warmFit.cpu)}`,
    `calibration-slope criterion alone (quadrature included), LP given: processor time ${spread(slope.cpu)}; elapsed ${spread(slope.wall)}`,
    nodeStudy(given),
    `checksums (sum of n): ${formatCount(full.checksum)} / ${formatCount(withFit.checksum)} / ${formatCount(slope.checksum)}`,
    `machine: ${availableParallelism()} cores, load average ${loadavg()
      .map((x) => formatDecimal(x, 1))
      .join(' / ')} (1/5/15 min) — other jobs inflate both times`,
  ];
}
