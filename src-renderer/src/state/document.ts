// The open plan as an immutable value with undo/redo. Every edit goes through `edit`, so every
// edit can be undone; "unsaved" means the current value is not the one last saved or opened.
import type { Project } from '@shared/model/project';

export const UNDO_LIMIT = 500;

export interface DocumentState {
  readonly project: Project;
  /** Where the plan lives on disk; null for a plan never saved. */
  readonly path: string | null;
  /** The value last saved or opened (compared by identity). */
  readonly saved: Project | null;
  readonly past: readonly { readonly project: Project; readonly label: string }[];
  readonly future: readonly { readonly project: Project; readonly label: string }[];
  /** What the last edit did, for the undo button's title. */
  readonly lastLabel: string | null;
}

export type DocumentAction =
  | { readonly type: 'load'; readonly project: Project; readonly path: string | null; readonly saved: boolean }
  | { readonly type: 'edit'; readonly label: string; readonly change: (project: Project) => Project }
  | { readonly type: 'undo' }
  | { readonly type: 'redo' }
  | { readonly type: 'saved'; readonly path: string };

export function initialDocument(project: Project, path: string | null = null, saved = true): DocumentState {
  return { project, path, saved: saved ? project : null, past: [], future: [], lastLabel: null };
}

export function documentReducer(state: DocumentState, action: DocumentAction): DocumentState {
  switch (action.type) {
    case 'load':
      return initialDocument(action.project, action.path, action.saved);
    case 'edit': {
      const next = action.change(state.project);
      if (next === state.project) return state;
      const past = [...state.past, { project: state.project, label: action.label }].slice(-UNDO_LIMIT);
      return { ...state, project: next, past, future: [], lastLabel: action.label };
    }
    case 'undo': {
      const previous = state.past.at(-1);
      if (previous === undefined) return state;
      return {
        ...state,
        project: previous.project,
        past: state.past.slice(0, -1),
        future: [{ project: state.project, label: previous.label }, ...state.future],
        lastLabel: state.past.at(-2)?.label ?? null,
      };
    }
    case 'redo': {
      const next = state.future[0];
      if (next === undefined) return state;
      return {
        ...state,
        project: next.project,
        past: [...state.past, { project: state.project, label: next.label }],
        future: state.future.slice(1),
        lastLabel: next.label,
      };
    }
    case 'saved':
      return { ...state, path: action.path, saved: state.project };
  }
}

export function isDirty(state: DocumentState): boolean {
  return state.saved !== state.project;
}
