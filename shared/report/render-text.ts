// The document as plain text: for the clipboard (pasted into a protocol or an email) and .txt
// files. Paragraphs are not wrapped, so a word processor reflows them; tables are aligned in
// columns for a fixed-width font.
import type { Block, ReportDocument, ReportSection, ReportTable } from './document';
import { createNumbering, type Numbering } from './numbering';
import { reproducibilityLines } from './reproducibility';

const width = (text: string): number => [...text].length;

function pad(text: string, size: number, right: boolean): string {
  const gap = ' '.repeat(Math.max(0, size - width(text)));
  return right ? gap + text : text + gap;
}

/** A table in aligned columns: header, a rule, the rows, the footer below a second rule. */
export function tableText(table: ReportTable, label: string): string[] {
  const all = [table.header, ...table.rows, ...(table.footer === undefined ? [] : [table.footer])];
  const sizes = table.header.map((_, i) => Math.max(...all.map((row) => width(row[i] ?? ''))));
  const line = (row: readonly string[]): string =>
    row
      .map((cell, i) => pad(cell, sizes[i] ?? 0, table.numeric[i] ?? false))
      .join('  ')
      .trimEnd();
  const rule = sizes.map((s) => '-'.repeat(s)).join('  ');
  return [
    `${label}. ${table.caption}`,
    line(table.header),
    rule,
    ...table.rows.map(line),
    ...(table.footer === undefined ? [] : [rule, line(table.footer)]),
    ...(table.note === undefined ? [] : [table.note]),
  ];
}

function blockText(block: Block, numbering: Numbering): string[] {
  switch (block.kind) {
    case 'paragraph':
      return [block.lead === undefined ? block.text : block.text === '' ? block.lead : `${block.lead} ${block.text}`];
    case 'list':
      return block.items.map((item) => `- ${item}`);
    case 'table':
      return tableText(block.table, numbering.next(block));
    case 'figure':
      return [`${numbering.next(block)}. ${block.figure.caption}. ${block.figure.description}`];
    case 'references':
      return block.items.map((r) => `[${r.number}] ${r.citation}`);
  }
}

function sectionText(section: ReportSection, numbering: Numbering): string[] {
  const out = [section.title, ''];
  for (const block of section.blocks) out.push(...blockText(block, numbering), '');
  for (const sub of section.subsections ?? []) out.push(...sectionText(sub, numbering));
  return out;
}

/** The whole document as plain text, ending with one newline. */
export function renderText(doc: ReportDocument): string {
  const numbering = createNumbering();
  const out = [doc.title, ...doc.subtitle, ''];
  for (const section of doc.sections) out.push(...sectionText(section, numbering));
  if (doc.reproducibility !== undefined) out.push('Reproducibility', '', ...reproducibilityLines(doc.reproducibility), '');
  return `${out.join('\n').trimEnd()}\n`;
}
