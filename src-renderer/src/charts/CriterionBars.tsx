import { memo } from 'react';
import { Bar, BarChart, CartesianGrid, Cell, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatCount } from '@shared/format/numbers';
import type { ComparisonRow } from '@shared/summary/comparison';
import { criterionColumns } from '@shared/summary/criterion-columns';
import { seriesColour } from './palette';
import { chartRows } from './chart-rows';

/** n per population by criterion, in the table's order; the binding criterion's bar is outlined and opaque. */
export const CriterionBars = memo(function CriterionBars({
  rows: ordered,
  selectedId,
}: {
  readonly rows: readonly ComparisonRow[];
  readonly selectedId: string | null;
}) {
  const { rows, hidden } = chartRows(ordered, selectedId);
  const columns = criterionColumns(rows);
  const data = rows.map((row) => {
    const entry: Record<string, number | string | null> = { name: row.name, id: row.populationId, binding: row.binding };
    for (const column of columns) entry[column.id] = row.criteria.find((c) => c.id === column.id)?.n ?? null;
    return entry;
  });
  return (
    <figure className="chart" aria-label="Sample size per population by criterion">
      <figcaption>
        n per population by criterion (binding criterion opaque and outlined)
        {hidden > 0 ? `; the first ${rows.length} in the table's order (${hidden} more in the table)` : ''}
      </figcaption>
      <ResponsiveContainer width="100%" height={320}>
        <BarChart data={data} margin={{ top: 8, right: 16, bottom: 8, left: 8 }}>
          <CartesianGrid strokeDasharray="3 3" />
          <XAxis dataKey="name" interval={0} tick={{ fontSize: 11 }} angle={-18} textAnchor="end" height={70} />
          <YAxis tickFormatter={(v: number) => formatCount(v)} width={60} />
          <Tooltip formatter={(value) => formatCount(typeof value === 'number' ? value : Number(value))} />
          <Legend />
          {columns.map((column, index) => (
            <Bar key={column.id} dataKey={column.id} name={column.header} fill={seriesColour(index)} isAnimationActive={false}>
              {data.map((entry) => {
                const binding = entry['binding'] === column.id;
                const selected = entry['id'] === selectedId;
                return (
                  <Cell
                    key={`${String(entry['id'])}-${column.id}`}
                    fillOpacity={binding ? 1 : 0.45}
                    stroke={binding ? 'currentColor' : 'none'}
                    strokeWidth={binding ? (selected ? 3 : 1.5) : 0}
                  />
                );
              })}
            </Bar>
          ))}
        </BarChart>
      </ResponsiveContainer>
    </figure>
  );
});
