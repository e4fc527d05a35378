// The one place where numbers become text: the table, charts, reports and the command line all
// format through these functions, so rounding rules cannot drift apart.

/** A sample size or count: whole number with thousands separators, e.g. 12,345. */
export function formatCount(n: number | null | undefined): string {
  if (n === null || n === undefined || !Number.isFinite(n)) return '—';
  return Math.round(n).toLocaleString('en-GB');
}

/** A plain integer with no separators, for machine-readable text (CSV, TSV). */
export function formatInteger(n: number | null | undefined): string {
  if (n === null || n === undefined || !Number.isFinite(n)) return '';
  return String(Math.round(n));
}

/** A measure with a fixed number of decimals (default 3), e.g. 0.051. */
export function formatDecimal(x: number | null | undefined, decimals = 3): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '—';
  return x.toFixed(decimals);
}

/** A value with `significant` significant digits, trailing zeros dropped: 0.0255, 20.99, 1200. */
export function formatSignificant(x: number | null | undefined, significant = 4): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '—';
  if (x === 0) return '0';
  return String(Number(x.toPrecision(significant)));
}

/** A proportion as a percentage, e.g. 0.95 → "95%", 0.175 → "17.5%". */
export function formatPercent(p: number | null | undefined, decimals = 1): string {
  if (p === null || p === undefined || !Number.isFinite(p)) return '—';
  return `${Number((p * 100).toFixed(decimals))}%`;
}

/** Months, one decimal: 14.2 months. */
export function formatMonths(m: number | null | undefined): string {
  if (m === null || m === undefined || !Number.isFinite(m)) return '—';
  return `${m.toFixed(1)} months`;
}

/** A duration for people, from milliseconds: "under 1 s", "12 s", "3 min 20 s", "1 h 5 min". */
export function formatDuration(ms: number | null | undefined): string {
  if (ms === null || ms === undefined || !Number.isFinite(ms) || ms < 0) return '—';
  const seconds = Math.round(ms / 1000);
  if (seconds < 1) return 'under 1 s';
  if (seconds < 60) return `${seconds} s`;
  const minutes = Math.floor(seconds / 60);
  if (minutes < 60) return `${minutes} min ${seconds % 60} s`;
  return `${Math.floor(minutes / 60)} h ${minutes % 60} min`;
}
