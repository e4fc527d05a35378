// Speed of the across-sites summary (pooledSummary: per-site SEs, the figures at low, base and high
// τ, curves, the one-more-site comparison and the pooled planner's proposal), as the workspace
// panel recomputes it after an edit: invented plans of 5, 50 and 200 sites with one pooled measure
// (the calibration slope) and with three (slope, CITL and R²), for both planner objectives.
// Median elapsed time over repeated runs after a warm-up run. Target: 50 ms for the figures of a
// 5-site plan with three measures without the proposal (the site-specific aim). The proposal (the
// pooled planner, most of the time with several measures) has no target here: it is reported so its
// cost is known; the panel computes it at a lower priority than the table.
import { availableParallelism, loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';
import { formatCount, formatDecimal } from '../../shared/format/numbers';
import { FORMAT_TAG, SCHEMA_VERSION, projectSchema, type Project } from '../../shared/model/project';
import { pooledSummary } from '../../shared/summary/pooled-summary';

const RUNS = 7;
const TARGET_MS = 50;

function project(sites: number, measures: 1 | 3, objective: string, aim = 'pooled'): Project {
  const slope = { tau: 0.05, tauRange: { low: 0.02, high: 0.1 }, summaryCiWidth: 0.15, predictionIntervalWidth: 0.6 };
  return projectSchema.parse({
    format: FORMAT_TAG,
    schemaVersion: SCHEMA_VERSION,
    name: 'Invented consortium for the benchmark',
    outcome: 'continuous',
    study: { windowMonths: 24 },
    pooled: {
      aim,
      objective,
      measures:
        measures === 1
          ? { slope }
          : { slope, citl: { tau: 0.03, summaryCiWidth: 0.1 }, rSquared: { tau: 0.03, summaryCiWidth: 0.08 } },
    },
    populations: Array.from({ length: sites }, (_, i) => ({
      id: `site-${i}`,
      name: `Site ${i}`,
      outcome: 'continuous',
      anticipated: { rSquared: 0.3 + (0.4 * ((i * 7) % 10)) / 10, outcomeVariance: 0.5 + ((i * 3) % 5) / 10 },
      precision: { citl: { width: 0.15 } },
      recruitment: { accrualPerMonth: 20 + ((i * 37) % 150), consentFraction: 0.8, missingOutcomeFraction: 0.05 },
    })),
  });
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] ?? Number.NaN;
}

export async function bench(): Promise<readonly string[]> {
  const lines: string[] = [];
  const time = (plan: Project): { ms: number; times: number[] } => {
    pooledSummary(plan); // warm-up
    const times: number[] = [];
    for (let r = 0; r < RUNS; r++) {
      const start = performance.now();
      pooledSummary(plan);
      times.push(performance.now() - start);
    }
    return { ms: median(times), times };
  };
  const figures = time(project(5, 3, 'fewest-participants', 'site-specific'));
  lines.push(
    `figures without the proposal (site-specific aim), 5 sites, 3 measures: median ${formatDecimal(figures.ms, 1)} ms — target ${TARGET_MS} ms ${figures.ms <= TARGET_MS ? 'met' : 'NOT met'}`,
  );
  for (const objective of ['fewest-participants', 'shortest-recruitment']) {
    for (const sites of [5, 50, 200]) {
      for (const measures of [1, 3] as const) {
        const plan = project(sites, measures, objective);
        const first = pooledSummary(plan);
        const { ms, times } = time(plan);
        lines.push(
          `${objective}, ${formatCount(sites)} sites, ${measures} measure${measures === 1 ? '' : 's'}: median ${formatDecimal(ms, 1)} ms ` +
            `(min ${formatDecimal(Math.min(...times), 1)}, max ${formatDecimal(Math.max(...times), 1)}); proposal ${first.proposal?.status ?? 'none'}, ` +
            `${formatCount(first.proposal?.totalN)} participants`,
        );
      }
    }
  }
  lines.push(
    `${RUNS} runs each after a warm-up; machine: ${availableParallelism()} cores, load average ${loadavg()
      .map((x) => formatDecimal(x, 1))
      .join(' / ')} (1/5/15 min)`,
  );
  return lines;
}
