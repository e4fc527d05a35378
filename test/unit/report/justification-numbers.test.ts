import { describe, expect, it } from 'vitest';
import { justificationDocument } from '@shared/report/plan-justification';
import { reportRows } from '@shared/report/report-rows';
import { renderMarkdown } from '@shared/report/render-markdown';
import { renderText } from '@shared/report/render-text';
import { comparisonCells } from '@shared/summary/table-cells';
import { enginePlanner } from '@shared/summary/planner';
import { demoProject } from './demo-plan';
import { containsNumberText, expectedTexts } from './table-numbers';

describe('the justification text of the demo plan', () => {
  const project = demoProject();
  const data = reportRows(project, enginePlanner);
  const table = comparisonCells(data.rows, data.totals);
  const expected = expectedTexts(table, data.rows, data.totals);
  const doc = justificationDocument({ project, planner: enginePlanner });
  const text = renderText(doc);

  it('checks every filled cell of the comparison table (5 populations × 21 columns, all filled, plus 2 totals)', () => {
    expect(data.rows).toHaveLength(5);
    expect(table.header).toHaveLength(21);
    expect(expected).toHaveLength(5 * 21 + 2);
  });

  it('holds every number and entry of the comparison table, as the table formats it', () => {
    const missing = expected.filter((e) => !containsNumberText(text, e.text)).map((e) => `${e.row} / ${e.column}: "${e.text}"`);
    expect(missing).toEqual([]);
  });

  it('states each population’s numbers in its own section', () => {
    const sections = doc.sections[0]?.subsections ?? [];
    expect(sections.map((s) => s.title)).toEqual(data.rows.map((r) => r.name));
    for (const [i, row] of data.rows.entries()) {
      const own = renderText({ title: '', subtitle: [], sections: [sections[i] ?? { id: '', title: '', blocks: [] }] });
      for (const e of expected.filter((x) => x.row === row.name))
        expect(containsNumberText(own, e.text), `${row.name}: ${e.column}`).toBe(true);
    }
  });

  it('gives the same words in Markdown', () => {
    const markdown = renderMarkdown(doc);
    const missing = expected.filter((e) => !containsNumberText(markdown.replace(/\\/g, ''), e.text));
    expect(missing).toEqual([]);
  });
});
