import { DomainError } from '../errors';
import { requireFinite, requireOrdered } from './domain-guards';

/** Refuses a (min, median, max) summary unless min ≤ median ≤ max with min < max, all finite. */
export function requireMinMedianMax(min: number, median: number, max: number): void {
  requireFinite('min', min);
  requireFinite('median', median);
  requireFinite('max', max);
  requireOrdered('min', min, 'max', max);
  if (median < min || median > max) throw new DomainError('median', median, `a number between min (${min}) and max (${max})`);
}
