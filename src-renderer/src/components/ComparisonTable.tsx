import { memo, useEffect, useMemo, useRef, type KeyboardEvent, type ReactNode } from 'react';
import {
  createColumnHelper,
  createSortedRowModel,
  rowSortingFeature,
  sortFn_text,
  tableFeatures,
  useTable,
  type SortingState,
} from '@tanstack/react-table';
import { formatCount, formatMonths, formatSignificant } from '@shared/format/numbers';
import type { ComparisonRow, ComparisonTotals } from '@shared/summary/comparison';
import { criterionColumns, type CriterionColumn } from '@shared/summary/criterion-columns';
import { hasEvents } from '@shared/summary/table-cells';

const features = tableFeatures({ rowSortingFeature, sortedRowModel: createSortedRowModel(), sortFns: { text: sortFn_text } });
const helper = createColumnHelper<typeof features, ComparisonRow>();

const FEASIBILITY_TEXT = { fits: 'fits the window', exceeds: 'exceeds the window', unknown: 'not known' } as const;

/** How one body cell shows a row; `invalid` marks a population with a rejected entry. */
type CellRenderer = (row: ComparisonRow, invalid: boolean) => ReactNode;

function criterionCell(row: ComparisonRow, column: CriterionColumn): ReactNode {
  const result = row.criteria.find((c) => c.id === column.id);
  if (result === undefined) return <span className="muted">—</span>;
  if (result.n === null) {
    return (
      <span className="muted" title={result.reason}>
        {result.status === 'not-converged' ? 'failed' : 'n/a'}
      </span>
    );
  }
  const binding = row.binding === column.id;
  return (
    <span className={binding ? 'binding' : undefined} title={binding ? `${result.label} binds` : result.label}>
      {formatCount(result.n)}
      {binding ? <span aria-label=" (binding)"> ◆</span> : null}
    </span>
  );
}

const FIXED_RENDERERS: Readonly<Record<string, CellRenderer>> = {
  name: (row, invalid) => (
    <span>
      {row.name}
      {invalid ? (
        <span className="warn-mark" title="A field holds a rejected entry; the row shows the last accepted values.">
          {' '}
          ⚠ input to fix
        </span>
      ) : null}
      {row.problem ? <span className="field-error"> {row.problem}</span> : null}
    </span>
  ),
  required: (row) => (
    <span>
      <strong>{formatCount(row.requiredN)}</strong>
      {row.bindingLabel ? <span className="muted small"> ({row.bindingLabel})</span> : null}
    </span>
  ),
  worst: (row) =>
    row.worstCase === null ? (
      <span className="muted">no ranges</span>
    ) : (
      <span title={row.worstCase.assumption}>
        {formatCount(row.worstCase.requiredN)} <span className="muted small">({row.worstCase.assumption})</span>
      </span>
    ),
  events: (row) =>
    row.events === undefined || row.events === null ? (
      <span className="muted">—</span>
    ) : (
      <span
        title={`${formatSignificant(row.events.exact)} events expected at the required n${row.eventsPerParameter === undefined || row.eventsPerParameter === null ? '' : `; ${formatSignificant(row.eventsPerParameter, 3)} per predictor parameter`}`}
      >
        {formatCount(row.events.whole)}
        {(row.warnings ?? []).length > 0 ? (
          <span className="warn-mark" title={(row.warnings ?? []).join('\n')}>
            {' '}
            ⚠
          </span>
        ) : null}
      </span>
    ),
  enrol: (row) => formatCount(row.enrolmentTarget),
  months: (row) => (row.months === null ? <span className="muted">no accrual given</span> : formatMonths(row.months)),
  finish: (row) => row.finishDate ?? '—',
  feasible: (row) => (
    <span className={`feasibility feasibility-${row.feasibility}`}>
      {row.feasibility === 'fits' ? '✓ ' : row.feasibility === 'exceeds' ? '✗ ' : ''}
      {FEASIBILITY_TEXT[row.feasibility]}
    </span>
  ),
};

interface BodyRowProps {
  readonly row: ComparisonRow;
  readonly rank: number;
  readonly selected: boolean;
  readonly invalid: boolean;
  readonly columns: readonly { readonly id: string; readonly render: CellRenderer }[];
  readonly onSelect: (populationId: string) => void;
}

/** One population's row; memoised, so an edit re-renders only the rows whose data or rank changed. */
const BodyRow = memo(function BodyRow({ row, rank, selected, invalid, columns, onSelect }: BodyRowProps) {
  return (
    <tr
      data-population-id={row.populationId}
      className={selected ? 'selected' : undefined}
      aria-selected={selected}
      onClick={() => onSelect(row.populationId)}
    >
      <td tabIndex={rank === 1 ? 0 : -1}>{rank}</td>
      {columns.map((column) => (
        <td key={column.id} tabIndex={-1} data-column={column.id}>
          {column.render(row, invalid)}
        </td>
      ))}
    </tr>
  );
});

export interface ComparisonTableProps {
  readonly rows: readonly ComparisonRow[];
  readonly totals: ComparisonTotals;
  readonly sorting: SortingState;
  readonly onSortingChange: (sorting: SortingState) => void;
  readonly selectedId: string | null;
  readonly onSelect: (populationId: string) => void;
  /** Receives the rows in display order whenever it changes (charts follow it). */
  readonly onOrder?: (ids: readonly string[]) => void;
  readonly invalidIds: ReadonlySet<string>;
}

export function ComparisonTable({
  rows,
  totals,
  sorting,
  onSortingChange,
  selectedId,
  onSelect,
  onOrder,
  invalidIds,
}: ComparisonTableProps) {
  const currentSpec = criterionColumns(rows);
  const specKey = currentSpec.map((c) => `${c.id}|${c.header}|${c.label}|${c.purpose}`).join('\n');
  // Rebuilt only when the set of criterion columns changes, not on every edit.
  const columnsSpec = useMemo(() => currentSpec, [specKey]);
  // Binary plans: expected events beside the required n (planners think in events).
  const withEvents = hasEvents(rows);
  const fixedIds = useMemo(
    () => ['name', 'required', ...(withEvents ? ['events'] : []), 'worst', 'enrol', 'months', 'finish', 'feasible'],
    [withEvents],
  );

  const columns = useMemo(
    () =>
      helper.columns([
        helper.accessor((row) => row.name, { id: 'name', header: 'Population', sortFn: 'text' }),
        helper.accessor((row) => row.requiredN ?? -1, { id: 'required', header: 'Required n' }),
        ...(withEvents
          ? [helper.accessor((row) => row.events?.whole ?? -1, { id: 'events', header: 'Events at required n' })]
          : []),
        helper.accessor((row) => row.worstCase?.requiredN ?? -1, { id: 'worst', header: 'Worst case n' }),
        helper.accessor((row) => row.enrolmentTarget ?? -1, { id: 'enrol', header: 'Enrolment target' }),
        helper.accessor((row) => row.months ?? Number.POSITIVE_INFINITY, { id: 'months', header: 'Months to recruit' }),
        helper.accessor((row) => row.finishDate ?? '', { id: 'finish', header: 'Finish', sortFn: 'text' }),
        helper.accessor((row) => ({ fits: 0, unknown: 1, exceeds: 2 })[row.feasibility], { id: 'feasible', header: 'Feasible' }),
        ...columnsSpec.map((spec) =>
          helper.accessor((row) => row.criteria.find((c) => c.id === spec.id)?.n ?? -1, {
            id: `criterion:${spec.id}`,
            header: () => <span title={spec.label}>{spec.header}</span>,
          }),
        ),
      ]),
    [columnsSpec, withEvents],
  );
  const renderers = useMemo(
    () => [
      ...fixedIds.map((id) => ({
        id,
        render: FIXED_RENDERERS[id] as CellRenderer,
      })),
      ...columnsSpec.map((spec) => ({ id: `criterion:${spec.id}`, render: (row: ComparisonRow) => criterionCell(row, spec) })),
    ],
    [columnsSpec, fixedIds],
  );

  const data = useMemo(() => [...rows], [rows]);
  const table = useTable({
    features,
    columns,
    data,
    getRowId: (row) => row.populationId,
    state: { sorting },
    onSortingChange: (updater) => onSortingChange(typeof updater === 'function' ? updater(sorting) : updater),
  });

  const gridRef = useRef<HTMLTableElement>(null);
  const onKeyDown = (event: KeyboardEvent<HTMLTableElement>): void => {
    const cell = (event.target as HTMLElement).closest('td,th');
    if (cell === null || gridRef.current === null) return;
    const rowEl = cell.parentElement as HTMLTableRowElement;
    const allRows = Array.from(gridRef.current.querySelectorAll('tr'));
    let r = allRows.indexOf(rowEl);
    let c = Array.from(rowEl.children).indexOf(cell);
    if (event.key === 'ArrowDown') r += 1;
    else if (event.key === 'ArrowUp') r -= 1;
    else if (event.key === 'ArrowRight') c += 1;
    else if (event.key === 'ArrowLeft') c -= 1;
    else if (event.key === 'Home') c = 0;
    else if (event.key === 'End') c = rowEl.children.length - 1;
    else if (event.key === 'Enter' || event.key === ' ') {
      const id = rowEl.dataset['populationId'];
      if (id !== undefined) {
        event.preventDefault();
        onSelect(id);
      }
      return;
    } else return;
    event.preventDefault();
    const target = allRows[Math.max(0, Math.min(allRows.length - 1, r))]?.children[Math.max(0, c)] as HTMLElement | undefined;
    if (target) {
      const focusable = target.querySelector<HTMLElement>('button') ?? target;
      focusable.focus();
    }
  };

  const rendered = table.getRowModel().rows;
  const orderKey = rendered.map((row) => row.id).join('\u0000');
  useEffect(() => {
    onOrder?.(orderKey === '' ? [] : orderKey.split('\u0000'));
  }, [orderKey, onOrder]);

  return (
    <div className="table-wrap" role="region" aria-label="Comparison of populations" tabIndex={-1}>
      <table ref={gridRef} className="comparison" data-testid="comparison-table" onKeyDown={onKeyDown}>
        <caption>
          Minimum sample size per population; ◆ marks the criterion that binds. Arrow keys move between cells; Enter opens a
          population.
        </caption>
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              <th scope="col">Rank</th>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'}
                  >
                    <button type="button" className="sort" onClick={header.column.getToggleSortingHandler()} tabIndex={-1}>
                      <table.FlexRender header={header} />
                      {sorted === 'asc' ? ' ▲' : sorted === 'desc' ? ' ▼' : ''}
                    </button>
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rendered.map((row, index) => (
            <BodyRow
              key={row.id}
              row={row.original}
              rank={index + 1}
              selected={row.id === selectedId}
              invalid={invalidIds.has(row.id)}
              columns={renderers}
              onSelect={onSelect}
            />
          ))}
        </tbody>
        <tfoot>
          <tr className="totals">
            <th scope="row">Total</th>
            <td>{totals.populations} populations</td>
            <td />
            {withEvents ? <td /> : null}
            <td />
            <td data-testid="total-enrolment">
              <strong>{formatCount(totals.enrolmentTarget)}</strong>
              {totals.unplanned > 0 ? <span className="muted small"> ({totals.unplanned} not planned)</span> : null}
            </td>
            <td data-testid="longest-recruitment">
              {totals.longestMonths === null ? '—' : `${formatMonths(totals.longestMonths)} (${totals.longestSite ?? ''})`}
            </td>
            <td />
            <td>{totals.exceeding > 0 ? `${totals.exceeding} exceed the window` : ''}</td>
            {columnsSpec.map((spec) => (
              <td key={spec.id} />
            ))}
          </tr>
        </tfoot>
      </table>
    </div>
  );
}
