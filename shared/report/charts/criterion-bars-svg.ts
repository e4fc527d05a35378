// Figure: each criterion's n per population as horizontal bars, one group per population in the
// table's order, the binding criterion drawn solid, outlined and labelled with ◆ and its n.
import { formatCount } from '../../format/numbers';
import type { ComparisonRow } from '../../summary/comparison';
import type { CriterionColumn } from '../../summary/criterion-columns';
import { escapeXml, fitText, HALO, niceTicks, printColour, svgRoot, textWidth } from './svg';

const WIDTH = 680;
const LABEL_WIDTH = 196;
const RIGHT_SPACE = 64;
const BAR = 7;
const BAR_GAP = 1.5;
const GROUP_GAP = 14;
const FONT = 9.5;
const SMALL = 8.5;

function legend(columns: readonly CriterionColumn[]): { svg: string; height: number } {
  let x = 0;
  let y = 0;
  const parts: string[] = [];
  for (const [index, column] of columns.entries()) {
    const width = 16 + textWidth(column.header, SMALL) + 14;
    if (x + width > WIDTH && x > 0) {
      x = 0;
      y += 15;
    }
    parts.push(
      `<rect x="${x}" y="${y}" width="10" height="10" fill="${printColour(index)}"/>` +
        `<text x="${x + 14}" y="${y + 9}" font-size="${SMALL}">${escapeXml(column.header)}</text>`,
    );
    x += width;
  }
  return { svg: parts.join(''), height: y + 15 };
}

/**
 * The SVG for the given rows (ranked) and criterion columns. Criteria without an n are left out
 * of a group; a population with none shows "no criterion sized".
 * @example criterionBarsSvg(rows, criterionColumns(rows)).startsWith('<svg') // true
 */
export function criterionBarsSvg(rows: readonly ComparisonRow[], columns: readonly CriterionColumn[]): string {
  const key = legend(columns);
  const top = key.height + 10;
  const plotLeft = LABEL_WIDTH + 8;
  const plotWidth = WIDTH - plotLeft - RIGHT_SPACE;
  const ns = rows.flatMap((row) => row.criteria.map((c) => c.n ?? 0));
  const ticks = niceTicks(Math.max(1, ...ns));
  const scaleMax = ticks.at(-1) ?? 1;
  const x = (n: number): number => plotLeft + (n / scaleMax) * plotWidth;

  const groups: string[] = [];
  let y = top;
  for (const row of rows) {
    const bars = columns
      .map((column, index) => ({ column, index, result: row.criteria.find((c) => c.id === column.id) }))
      .filter((b) => b.result?.n !== null && b.result?.n !== undefined);
    const height = Math.max(2 * FONT + 4, bars.length * (BAR + BAR_GAP));
    const middle = y + height / 2;
    const name = fitText(row.name, LABEL_WIDTH, FONT);
    const required = row.requiredN === null ? 'n —' : `n = ${formatCount(row.requiredN)}`;
    groups.push(
      `<text x="${LABEL_WIDTH}" y="${middle - 1}" font-size="${FONT}" text-anchor="end">${escapeXml(name)}</text>` +
        `<text x="${LABEL_WIDTH}" y="${middle + SMALL + 1}" font-size="${SMALL}" fill="#444" text-anchor="end">${escapeXml(required)}</text>`,
    );
    if (bars.length === 0) {
      groups.push(`<text x="${plotLeft + 4}" y="${middle + 3}" font-size="${SMALL}" fill="#444">no criterion sized</text>`);
    }
    bars.forEach(({ column, index, result }, i) => {
      const n = result?.n ?? 0;
      const barY = y + i * (BAR + BAR_GAP);
      const binding = row.binding === column.id;
      const width = Math.max(0.5, x(n) - plotLeft);
      groups.push(
        binding
          ? `<rect x="${plotLeft}" y="${barY}" width="${width.toFixed(2)}" height="${BAR}" fill="${printColour(index)}" stroke="#000" stroke-width="1"/>` +
              `<text x="${(x(n) + 4).toFixed(2)}" y="${barY + BAR - 0.5}" font-size="${SMALL}" font-weight="bold" ${HALO}>◆ ${escapeXml(formatCount(n))}</text>`
          : `<rect x="${plotLeft}" y="${barY}" width="${width.toFixed(2)}" height="${BAR}" fill="${printColour(index)}" fill-opacity="0.55"/>`,
      );
    });
    y += height + GROUP_GAP;
  }
  const plotBottom = y - GROUP_GAP + 4;
  const grid = ticks
    .map((t) => {
      const tx = x(t).toFixed(2);
      return (
        `<line x1="${tx}" y1="${top - 4}" x2="${tx}" y2="${plotBottom}" stroke="#ccc" stroke-width="0.6"/>` +
        `<text x="${tx}" y="${plotBottom + 12}" font-size="${SMALL}" text-anchor="middle">${escapeXml(formatCount(t))}</text>`
      );
    })
    .join('');
  const axisTitle = `<text x="${plotLeft + plotWidth / 2}" y="${plotBottom + 26}" font-size="${SMALL}" text-anchor="middle">participants with an observed outcome (n)</text>`;
  const height = plotBottom + 32;
  return svgRoot(
    WIDTH,
    height,
    'n per population by criterion; the binding criterion is outlined and marked ◆',
    `<g>${key.svg}</g>${grid}<line x1="${plotLeft}" y1="${top - 4}" x2="${plotLeft}" y2="${plotBottom}" stroke="#000" stroke-width="0.8"/>${groups.join('')}${axisTitle}`,
  );
}
