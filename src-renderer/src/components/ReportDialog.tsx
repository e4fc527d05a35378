import { useEffect, useRef, useState } from 'react';
import type { Project } from '@shared/model/project';
import { justificationDocument } from '@shared/report/plan-justification';
import { renderMarkdown } from '@shared/report/render-markdown';
import { renderText } from '@shared/report/render-text';
import type { Planner } from '@shared/summary/comparison';
import { pooledReportSections } from '@shared/summary/pooled-report-section';
import { call } from '../api/client';
import type { PickPurpose } from './FilePicker';

type Pick = (purpose: PickPurpose, then: (path: string) => void, suggestedName?: string) => void;

export interface ReportDialogProps {
  readonly project: Project;
  /** The plan's file (named in the report's reproducibility footer); null when unsaved. */
  readonly planPath: string | null;
  readonly planner: Planner;
  /** File names are suggested as this plus the format's extension. */
  readonly baseName: string;
  readonly pick: Pick;
  readonly onClose: () => void;
}

interface Outcome {
  readonly ok: boolean;
  readonly text: string;
}

function message(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/**
 * The report commands: copy the justification text (plain or Markdown; computed here, the
 * report module is pure), save the full report as PDF or Markdown, export the tables as CSV or
 * XLSX (written by the main process). Each says whether it worked.
 */
export function ReportDialog({ project, planPath, planner, baseName, pick, onClose }: ReportDialogProps) {
  const dialog = useRef<HTMLDialogElement>(null);
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const [busy, setBusy] = useState<string | null>(null);
  const [table, setTable] = useState<'comparison' | 'criteria'>('comparison');

  useEffect(() => {
    dialog.current?.showModal();
  }, []);

  const copy = (as: 'text' | 'markdown'): void => {
    let text: string;
    try {
      const doc = justificationDocument({ project, planner, extraSections: pooledReportSections(project) });
      text = as === 'text' ? renderText(doc) : renderMarkdown(doc);
    } catch (error) {
      setOutcome({ ok: false, text: `The justification text could not be made: ${message(error)}` });
      return;
    }
    navigator.clipboard.writeText(text).then(
      () => setOutcome({ ok: true, text: `The justification was copied as ${as === 'text' ? 'plain text' : 'Markdown'}.` }),
      () => setOutcome({ ok: false, text: 'The clipboard is not available here; nothing was copied.' }),
    );
  };

  const run = (doing: string, task: () => Promise<{ path: string }>, done: string): void => {
    setBusy(doing);
    setOutcome(null);
    task()
      .then(
        (written) => setOutcome({ ok: true, text: `${done} ${written.path}.` }),
        (error: unknown) => setOutcome({ ok: false, text: `${doing.replace(/…$/, '')} failed: ${message(error)}` }),
      )
      .finally(() => setBusy(null));
  };

  const saveReport = (format: 'pdf' | 'md'): void =>
    pick(
      format === 'pdf' ? 'report-pdf' : 'report-md',
      (path) =>
        run(
          format === 'pdf' ? 'Printing the PDF…' : 'Writing the Markdown report…',
          () => call('exportReport', { project, planPath, format, path }),
          'The report was saved to',
        ),
      `${baseName} report.${format}`,
    );

  const exportCsv = (): void =>
    pick(
      'table-csv',
      (path) =>
        run(
          'Writing the CSV file…',
          () => call('exportTable', { project, planPath, format: 'csv', table, path }),
          'The table was exported to',
        ),
      `${baseName} ${table === 'comparison' ? 'comparison' : 'criteria'}.csv`,
    );

  const exportXlsx = (): void =>
    pick(
      'table-xlsx',
      (path) =>
        run(
          'Writing the workbook…',
          () => call('exportTable', { project, planPath, format: 'xlsx', path }),
          'The tables were exported to',
        ),
      `${baseName}.xlsx`,
    );

  const disabled = busy !== null;
  return (
    <dialog ref={dialog} aria-labelledby="report-title" onCancel={onClose} onClose={onClose} data-testid="report-dialog">
      <h2 id="report-title">Report</h2>
      <p className="muted">
        The justification text states every anticipated value with its source, every precision target, the n of each criterion
        with its formula and numbered references, the binding criterion, the worst case, enrolment and recruitment.
      </p>
      <h3>Copy the justification</h3>
      <div className="buttons">
        <button type="button" onClick={() => copy('text')} disabled={disabled}>
          Copy as plain text
        </button>
        <button type="button" onClick={() => copy('markdown')} disabled={disabled}>
          Copy as Markdown
        </button>
      </div>
      <h3>Save the full report</h3>
      <p className="muted small">
        With the comparison tables, the charts, the assumptions, the references, the cautions and a content hash of the plan.
      </p>
      <div className="buttons">
        <button type="button" onClick={() => saveReport('pdf')} disabled={disabled}>
          Save PDF…
        </button>
        <button type="button" onClick={() => saveReport('md')} disabled={disabled}>
          Save Markdown…
        </button>
      </div>
      <h3>Export the tables</h3>
      <div className="buttons">
        <label>
          CSV of{' '}
          <select
            value={table}
            onChange={(event) => setTable(event.target.value === 'criteria' ? 'criteria' : 'comparison')}
            disabled={disabled}
          >
            <option value="comparison">the comparison table</option>
            <option value="criteria">each criterion of each population</option>
          </select>
        </label>
        <button type="button" onClick={exportCsv} disabled={disabled}>
          Export CSV…
        </button>
        <button type="button" onClick={exportXlsx} disabled={disabled} title="One workbook with both tables and an About sheet">
          Export XLSX…
        </button>
      </div>
      {busy !== null ? (
        <p className="status" role="status" data-testid="report-status">
          {busy}
        </p>
      ) : outcome !== null ? (
        <p
          className={outcome.ok ? 'status' : 'status field-error'}
          role={outcome.ok ? 'status' : 'alert'}
          data-testid="report-status"
        >
          {outcome.text}
        </p>
      ) : null}
      <div className="buttons">
        <button type="button" onClick={onClose}>
          Close
        </button>
      </div>
    </dialog>
  );
}
