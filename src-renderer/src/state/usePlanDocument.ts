import { useCallback, useEffect, useReducer, useRef } from 'react';
import type { Project } from '@shared/model/project';
import { newEmptyProject } from '@shared/model/new-project';
import { documentReducer, initialDocument, isDirty, type DocumentState } from './document';

/** Autosave waits this long after the last edit (ms). */
export const AUTOSAVE_DELAY_MS = 1500;

function newDocumentId(): string {
  return crypto.randomUUID();
}

export interface PlanDocument {
  readonly state: DocumentState;
  readonly documentId: string;
  readonly dirty: boolean;
  readonly edit: (label: string, change: (project: Project) => Project) => void;
  readonly undo: () => void;
  readonly redo: () => void;
  /** Replaces the document (open, new, restore); a new document id unless one is given. */
  readonly load: (project: Project, path: string | null, options?: { saved?: boolean; documentId?: string }) => void;
  /** Records a successful save of the current value at `path` (undo history is kept). */
  readonly markSaved: (path: string) => void;
}

/**
 * The open plan with undo/redo, and autosave of unsaved changes to the recovery area through
 * `autosave` (the main process writes it atomically in the user-data folder).
 */
export function usePlanDocument(
  autosave: (documentId: string, path: string | null, project: Project) => Promise<void>,
): PlanDocument {
  const [state, dispatch] = useReducer(documentReducer, undefined, () => initialDocument(newEmptyProject()));
  const documentId = useRef(newDocumentId());
  const dirty = isDirty(state);

  useEffect(() => {
    if (!dirty) return;
    const timer = setTimeout(() => {
      void autosave(documentId.current, state.path, state.project);
    }, AUTOSAVE_DELAY_MS);
    return () => clearTimeout(timer);
  }, [dirty, state.project, state.path, autosave]);

  const edit = useCallback(
    (label: string, change: (project: Project) => Project) => dispatch({ type: 'edit', label, change }),
    [],
  );
  const undo = useCallback(() => dispatch({ type: 'undo' }), []);
  const redo = useCallback(() => dispatch({ type: 'redo' }), []);
  const load = useCallback((project: Project, path: string | null, options: { saved?: boolean; documentId?: string } = {}) => {
    documentId.current = options.documentId ?? newDocumentId();
    dispatch({ type: 'load', project, path, saved: options.saved ?? true });
  }, []);
  const markSaved = useCallback((path: string) => dispatch({ type: 'saved', path }), []);

  return { state, documentId: documentId.current, dirty, edit, undo, redo, load, markSaved };
}
