// The comparison table of a binary plan: short criterion headers, an events column beside the
// required n (absent for continuous plans), and rows that carry the planner's events and cautions.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parsePlanText } from '@shared/model/plan-file';
import type { Project } from '@shared/model/project';
import { comparisonRows, comparisonTotals, rankByRequiredN } from '@shared/summary/comparison';
import { criterionColumns, shortHeader } from '@shared/summary/criterion-columns';
import { enginePlanner } from '@shared/summary/planner';
import { comparisonCells, hasEvents } from '@shared/summary/table-cells';

function demo(file: string): Project {
  const parsed = parsePlanText(readFileSync(`demo/${file}`, 'utf8'));
  if (!parsed.ok) throw new Error(parsed.error.message);
  return parsed.project;
}

describe('binary comparison table', () => {
  const project = demo('consortium-binary.plumb');
  const rows = rankByRequiredN(comparisonRows(project, enginePlanner));

  it('uses the short headers O/E, Slope, C, NB @t and the development ones', () => {
    expect(shortHeader('oe', 'x')).toBe('O/E');
    expect(shortHeader('c-statistic', 'x')).toBe('C');
    expect(shortHeader('net-benefit@0.1', 'x')).toBe('NB @0.1');
    expect(shortHeader('dev-overall-risk', 'x')).toBe('Dev. overall risk');
    expect(criterionColumns(rows).map((c) => c.header)).toEqual([
      'O/E',
      'Slope',
      'C',
      'NB @0.1',
      'NB @0.2',
      'Dev. shrinkage',
      'Dev. optimism',
      'Dev. overall risk',
    ]);
  });

  it('puts the events at the required n (rounded up) right after the required n', () => {
    expect(hasEvents(rows)).toBe(true);
    const cells = comparisonCells(rows, comparisonTotals(rows));
    const at = cells.header.indexOf('Events at required n');
    expect(at).toBe(cells.header.indexOf('Required n') + 1);
    for (const [i, row] of rows.entries()) {
      expect(cells.body[i]?.[at]).toBe(row.events?.whole);
      expect(row.events?.whole).toBe(Math.ceil(row.events?.exact ?? Number.NaN));
    }
    expect(cells.footer).toHaveLength(cells.header.length);
    expect(cells.body.every((r) => r.length === cells.header.length)).toBe(true);
  });

  it('has no events column for a continuous plan', () => {
    const continuous = demo('consortium-continuous.plumb');
    const continuousRows = comparisonRows(continuous, enginePlanner);
    expect(hasEvents(continuousRows)).toBe(false);
    expect(comparisonCells(continuousRows, comparisonTotals(continuousRows)).header).not.toContain('Events at required n');
    expect(continuousRows.every((r) => r.events === null && (r.warnings ?? []).length === 0)).toBe(true);
  });
});
