import { useState } from 'react';
import { DomainError } from '@shared/engine/errors';
import { parseSimulationConfig, SIMULATION_LIMITS, simulationVerdict } from '@shared/engine/simulation';
import type { SimulationResult } from '@shared/engine/simulation';
import { formatCount, formatDuration } from '@shared/format/numbers';
import type { Population, Project } from '@shared/model/project';
import type { SimulationBasis, SimulationRecord } from '@shared/model/simulation-record';
import type { ComparisonRow } from '@shared/summary/comparison';
import {
  closedFormAtN,
  DEFAULT_REPLICATES,
  simulatedInputsOf,
  simulationConfigOf,
  simulationN,
  simulationNotes,
  simulationStaleness,
  simulationTargets,
  verdictReferences,
} from '@shared/summary/simulation-check';
import type { PlanForSimulation } from '@shared/summary/simulation-check';
import { SIMULATION_HEADER, simulationCells } from '@shared/summary/simulation-cells';
import { recordOf, resultOf, withSimulation } from '@shared/summary/simulation-store';
import { CAUTIONS } from '@shared/text/cautions';
import type { FinishedRun, SimulationJob } from '../simulation/simulation-client';
import { useSimulation } from '../simulation/useSimulation';
import { parseNumberText } from '../state/field-edit';
import { NumberField } from './NumberField';

export interface SimulationPanelProps {
  readonly project: Project;
  readonly rows: readonly ComparisonRow[];
  /** The population shown in the side column. */
  readonly populationId: string;
  readonly onEdit: (label: string, change: (project: Project) => Project) => void;
}

interface JobTag {
  readonly basis: SimulationBasis;
}

const MAX_SEED = 4_294_967_295;

function randomSeed(): number {
  return crypto.getRandomValues(new Uint32Array(1))[0] ?? 1;
}

/** Typed text as a whole number in [from, to], or the message for the field. */
function wholeNumberIn(text: string, from: number, to: number, empty: number | null): { value: number } | { error: string } {
  const parsed = parseNumberText(text);
  if (!parsed.ok) return { error: parsed.message };
  const value = parsed.value ?? empty;
  const allowed = `a whole number from ${formatCount(from)} to ${formatCount(to)}`;
  if (value === null) return { error: `give ${allowed}` };
  if (!Number.isInteger(value) || value < from || value > to) return { error: `${text.trim()} is not ${allowed}` };
  return { value };
}

function planOf(row: ComparisonRow): PlanForSimulation {
  return { criteria: row.criteria, requiredN: row.requiredN, availableN: row.availableN };
}

/**
 * "Check by simulation": simulates validation studies of the planned size for the selected
 * population (or every population, one after another) in a worker, shows the progress with a
 * Cancel, and files each finished or cancelled result in the plan as an undoable edit. Beside the
 * closed form it shows, per measure, the simulated SE, mean CI, share of studies meeting the
 * target and coverage, with Monte Carlo errors, the verdict in words and the cautions.
 */
export function SimulationPanel({ project, rows, populationId, onEdit }: SimulationPanelProps) {
  const [replicates, setReplicates] = useState(DEFAULT_REPLICATES);
  const [seed, setSeed] = useState(randomSeed);
  const [chosenBasis, setBasis] = useState<SimulationBasis>('required-n');
  const [problems, setProblems] = useState<readonly string[]>([]);

  const onResult = ({ job, result, elapsedMs, cancelled }: FinishedRun<JobTag>): void => {
    if (result.replicatesDone < 2) {
      setProblems((list) => [...list, `${job.label}: cancelled before two replicates were complete, so nothing was kept.`]);
      return;
    }
    const record = recordOf(result, job.tag.basis, { ranAt: new Date().toISOString(), elapsedMs });
    onEdit(`${cancelled ? 'partial ' : ''}simulation check of ${job.label}`, (p) => withSimulation(p, job.key, record));
  };
  const { state, run, cancel } = useSimulation<JobTag>(onResult);

  const population = project.populations.find((p) => p.id === populationId);
  const row = rows.find((r) => r.populationId === populationId);
  if (population === undefined || row === undefined) return null;
  const plan = planOf(row);
  const targets = simulationTargets(plan);
  const basis: SimulationBasis = targets.some((t) => t.basis === chosenBasis) ? chosenBasis : 'required-n';
  const running = state.running;

  const jobFor = (p: Population, r: ComparisonRow, b: SimulationBasis): SimulationJob<JobTag> | string => {
    const n = simulationN(planOf(r), b);
    if (n === null) {
      return `${p.name}: ${b === 'required-n' ? 'no required n to simulate at (a target is out of reach)' : 'no available n is stated'}.`;
    }
    const inputs = simulatedInputsOf(p);
    if (!inputs.ok) return `${p.name}: cannot be simulated: ${inputs.reason}.`;
    const config = simulationConfigOf(inputs.inputs, n, replicates, seed);
    try {
      parseSimulationConfig(config);
    } catch (error) {
      return `${p.name}: ${error instanceof DomainError ? error.message : String(error)}`;
    }
    return { key: p.id, label: p.name, config, tag: { basis: b } };
  };

  const start = (jobsOrProblems: readonly (SimulationJob<JobTag> | string)[]): void => {
    const jobs = jobsOrProblems.filter((j): j is SimulationJob<JobTag> => typeof j !== 'string');
    setProblems(jobsOrProblems.filter((j): j is string => typeof j === 'string'));
    if (jobs.length > 0) run(jobs);
  };

  const checkAll = (): void =>
    start(
      project.populations.flatMap((p) => {
        const r = rows.find((x) => x.populationId === p.id);
        return r === undefined ? [] : [jobFor(p, r, 'required-n')];
      }),
    );

  const live = running !== null && running.job.key === populationId ? running.partial : null;
  const stored = project.simulations?.[populationId];
  const errors = [...problems, ...state.errors.map((e) => `${e.label}: ${e.field === null ? '' : `${e.field}: `}${e.message}`)];

  return (
    <section className="simulation" aria-labelledby="simulation-title" data-testid="simulation-panel">
      <h3 id="simulation-title">Check by simulation</h3>
      <p className="muted small">
        Simulates many validation studies of the planned size from {population.name}&rsquo;s anticipated values, fits the
        calibration models to each, and compares the precision they reach with the closed form.
      </p>
      {targets.length > 1 ? (
        <fieldset className="simulation-basis">
          <legend>Simulate at</legend>
          {targets.map((t) => (
            <label key={t.basis}>
              <input
                type="radio"
                name="simulation-basis"
                value={t.basis}
                checked={basis === t.basis}
                onChange={() => setBasis(t.basis)}
              />{' '}
              {t.label}
            </label>
          ))}
        </fieldset>
      ) : null}
      <div className="simulation-inputs">
        <NumberField
          label="Replicates"
          value={replicates}
          allowed={`${formatCount(SIMULATION_LIMITS.minReplicates)} to ${formatCount(SIMULATION_LIMITS.maxReplicates)}`}
          defaultText={formatCount(DEFAULT_REPLICATES)}
          help="Simulated studies; more replicates give smaller Monte Carlo errors and take longer."
          testId="simulation-replicates"
          onCommit={(text) => {
            const parsed = wholeNumberIn(
              text,
              SIMULATION_LIMITS.minReplicates,
              SIMULATION_LIMITS.maxReplicates,
              DEFAULT_REPLICATES,
            );
            if ('error' in parsed) return parsed.error;
            setReplicates(parsed.value);
            return null;
          }}
        />
        <NumberField
          label="Seed"
          value={seed}
          allowed={`0 to ${formatCount(MAX_SEED)}`}
          required
          help="The same seed and replicate count give the same numbers again; it is stored with the result."
          testId="simulation-seed"
          onCommit={(text) => {
            const parsed = wholeNumberIn(text, 0, MAX_SEED, null);
            if ('error' in parsed) return parsed.error;
            setSeed(parsed.value);
            return null;
          }}
        />
      </div>
      <div className="buttons">
        <button
          type="button"
          data-testid="simulation-run"
          disabled={running !== null}
          onClick={() => start([jobFor(population, row, basis)])}
        >
          Check {population.name} by simulation
        </button>
        <button type="button" data-testid="simulation-run-all" disabled={running !== null} onClick={checkAll}>
          Check every population
        </button>
        <button type="button" onClick={() => setSeed(randomSeed())} disabled={running !== null}>
          New seed
        </button>
      </div>
      {running !== null ? (
        <div className="simulation-progress" data-testid="simulation-running">
          <progress
            max={running.progress?.total ?? 1}
            value={running.progress?.done ?? 0}
            aria-label={`Simulation of ${running.job.label}`}
            data-testid="simulation-progress"
            data-done={running.progress?.done ?? 0}
            data-elapsed-ms={running.progress?.elapsedMs ?? 0}
          />
          <p className="small" aria-live="polite" data-testid="simulation-progress-text">
            {running.count > 1 ? `Population ${running.index + 1} of ${running.count}: ` : ''}
            {running.job.label}: {formatCount(running.progress?.done ?? 0)} of {formatCount(running.progress?.total ?? null)}{' '}
            replicates
            {running.progress?.estimatedRemainingMs === null || running.progress === null
              ? ''
              : ` · about ${formatDuration(running.progress.estimatedRemainingMs)} left`}
            {running.cancelling ? ' · stopping…' : ''}
          </p>
          <button type="button" data-testid="simulation-cancel" onClick={cancel} disabled={running.cancelling}>
            Cancel
          </button>
        </div>
      ) : null}
      {errors.length > 0 ? (
        <ul className="field-error simulation-errors" role="alert" data-testid="simulation-errors">
          {errors.map((e, i) => (
            <li key={i}>{e}</li>
          ))}
        </ul>
      ) : null}
      {live !== null ? (
        <SimulationResultView result={live} population={population} plan={plan} record={null} />
      ) : stored !== undefined ? (
        <SimulationResultView result={resultOf(stored)} population={population} plan={plan} record={stored} />
      ) : null}
    </section>
  );
}

function SimulationResultView({
  result,
  population,
  plan,
  record,
}: {
  readonly result: SimulationResult;
  readonly population: Population;
  readonly plan: PlanForSimulation;
  /** The stored record being shown, or null for a run still going. */
  readonly record: SimulationRecord | null;
}) {
  const closed = closedFormAtN(population, plan, result.n);
  const verdict = simulationVerdict(result, verdictReferences(closed));
  const stale = record === null ? [] : simulationStaleness(record, population, plan);
  const notes = simulationNotes(population);
  return (
    <div className="simulation-result" data-testid="simulation-result" data-live={record === null}>
      {stale.length > 0 ? (
        <p className="warn-mark" role="status" data-testid="simulation-stale">
          Out of date: {stale.join('; ')}. Run the check again to bring it up to date.
        </p>
      ) : null}
      <p data-testid="simulation-verdict">
        <strong>{verdict.headline}</strong>
      </p>
      <div className="simulation-table">
        <table className="plain" data-testid="simulation-table">
          <thead>
            <tr>
              {SIMULATION_HEADER.map((h) => (
                <th key={h} scope="col">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {simulationCells(result, closed).map((r) => (
              <tr key={r.id} data-measure={r.id}>
                {r.cells.map((c, i) =>
                  i === 0 ? (
                    <th key={i} scope="row">
                      {c}
                    </th>
                  ) : (
                    <td key={i}>{c}</td>
                  ),
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <ul className="simulation-verdicts small">
        {verdict.measures.map((m) => (
          <li key={m.measureId} data-status={m.status}>
            {m.text}
          </li>
        ))}
      </ul>
      {notes.map((note) => (
        <p key={note} className="small muted">
          {note}
        </p>
      ))}
      {record !== null ? (
        <p className="small muted" data-testid="simulation-meta">
          Seed {record.seed} · {formatCount(record.replicatesDone)} of {formatCount(record.replicatesRequested)} replicates · n ={' '}
          {formatCount(record.n)} · {record.engineVersion} · ran {new Date(record.ranAt).toLocaleString()} in{' '}
          {formatDuration(record.elapsedMs)}
        </p>
      ) : null}
      <ul className="small muted simulation-cautions">
        {CAUTIONS.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
    </div>
  );
}
