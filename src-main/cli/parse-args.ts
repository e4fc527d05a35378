// The command line's arguments: one plan file or --demo, and at most one output format or a
// report file to write.
import { reportFormatOf } from '../report/report-files';

import type { DemoKind } from '../handlers/load-demo';
import { SIMULATE_USAGE } from './simulate-args';

export type OutputFormat = 'table' | 'json' | 'csv' | 'markdown';

export type PlanArgs =
  | {
      readonly kind: 'plan';
      readonly source: { readonly demo: true; readonly which: DemoKind } | { readonly demo: false; readonly file: string };
      readonly format: OutputFormat;
      /** --report <file>: write the report there (.pdf, .md or .txt) instead of printing the plan. */
      readonly report?: string;
    }
  | { readonly kind: 'help' }
  | { readonly kind: 'usage-error'; readonly message: string };

export const USAGE = `Usage: npm run --silent plan -- <plan-file> [--json | --csv | --markdown | --report <file>]
       npm run --silent plan -- --demo [--json | --csv | --markdown | --report <file>]

Prints, for each population of the plan, every criterion's minimum n, the required n and the
criterion that sets it. Without a format option the output is a readable table.

  --demo       use the bundled demo plan (demo/consortium-continuous.plumb, a continuous outcome)
  --demo binary, --demo-binary
               use the bundled binary-outcome demo plan (demo/consortium-binary.plumb)
  --json       machine-readable JSON: { "populations": [ { "name", "requiredN", "binding", "criteria": [ { "id", "n" } ] } ] }
  --csv        one row per population (RFC 4180)
  --markdown   tables in Markdown
${SIMULATE_USAGE}
  --report F   write the report with its justification text to F: a PDF (printed by Chromium;
               CHROMIUM_PATH overrides where it is looked for), Markdown (.md) or plain text (.txt)
  --help       this text

Exit status: 0 on success, 2 when the plan or the arguments are invalid (the problems are printed
on stderr), 1 on any other error.`;

const FORMATS: Readonly<Record<string, OutputFormat>> = { '--json': 'json', '--csv': 'csv', '--markdown': 'markdown' };

/** Reads argv (without the node and script paths). */
export function parseArgs(argv: readonly string[]): PlanArgs {
  let format: OutputFormat | null = null;
  let demo: DemoKind | null = null;
  let afterDemo = false;
  const files: string[] = [];
  let onlyFiles = false;
  let report: string | null = null;
  let expectReport = false;
  for (const arg of argv) {
    // `--demo binary`: a demo kind right after --demo names which demo.
    const kindAfterDemo = afterDemo && (arg === 'binary' || arg === 'continuous');
    afterDemo = false;
    if (kindAfterDemo) {
      demo = arg;
      continue;
    }
    if (expectReport) {
      report = arg;
      expectReport = false;
    } else if (!onlyFiles && arg === '--report') {
      expectReport = true;
    } else if (!onlyFiles && arg.startsWith('--report=')) {
      report = arg.slice('--report='.length);
    } else if (!onlyFiles && arg === '--') {
      onlyFiles = true;
    } else if (!onlyFiles && (arg === '--help' || arg === '-h')) {
      return { kind: 'help' };
    } else if (!onlyFiles && arg === '--demo') {
      demo = 'continuous';
      afterDemo = true;
    } else if (!onlyFiles && (arg === '--demo-binary' || arg === '--demo=binary')) {
      demo = 'binary';
    } else if (!onlyFiles && arg === '--demo=continuous') {
      demo = 'continuous';
    } else if (!onlyFiles && arg in FORMATS) {
      const chosen = FORMATS[arg] ?? 'table';
      if (format !== null && format !== chosen)
        return { kind: 'usage-error', message: 'choose one output format: --json, --csv or --markdown' };
      format = chosen;
    } else if (!onlyFiles && arg.startsWith('-') && arg !== '-') {
      return { kind: 'usage-error', message: `unknown option ${arg}` };
    } else {
      files.push(arg);
    }
  }
  if (expectReport || report === '') return { kind: 'usage-error', message: '--report needs a file name' };
  if (report !== null && reportFormatOf(report) === null)
    return { kind: 'usage-error', message: `--report writes a .pdf, .md or .txt file (got ${report})` };
  if (report !== null && format !== null)
    return { kind: 'usage-error', message: '--report writes a file; leave out --json, --csv and --markdown' };
  if (demo !== null && files.length > 0) return { kind: 'usage-error', message: 'give either a plan file or --demo, not both' };
  if (files.length > 1) return { kind: 'usage-error', message: `give one plan file (got ${files.length})` };
  const file = files[0];
  if (demo === null && file === undefined)
    return { kind: 'usage-error', message: 'give a plan file, or --demo for the bundled demo plan' };
  return {
    kind: 'plan',
    source: file === undefined ? { demo: true, which: demo ?? 'continuous' } : { demo: false, file },
    format: format ?? 'table',
    ...(report === null ? {} : { report }),
  };
}
