import { requireInteger } from './require-input';

/** Points on the simplex per number of measures: compositions of J into M parts (J by M). */
const STEPS: Readonly<Record<number, number>> = { 1: 1, 2: 8, 3: 4, 4: 2 };

/**
 * Weightings μ of M measures (μ_m ≥ 0, Σμ_m = 1) at which the planner combines the measures'
 * targets into one: every composition of J into M parts divided by J — J = 8 for 2 measures
 * (9 weightings), 4 for 3 (15), 2 for 4 (10) — and for 5 or more measures the M single measures
 * plus equal weights. Always includes each measure on its own. Domain: 1 ≤ M ≤ 100 (DomainError).
 * Common practice (a grid on the simplex).
 * @example measureWeightings(2) // [[0, 1], [0.125, 0.875], [0.25, 0.75], … [0.875, 0.125], [1, 0]] (9 weightings)
 */
export function measureWeightings(measureCount: number): number[][] {
  requireInteger('measureCount', measureCount, 1, 100);
  const steps = STEPS[measureCount];
  if (steps === undefined) {
    const single = Array.from({ length: measureCount }, (_, m) =>
      Array.from({ length: measureCount }, (_, j) => (j === m ? 1 : 0)),
    );
    return [...single, new Array<number>(measureCount).fill(1 / measureCount)];
  }
  const out: number[][] = [];
  const build = (prefix: number[], left: number): void => {
    if (prefix.length === measureCount - 1) {
      out.push([...prefix, left].map((v) => v / steps));
      return;
    }
    for (let v = 0; v <= left; v++) build([...prefix, v], left - v);
  };
  build([], steps);
  return out;
}
