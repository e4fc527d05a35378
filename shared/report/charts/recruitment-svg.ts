// Figure: months each site needs to enrol its target, as horizontal bars against a dashed line at
// the study window; a site that cannot finish within the window is drawn in the warning colour.
import { formatMonths } from '../../format/numbers';
import type { ComparisonRow } from '../../summary/comparison';
import { escapeXml, fitText, HALO, niceTicks, svgRoot, tickLabel } from './svg';

const WIDTH = 680;
const LABEL_WIDTH = 196;
const RIGHT_SPACE = 78;
const BAR = 14;
const GAP = 8;
const FONT = 9.5;
const SMALL = 8.5;
const FITS = '#0072B2';
const EXCEEDS = '#D55E00';

/**
 * The SVG for the given rows (ranked); rows without a recruitment time say why in place of a bar.
 * @example recruitmentSvg(rows, 24).includes('24-month window') // true
 */
export function recruitmentSvg(rows: readonly ComparisonRow[], windowMonths: number | undefined): string {
  const top = 34;
  const plotLeft = LABEL_WIDTH + 8;
  const plotWidth = WIDTH - plotLeft - RIGHT_SPACE;
  const longest = Math.max(0, ...rows.map((r) => r.months ?? 0), windowMonths ?? 0);
  const ticks = niceTicks(longest > 0 ? longest : 1);
  const scaleMax = ticks.at(-1) ?? 1;
  const x = (m: number): number => plotLeft + (m / scaleMax) * plotWidth;
  const legend =
    windowMonths === undefined
      ? ''
      : `<rect x="${plotLeft}" y="0" width="10" height="10" fill="${FITS}"/><text x="${plotLeft + 14}" y="9" font-size="${SMALL}">within the window</text>` +
        `<rect x="${plotLeft + 130}" y="0" width="10" height="10" fill="${EXCEEDS}"/><text x="${plotLeft + 144}" y="9" font-size="${SMALL}">beyond the window</text>`;
  const bars = rows.map((row, i) => {
    const y = top + i * (BAR + GAP);
    const label = `<text x="${LABEL_WIDTH}" y="${y + BAR - 3}" font-size="${FONT}" text-anchor="end">${escapeXml(fitText(row.name, LABEL_WIDTH, FONT))}</text>`;
    if (row.months === null) {
      const why = row.perMonth === null ? 'no accrual given' : 'no required n';
      return `${label}<text x="${plotLeft + 4}" y="${y + BAR - 3}" font-size="${SMALL}" fill="#444">${why}</text>`;
    }
    const colour = row.feasibility === 'exceeds' ? EXCEEDS : FITS;
    const end = x(row.months);
    return (
      `${label}<rect x="${plotLeft}" y="${y}" width="${Math.max(0.5, end - plotLeft).toFixed(2)}" height="${BAR}" fill="${colour}"/>` +
      `<text x="${(end + 4).toFixed(2)}" y="${y + BAR - 3}" font-size="${SMALL}" ${HALO}>${escapeXml(formatMonths(row.months))}</text>`
    );
  });
  const plotBottom = top + rows.length * (BAR + GAP) - GAP + 4;
  const grid = ticks
    .map((t) => {
      const tx = x(t).toFixed(2);
      return (
        `<line x1="${tx}" y1="${top - 4}" x2="${tx}" y2="${plotBottom}" stroke="#ccc" stroke-width="0.6"/>` +
        `<text x="${tx}" y="${plotBottom + 12}" font-size="${SMALL}" text-anchor="middle">${tickLabel(t)}</text>`
      );
    })
    .join('');
  const windowLine =
    windowMonths === undefined
      ? ''
      : `<line x1="${x(windowMonths).toFixed(2)}" y1="${top - 8}" x2="${x(windowMonths).toFixed(2)}" y2="${plotBottom}" stroke="${EXCEEDS}" stroke-width="1.6" stroke-dasharray="5 3"/>` +
        `<text x="${x(windowMonths).toFixed(2)}" y="${top - 11}" font-size="${SMALL}" text-anchor="middle" fill="${EXCEEDS}">${escapeXml(`${tickLabel(windowMonths)}-month window`)}</text>`;
  const axisTitle = `<text x="${plotLeft + plotWidth / 2}" y="${plotBottom + 26}" font-size="${SMALL}" text-anchor="middle">months to enrol the target</text>`;
  return svgRoot(
    WIDTH,
    plotBottom + 32,
    windowMonths === undefined
      ? 'Months to recruit per site'
      : `Months to recruit per site against the ${tickLabel(windowMonths)}-month window`,
    `${legend}${grid}<line x1="${plotLeft}" y1="${top - 4}" x2="${plotLeft}" y2="${plotBottom}" stroke="#000" stroke-width="0.8"/>${windowLine}${bars.join('')}${axisTitle}`,
  );
}
