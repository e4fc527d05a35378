import { memo } from 'react';
import { CartesianGrid, Legend, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatCount, formatSignificant } from '@shared/format/numbers';
import type { PooledCurves } from '@shared/summary/pooled-summary';
import type { PooledTarget } from '@shared/engine/pooled';
import { WINDOW_COLOUR, seriesColour } from './palette';

interface WidthPoint {
  readonly x: number;
  readonly summary: number;
  readonly prediction: number | null;
}

function WidthPanel({
  caption,
  label,
  data,
  marker,
  target,
  logX,
  floors,
}: {
  readonly caption: string;
  readonly label: string;
  readonly data: readonly WidthPoint[];
  readonly marker: number;
  readonly target: PooledTarget;
  readonly logX: boolean;
  /** Widths the curves approach but never cross (heterogeneity floors). */
  readonly floors: readonly number[];
}) {
  const format = (v: number) => formatSignificant(v, 3);
  return (
    <figure className="chart small" aria-label={caption}>
      <figcaption>{caption}</figcaption>
      <ResponsiveContainer width="100%" height={260}>
        <LineChart data={[...data]} margin={{ top: 8, right: 16, bottom: 18, left: 4 }}>
          <CartesianGrid strokeDasharray="3 3" />
          <XAxis
            dataKey="x"
            type="number"
            scale={logX ? 'log' : 'linear'}
            domain={['dataMin', 'dataMax']}
            tickFormatter={(v: number) => formatCount(v)}
            label={{ value: label, position: 'insideBottom', offset: -10 }}
          />
          <YAxis tickFormatter={format} width={56} />
          <Tooltip labelFormatter={(v) => `${label} ${formatCount(Number(v))}`} formatter={(v) => format(Number(v))} />
          <Legend verticalAlign="top" height={24} />
          <ReferenceLine x={marker} stroke="currentColor" strokeDasharray="2 4" />
          <ReferenceLine y={target.maxSummaryCiWidth} stroke={seriesColour(0)} strokeDasharray="6 3" />
          {target.maxPredictionIntervalWidth === undefined ? null : (
            <ReferenceLine y={target.maxPredictionIntervalWidth} stroke={seriesColour(1)} strokeDasharray="6 3" />
          )}
          {floors.map((f) => (
            <ReferenceLine key={f} y={f} stroke={WINDOW_COLOUR} strokeDasharray="1 3" />
          ))}
          <Line
            dataKey="summary"
            name="summary CI width"
            stroke={seriesColour(0)}
            dot={false}
            strokeWidth={2}
            isAnimationActive={false}
          />
          <Line
            dataKey="prediction"
            name="prediction-interval width"
            stroke={seriesColour(1)}
            dot={false}
            strokeWidth={2}
            isAnimationActive={false}
            connectNulls={false}
          />
        </LineChart>
      </ResponsiveContainer>
    </figure>
  );
}

/**
 * Summary CI width and prediction-interval width of one measure against the number of sites (each
 * like the typical site) and against the per-site n (every current site at that n). Dashed lines:
 * the targets; dotted: the current number of sites or typical n, and the heterogeneity floors
 * (2·z·τ as sites are added; 2·t·τ and 2·z·τ/√K as the per-site n grows).
 */
export const PooledWidthChart = memo(function PooledWidthChart({
  name,
  curves,
  target,
}: {
  readonly name: string;
  readonly curves: PooledCurves;
  readonly target: PooledTarget;
}) {
  const bySites = curves.againstSites.map((p) => ({ x: p.k, summary: p.summaryCiWidth, prediction: p.predictionIntervalWidth }));
  const byN = curves.againstPerSiteN.map((p) => ({ x: p.n, summary: p.summaryCiWidth, prediction: p.predictionIntervalWidth }));
  const first = curves.againstPerSiteN[0];
  const nFloors = [first?.predictionFloorWidth ?? null, first?.summaryFloorWidth ?? null].filter(
    (f): f is number => f !== null && f > 0,
  );
  const sitesFloors = [curves.againstSites[0]?.predictionFloorManySites ?? 0].filter((f) => f > 0);
  return (
    <div>
      <p className="small muted">
        Dashed lines: the targets. Dotted black: the current number of sites, or the typical n. Dotted red: the widths
        heterogeneity alone leaves (2·z·τ as sites are added; 2·t·τ and 2·z·τ/√K as the per-site n grows).
      </p>
      <div className="pooled-chart-pair" data-testid="pooled-chart">
        <WidthPanel
          caption={`${name}: widths against the number of sites (each like ${curves.typicalSite}, n = ${formatCount(curves.typicalN)})`}
          label="sites"
          data={bySites}
          marker={curves.k}
          target={target}
          logX={false}
          floors={sitesFloors}
        />
        <WidthPanel
          caption={`${name}: widths against the per-site n (the ${formatCount(curves.k)} sites, each at that n)`}
          label="per-site n"
          data={byN}
          marker={curves.typicalN}
          target={target}
          logX
          floors={nFloors}
        />
      </div>
    </div>
  );
});
