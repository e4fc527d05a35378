// Small helpers for the report's charts, which are plain SVG strings (no DOM, no chart library),
// so the same figure comes out in the app, the browser host and the command line.
import { formatSignificant } from '../../format/numbers';

/** Text made safe for SVG/HTML content and attribute values. */
export function escapeXml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
}

/** The font the charts and the page use (DejaVu Sans ships with Debian's fonts-dejavu-core). */
export const CHART_FONT = "'DejaVu Sans', 'Liberation Sans', Arial, sans-serif";

/**
 * An estimate of the width of a line of text: DejaVu Sans averages about 0.6 em per character in
 * mixed text, which is enough for laying out labels (common practice for server-side charts).
 */
export function textWidth(text: string, fontSize: number): number {
  return [...text].length * fontSize * 0.6;
}

/** The text cut with "…" so that it fits `width` at `fontSize`. */
export function fitText(text: string, width: number, fontSize: number): string {
  if (textWidth(text, fontSize) <= width) return text;
  const chars = [...text];
  const keep = Math.max(1, Math.floor(width / (fontSize * 0.6)) - 1);
  return `${chars.slice(0, keep).join('').trimEnd()}…`;
}

/**
 * Axis ticks from 0 to at least `max`, at a step of 1, 2 or 5 times a power of ten giving about
 * `target` intervals (common practice for readable axes). A max of 0 or less gives [0, 1].
 * @example niceTicks(1424) // [0, 500, 1000, 1500]
 */
export function niceTicks(max: number, target = 5): number[] {
  if (!(max > 0) || !Number.isFinite(max)) return [0, 1];
  const raw = max / target;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const ticks: number[] = [];
  for (let i = 0; i * step < max + step * 1e-9 || ticks.length < 2; i += 1) ticks.push(Number((i * step).toPrecision(12)));
  if ((ticks.at(-1) ?? 0) < max) ticks.push(Number((ticks.length * step).toPrecision(12)));
  return ticks;
}

/** A tick label: whole numbers with separators come from the caller; others read with 3 significant digits. */
export function tickLabel(value: number): string {
  return formatSignificant(value, 3);
}

/**
 * Print colours for the criteria, the Okabe–Ito set chosen to stay distinguishable with common
 * colour-vision deficiencies and in greyscale print (common practice), darkest first.
 */
export const PRINT_COLOURS = [
  '#0072B2',
  '#E69F00',
  '#009E73',
  '#CC79A7',
  '#56B4E9',
  '#D55E00',
  '#8C7A00',
  '#555555',
  '#7F3C8D',
] as const;

export function printColour(index: number): string {
  return PRINT_COLOURS[index % PRINT_COLOURS.length] ?? '#0072B2';
}

/** A white outline behind a label, so it stays readable where it crosses a grid or window line. */
export const HALO = 'paint-order="stroke" stroke="#fff" stroke-width="3" stroke-linejoin="round"';

/** An <svg> root sized by its viewBox, so it scales to the column width of the page. */
export function svgRoot(width: number, height: number, label: string, body: string): string {
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-label="${escapeXml(label)}" ` +
    `font-family="${escapeXml(CHART_FONT)}">${body}</svg>`
  );
}
