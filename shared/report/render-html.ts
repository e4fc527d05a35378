// The document as a standalone HTML page for Chromium's print-to-PDF: no scripts, no external
// resources (a CSP forbids them), the charts inline as SVG, the print style of print-css.ts. A
// title page carries the project, the date, the reproducibility details and the cautions.
import { CAUTIONS } from '../text/cautions';
import { escapeXml as escapeHtml } from './charts/svg';
import type { Block, ReportDocument, ReportSection, ReportTable } from './document';
import { createNumbering, type Numbering } from './numbering';
import { printCss } from './print-css';
import { reproducibilityFootline, reproducibilityLines } from './reproducibility';

/** Sections that start on a new page. */
const MAJOR_SECTIONS = new Set(['summary', 'figures', 'justification', 'assumptions', 'references']);

/** Tables with more columns than this are set in a smaller type. */
const WIDE_TABLE_COLUMNS = 11;

function tableHtml(table: ReportTable, label: string): string {
  const cell = (tag: 'th' | 'td', text: string, i: number): string =>
    `<${tag} class="${table.numeric[i] === true ? 'num' : 'text'}">${escapeHtml(text)}</${tag}>`;
  const head = `<thead><tr>${table.header.map((h, i) => cell('th', h, i)).join('')}</tr></thead>`;
  const body = `<tbody>${table.rows.map((r) => `<tr>${r.map((c, i) => cell('td', c, i)).join('')}</tr>`).join('')}</tbody>`;
  const foot =
    table.footer === undefined ? '' : `<tfoot><tr>${table.footer.map((c, i) => cell('td', c, i)).join('')}</tr></tfoot>`;
  const wide = table.header.length > WIDE_TABLE_COLUMNS ? ' class="wide"' : '';
  const note = table.note === undefined ? '' : `<p class="table-note">${escapeHtml(table.note)}</p>`;
  return `<table${wide}><caption><span class="label">${label}.</span> ${escapeHtml(table.caption)}</caption>${head}${body}${foot}</table>${note}`;
}

function blockHtml(block: Block, numbering: Numbering): string {
  switch (block.kind) {
    case 'paragraph':
      if (block.lead === undefined) return `<p>${escapeHtml(block.text)}</p>`;
      if (block.text === '') return `<p class="lead-only"><span class="lead">${escapeHtml(block.lead)}</span></p>`;
      return `<p><span class="lead">${escapeHtml(block.lead)}</span> ${escapeHtml(block.text)}</p>`;
    case 'list':
      return `<ul>${block.items.map((item) => `<li>${escapeHtml(item)}</li>`).join('')}</ul>`;
    case 'table':
      return tableHtml(block.table, numbering.next(block));
    case 'figure':
      return (
        `<figure>${block.figure.svg}<figcaption><span class="label">${numbering.next(block)}.</span> ` +
        `${escapeHtml(block.figure.caption)}. ${escapeHtml(block.figure.description)}</figcaption></figure>`
      );
    case 'references':
      return `<ol class="references">${block.items.map((r) => `<li>[${r.number}] ${escapeHtml(r.citation)}</li>`).join('')}</ol>`;
  }
}

function sectionHtml(section: ReportSection, depth: number, numbering: Numbering): string {
  const tag = depth === 1 ? 'h2' : 'h3';
  const major = depth === 1 && MAJOR_SECTIONS.has(section.id) ? ' class="major"' : '';
  const blocks = section.blocks.map((b) => blockHtml(b, numbering)).join('');
  const subs = (section.subsections ?? []).map((s) => sectionHtml(s, depth + 1, numbering)).join('');
  return `<section id="${escapeHtml(section.id)}"${major}><${tag}>${escapeHtml(section.title)}</${tag}>${blocks}${subs}</section>`;
}

function titlePage(doc: ReportDocument): string {
  const r = doc.reproducibility;
  const facts =
    r === undefined
      ? ''
      : `<dl><dt>Date</dt><dd>${escapeHtml(r.date)}</dd><dt>Plan file</dt><dd>${escapeHtml(r.fileName ?? 'not saved yet')}</dd>` +
        `<dt>Made with</dt><dd>${escapeHtml(`${r.appName} ${r.appVersion}`)}</dd><dt>Plan SHA-256</dt><dd>${escapeHtml(r.contentHash)}</dd></dl>`;
  return (
    `<section class="title-page"><p class="kicker">Sample size justification</p><h1>${escapeHtml(doc.title)}</h1>` +
    `${doc.subtitle.map((line) => `<p class="subtitle">${escapeHtml(line)}</p>`).join('')}${facts}` +
    `<div class="cautions-box"><p>Read with care</p><ul>${CAUTIONS.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul></div></section>`
  );
}

/** The whole document as one HTML page, ready for print-to-PDF on A4. */
export function renderHtml(doc: ReportDocument): string {
  const numbering = createNumbering();
  const r = doc.reproducibility;
  const footline = r === undefined ? doc.title : reproducibilityFootline(r);
  const sections = doc.sections.map((s) => sectionHtml(s, 1, numbering)).join('');
  const footer =
    r === undefined
      ? ''
      : `<div class="reproducibility">${reproducibilityLines(r)
          .map((line) => `<p>${escapeHtml(line)}</p>`)
          .join('')}</div>`;
  return (
    '<!doctype html><html lang="en"><head><meta charset="utf-8">' +
    `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">` +
    `<title>${escapeHtml(doc.title)}</title><style>${printCss(footline)}</style></head><body>` +
    `${titlePage(doc)}<main>${sections}${footer}</main></body></html>\n`
  );
}
