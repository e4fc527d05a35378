import { memo, useMemo } from 'react';
import {
  CartesianGrid,
  Line,
  LineChart,
  ReferenceDot,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { formatCount, formatSignificant } from '@shared/format/numbers';
import type { Population, Project } from '@shared/model/project';
import type { Planner } from '@shared/summary/comparison';
import { seriesColour } from './palette';

/**
 * Required n against each anticipated value across its low–high range (the others held at their
 * base values); the base value is marked, with the base n as a dashed line.
 */
export const SensitivityChart = memo(function SensitivityChart({
  population,
  updating,
  planner,
}: {
  readonly population: Population;
  readonly updating: Project['updating'];
  readonly planner: Planner;
}) {
  // Recomputed only when this population or the updating settings change, not on every edit elsewhere.
  const { curves, problem } = useMemo(() => {
    try {
      return { curves: planner.sensitivity?.(population, { updating }) ?? [], problem: null };
    } catch (error) {
      return { curves: [], problem: error instanceof Error ? error.message : String(error) };
    }
  }, [planner, population, updating]);
  if (problem !== null) return <p className="field-error">Sensitivity curves could not be drawn: {problem}</p>;
  if (curves.length === 0) {
    return (
      <p className="muted" data-testid="sensitivity-empty">
        Give a low–high range for an anticipated value of {population.name} to see how the required n moves across it.
      </p>
    );
  }
  return (
    <div className="sensitivity" data-testid="sensitivity">
      <h3>How the required n for {population.name} moves with each assumption</h3>
      <div className="small-multiples">
        {curves.map((curve, index) => (
          <figure key={curve.key} className="chart small" aria-label={`Required n against ${curve.label}`}>
            <figcaption>{curve.label}</figcaption>
            <ResponsiveContainer width="100%" height={190}>
              <LineChart data={[...curve.points]} margin={{ top: 8, right: 12, bottom: 4, left: 4 }}>
                <CartesianGrid strokeDasharray="3 3" />
                <XAxis
                  dataKey="value"
                  type="number"
                  domain={['dataMin', 'dataMax']}
                  tickFormatter={(v: number) => formatSignificant(v, 3)}
                />
                <YAxis tickFormatter={(v: number) => formatCount(v)} width={56} />
                <Tooltip
                  labelFormatter={(v) => `${curve.label} ${formatSignificant(Number(v), 4)}`}
                  formatter={(v) => formatCount(Number(v))}
                />
                {curve.baseN === null ? null : <ReferenceLine y={curve.baseN} strokeDasharray="4 4" stroke="currentColor" />}
                <Line
                  dataKey="n"
                  name="required n"
                  stroke={seriesColour(index)}
                  dot={false}
                  strokeWidth={2}
                  isAnimationActive={false}
                  connectNulls={false}
                />
                {curve.baseN === null ? null : (
                  <ReferenceDot x={curve.base} y={curve.baseN} r={5} fill={seriesColour(index)} stroke="currentColor" />
                )}
              </LineChart>
            </ResponsiveContainer>
          </figure>
        ))}
      </div>
    </div>
  );
});
