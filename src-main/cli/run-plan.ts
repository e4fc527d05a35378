// The `plan` command: reads a plan file (or the bundled demo), validates it field by field and
// prints every population's plan as a table, JSON, CSV or Markdown, or writes its report.
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { planProject } from '@shared/engine/plan/plan-project';
import { parsePlanText } from '@shared/model/plan-file';
import type { Project } from '@shared/model/project';
import { comparisonCells } from '@shared/summary/table-cells';
import { comparisonRows, comparisonTotals, rankByRequiredN } from '@shared/summary/comparison';
import { toCsv } from '@shared/summary/table-cells';
import { formatJson } from './format-json';
import { formatMarkdown } from './format-markdown';
import { formatTable } from './format-table';
import { cliPooledSummary, pooledMarkdownText, pooledTableText, withPooledJson } from './format-pooled';
import { DEMO_FILES } from '../handlers/load-demo';
import { parseArgs, USAGE } from './parse-args';
import { formatSimulationMarkdown, formatSimulationTable } from './format-simulation';
import { extractSimulateArgs } from './simulate-args';
import { simulateAll } from './simulate-populations';
import { cliPlanner } from './planner';
import { writeReportFile } from './write-report';

export const EXIT_OK = 0;
export const EXIT_FAILURE = 1;
export const EXIT_INVALID = 2;

export interface PlanIo {
  readonly stdout: (text: string) => void;
  readonly stderr: (text: string) => void;
  /** Absolute path of the folder holding the bundled demo plans (DEMO_FILES). */
  readonly demoDir: string;
}

async function loadProject(path: string, io: PlanIo): Promise<Project | number> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (error) {
    const reason = error instanceof Error && 'code' in error && error.code === 'ENOENT' ? 'no such file' : String(error);
    io.stderr(`plan: cannot read ${path}: ${reason}\n`);
    return EXIT_FAILURE;
  }
  const parsed = parsePlanText(text);
  if (!parsed.ok) {
    io.stderr(`plan: ${path}: ${parsed.error.message}\n`);
    return EXIT_INVALID;
  }
  return parsed.project;
}

/** Runs the command with `argv` (arguments after the script name); resolves to the exit status. */
export async function runPlan(argv: readonly string[], io: PlanIo): Promise<number> {
  const simulate = extractSimulateArgs(argv);
  if (!simulate.ok) {
    io.stderr(`plan: ${simulate.message}\n\n${USAGE}\n`);
    return EXIT_INVALID;
  }
  const args = parseArgs(simulate.rest);
  if (args.kind === 'help') {
    io.stdout(`${USAGE}\n`);
    return EXIT_OK;
  }
  if (args.kind === 'usage-error') {
    io.stderr(`plan: ${args.message}\n\n${USAGE}\n`);
    return EXIT_INVALID;
  }
  const path = args.source.demo ? join(io.demoDir, DEMO_FILES[args.source.which]) : args.source.file;
  const project = await loadProject(path, io);
  if (typeof project === 'number') return project;
  if (args.report !== undefined) return (await writeReportFile(project, path, args.report, io)) ? EXIT_OK : EXIT_FAILURE;
  try {
    const plan = planProject(project);
    const rows = comparisonRows(project, cliPlanner);
    const pooled = cliPooledSummary(project, plan);
    const simulations = simulate.simulate === null ? null : simulateAll(project, rows, simulate.simulate, io.stderr);
    if (simulations !== null && !Array.isArray(simulations)) {
      io.stderr(`plan: ${simulations.message}\n`);
      return EXIT_INVALID;
    }
    if (args.format === 'json') io.stdout(withPooledJson(formatJson(plan, rows, simulations ?? undefined), pooled));
    else if (args.format === 'table')
      io.stdout(
        formatTable(project, plan, rows) +
          pooledTableText(pooled) +
          (simulations === null ? '' : formatSimulationTable(simulations)),
      );
    else {
      const ranked = rankByRequiredN(rows);
      const cells = comparisonCells(ranked, comparisonTotals(ranked));
      io.stdout(
        args.format === 'csv'
          ? toCsv(cells)
          : formatMarkdown(project, plan, cells) +
              pooledMarkdownText(pooled) +
              (simulations === null ? '' : formatSimulationMarkdown(simulations)),
      );
    }
    return EXIT_OK;
  } catch (error) {
    io.stderr(`plan: could not compute the plan: ${error instanceof Error ? error.message : String(error)}\n`);
    return EXIT_FAILURE;
  }
}
