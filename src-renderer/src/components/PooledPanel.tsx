import { useDeferredValue, useMemo, useState } from 'react';
import { formatCount, formatMonths, formatPercent } from '@shared/format/numbers';
import type { Project } from '@shared/model/project';
import type { ComparisonRow } from '@shared/summary/comparison';
import { POOLED_MEASURES, type PooledMeasureSpec } from '@shared/summary/pooled-measures';
import { formatPooledInput, formatPooledWidth } from '@shared/summary/pooled-paragraph';
import {
  pooledParagraph,
  pooledSettingsOf,
  pooledSummary,
  type PooledMeasureFigures,
  type PooledProposal,
  type ProposedSite,
  type TauCase,
} from '@shared/summary/pooled-summary';
import { CAUTIONS_ONE_LINE } from '@shared/text/cautions';
import { PooledWidthChart } from '../charts/PooledWidthChart';
import { parseNumberText } from '../state/field-edit';
import { applyPooledEdit } from '../state/pooled-edit';
import { getAt } from '../state/paths';
import { NumberField } from './NumberField';

export interface PooledPanelProps {
  readonly project: Project;
  /** The table's rows: each population's required n, so the panel does not plan them again. */
  readonly rows: readonly Pick<ComparisonRow, 'populationId' | 'requiredN'>[];
  readonly onEdit: (label: string, change: (project: Project) => Project) => void;
}

const AIMS = [
  { value: 'site-specific', label: 'Each site on its own (site-specific)' },
  { value: 'pooled', label: 'The summary across sites (pooled)' },
  { value: 'both', label: 'Both: every site, and the summary' },
] as const;

const SET_BY: Readonly<Record<NonNullable<ProposedSite['setBy']>, string>> = {
  'own-targets': 'its own targets',
  'pooled-targets': 'the pooled targets',
  minimum: 'smallest usable n',
  'not-assessable': 'not assessable',
};

const capitalise = (text: string): string => `${text[0]?.toUpperCase() ?? ''}${text.slice(1)}`;

function verdict(met: boolean | null) {
  if (met === null) return <span className="muted">no target</span>;
  return met ? <span className="good">✓ met</span> : <span className="bad">✗ not met</span>;
}

function TauCasesTable({
  title,
  measures,
  pick,
  testId,
}: {
  readonly title: string;
  readonly measures: readonly PooledMeasureFigures[];
  readonly pick: (m: PooledMeasureFigures) => readonly TauCase[] | null;
  readonly testId: string;
}) {
  const rows = measures.flatMap((m) => (pick(m) ?? []).map((c) => ({ m, c })));
  if (rows.length === 0) return null;
  return (
    <table className="plain" data-testid={testId}>
      <caption>{title}</caption>
      <thead>
        <tr>
          <th scope="col">Measure</th>
          <th scope="col">τ</th>
          <th scope="col">Summary SE</th>
          <th scope="col">Summary CI width</th>
          <th scope="col">Target</th>
          <th scope="col">Prediction-interval width</th>
          <th scope="col">Target</th>
        </tr>
      </thead>
      <tbody>
        {rows.map(({ m, c }) => (
          <tr key={`${m.key}-${c.which}`} data-measure={m.key} data-tau={c.which}>
            <th scope="row">
              {capitalise(m.name)} {c.which === 'base' ? '' : <span className="muted small">({c.which} τ)</span>}
            </th>
            <td>{formatPooledInput(c.tau)}</td>
            <td>{formatPooledWidth(c.precision.summarySe)}</td>
            <td data-column="summary-width">{formatPooledWidth(c.precision.summaryCiWidth)}</td>
            <td>
              ≤ {formatPooledInput(c.precision.targetSummaryCiWidth)} {verdict(c.precision.meetsSummary)}
            </td>
            <td data-column="prediction-width">
              {c.precision.predictionIntervalWidth === null ? (
                <span className="muted">needs 3 sites</span>
              ) : (
                formatPooledWidth(c.precision.predictionIntervalWidth)
              )}
            </td>
            <td>
              {c.precision.targetPredictionIntervalWidth === null
                ? ''
                : `≤ ${formatPooledInput(c.precision.targetPredictionIntervalWidth)} `}
              {verdict(c.precision.meetsPrediction)}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function ProposalTable({ proposal }: { readonly proposal: PooledProposal }) {
  const feasible = proposal.status === 'feasible';
  const goal = proposal.objective === 'fewest-participants' ? 'fewest participants' : 'shortest recruitment';
  return (
    <div data-testid="pooled-proposal">
      <h3>
        {feasible
          ? `Proposal (${goal}): ${formatCount(proposal.totalN)} participants with an outcome across ${formatCount(proposal.sites.length)} sites`
          : 'No proposal: the pooled targets cannot be met as asked'}
      </h3>
      {feasible ? (
        <table className="plain" data-testid="pooled-proposal-table">
          <thead>
            <tr>
              <th scope="col">Site</th>
              <th scope="col">Own required n</th>
              <th scope="col">Proposed n</th>
              <th scope="col">Capacity</th>
              <th scope="col">Set by</th>
              <th scope="col">Enrol</th>
              <th scope="col">Months</th>
            </tr>
          </thead>
          <tbody>
            {proposal.sites.map((s) => (
              <tr key={s.siteId} data-site={s.siteId}>
                <th scope="row">{s.name}</th>
                <td>{formatCount(s.siteSpecificN)}</td>
                <td data-column="proposed">{formatCount(s.n)}</td>
                <td>
                  {formatCount(s.capacity)} {s.atCapacity ? <span className="muted small">(at capacity)</span> : null}
                </td>
                <td>{s.setBy === null ? '—' : SET_BY[s.setBy]}</td>
                <td>{formatCount(s.enrolmentTarget)}</td>
                <td className={s.fitsWindow === 'exceeds' ? 'bad' : ''}>{formatMonths(s.months)}</td>
              </tr>
            ))}
          </tbody>
          <tfoot>
            <tr>
              <th scope="row">All sites</th>
              <td />
              <td>{formatCount(proposal.totalN)}</td>
              <td />
              <td />
              <td>{formatCount(proposal.totalEnrolment)}</td>
              <td>{proposal.longestMonths === null ? '—' : `longest ${formatMonths(proposal.longestMonths)}`}</td>
            </tr>
          </tfoot>
        </table>
      ) : null}
      <ul data-testid="pooled-proposal-messages">
        {proposal.messages.map((m) => (
          <li key={m}>{m}</li>
        ))}
      </ul>
    </div>
  );
}

/** Per-site SE range, heterogeneity floors, fewest sites and problems of one measure, in words. */
function measureNotes(m: PooledMeasureFigures, k: number): string {
  const parts: string[] = [];
  if (m.perSite !== null) {
    const ses = m.perSite.map((s) => s.se);
    parts.push(`Per-site SE ${formatPooledWidth(Math.min(...ses))} to ${formatPooledWidth(Math.max(...ses))}.`);
  }
  const base = m.atPlanned?.find((c) => c.which === 'base')?.precision;
  if (base !== undefined) {
    const pi =
      base.predictionFloorWidth === null
        ? ''
        : `, and the prediction-interval width above ${formatPooledWidth(base.predictionFloorWidth)} (${formatPooledWidth(base.predictionFloorManySites)} with any number of sites)`;
    parts.push(
      `Whatever the n per site, heterogeneity keeps the summary CI width above ${formatPooledWidth(base.summaryFloorWidth)} with ${formatCount(k)} sites${pi}.`,
    );
  }
  if (m.minimumSites !== null) {
    const sites = (x: { sites: number | null; reason?: string }) => (x.sites === null ? (x.reason ?? '—') : formatCount(x.sites));
    const prediction =
      m.minimumSites.prediction === null ? '' : `; for the prediction target: ${sites(m.minimumSites.prediction)}`;
    parts.push(
      `Fewest sites that could meet the summary target with unlimited participants: ${sites(m.minimumSites.summary)}${prediction}.`,
    );
  }
  return [...parts, ...m.problems].join(' ');
}

function MeasureInputs({
  spec,
  project,
  edit,
}: {
  readonly spec: PooledMeasureSpec;
  readonly project: Project;
  readonly edit: (path: string, label: string, text: string) => string | null;
}) {
  const at = (field: string) => getAt(pooledSettingsOf(project), `measures.${spec.key}.${field}`) as number | undefined;
  const field = (name: string, label: string, allowed: string, help: string, testId: string) => (
    <NumberField
      label={label}
      value={at(name)}
      unit={spec.scale}
      allowed={allowed}
      help={help}
      testId={`pooled-${spec.key}-${testId}`}
      onCommit={(text) => edit(`measures.${spec.key}.${name}`, `${label} (${spec.name})`, text)}
    />
  );
  const tauMax = spec.key === 'rSquared' ? ', at most 0.5' : '';
  const widthMax = spec.key === 'rSquared' ? ', at most 1' : '';
  return (
    <fieldset className="group" data-testid={`pooled-inputs-${spec.key}`}>
      <legend>{capitalise(spec.name)}</legend>
      <div className="pooled-fields">
        {field(
          'tau',
          'Between-site SD τ',
          `at least 0${tauMax}`,
          'The SD of the true site values, from earlier validations of this or similar models, or judged.',
          'tau',
        )}
        {field(
          'tauRange.low',
          'τ low',
          `at least 0${tauMax}, at most τ`,
          'Low end of the plausible range of τ; the other end starts at τ. Clear to remove the range.',
          'tau-low',
        )}
        {field(
          'tauRange.high',
          'τ high',
          `at least τ${tauMax}`,
          'High end of the plausible range of τ; clear to remove the range.',
          'tau-high',
        )}
        {field(
          'summaryCiWidth',
          'Target summary CI width',
          `greater than 0${widthMax}`,
          'Largest acceptable width of the CI of the random-effects summary.',
          'summary',
        )}
        {field(
          'predictionIntervalWidth',
          'Target prediction-interval width',
          `greater than 0${widthMax}; optional`,
          'Largest acceptable width of the prediction interval for the performance in a new site.',
          'prediction',
        )}
      </div>
    </fieldset>
  );
}

/**
 * Across sites: the planning aim and the pooled inputs (τ with its range and the targets per
 * measure), the random-effects summary and prediction interval at the planned n and at the
 * proposal, the proposal per site, widths against sites and per-site n, and the cautions.
 */
export function PooledPanel({ project, rows, onEdit }: PooledPanelProps) {
  const settings = pooledSettingsOf(project);
  const deferredProject = useDeferredValue(project);
  const deferredRows = useDeferredValue(rows);
  const summary = useMemo(
    () => pooledSummary(deferredProject, { requiredN: new Map(deferredRows.map((r) => [r.populationId, r.requiredN])) }),
    [deferredProject, deferredRows],
  );
  const paragraph = useMemo(() => pooledParagraph(summary), [summary]);
  const [chartKey, setChartKey] = useState<string | null>(null);
  const charted =
    summary.measures.find((m) => m.key === chartKey && m.curves !== null) ?? summary.measures.find((m) => m.curves !== null);

  const commit = (path: string, label: string, value: unknown): string | null => {
    const result = applyPooledEdit(project.pooled, path, value);
    if (!result.ok) return result.message;
    onEdit(label, (p) => ({ ...p, pooled: result.pooled }));
    return null;
  };
  const edit = (path: string, label: string, text: string): string | null => {
    const parsed = parseNumberText(text);
    return parsed.ok ? commit(path, label, parsed.value) : parsed.message;
  };

  return (
    <section className="pooled" aria-labelledby="pooled-title" data-testid="pooled-panel">
      <h2 id="pooled-title">Across sites: precision of the summary and of a new site</h2>
      <div className="pooled-settings">
        <fieldset className="group">
          <legend>Planning aim</legend>
          {AIMS.map((aim) => (
            <label key={aim.value} className="toggle">
              <input
                type="radio"
                name="pooled-aim"
                value={aim.value}
                data-testid={`pooled-aim-${aim.value}`}
                checked={settings.aim === aim.value}
                onChange={() => commit('aim', `planning aim: ${aim.value}`, aim.value)}
              />{' '}
              {aim.label}
            </label>
          ))}
          <label className="field">
            Across sites, look for the{' '}
            <select
              data-testid="pooled-objective"
              value={settings.objective}
              onChange={(event) => commit('objective', 'pooled planning objective', event.target.value)}
            >
              <option value="fewest-participants">fewest participants in all</option>
              <option value="shortest-recruitment">shortest recruitment</option>
            </select>
          </label>
          <NumberField
            label="Confidence level of the pooled intervals"
            value={settings.confidence}
            allowed="between 0 and 1 (exclusive)"
            defaultText="0.95"
            help="Level of the summary CI and of the prediction interval."
            testId="pooled-confidence"
            onCommit={(text) => edit('confidence', 'confidence level of the pooled intervals', text)}
          />
        </fieldset>
        {POOLED_MEASURES.map((spec) => (
          <MeasureInputs key={spec.key} spec={spec} project={project} edit={edit} />
        ))}
      </div>

      {summary.notes.length > 0 ? (
        <ul className="muted" data-testid="pooled-notes">
          {summary.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      ) : null}

      <TauCasesTable
        title={`At each site's planned n (its fixed available n, else its own required n), ${formatPercent(summary.confidence, 1)} intervals`}
        measures={summary.measures}
        pick={(m) => m.atPlanned}
        testId="pooled-figures"
      />
      {summary.measures.map((m) => (
        <p key={m.key} className="small" data-testid={`pooled-floors-${m.key}`}>
          <strong>{capitalise(m.name)}:</strong> {measureNotes(m, summary.k)}
        </p>
      ))}

      {summary.proposal === null ? null : (
        <>
          <ProposalTable proposal={summary.proposal} />
          <TauCasesTable
            title="At the proposed n"
            measures={summary.measures}
            pick={(m) => m.atProposal}
            testId="pooled-at-proposal"
          />
        </>
      )}

      {summary.measures.some((m) => m.comparison !== null) ? (
        <div data-testid="pooled-comparison">
          <h3>One more site, or more participants at each site?</h3>
          {summary.measures.map((m) => (m.comparison === null ? null : <p key={m.key}>{m.comparison.sentence}</p>))}
        </div>
      ) : null}

      {charted?.curves ? (
        <div className="pooled-charts">
          {summary.measures.length > 1 ? (
            <label className="field">
              Chart of{' '}
              <select
                data-testid="pooled-chart-measure"
                value={charted.key}
                onChange={(event) => setChartKey(event.target.value)}
              >
                {summary.measures
                  .filter((m) => m.curves !== null)
                  .map((m) => (
                    <option key={m.key} value={m.key}>
                      {m.name}
                    </option>
                  ))}
              </select>
            </label>
          ) : null}
          <PooledWidthChart name={capitalise(charted.name)} curves={charted.curves} target={charted.target} />
        </div>
      ) : null}

      <div className="cautions" role="note" data-testid="pooled-cautions">
        <strong>Cautions for the pooled figures.</strong>
        <ul>
          {summary.cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
          <li>{CAUTIONS_ONE_LINE}</li>
        </ul>
      </div>

      {summary.measures.length > 0 ? (
        <details data-testid="pooled-paragraph">
          <summary>Paragraph for the protocol</summary>
          {paragraph.split('\n\n').map((p, i) => (
            // The paragraphs are rebuilt as a whole; their position is their identity.
            <p key={i}>{p}</p>
          ))}
        </details>
      ) : null}
    </section>
  );
}
