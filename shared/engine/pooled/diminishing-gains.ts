import type { AllocationProblem } from './allocation-problem';
import { geometricGrid } from './geometric-grid';

/** Whether each site's weight gains were seen to shrink as n grows, and where they did not. */
export interface DiminishingGainsCheck {
  readonly holds: boolean;
  /** Where a gain grew, e.g. "site 2, calibration slope, between n = 40 and n = 64". */
  readonly where?: string;
}

const GRID_POINTS = 24;
/** Relative slack for floating-point noise in the gains. */
const SLACK = 1e-7;

/**
 * Samples the gain in weight w(n+1) − w(n), w = 1/(s(n)² + τ²), at 24 points spaced evenly on a
 * log scale from each site's floor to its cap, for every measure, and checks that it never grows
 * (beyond a 1e-7 relative slack for rounding). This is the condition under which the marginal
 * allocation gives the fewest participants (see fewestParticipants); it holds for every
 * s² = a/(n − c) + b with b ≥ 0. A sampled check: it can miss a bump between grid points.
 * Also raises (through weightGain) a DomainError when an SE grows with n.
 * Source: concavity condition of marginal analysis (common practice).
 * @example diminishingGains(problem).holds // true (problem as in makeAllocationProblem's example)
 */
export function diminishingGains(problem: AllocationProblem): DiminishingGainsCheck {
  for (let site = 0; site < problem.k; site++) {
    const floor = problem.floors[site] ?? 1;
    const last = (problem.caps[site] ?? floor) - 1;
    if (last <= floor) continue;
    const grid = geometricGrid(floor, last, GRID_POINTS);
    for (let m = 0; m < problem.measures.length; m++) {
      let previous = Number.POSITIVE_INFINITY;
      let previousN = floor;
      for (const n of grid) {
        const g = problem.weightGain(site, m, n);
        if (g > previous * (1 + SLACK)) {
          return {
            holds: false,
            where: `site ${site + 1}, ${problem.measures[m]?.label ?? ''}, between n = ${previousN} and n = ${n}`,
          };
        }
        previous = g;
        previousN = n;
      }
    }
  }
  return { holds: true };
}
