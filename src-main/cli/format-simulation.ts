// The --simulate results as text: a block per population after the plan's table, a Markdown
// section, and the `simulation` field of each population in --json. No timings here: with the
// same seed the output is the same, run after run.
import { SIMULATION_HEADER, simulationCells } from '@shared/summary/simulation-cells';
import { storedMeasureOf } from '@shared/summary/simulation-store';
import { CAUTIONS, CAUTIONS_ONE_LINE } from '@shared/text/cautions';
import type { PopulationSimulation } from './simulate-populations';

function pad(text: string, width: number, right = false): string {
  const gap = ' '.repeat(Math.max(0, width - [...text].length));
  return right ? gap + text : text + gap;
}

/** A plain-text grid: the first column left-aligned, the numbers right-aligned. */
function grid(header: readonly string[], rows: readonly (readonly string[])[]): string[] {
  const widths = header.map((h, i) => Math.max([...h].length, ...rows.map((r) => [...(r[i] ?? '')].length)));
  const line = (cells: readonly string[]): string =>
    `    ${cells.map((c, i) => pad(c, widths[i] ?? 0, i > 0)).join('  ')}`.trimEnd();
  return [line(header), ...rows.map(line)];
}

/** After the default table: per population the headline, the measures beside the closed form and the verdicts. */
export function formatSimulationTable(simulations: readonly PopulationSimulation[]): string {
  const lines: string[] = ['', 'Check by simulation (at each population’s required n)'];
  for (const s of simulations) {
    lines.push('');
    if (!s.ran) {
      lines.push(`${s.name} — not simulated: ${s.reason}`);
      continue;
    }
    lines.push(`${s.name} — ${s.verdict.headline}`);
    lines.push(
      ...grid(
        SIMULATION_HEADER,
        simulationCells(s.result, s.closed).map((r) => r.cells),
      ),
    );
    for (const m of s.verdict.measures) lines.push(`  · ${m.text}`);
    lines.push(`  Engine ${s.result.engineVersion}, seed ${s.result.seed}.`);
  }
  lines.push('', CAUTIONS_ONE_LINE);
  return `${lines.join('\n')}\n`;
}

function cell(text: string): string {
  return text.replace(/\|/g, '\\|').replace(/[\r\n]+/g, ' ');
}

/** After the Markdown plan: a section with one table and the verdicts per population. */
export function formatSimulationMarkdown(simulations: readonly PopulationSimulation[]): string {
  const lines: string[] = ['', '## Check by simulation', ''];
  for (const s of simulations) {
    lines.push(`### ${cell(s.name)}`, '');
    if (!s.ran) {
      lines.push(`Not simulated: ${cell(s.reason)}`, '');
      continue;
    }
    lines.push(`**${cell(s.verdict.headline)}**`, '');
    lines.push(`| ${SIMULATION_HEADER.map(cell).join(' | ')} |`, `|${SIMULATION_HEADER.map(() => ' --- ').join('|')}|`);
    for (const r of simulationCells(s.result, s.closed)) lines.push(`| ${r.cells.map(cell).join(' | ')} |`);
    lines.push(
      '',
      ...s.verdict.measures.map((m) => `- ${cell(m.text)}`),
      '',
      `Engine \`${s.result.engineVersion}\`, seed ${s.result.seed}.`,
      '',
    );
  }
  lines.push(...CAUTIONS.map((c) => `> ${c}`));
  return `${lines.join('\n')}\n`;
}

/**
 * The `simulation` field of a population in --json: `{ ran: false, reason }`, or the run's n,
 * seed, counts and engine version, the verdict headline, and per measure the engine's summary
 * (each Monte Carlo estimate as { value, mcse }) beside the closed form and the measure's verdict.
 */
export function simulationJson(s: PopulationSimulation): Record<string, unknown> {
  if (!s.ran) return { ran: false, reason: s.reason };
  const { result, closed, verdict } = s;
  return {
    ran: true,
    n: result.n,
    seed: result.seed,
    replicatesRequested: result.replicatesRequested,
    replicatesDone: result.replicatesDone,
    engineVersion: result.engineVersion,
    confidence: result.confidence,
    headline: verdict.headline,
    measures: result.measures.map((m) => {
      const c = closed[m.id];
      const v = verdict.measures.find((x) => x.measureId === m.id);
      return {
        ...storedMeasureOf(m),
        closedForm: c === undefined ? null : { criterionId: c.criterionId, n: c.criterionN, se: c.se, size: c.achieved },
        status: v?.status ?? null,
        verdict: v?.text ?? null,
      };
    }),
  };
}
