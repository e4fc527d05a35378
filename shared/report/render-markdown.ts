// The document as Markdown (GitHub-flavoured tables), for .md files and the clipboard. Figures
// are given by caption and description; the numbers they draw are in the tables.
import type { Block, ReportDocument, ReportSection, ReportTable } from './document';
import { createNumbering, type Numbering } from './numbering';
import { reproducibilityLines } from './reproducibility';

/**
 * Text with the characters escaped that could change a Markdown document's structure or add
 * markup (emphasis, code, HTML, table cells, headings, list markers), so names and sources print
 * as written. Brackets and underscores are left alone so that "[1]" citation marks and "σ²_CITL"
 * stay readable; at worst they make a link or emphasis, never a broken document.
 */
export function escapeMarkdown(text: string): string {
  return text
    .replace(/([\\`*<>|~])/g, '\\$1')
    .replace(/^(#)/, '\\$1')
    .replace(/^(\d+)\.(\s)/, '$1\\.$2')
    .replace(/^([-+=])/, '\\$1')
    .replace(/[\r\n]+/g, ' ');
}

function tableMarkdown(table: ReportTable, label: string): string[] {
  const row = (cells: readonly string[]): string => `| ${cells.map(escapeMarkdown).join(' | ')} |`;
  const rule = `|${table.numeric.map((n) => (n ? ' ---: ' : ' --- ')).join('|')}|`;
  return [
    `**${label}.** ${escapeMarkdown(table.caption)}`,
    '',
    row(table.header),
    rule,
    ...table.rows.map(row),
    ...(table.footer === undefined ? [] : [row(table.footer)]),
    ...(table.note === undefined ? [] : ['', `*${escapeMarkdown(table.note)}*`]),
  ];
}

function blockMarkdown(block: Block, numbering: Numbering): string[] {
  switch (block.kind) {
    case 'paragraph': {
      const text = escapeMarkdown(block.text);
      return [block.lead === undefined ? text : `**${escapeMarkdown(block.lead)}**${text === '' ? '' : ` ${text}`}`];
    }
    case 'list':
      return block.items.map((item) => `- ${escapeMarkdown(item)}`);
    case 'table':
      return tableMarkdown(block.table, numbering.next(block));
    case 'figure':
      return [
        `**${numbering.next(block)}.** ${escapeMarkdown(block.figure.caption)}. ${escapeMarkdown(block.figure.description)}`,
      ];
    case 'references':
      return block.items.map((r) => `${r.number}. ${escapeMarkdown(r.citation)}`);
  }
}

function sectionMarkdown(section: ReportSection, depth: number, numbering: Numbering): string[] {
  const out = [`${'#'.repeat(Math.min(6, depth))} ${escapeMarkdown(section.title)}`, ''];
  for (const block of section.blocks) out.push(...blockMarkdown(block, numbering), '');
  for (const sub of section.subsections ?? []) out.push(...sectionMarkdown(sub, depth + 1, numbering));
  return out;
}

/** The whole document as Markdown, ending with one newline. */
export function renderMarkdown(doc: ReportDocument): string {
  const numbering = createNumbering();
  const out = [`# ${escapeMarkdown(doc.title)}`, '', ...doc.subtitle.map((line) => `${escapeMarkdown(line)}  `), ''];
  for (const section of doc.sections) out.push(...sectionMarkdown(section, 2, numbering));
  if (doc.reproducibility !== undefined) {
    out.push(
      '## Reproducibility',
      '',
      ...reproducibilityLines(doc.reproducibility).map((line) => `- ${escapeMarkdown(line)}`),
      '',
    );
  }
  return `${out.join('\n').trimEnd()}\n`;
}
