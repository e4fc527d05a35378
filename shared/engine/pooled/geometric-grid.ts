import { requireInteger } from './require-input';

/**
 * Whole numbers from `from` to `to` spaced evenly on a log scale: round(from·(to/from)^(j/(points−1))),
 * duplicates dropped, both ends included (so fewer than `points` values when the range is narrow).
 * Domain: 1 ≤ from ≤ to whole numbers, 2 ≤ points ≤ 10,000 (DomainError otherwise). Common practice.
 * @example geometricGrid(1, 100, 3) // [1, 10, 100]
 */
export function geometricGrid(from: number, to: number, points: number): number[] {
  requireInteger('from', from, 1, Number.MAX_SAFE_INTEGER);
  requireInteger('to', to, from, Number.MAX_SAFE_INTEGER);
  requireInteger('points', points, 2, 10_000);
  const grid: number[] = [];
  for (let j = 0; j < points; j++) {
    const n = j === points - 1 ? to : Math.round(from * (to / from) ** (j / (points - 1)));
    if (grid.length === 0 || n > (grid[grid.length - 1] ?? 0)) grid.push(n);
  }
  return grid;
}
