import { useState } from 'react';
import { OUTCOME_TYPES, projectSchema, type OutcomeType, type Project } from '@shared/model/project';
import { fieldProblems } from '@shared/model/validation-message';
import { parseNumberText } from '../state/field-edit';
import { getAt, setAt } from '../state/paths';
import { CoxSnellHelper } from './CoxSnellHelper';
import { NumberField } from './NumberField';

const OUTCOME_WORDS: Readonly<Record<OutcomeType, string>> = {
  continuous: 'continuous (a measurement)',
  binary: 'binary (an event or a diagnosis)',
};

export interface ProjectSettingsProps {
  readonly project: Project;
  readonly onChange: (label: string, next: Project) => void;
}

/** Applies a project-level edit and validates the whole project with the schema. */
function applyProjectEdit(
  project: Project,
  path: string,
  value: unknown,
): { ok: true; project: Project } | { ok: false; message: string } {
  const parsed = projectSchema.safeParse(setAt(project, path, value), { reportInput: true });
  if (parsed.success) return { ok: true, project: parsed.data };
  const problems = fieldProblems(parsed.error);
  const own = problems.find((p) => p.path === path) ?? problems[0];
  return { ok: false, message: own?.message ?? 'not accepted' };
}

/** The plan as a whole: its name, the model being validated, model updating and the study window. */
export function ProjectSettings({ project, onChange }: ProjectSettingsProps) {
  // Why the updating toggle was refused (e.g. a Cox–Snell R² impossible at a population's proportion).
  const [toggleProblem, setToggleProblem] = useState<string | null>(null);
  const number = (
    path: string,
    label: string,
    extra: { unit?: string; allowed: string; defaultText?: string; integer?: boolean; help: string },
  ) => (
    <NumberField
      label={label}
      value={getAt(project, path) as number | undefined}
      allowed={extra.allowed}
      {...(extra.unit === undefined ? {} : { unit: extra.unit })}
      {...(extra.defaultText === undefined ? {} : { defaultText: extra.defaultText })}
      help={extra.help}
      testId={`project-${path}`}
      onCommit={(text) => {
        const parsed = parseNumberText(text);
        if (!parsed.ok) return parsed.message;
        const edit = applyProjectEdit(project, path, parsed.value);
        if (!edit.ok) return edit.message;
        onChange(label, edit.project);
        return null;
      }}
    />
  );
  const text = (path: string, label: string, multiline = false) => {
    const current = (getAt(project, path) as string | undefined) ?? '';
    const id = `project-${path.replace(/\./g, '-')}`;
    if (!multiline) {
      return (
        <NumberField
          label={label}
          kind="text"
          value={current}
          testId={id}
          onCommit={(typed) => {
            if (typed === current) return null;
            const edit = applyProjectEdit(project, path, typed);
            if (!edit.ok) return edit.message;
            onChange(label, edit.project);
            return null;
          }}
        />
      );
    }
    return (
      <div className="field">
        <label htmlFor={id}>{label}</label>
        <textarea
          id={id}
          rows={2}
          key={`${id}-${current}`}
          defaultValue={current}
          onBlur={(e) => {
            if (e.target.value === current) return;
            const edit = applyProjectEdit(project, path, e.target.value);
            if (edit.ok) onChange(label, edit.project);
          }}
        />
      </div>
    );
  };
  const updating = project.updating;
  const binary = project.outcome === 'binary';
  return (
    <details className="settings" open>
      <summary>Plan settings: model, updating and study window</summary>
      <div className="settings-grid">
        <fieldset className="group">
          <legend>Plan and model</legend>
          {text('name', 'Plan name')}
          {text('description', 'Description', true)}
          {text('model.name', 'Model being validated')}
          {text('model.reportedPerformance', 'Reported development performance', true)}
          <div className="field">
            <label htmlFor="project-outcome">Outcome type</label>
            {project.populations.length === 0 ? (
              <select
                id="project-outcome"
                data-testid="project-outcome"
                value={project.outcome}
                onChange={(event) => {
                  const edit = applyProjectEdit(project, 'outcome', event.target.value);
                  if (edit.ok) onChange(`outcome type ${event.target.value}`, edit.project);
                }}
              >
                {OUTCOME_TYPES.map((outcome) => (
                  <option key={outcome} value={outcome}>
                    {OUTCOME_WORDS[outcome]}
                  </option>
                ))}
              </select>
            ) : (
              <output id="project-outcome" data-testid="project-outcome">
                {OUTCOME_WORDS[project.outcome]}
              </output>
            )}
            <span className="hint">
              {project.populations.length === 0
                ? 'Chosen once: one model predicts one outcome type, so it is fixed when the first population is added.'
                : 'Fixed: one model predicts one outcome type, and this plan has populations.'}
            </span>
          </div>
        </fieldset>
        <fieldset className="group">
          <legend>Model updating</legend>
          <label className="toggle">
            <input
              type="checkbox"
              data-testid="updating-toggle"
              checked={updating.enabled}
              onChange={(event) => {
                const edit = applyProjectEdit(project, 'updating.enabled', event.target.checked);
                setToggleProblem(edit.ok ? null : edit.message);
                if (edit.ok) onChange(event.target.checked ? 'turn model updating on' : 'turn model updating off', edit.project);
              }}
            />{' '}
            The model will be updated locally (add the development minimums)
          </label>
          {toggleProblem === null ? null : (
            <p className="field-error" role="alert">
              Model updating was not changed: {toggleProblem}
            </p>
          )}
          {number('updating.predictorParameters', 'Predictor parameters (P)', {
            allowed: 'a whole number, at least 1',
            help: 'Count every parameter the updated model estimates: each dummy, spline term and interaction.',
          })}
          {binary
            ? number('updating.anticipatedCoxSnellR2', 'Anticipated Cox–Snell R²', {
                allowed: "greater than 0, below its maximum at every population's outcome proportion",
                help: 'Optimism-adjusted Cox–Snell R² expected of the updated model; the helper below derives it from a reported C-statistic, Nagelkerke R² or likelihood-ratio statistic.',
              })
            : number('updating.anticipatedAdjustedRSquared', 'Anticipated adjusted R²', {
                allowed: 'between 0 and 1 (exclusive)',
                help: 'Optimism-adjusted R² expected of the updated model.',
              })}
          {number('updating.targetShrinkage', 'Target shrinkage factor', {
            allowed: 'between 0 and 1 (exclusive)',
            defaultText: '0.9',
            help: 'Expected shrinkage of at least this value.',
          })}
          {number('updating.optimismMargin', binary ? 'Allowed optimism in Nagelkerke R²' : 'Allowed optimism in R²', {
            allowed: 'between 0 and 1 (exclusive)',
            defaultText: '0.05',
            help: binary
              ? 'Apparent minus optimism-adjusted Nagelkerke R² at most this value.'
              : 'Apparent minus adjusted R² at most this value.',
          })}
          {binary
            ? number('updating.riskMargin', 'Margin for the overall risk', {
                allowed: 'greater than 0, below 0.5',
                defaultText: '0.05',
                help: 'The CI for the overall outcome risk should lie within ± this margin.',
              })
            : null}
          {binary ? (
            <CoxSnellHelper
              onUse={(value) => {
                const edit = applyProjectEdit(project, 'updating.anticipatedCoxSnellR2', value);
                if (!edit.ok) return edit.message;
                onChange('anticipated Cox–Snell R²', edit.project);
                return null;
              }}
            />
          ) : null}
          {binary ? null : (
            <label className="field">
              Shrinkage criterion form{' '}
              <select
                value={updating.shrinkageForm}
                onChange={(event) => {
                  const edit = applyProjectEdit(project, 'updating.shrinkageForm', event.target.value);
                  if (edit.ok) onChange('shrinkage criterion form', edit.project);
                }}
              >
                <option value="adjusted-r2-link">via the adjusted-R² link (reproduces the published 918)</option>
                <option value="closed-form">closed form used for binary outcomes</option>
              </select>
            </label>
          )}
        </fieldset>
        <fieldset className="group">
          <legend>Study window</legend>
          <NumberField
            label="Recruitment starts"
            kind="text"
            value={project.study.startDate}
            allowed="a date written YYYY-MM-DD"
            help="First day of recruitment; finish dates are counted from here."
            testId="project-study.startDate"
            onCommit={(typed) => {
              const edit = applyProjectEdit(project, 'study.startDate', typed.trim() === '' ? undefined : typed.trim());
              if (!edit.ok) return edit.message;
              onChange('study start', edit.project);
              return null;
            }}
          />
          {number('study.windowMonths', 'Recruitment window', {
            unit: 'months',
            allowed: 'greater than 0, at most 600',
            help: 'Months available for recruitment in the funding period.',
          })}
        </fieldset>
      </div>
    </details>
  );
}
