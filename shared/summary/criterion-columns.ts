import type { ComparisonRow } from './comparison';

export interface CriterionColumn {
  readonly id: string;
  readonly header: string;
  readonly purpose: 'validation' | 'development';
}

/** The criterion columns present in any row, validation first, in the engine's order. */
export function criterionColumns(rows: readonly ComparisonRow[]): CriterionColumn[] {
  const seen = new Map<string, CriterionColumn>();
  for (const row of rows) {
    for (const criterion of row.criteria) {
      if (!seen.has(criterion.id)) seen.set(criterion.id, { id: criterion.id, header: criterion.label, purpose: criterion.purpose });
    }
  }
  const all = [...seen.values()];
  return [...all.filter((c) => c.purpose === 'validation'), ...all.filter((c) => c.purpose === 'development')];
}
