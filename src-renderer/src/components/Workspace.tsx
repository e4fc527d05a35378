import { useCallback, useDeferredValue, useMemo, useState } from 'react';
import type { SortingState } from '@tanstack/react-table';
import type { Population, Project } from '@shared/model/project';
import { comparisonTotals, type Planner } from '@shared/summary/comparison';
import { createRowCache } from '@shared/summary/row-cache';
import { comparisonCells, toTsv } from '@shared/summary/table-cells';
import { duplicatePopulation } from '@shared/model/population-ops';
import { CriterionBars } from '../charts/CriterionBars';
import { RecruitmentTimeline } from '../charts/RecruitmentTimeline';
import { SensitivityChart } from '../charts/SensitivityChart';
import { ComparisonTable } from './ComparisonTable';
import { PopulationEditor } from './PopulationEditor';
import { PrecisionPanel } from './PrecisionPanel';
import { ProjectSettings } from './ProjectSettings';
import { PooledPanel } from './PooledPanel';
import { SimulationPanel } from './SimulationPanel';
import { newPopulation } from '../state/new-population';

export interface WorkspaceProps {
  readonly project: Project;
  readonly planner: Planner;
  readonly onEdit: (label: string, change: (project: Project) => Project) => void;
  readonly onExportPopulation?: (populationId: string) => void;
  readonly onStatus: (message: string) => void;
}

const DEFAULT_SORT: SortingState = [{ id: 'required', desc: true }];

/** The screen the plan is worked in: settings, the ranking table, the editor and the charts. */
export function Workspace({ project, planner, onEdit, onExportPopulation, onStatus }: WorkspaceProps) {
  const [sorting, setSorting] = useState<SortingState>(DEFAULT_SORT);
  const [selectedId, setSelectedId] = useState<string | null>(project.populations[0]?.id ?? null);
  const [invalid, setInvalid] = useState<Record<string, Record<string, string>>>({});

  const cache = useMemo(() => createRowCache(planner), [planner]);
  const rows = useMemo(() => cache.rows(project), [cache, project]);
  const [orderIds, setOrderIdsState] = useState<readonly string[]>([]);
  const setOrderIds = useCallback(
    (ids: readonly string[]) =>
      setOrderIdsState((current) => (current.length === ids.length && current.every((id, i) => id === ids[i]) ? current : ids)),
    [],
  );
  const order = useMemo(() => orderBy(rows, orderIds), [rows, orderIds]);
  const totals = useMemo(() => comparisonTotals(rows), [rows]);
  const invalidIds = useMemo(
    () =>
      new Set(
        Object.entries(invalid)
          .filter(([, fields]) => Object.keys(fields).length > 0)
          .map(([id]) => id),
      ),
    [invalid],
  );

  const selected = project.populations.find((p) => p.id === selectedId) ?? project.populations[0] ?? null;
  const selectedRow = rows.find((r) => r.populationId === selected?.id) ?? null;
  // The charts take their inputs at a lower priority: the table and the editor answer an edit at
  // once, and the charts follow as soon as the browser is free.
  const chartOrder = useDeferredValue(order);
  const chartSelected = useDeferredValue(selected);
  const chartUpdating = useDeferredValue(project.updating);

  const replacePopulation = useCallback(
    (label: string, next: Population) =>
      onEdit(label, (p) => ({ ...p, populations: p.populations.map((q) => (q.id === next.id ? next : q)) })),
    [onEdit],
  );

  const copyTable = (): void => {
    const text = toTsv(comparisonCells(order, totals));
    navigator.clipboard.writeText(text).then(
      () => onStatus('The table was copied as tab-separated text.'),
      () => onStatus('The clipboard is not available here; nothing was copied.'),
    );
  };

  return (
    <div className="workspace">
      <ProjectSettings project={project} onChange={(label, next) => onEdit(label, () => next)} />
      <section aria-labelledby="table-title" className="table-section">
        <div className="section-head">
          <h2 id="table-title">Populations ranked by required n</h2>
          <div className="buttons">
            <button
              type="button"
              onClick={() => {
                const population = newPopulation(project);
                onEdit(`add ${population.name}`, (p) => ({ ...p, populations: [...p.populations, population] }));
                setSelectedId(population.id);
              }}
            >
              Add population
            </button>
            <button type="button" onClick={copyTable}>
              Copy table
            </button>
            <button
              type="button"
              onClick={() => setSorting(DEFAULT_SORT)}
              disabled={JSON.stringify(sorting) === JSON.stringify(DEFAULT_SORT)}
            >
              Rank by required n
            </button>
          </div>
        </div>
        {rows.length === 0 ? (
          <p className="muted">This plan has no populations yet. Add one to start.</p>
        ) : (
          <ComparisonTable
            rows={rows}
            totals={totals}
            sorting={sorting}
            onSortingChange={setSorting}
            selectedId={selected?.id ?? null}
            onSelect={setSelectedId}
            invalidIds={invalidIds}
            onOrder={setOrderIds}
          />
        )}
      </section>
      <PooledPanel project={project} rows={rows} onEdit={onEdit} />
      <div className="lower">
        <div className="charts">
          {chartOrder.length > 0 ? <CriterionBars rows={chartOrder} selectedId={chartSelected?.id ?? null} /> : null}
          {chartOrder.length > 0 ? (
            <RecruitmentTimeline
              rows={chartOrder}
              windowMonths={project.study.windowMonths}
              selectedId={chartSelected?.id ?? null}
            />
          ) : null}
          {chartSelected ? <SensitivityChart population={chartSelected} updating={chartUpdating} planner={planner} /> : null}
        </div>
        {selected ? (
          <div className="side">
            {selectedRow !== null && (selectedRow.warnings ?? []).length > 0 ? (
              <ul
                className="plan-warnings"
                data-testid="plan-warnings"
                aria-label={`Cautions about the plan for ${selected.name}`}
              >
                {(selectedRow.warnings ?? []).map((warning) => (
                  <li key={warning} className="warn-mark">
                    ⚠ {warning}
                  </li>
                ))}
              </ul>
            ) : null}
            {selectedRow?.availableN && selectedRow.precisionAtAvailableN ? (
              <PrecisionPanel availableN={selectedRow.availableN} precision={selectedRow.precisionAtAvailableN} />
            ) : null}
            <PopulationEditor
              key={selected.id}
              population={selected}
              onChange={replacePopulation}
              onInvalid={(path, message) =>
                setInvalid((current) => {
                  const fields = current[selected.id] ?? {};
                  // Keep the same object when nothing changes, so the screen is not re-rendered for nothing.
                  if ((message === null && !(path in fields)) || (message !== null && fields[path] === message)) return current;
                  const next = { ...fields };
                  if (message === null) delete next[path];
                  else next[path] = message;
                  return { ...current, [selected.id]: next };
                })
              }
              onDuplicate={() => {
                const result = duplicatePopulation(project, selected.id);
                if (!result.ok) {
                  onStatus(result.error.message);
                  return;
                }
                onEdit(`duplicate ${selected.name}`, () => result.value.project);
                setSelectedId(result.value.population.id);
              }}
              onRemove={() => {
                onEdit(`remove ${selected.name}`, (p) => ({
                  ...p,
                  populations: p.populations.filter((q) => q.id !== selected.id),
                }));
                setSelectedId(null);
                onStatus(`${selected.name} was removed (Undo brings it back).`);
              }}
              {...(onExportPopulation ? { onExport: () => onExportPopulation(selected.id) } : {})}
            />
            <SimulationPanel project={project} rows={rows} populationId={selected.id} onEdit={onEdit} />
          </div>
        ) : null}
      </div>
    </div>
  );
}

/** Rows in the order the table shows them (charts follow the table); rows the table has not placed yet go last. */
function orderBy<T extends { populationId: string }>(rows: readonly T[], ids: readonly string[]): T[] {
  const position = new Map(ids.map((id, index) => [id, index]));
  return [...rows].sort((a, b) => (position.get(a.populationId) ?? Infinity) - (position.get(b.populationId) ?? Infinity));
}
