// The per-criterion detail as plain cells (numbers stay numbers): one row per population and
// criterion, with everything a reviewer needs to audit the n. The CSV and XLSX exports read it.
import { REFERENCES } from '../engine/references';
import type { ComparisonRow } from '../summary/comparison';
import type { CellTable, CellValue } from '../summary/table-cells';
import { intermediatesText } from './criterion-sentence';

export const CRITERIA_HEADER = [
  'Population id',
  'Population',
  'Criterion id',
  'Criterion',
  'Purpose',
  'n',
  'Status',
  'Binding',
  'Target',
  'Formula',
  'References',
  'Intermediates',
  'Reason',
] as const;

/** Index of the n column, which holds numbers. */
export const CRITERIA_N_COLUMN = CRITERIA_HEADER.indexOf('n');

/**
 * One row per population × criterion, in the rows' order; references are written out in full (one
 * per line) and the intermediates as "name = value" pairs. A population that could not be planned
 * has one row saying why.
 * @example criteriaCells(rows).body[0]?.[5] // 1424
 */
export function criteriaCells(rows: readonly ComparisonRow[]): CellTable {
  const body = rows.flatMap((row): CellValue[][] => {
    if (row.problem !== null)
      return [[row.populationId, row.name, null, null, null, null, 'not planned', null, null, null, null, null, row.problem]];
    return row.criteria.map((c) => [
      row.populationId,
      row.name,
      c.id,
      c.label,
      c.purpose,
      c.n,
      c.status,
      c.id === row.binding ? 'yes' : 'no',
      c.target,
      c.formula,
      c.references.map((key) => REFERENCES[key].citation).join('\n'),
      c.intermediates.length === 0 ? null : intermediatesText(c),
      c.reason ?? null,
    ]);
  });
  return { header: [...CRITERIA_HEADER], body, footer: [] };
}
