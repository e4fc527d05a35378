import type { ComparisonRow } from './comparison';

export interface CriterionColumn {
  readonly id: string;
  /** A short column header; the full label is in `label`. */
  readonly header: string;
  readonly label: string;
  readonly purpose: 'validation' | 'development';
}

const SHORT_HEADERS: Readonly<Record<string, string>> = {
  r2: 'R²',
  citl: 'CITL',
  slope: 'Slope',
  'residual-sd-citl': 'Resid. SD (CITL)',
  'residual-sd-slope': 'Resid. SD (slope)',
  'dev-shrinkage': 'Dev. shrinkage',
  'dev-optimism': 'Dev. optimism',
  'dev-residual-sd': 'Dev. resid. SD',
  'dev-intercept': 'Dev. intercept',
  oe: 'O/E',
  'c-statistic': 'C',
  'dev-overall-risk': 'Dev. overall risk',
};

/** The short header of a criterion column (the label itself when no short form is known). */
export function shortHeader(id: string, label: string): string {
  if (id.startsWith('net-benefit@')) return `NB @${id.slice('net-benefit@'.length)}`;
  return SHORT_HEADERS[id] ?? label;
}

/** The criterion columns present in any row, validation first, in the engine's order. */
export function criterionColumns(rows: readonly ComparisonRow[]): CriterionColumn[] {
  const seen = new Map<string, CriterionColumn>();
  for (const row of rows) {
    for (const criterion of row.criteria) {
      if (!seen.has(criterion.id)) {
        seen.set(criterion.id, {
          id: criterion.id,
          header: shortHeader(criterion.id, criterion.label),
          label: criterion.label,
          purpose: criterion.purpose,
        });
      }
    }
  }
  const all = [...seen.values()];
  return [...all.filter((c) => c.purpose === 'validation'), ...all.filter((c) => c.purpose === 'development')];
}
