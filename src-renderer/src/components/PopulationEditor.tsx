import { POPULATION_FIELDS, type FieldGroup, type FieldSpec } from '@shared/model/population-fields';
import type { BinaryPopulation, Population, Range } from '@shared/model/project';
import { applyFieldEdit, parseNumberText } from '../state/field-edit';
import { getAt } from '../state/paths';
import { LpNote } from './LpNote';
import { NumberField } from './NumberField';
import { OeTargetFields } from './OeTargetFields';
import { ThresholdList } from './ThresholdList';
import { VarianceHelper } from './VarianceHelper';
import { WidthHelper } from './WidthHelper';

export interface PopulationEditorProps {
  readonly population: Population;
  /** Records an accepted edit (undoable) under a label such as "R² of Harbour General". */
  readonly onChange: (label: string, next: Population) => void;
  /** Reports a field that holds a rejected entry (message) or no longer does (null). */
  readonly onInvalid: (path: string, message: string | null) => void;
  readonly onDuplicate: () => void;
  readonly onRemove: () => void;
  readonly onExport?: () => void;
}

/** The O/E target's fields, shown by OeTargetFields in the convention chosen. */
const OE_PREFIX = 'precision.oe.';

const GROUP_TITLES: Readonly<Record<FieldGroup, string>> = {
  anticipated: 'Anticipated values (with optional low–high range)',
  precision: 'Precision targets',
  recruitment: 'Recruitment',
};

export function PopulationEditor({ population, onChange, onInvalid, onDuplicate, onRemove, onExport }: PopulationEditorProps) {
  const commitNumber = (path: string, label: string, text: string): string | null => {
    const parsed = parseNumberText(text);
    if (!parsed.ok) {
      onInvalid(path, parsed.message);
      return parsed.message;
    }
    const edit = applyFieldEdit(population, path, parsed.value, label);
    if (!edit.ok) {
      onInvalid(path, edit.message);
      return edit.message;
    }
    onInvalid(path, null);
    onChange(`${label} of ${population.name}`, edit.population);
    return null;
  };

  const setDirect = (path: string, label: string, value: unknown): void => {
    const edit = applyFieldEdit(population, path, value, label);
    if (edit.ok) {
      onInvalid(path, null);
      onChange(`${label} of ${population.name}`, edit.population);
    }
  };

  const field = (spec: FieldSpec) => (
    <NumberField
      key={spec.path}
      label={spec.label}
      unit={spec.unit}
      allowed={spec.allowed}
      {...(spec.defaultText === undefined ? {} : { defaultText: spec.defaultText })}
      required={spec.required}
      help={spec.help}
      value={getAt(population, spec.path) as number | undefined}
      testId={`field-${spec.path}`}
      onCommit={(text) => commitNumber(spec.path, spec.label, text)}
    />
  );

  const rangeFields = (spec: FieldSpec) => {
    if (spec.rangeKey === undefined) return null;
    const key = spec.rangeKey;
    const ranges: Readonly<Partial<Record<string, Range>>> = population.ranges;
    const range = ranges[key];
    const commitEnd = (end: 'low' | 'high', text: string): string | null => {
      const parsed = parseNumberText(text);
      if (!parsed.ok) return parsed.message;
      const other = end === 'low' ? range?.high : range?.low;
      if (parsed.value === undefined) {
        if (other === undefined || range === undefined) {
          const edit = applyFieldEdit(population, `ranges.${key}`, undefined, spec.label);
          if (!edit.ok) return edit.message;
          onChange(`range of ${spec.label} of ${population.name}`, edit.population);
          return null;
        }
        return 'give both ends of the range, or clear both';
      }
      const base = getAt(population, spec.path) as number | undefined;
      const next = {
        low: end === 'low' ? parsed.value : (other ?? base ?? parsed.value),
        high: end === 'high' ? parsed.value : (other ?? base ?? parsed.value),
      };
      return commitNumberRange(`ranges.${key}`, spec.label, next);
    };
    return (
      <details
        className="range-details"
        key={`${spec.path}-range`}
        open={range !== undefined || population.sources[key] !== undefined}
      >
        <summary>Range and source{range ? `: ${range.low} to ${range.high}` : ''}</summary>
        <div className="range-row">
          <NumberField
            label={`${spec.label}: low`}
            value={range?.low}
            onCommit={(text) => commitEnd('low', text)}
            testId={`range-${key}-low`}
          />
          <NumberField
            label={`${spec.label}: high`}
            value={range?.high}
            onCommit={(text) => commitEnd('high', text)}
            testId={`range-${key}-high`}
          />
          <label className="source">
            Source of this assumption
            <input
              type="text"
              defaultValue={population.sources[key] ?? ''}
              key={`${population.id}-${key}-source`}
              onBlur={(event) => {
                const text = event.target.value.trim();
                if (text !== (population.sources[key] ?? '')) {
                  const sources = { ...population.sources };
                  if (text === '') delete sources[key];
                  else sources[key] = text;
                  setDirect('sources', `source of ${spec.label}`, sources);
                }
              }}
            />
          </label>
        </div>
      </details>
    );
  };

  const commitNumberRange = (path: string, label: string, value: { low: number; high: number }): string | null => {
    const edit = applyFieldEdit(population, path, value, label);
    if (!edit.ok) {
      onInvalid(path, edit.message);
      return edit.message;
    }
    onInvalid(path, null);
    onChange(`range of ${label} of ${population.name}`, edit.population);
    return null;
  };

  const groups: FieldGroup[] = ['anticipated', 'precision', 'recruitment'];
  const specs = POPULATION_FIELDS[population.outcome];
  const binary: BinaryPopulation | null = population.outcome === 'binary' ? population : null;
  return (
    <section className="editor" aria-labelledby="editor-title">
      <div className="editor-head">
        <h2 id="editor-title">Population</h2>
        <div className="buttons">
          <button type="button" onClick={onDuplicate}>
            Duplicate
          </button>
          {onExport ? (
            <button type="button" onClick={onExport}>
              Export…
            </button>
          ) : null}
          <button type="button" className="danger" onClick={onRemove}>
            Remove
          </button>
        </div>
      </div>
      <div className="field">
        <label htmlFor="population-name">Site or population name</label>
        <input
          id="population-name"
          type="text"
          key={`${population.id}-name`}
          defaultValue={population.name}
          onBlur={(event) => {
            const name = event.target.value;
            if (name !== population.name) {
              const edit = applyFieldEdit(population, 'name', name, 'name');
              if (edit.ok) onChange(`name of ${population.name}`, edit.population);
              else event.target.value = population.name;
            }
          }}
        />
      </div>
      <div className="field">
        <label htmlFor="population-notes">Notes</label>
        <textarea
          id="population-notes"
          key={`${population.id}-notes`}
          rows={2}
          defaultValue={population.notes}
          onBlur={(event) => {
            if (event.target.value !== population.notes) setDirect('notes', 'notes', event.target.value);
          }}
        />
      </div>
      {groups.map((group) => (
        <fieldset key={group} className="group">
          <legend>{GROUP_TITLES[group]}</legend>
          {binary !== null && group === 'precision' ? (
            <OeTargetFields
              target={binary.precision.oe}
              specs={specs.filter((spec) => spec.path.startsWith(OE_PREFIX))}
              field={field}
              onSwitch={(next) => setDirect('precision.oe', 'O/E target convention', next)}
            />
          ) : null}
          {specs
            .filter((spec) => spec.group === group && !spec.path.startsWith(OE_PREFIX))
            .map((spec) => (
              <div key={spec.path} className="field-block">
                {field(spec)}
                {group === 'anticipated' ? rangeFields(spec) : null}
              </div>
            ))}
          {binary !== null && group === 'anticipated' ? (
            <>
              <LpNote anticipated={binary.anticipated} />
              <ThresholdList
                thresholds={binary.anticipated.thresholds}
                onCommit={(next, label) => {
                  const edit = applyFieldEdit(binary, 'anticipated.thresholds', next, label);
                  if (!edit.ok) {
                    onInvalid('anticipated.thresholds', edit.message);
                    return edit.message;
                  }
                  onInvalid('anticipated.thresholds', null);
                  onChange(`${label} of ${population.name}`, edit.population);
                  return null;
                }}
              />
            </>
          ) : null}
          {binary !== null && group === 'precision' ? (
            <label className="toggle">
              <input
                type="checkbox"
                data-testid="field-precision.netBenefit.standardised"
                checked={binary.precision.netBenefit.standardised}
                onChange={(event) =>
                  setDirect('precision.netBenefit.standardised', 'net-benefit width standardised', event.target.checked)
                }
              />{' '}
              The net-benefit width is for standardised net benefit (net benefit ÷ outcome proportion)
            </label>
          ) : null}
          {population.outcome === 'continuous' && group === 'anticipated' ? (
            <VarianceHelper onUse={(variance) => setDirect('anticipated.outcomeVariance', 'outcome variance', variance)} />
          ) : null}
          {population.outcome === 'continuous' && group === 'precision' ? (
            <WidthHelper
              confidence={population.precision.confidence}
              onUse={(width) => setDirect('precision.citl.width', 'CITL width', width)}
            />
          ) : null}
        </fieldset>
      ))}
    </section>
  );
}
