import type { ProjectPlan } from '@shared/engine/plan/plan-project';
import { formatCount } from '@shared/format/numbers';
import type { Project } from '@shared/model/project';
import type { CellTable, CellValue } from '@shared/summary/table-cells';
import { CAUTIONS } from '@shared/text/cautions';

function cell(value: CellValue): string {
  if (value === null) return '';
  return String(value)
    .replace(/\|/g, '\\|')
    .replace(/[\r\n]+/g, ' ');
}

function table(header: readonly string[], body: readonly (readonly CellValue[])[]): string[] {
  return [
    `| ${header.map(cell).join(' | ')} |`,
    `|${header.map(() => ' --- ').join('|')}|`,
    ...body.map((r) => `| ${r.map(cell).join(' | ')} |`),
  ];
}

/** --markdown: the comparison table, then each population's criteria, then the cautions. */
export function formatMarkdown(project: Project, plan: ProjectPlan, summary: CellTable): string {
  const lines: string[] = [`# ${cell(project.name)}`, '', '## Required sample size by population', ''];
  lines.push(...table(summary.header, [...summary.body, summary.footer]));
  for (const p of plan.populations) {
    lines.push('', `## ${cell(p.name)}`, '');
    lines.push(
      `Required n: **${p.requiredN === null ? '—' : formatCount(p.requiredN)}**${p.binding === null ? '' : ` (binding: \`${p.binding}\`)`}${p.events === undefined || p.events === null ? '' : `; expected events ${formatCount(p.events.whole)}`}`,
      '',
    );
    lines.push(
      ...table(
        ['Criterion', 'Id', 'n', 'Status', 'Target'],
        p.criteria.map((c) => [
          c.label,
          c.id,
          c.n === null ? null : formatCount(c.n),
          c.reason === undefined ? c.status : `${c.status}: ${c.reason}`,
          c.target,
        ]),
      ),
    );
    if (p.worstCase !== null) {
      lines.push(
        '',
        `Worst case across the ranges: ${p.worstCase.requiredN === null ? 'out of reach' : formatCount(p.worstCase.requiredN)} (${cell(p.worstCase.assumption)})`,
      );
    }
  }
  lines.push('', ...CAUTIONS.map((c) => `> ${c}`));
  return `${lines.join('\n')}\n`;
}
