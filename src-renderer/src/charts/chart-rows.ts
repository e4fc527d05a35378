/** Bar charts stay readable up to about this many populations. */
export const CHART_ROW_LIMIT = 12;

/**
 * The rows a chart draws: the first CHART_ROW_LIMIT in the table's order, plus the selected row if
 * it lies further down, so the chart always shows what the table shows first and what is selected.
 */
export function chartRows<T extends { readonly populationId: string }>(
  ordered: readonly T[],
  selectedId: string | null,
): { rows: T[]; hidden: number } {
  const rows = ordered.slice(0, CHART_ROW_LIMIT);
  const selected = ordered.find((row) => row.populationId === selectedId);
  if (selected !== undefined && !rows.includes(selected)) rows.push(selected);
  return { rows, hidden: ordered.length - rows.length };
}
