// `--simulate <replicates> [--seed <s>]`: taken out of the arguments before the rest are read, so
// the other options keep their own parser.
import { SIMULATION_LIMITS } from '@shared/engine/simulation';
import { formatCount } from '@shared/format/numbers';

export interface SimulateOptions {
  readonly replicates: number;
  /** Null when --seed is not given: a random seed is drawn and printed. */
  readonly seed: number | null;
}

export type SimulateArgs =
  | { readonly ok: true; readonly rest: readonly string[]; readonly simulate: SimulateOptions | null }
  | { readonly ok: false; readonly message: string };

export const MAX_SEED = 4_294_967_295;

export const SIMULATE_USAGE = `  --simulate R checks each population by simulation: R simulated validation studies (${formatCount(SIMULATION_LIMITS.minReplicates)} to ${formatCount(SIMULATION_LIMITS.maxReplicates)})
               at its required n, their precision beside the closed form and a verdict
               (with the table, --json or --markdown; progress goes to stderr)
  --seed S     the simulation's seed, 0 to ${formatCount(MAX_SEED)} (default: drawn at random and printed);
               the same seed gives the same output`;

function wholeNumber(option: string, text: string | undefined, from: number, to: number): number | string {
  const allowed = `a whole number from ${formatCount(from)} to ${formatCount(to)}`;
  if (text === undefined || text.startsWith('--')) return `${option} needs ${allowed}`;
  const value = /^\d+$/.test(text.trim()) ? Number(text.trim()) : NaN;
  if (!Number.isSafeInteger(value) || value < from || value > to) return `${option} must be ${allowed} (got ${text})`;
  return value;
}

/**
 * Removes --simulate and --seed (as `--simulate 2000` or `--simulate=2000`) from `argv` and checks
 * their values; everything after a bare `--` is left alone (file names).
 * @example extractSimulateArgs(['--demo', '--simulate', '500', '--seed', '7']) // { ok: true, rest: ['--demo'], simulate: { replicates: 500, seed: 7 } }
 */
export function extractSimulateArgs(argv: readonly string[]): SimulateArgs {
  const rest: string[] = [];
  let replicatesText: string | undefined;
  let seedText: string | undefined;
  let sawSimulate = false;
  let sawSeed = false;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i] ?? '';
    if (arg === '--') {
      rest.push(...argv.slice(i));
      break;
    }
    const [name, inline] =
      arg.startsWith('--') && arg.includes('=')
        ? [arg.slice(0, arg.indexOf('=')), arg.slice(arg.indexOf('=') + 1)]
        : [arg, undefined];
    if (name === '--simulate' || name === '--seed') {
      const value = inline ?? argv[i + 1];
      if (inline === undefined && value !== undefined && !value.startsWith('--')) i++;
      if (name === '--simulate') {
        if (sawSimulate) return { ok: false, message: 'give --simulate once' };
        sawSimulate = true;
        replicatesText = inline ?? (value !== undefined && !value.startsWith('--') ? value : undefined);
      } else {
        if (sawSeed) return { ok: false, message: 'give --seed once' };
        sawSeed = true;
        seedText = inline ?? (value !== undefined && !value.startsWith('--') ? value : undefined);
      }
    } else {
      rest.push(arg);
    }
  }
  const end = rest.indexOf('--');
  const options = end === -1 ? rest : rest.slice(0, end);
  if (sawSimulate && options.some((a) => a === '--report' || a.startsWith('--report='))) {
    return { ok: false, message: '--simulate prints its results with the plan; it does not go with --report' };
  }
  if (sawSimulate && options.includes('--csv')) {
    return { ok: false, message: '--simulate prints with the table, --json or --markdown, not --csv' };
  }
  if (!sawSimulate) {
    return sawSeed ? { ok: false, message: '--seed goes with --simulate <replicates>' } : { ok: true, rest, simulate: null };
  }
  const replicates = wholeNumber('--simulate', replicatesText, SIMULATION_LIMITS.minReplicates, SIMULATION_LIMITS.maxReplicates);
  if (typeof replicates === 'string') return { ok: false, message: replicates };
  if (!sawSeed) return { ok: true, rest, simulate: { replicates, seed: null } };
  const seed = wholeNumber('--seed', seedText, 0, MAX_SEED);
  if (typeof seed === 'string') return { ok: false, message: seed };
  return { ok: true, rest, simulate: { replicates, seed } };
}
