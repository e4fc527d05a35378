import { useEffect, useMemo, useRef, type KeyboardEvent } from 'react';
import {
  createColumnHelper,
  createSortedRowModel,
  rowSortingFeature,
  sortFn_text,
  tableFeatures,
  useTable,
  type SortingState,
} from '@tanstack/react-table';
import { formatCount, formatMonths } from '@shared/format/numbers';
import type { ComparisonRow, ComparisonTotals } from '@shared/summary/comparison';
import { criterionColumns, type CriterionColumn } from '@shared/summary/criterion-columns';

const features = tableFeatures({ rowSortingFeature, sortedRowModel: createSortedRowModel(), sortFns: { text: sortFn_text } });
const helper = createColumnHelper<typeof features, ComparisonRow>();

const FEASIBILITY_TEXT = { fits: 'fits the window', exceeds: 'exceeds the window', unknown: 'not known' } as const;

function criterionCell(row: ComparisonRow, column: CriterionColumn) {
  const result = row.criteria.find((c) => c.id === column.id);
  if (result === undefined) return <span className="muted">—</span>;
  const binding = row.binding === column.id;
  if (result.n === null) {
    return (
      <span className="muted" title={result.reason}>
        {result.status === 'not-converged' ? 'failed' : 'n/a'}
      </span>
    );
  }
  return (
    <span className={binding ? 'binding' : undefined} title={binding ? `${result.label} binds` : result.label}>
      {formatCount(result.n)}
      {binding ? <span aria-label=" (binding)"> ◆</span> : null}
    </span>
  );
}

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
  const columnsSpec = useMemo(() => criterionColumns(rows), [rows]);
  const columns = useMemo(
    () =>
      helper.columns([
        helper.accessor((row) => row.name, {
          id: 'name',
          header: 'Population',
          sortFn: 'text',
          cell: (info) => (
            <span>
              {info.row.original.name}
              {invalidIds.has(info.row.original.populationId) ? (
                <span className="warn-mark" title="A field holds a rejected entry; the row shows the last accepted values.">
                  {' '}
                  ⚠ input to fix
                </span>
              ) : null}
              {info.row.original.problem ? <span className="field-error"> {info.row.original.problem}</span> : null}
            </span>
          ),
        }),
        helper.accessor((row) => row.requiredN ?? -1, {
          id: 'required',
          header: 'Required n',
          cell: (info) => (
            <span>
              <strong>{formatCount(info.row.original.requiredN)}</strong>
              {info.row.original.bindingLabel ? <span className="muted small"> ({info.row.original.bindingLabel})</span> : null}
            </span>
          ),
        }),
        helper.accessor((row) => row.worstCase?.requiredN ?? -1, {
          id: 'worst',
          header: 'Worst case n',
          cell: (info) => {
            const worst = info.row.original.worstCase;
            if (worst === null) return <span className="muted">no ranges</span>;
            return (
              <span title={worst.assumption}>
                {formatCount(worst.requiredN)} <span className="muted small">({worst.assumption})</span>
              </span>
            );
          },
        }),
        helper.accessor((row) => row.enrolmentTarget ?? -1, {
          id: 'enrol',
          header: 'Enrolment target',
          cell: (info) => formatCount(info.row.original.enrolmentTarget),
        }),
        helper.accessor((row) => row.months ?? Number.POSITIVE_INFINITY, {
          id: 'months',
          header: 'Months to recruit',
          cell: (info) =>
            info.row.original.months === null ? (
              <span className="muted">no accrual given</span>
            ) : (
              formatMonths(info.row.original.months)
            ),
        }),
        helper.accessor((row) => row.finishDate ?? '', {
          id: 'finish',
          header: 'Finish',
          sortFn: 'text',
          cell: (info) => info.row.original.finishDate ?? '—',
        }),
        helper.accessor((row) => ({ fits: 0, unknown: 1, exceeds: 2 })[row.feasibility], {
          id: 'feasible',
          header: 'Feasible',
          cell: (info) => {
            const f = info.row.original.feasibility;
            return (
              <span className={`feasibility feasibility-${f}`}>
                {f === 'fits' ? '✓ ' : f === 'exceeds' ? '✗ ' : ''}
                {FEASIBILITY_TEXT[f]}
              </span>
            );
          },
        }),
        ...columnsSpec.map((spec) =>
          helper.accessor((row) => row.criteria.find((c) => c.id === spec.id)?.n ?? -1, {
            id: `criterion:${spec.id}`,
            header: () => <span title={spec.label}>{spec.header}</span>,
            sortUndefined: 'last',
            cell: (info) => criterionCell(info.row.original, spec),
          }),
        ),
      ]),
    [columnsSpec, invalidIds],
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
            <tr
              key={row.id}
              data-population-id={row.id}
              className={row.id === selectedId ? 'selected' : undefined}
              aria-selected={row.id === selectedId}
              onClick={() => onSelect(row.id)}
            >
              <td tabIndex={index === 0 ? 0 : -1}>{index + 1}</td>
              {row.getAllCells().map((cell) => (
                <td key={cell.id} tabIndex={-1} data-column={cell.column.id}>
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr className="totals">
            <th scope="row">Total</th>
            <td>{totals.populations} populations</td>
            <td />
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
