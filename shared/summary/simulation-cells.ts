// A simulation check as a table of text cells: per measure the closed-form n, the closed-form SE
// beside the simulated one, the closed-form interval size beside the simulated mean, the target,
// the share of simulated studies meeting it and the coverage, each simulated value with its Monte
// Carlo SE. The workspace panel and the command line's table and Markdown read these cells.
import type { MeasureSummary, MonteCarloEstimate, SimulationResult } from '../engine/simulation';
import { formatCount, formatPercent, formatSignificant } from '../format/numbers';
import type { ClosedFormAtN } from './simulation-check';

export const SIMULATION_HEADER = [
  'Measure',
  'Closed-form n',
  'SE (closed form)',
  'SE (simulated ± MC)',
  'CI at n (closed form)',
  'Mean CI (simulated ± MC)',
  'Target',
  'Studies meeting target',
  'Coverage',
] as const;

export interface SimulationRowCells {
  readonly id: MeasureSummary['id'];
  readonly cells: readonly string[];
}

/** Margins sit just above 1 and need four digits to be told apart; widths three. */
function sizeText(m: MeasureSummary, x: number | null | undefined): string {
  if (x === null || x === undefined) return '—';
  return m.scale === 'margin-factor' ? `×/÷ ${formatSignificant(x, 4)}` : formatSignificant(x, 3);
}

function withMc(e: MonteCarloEstimate | null, show: (x: number) => string): string {
  if (e === null) return '—';
  return e.mcse > 0 ? `${show(e.value)} ± ${show(e.mcse)}` : show(e.value);
}

const percent = (x: number): string => formatPercent(x, 1);
const mcSize = (m: MeasureSummary) => (x: number) =>
  m.scale === 'margin-factor' ? formatSignificant(x, 4) : formatSignificant(x, 3);

/**
 * One row of text per measure, in the engine's order, with SIMULATION_HEADER as the header.
 * @example simulationCells(result, closed)[0]?.cells[0] // "R²"
 */
export function simulationCells(result: SimulationResult, closed: ClosedFormAtN): SimulationRowCells[] {
  return result.measures.map((m) => {
    const c = closed[m.id];
    const meanSize =
      m.meanSize === null
        ? '—'
        : m.scale === 'margin-factor'
          ? `×/÷ ${withMc(m.meanSize, mcSize(m))}`
          : withMc(m.meanSize, mcSize(m));
    return {
      id: m.id,
      cells: [
        m.label,
        c?.criterionN === null || c?.criterionN === undefined ? '—' : formatCount(c.criterionN),
        formatSignificant(c?.se ?? null, 3),
        withMc(m.empiricalSe, (x) => formatSignificant(x, 3)),
        sizeText(m, c?.achieved),
        meanSize,
        sizeText(m, m.targetValue),
        withMc(m.shareMeetingTarget, percent),
        withMc(m.coverage, percent),
      ],
    };
  });
}
