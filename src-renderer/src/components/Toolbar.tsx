export interface ToolbarActions {
  readonly newPlan: () => void;
  readonly newFromDemo: () => void;
  readonly newFromBinaryDemo: () => void;
  readonly open: () => void;
  readonly save: () => void;
  readonly saveAs: () => void;
  readonly revert: () => void;
  readonly importPopulations: () => void;
  readonly report: () => void;
  readonly undo: () => void;
  readonly redo: () => void;
}

/** File and edit commands, the same as the desktop menu (the browser host has no menu). */
export function Toolbar({
  actions,
  canUndo,
  canRedo,
  canRevert,
  undoLabel,
  redoLabel,
}: {
  readonly actions: ToolbarActions;
  readonly canUndo: boolean;
  readonly canRedo: boolean;
  readonly canRevert: boolean;
  readonly undoLabel: string | null;
  readonly redoLabel: string | null;
}) {
  return (
    <nav className="toolbar" aria-label="Plan commands">
      <button type="button" onClick={actions.newPlan}>
        New
      </button>
      <button type="button" onClick={actions.newFromDemo}>
        New from demo
      </button>
      <button type="button" onClick={actions.newFromBinaryDemo}>
        New from binary demo
      </button>
      <button type="button" onClick={actions.open} title="Ctrl+O">
        Open…
      </button>
      <button type="button" onClick={actions.save} title="Ctrl+S">
        Save
      </button>
      <button type="button" onClick={actions.saveAs} title="Ctrl+Shift+S">
        Save as…
      </button>
      <button type="button" onClick={actions.revert} disabled={!canRevert}>
        Revert
      </button>
      <button type="button" onClick={actions.importPopulations}>
        Import populations…
      </button>
      <button
        type="button"
        onClick={actions.report}
        title="Copy the justification text, save the report as PDF or Markdown, export the tables"
      >
        Report…
      </button>
      <button
        type="button"
        onClick={actions.undo}
        disabled={!canUndo}
        title={undoLabel ? `Undo ${undoLabel} (Ctrl+Z)` : 'Nothing to undo'}
      >
        Undo
      </button>
      <button
        type="button"
        onClick={actions.redo}
        disabled={!canRedo}
        title={redoLabel ? `Redo ${redoLabel} (Ctrl+Shift+Z)` : 'Nothing to redo'}
      >
        Redo
      </button>
    </nav>
  );
}
