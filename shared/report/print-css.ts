// The print style of the report page: A4 with margins, the reproducibility line and page numbers
// in the page margins, table headers repeated on every page, no row, figure or heading split
// from what follows it.

/** A CSS string literal holding `text` (quotes, backslashes and "<" escaped, so it cannot end the style element). */
export function cssString(text: string): string {
  return `"${text
    .replace(/\\/g, '\\\\')
    .replace(/"/g, '\\"')
    .replace(/</g, '\\3c ')
    .replace(/[\r\n]+/g, ' ')}"`;
}

/** The style sheet; `footline` goes at the bottom left of every page but the first. */
export function printCss(footline: string): string {
  return `
@page {
  size: A4;
  margin: 18mm 16mm 20mm 16mm;
  @bottom-left { content: ${cssString(footline)}; font-size: 7pt; color: #555; }
  @bottom-right { content: "Page " counter(page) " of " counter(pages); font-size: 7pt; color: #555; }
}
@page :first {
  @bottom-left { content: none; }
}
html { font-family: 'DejaVu Sans', 'Liberation Sans', Arial, sans-serif; font-size: 9.5pt; line-height: 1.4; color: #111; }
body { margin: 0; }
h1 { font-size: 22pt; line-height: 1.2; margin: 0 0 6mm; }
h2 { font-size: 14pt; margin: 8mm 0 3mm; border-bottom: 0.6pt solid #888; padding-bottom: 1mm; }
h3 { font-size: 11.5pt; margin: 6mm 0 2mm; }
h2, h3 { break-after: avoid; page-break-after: avoid; }
p, li { orphans: 3; widows: 3; }
p { margin: 0 0 2.4mm; }
ul, ol { margin: 0 0 2.4mm; padding-left: 6mm; }
li { margin-bottom: 1mm; }
.lead { font-weight: bold; }
p.lead-only { margin-bottom: 1mm; break-after: avoid; page-break-after: avoid; }
.title-page { break-after: page; page-break-after: always; padding-top: 45mm; }
.title-page .kicker { font-size: 10pt; text-transform: uppercase; letter-spacing: 0.08em; color: #555; margin-bottom: 4mm; }
.title-page .subtitle { font-size: 12pt; margin: 0 0 2mm; }
.title-page dl { margin: 14mm 0 0; display: grid; grid-template-columns: max-content 1fr; gap: 1.5mm 6mm; font-size: 9pt; }
.title-page dt { color: #555; }
.title-page dd { margin: 0; overflow-wrap: anywhere; }
.cautions-box { margin-top: 14mm; border: 0.8pt solid #b54a00; padding: 3mm 4mm; font-size: 9pt; }
.cautions-box p { margin: 0 0 1mm; font-weight: bold; }
.cautions-box ul { margin: 0; }
section.major { break-before: page; page-break-before: always; }
table { border-collapse: collapse; width: 100%; margin: 1mm 0 1.5mm; font-size: 7.6pt; line-height: 1.25; }
table.wide { font-size: 6.9pt; }
caption { caption-side: top; text-align: left; font-size: 8.5pt; margin-bottom: 1.5mm; }
caption .label { font-weight: bold; }
thead { display: table-header-group; }
tfoot { display: table-row-group; }
tr { break-inside: avoid; page-break-inside: avoid; }
th { text-align: left; vertical-align: bottom; border-bottom: 0.8pt solid #333; padding: 1mm 1.2mm; font-weight: bold; }
td { vertical-align: top; border-bottom: 0.3pt solid #ccc; padding: 0.8mm 1.2mm; overflow-wrap: anywhere; }
th.num { text-align: right; }
td.num { text-align: right; white-space: nowrap; }
td.text { min-width: 19mm; }
td.text:nth-child(2) { min-width: 24mm; }
th { overflow-wrap: normal; hyphens: manual; }
tfoot td { border-top: 0.8pt solid #333; border-bottom: none; font-weight: bold; }
.table-note { font-size: 7.4pt; color: #333; margin: 0 0 5mm; }
figure { margin: 3mm 0 6mm; break-inside: avoid; page-break-inside: avoid; }
figure svg { width: 100%; height: auto; display: block; }
figcaption { font-size: 8.5pt; margin-top: 1.5mm; }
figcaption .label { font-weight: bold; }
ol.references { list-style: none; padding-left: 0; }
ol.references li { padding-left: 8mm; text-indent: -8mm; break-inside: avoid; }
.reproducibility { margin-top: 8mm; border-top: 0.6pt solid #888; padding-top: 2mm; font-size: 8pt; color: #333; break-inside: avoid; }
.reproducibility p { margin: 0 0 1mm; overflow-wrap: anywhere; }
`;
}
