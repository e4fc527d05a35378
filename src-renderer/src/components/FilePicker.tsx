import { useEffect, useRef, useState } from 'react';
import type { ResponseOf } from '@shared/model/contract';
import { FILE_EXTENSION } from '@shared/model/project';
import { call } from '../api/client';

export type PickPurpose = 'open' | 'save' | 'import' | 'export' | 'report-pdf' | 'report-md' | 'table-csv' | 'table-xlsx';

const TITLES: Readonly<Record<PickPurpose, string>> = {
  open: 'Open a plan',
  save: 'Save the plan as',
  import: 'Import populations from a plan',
  export: 'Export the population as a plan',
  'report-pdf': 'Save the report as PDF',
  'report-md': 'Save the report as Markdown',
  'table-csv': 'Export the table as CSV',
  'table-xlsx': 'Export the tables as an Excel workbook',
};

/** The extension a saved file gets. */
const EXTENSIONS: Readonly<Record<PickPurpose, string>> = {
  open: FILE_EXTENSION,
  save: FILE_EXTENSION,
  import: FILE_EXTENSION,
  export: FILE_EXTENSION,
  'report-pdf': '.pdf',
  'report-md': '.md',
  'table-csv': '.csv',
  'table-xlsx': '.xlsx',
};

export interface FilePickerProps {
  readonly purpose: PickPurpose;
  readonly suggestedName?: string;
  readonly startFolder?: string;
  readonly onChoose: (path: string) => void;
  readonly onCancel: () => void;
}

/** The in-page file picker, used where the host has no native dialog (the browser host). */
export function FilePicker({ purpose, suggestedName, startFolder, onChoose, onCancel }: FilePickerProps) {
  const dialog = useRef<HTMLDialogElement>(null);
  const [folder, setFolder] = useState<ResponseOf<'listFolder'> | null>(null);
  const [name, setName] = useState(suggestedName ?? '');
  const [error, setError] = useState<string | null>(null);
  const saving = purpose !== 'open' && purpose !== 'import';
  const extension = EXTENSIONS[purpose];

  const list = (path?: string): void => {
    call('listFolder', path === undefined ? {} : { path }).then(
      (listing) => {
        setFolder(listing);
        setError(null);
      },
      (e: unknown) => setError(e instanceof Error ? e.message : String(e)),
    );
  };

  useEffect(() => {
    dialog.current?.showModal();
    list(startFolder);
  }, [startFolder]);

  const choose = (): void => {
    const typed = name.trim();
    if (typed === '') {
      setError(saving ? 'Give the file a name.' : 'Choose a plan file, or type its path.');
      return;
    }
    const isAbsolute = typed.startsWith('/') || /^[A-Za-z]:[\\/]/.test(typed);
    const base = isAbsolute || folder === null ? typed : `${folder.path}${folder.path.endsWith('/') ? '' : '/'}${typed}`;
    onChoose(saving && !base.toLowerCase().endsWith(extension) ? `${base}${extension}` : base);
  };

  return (
    <dialog ref={dialog} aria-labelledby="picker-title" onCancel={onCancel} data-testid="file-picker">
      <h2 id="picker-title">{TITLES[purpose]}</h2>
      <p className="muted">
        Folder: <code>{folder?.path ?? '…'}</code>
      </p>
      <ul className="file-list" aria-label="Folder contents">
        {folder?.parent ? (
          <li>
            <button type="button" onClick={() => list(folder.parent ?? undefined)}>
              ⬑ up to {folder.parent}
            </button>
          </li>
        ) : null}
        {folder?.entries.map((entry) => (
          <li key={entry.path}>
            <button
              type="button"
              onClick={() => (entry.kind === 'folder' ? list(entry.path) : setName(entry.name))}
              onDoubleClick={() => (entry.kind === 'plan' ? onChoose(entry.path) : undefined)}
            >
              {entry.kind === 'folder' ? '📁 ' : '📄 '}
              {entry.name}
            </button>
          </li>
        ))}
        {folder?.entries.length === 0 ? <li className="muted">No folders or plan files here.</li> : null}
      </ul>
      <div className="field">
        <label htmlFor="picker-name">
          {saving ? `File name (${extension} is added)` : 'Plan file (name in this folder, or a full path)'}
        </label>
        <input
          id="picker-name"
          type="text"
          value={name}
          onChange={(event) => setName(event.target.value)}
          onKeyDown={(event) => {
            if (event.key === 'Enter') choose();
          }}
        />
      </div>
      {error ? (
        <p className="field-error" role="alert">
          {error}
        </p>
      ) : null}
      <div className="buttons">
        <button type="button" className="primary" onClick={choose}>
          {saving ? 'Save' : purpose === 'import' ? 'Choose' : 'Open'}
        </button>
        <button type="button" onClick={onCancel}>
          Cancel
        </button>
      </div>
    </dialog>
  );
}
