import { memo } from 'react';
import { Bar, BarChart, CartesianGrid, Cell, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatMonths } from '@shared/format/numbers';
import type { ComparisonRow } from '@shared/summary/comparison';
import { SELECTED_COLOUR, WINDOW_COLOUR, seriesColour } from './palette';
import { chartRows } from './chart-rows';

/** Months each site needs to recruit its enrolment target, against the study window. */
export const RecruitmentTimeline = memo(function RecruitmentTimeline({
  rows,
  windowMonths,
  selectedId,
}: {
  readonly rows: readonly ComparisonRow[];
  readonly windowMonths: number | undefined;
  readonly selectedId: string | null;
}) {
  const shown = chartRows(rows, selectedId);
  const data = shown.rows
    .filter((row) => row.months !== null)
    .map((row) => ({ name: row.name, id: row.populationId, months: row.months, feasibility: row.feasibility }));
  if (data.length === 0) return <p className="muted">No site has an accrual rate yet, so there is no recruitment timeline.</p>;
  return (
    <figure className="chart" aria-label="Recruitment time per site">
      <figcaption>
        Months to recruit per site{windowMonths === undefined ? '' : `; the line marks the ${windowMonths}-month window`}
        {shown.hidden > 0 ? `; the first ${shown.rows.length} in the table's order` : ''}
      </figcaption>
      <ResponsiveContainer width="100%" height={Math.max(140, 36 * data.length + 50)}>
        <BarChart data={data} layout="vertical" margin={{ top: 8, right: 24, bottom: 8, left: 8 }}>
          <CartesianGrid strokeDasharray="3 3" />
          <XAxis
            type="number"
            tickFormatter={(v: number) => `${v}`}
            label={{ value: 'months', position: 'insideBottomRight', offset: -4 }}
          />
          <YAxis type="category" dataKey="name" width={170} tick={{ fontSize: 11 }} />
          <Tooltip formatter={(value) => formatMonths(typeof value === 'number' ? value : Number(value))} />
          {windowMonths === undefined ? null : (
            <ReferenceLine x={windowMonths} stroke={WINDOW_COLOUR} strokeWidth={2} label="window" />
          )}
          <Bar dataKey="months" name="months to recruit" isAnimationActive={false}>
            {data.map((entry) => (
              <Cell
                key={entry.id}
                fill={entry.feasibility === 'exceeds' ? WINDOW_COLOUR : seriesColour(0)}
                stroke={entry.id === selectedId ? SELECTED_COLOUR : 'none'}
                strokeWidth={entry.id === selectedId ? 3 : 0}
              />
            ))}
          </Bar>
        </BarChart>
      </ResponsiveContainer>
    </figure>
  );
});
