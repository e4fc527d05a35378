import type { BinaryPopulation, BinaryRangeKey, Project } from '../../model/project';
import { binaryAssumptionRanges } from './binary-assumption-ranges';
import type { WorstCase } from './worst-case';
import { worstAcross } from './worst-case';

/** The largest requirement across a binary population's ranges, and the assumption behind it. */
export type BinaryWorstCase = Omit<WorstCase, 'key'> & { readonly key: BinaryRangeKey };

/**
 * Worst case across the low/high ranges of a binary population: the maximum over
 * binaryAssumptionRanges, with the assumption that produced it named. Null without ranges.
 * @example binaryWorstCase(population, project)?.assumption // "Anticipated outcome proportion at its low end 0.09"
 */
export function binaryWorstCase(population: BinaryPopulation, project: Pick<Project, 'updating'>): BinaryWorstCase | null {
  return worstAcross(binaryAssumptionRanges(population, project));
}
