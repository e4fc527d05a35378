import { useCallback, useEffect, useState } from 'react';
import type { ResponseOf } from '@shared/model/contract';
import type { Project } from '@shared/model/project';
import { newEmptyProject } from '@shared/model/new-project';
import { enginePlanner } from '@shared/summary/planner';
import { call } from './api/client';
import { AboutDialog } from './components/AboutDialog';
import { Cautions } from './components/Cautions';
import { FilePicker, type PickPurpose } from './components/FilePicker';
import { RecoveryPrompt } from './components/RecoveryPrompt';
import { ReportDialog } from './components/ReportDialog';
import { Toolbar } from './components/Toolbar';
import { Workspace } from './components/Workspace';
import { usePlanDocument } from './state/usePlanDocument';

type Recoverable = ResponseOf<'listRecovery'>['items'][number];

interface Picking {
  readonly purpose: PickPurpose;
  readonly suggestedName?: string;
  readonly then: (path: string) => void;
}

function message(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

function fileNameFor(project: Project): string {
  return `${project.name.replace(/[\\/:*?"<>|]+/g, ' ').trim() || 'plan'}.plumb`;
}

export function App() {
  const autosave = useCallback(async (documentId: string, path: string | null, project: Project) => {
    try {
      await call('autosave', { documentId, path, project });
    } catch {
      // Autosave is a safety net; a failure here must not interrupt editing. The next edit retries.
    }
  }, []);
  const doc = usePlanDocument(autosave);
  const [info, setInfo] = useState<ResponseOf<'appInfo'> | null>(null);
  const [status, setStatus] = useState<string | null>(null);
  const [lockWarning, setLockWarning] = useState<string | null>(null);
  const [recoverable, setRecoverable] = useState<readonly Recoverable[]>([]);
  const [picking, setPicking] = useState<Picking | null>(null);
  const [ready, setReady] = useState(false);
  const [aboutOpen, setAboutOpen] = useState(false);
  const [reportOpen, setReportOpen] = useState(false);
  const { state, dirty } = doc;

  const report = (text: string): void => setStatus(text);
  const fail = (what: string) => (error: unknown) => setStatus(`${what}: ${message(error)}`);

  const pick = (purpose: PickPurpose, then: (path: string) => void, suggestedName?: string): void => {
    call('chooseFile', { purpose, ...(suggestedName === undefined ? {} : { suggestedName }) }).then((choice) => {
      if (choice.native) {
        if (choice.path !== null) then(choice.path);
      } else setPicking({ purpose, then, ...(suggestedName === undefined ? {} : { suggestedName }) });
    }, fail('No file could be chosen'));
  };

  const confirmDiscard = (): boolean => !dirty || window.confirm('This plan has unsaved changes. Discard them?');

  const openPath = (path: string, takeOverLock = false): void => {
    const previous = { path: state.path, documentId: doc.documentId };
    const documentId = crypto.randomUUID();
    call('openPlan', { path, documentId, takeOverLock }).then(
      (opened) => {
        doc.load(opened.project, opened.path, { documentId });
        void call('closePlan', previous).catch(() => undefined);
        setLockWarning(opened.lock.status === 'held-elsewhere' ? opened.lock.warning.message : null);
        const notes = [
          opened.migratedFrom === null
            ? null
            : `It was written by an older version (schema ${opened.migratedFrom}) and has been updated; saving writes the new version.`,
          ...opened.warnings,
        ];
        report([`Opened ${opened.path}.`, ...notes.filter((n) => n !== null)].join(' '));
      },
      fail(`${path} was not opened`),
    );
  };

  const saveTo = (path: string): void => {
    call('savePlan', { path, project: state.project, documentId: doc.documentId, previousPath: state.path }).then((saved) => {
      doc.markSaved(saved.path);
      setLockWarning(saved.lock.status === 'held-elsewhere' ? saved.lock.warning.message : null);
      report(
        [
          `Saved ${saved.path}${saved.backupPath ? ` (previous version kept as ${saved.backupPath})` : ''}.`,
          ...saved.warnings,
        ].join(' '),
      );
    }, fail('The plan was not saved'));
  };

  const newFromDemo = (which: 'continuous' | 'binary', what: string): void => {
    if (!confirmDiscard()) return;
    call('loadDemo', { which }).then((demo) => {
      doc.load(demo.project, null);
      report(`A new plan from ${what} (fictional). Save it to keep it.`);
    }, fail('The demo could not be loaded'));
  };

  const actions = {
    newPlan: () => {
      if (confirmDiscard()) {
        doc.load(newEmptyProject(), null);
        report('A new, empty plan. Add populations to start.');
      }
    },
    newFromDemo: () => newFromDemo('continuous', 'the demo consortium'),
    newFromBinaryDemo: () => newFromDemo('binary', 'the binary-outcome demo consortium'),
    open: () => {
      if (confirmDiscard()) pick('open', (path) => openPath(path));
    },
    save: () => (state.path === null ? actions.saveAs() : saveTo(state.path)),
    saveAs: () => pick('save', saveTo, fileNameFor(state.project)),
    revert: () => {
      if (state.path === null) return;
      if (!window.confirm('Go back to the version last saved on disk? Unsaved changes are lost.')) return;
      const path = state.path;
      call('revertPlan', { path }).then((read) => {
        doc.load(read.project, read.path, { documentId: doc.documentId });
        report(`Reverted to the saved ${read.path}.`);
      }, fail('Revert failed'));
    },
    importPopulations: () =>
      pick('import', (sourcePath) => {
        call('importPopulations', { project: state.project, sourcePath }).then((result) => {
          doc.edit(`import ${result.imported.length} populations`, () => result.project);
          report(`Imported ${result.imported.length} populations: ${result.imported.map((p) => p.name).join(', ')}.`);
        }, fail('Nothing was imported'));
      }),
    report: () => setReportOpen(true),
    undo: doc.undo,
    redo: doc.redo,
  };

  const exportPopulation = (populationId: string): void => {
    const population = state.project.populations.find((p) => p.id === populationId);
    if (population === undefined) return;
    pick(
      'export',
      (path) => {
        call('exportPopulation', { project: state.project, populationId, path }).then(
          (written) => report(`Exported ${population.name} to ${written.path}.`),
          fail('The population was not exported'),
        );
      },
      `${population.name.replace(/[\\/:*?"<>|]+/g, ' ').trim() || 'population'}.plumb`,
    );
  };

  // First start: offer unsaved work left by a crash; otherwise open the demo consortium.
  useEffect(() => {
    let live = true;
    void (async () => {
      try {
        const [appInfo, recovery] = await Promise.all([call('appInfo', {}), call('listRecovery', {})]);
        if (!live) return;
        setInfo(appInfo);
        const left = recovery.items.filter((item) => !item.inUse && item.problem === null);
        setRecoverable(left);
        const demo = await call('loadDemo', { which: 'continuous' });
        if (!live) return;
        doc.load(demo.project, null, { saved: true });
      } catch (error) {
        if (live) setStatus(`Plumbline could not start cleanly: ${message(error)}`);
      } finally {
        if (live) setReady(true);
      }
    })();
    return () => {
      live = false;
    };
  }, []);

  // Commands from the desktop menu (the browser host has the toolbar only).
  useEffect(() => {
    const menu = window.plumblineMenu;
    if (menu === undefined) return;
    return menu.onCommand((command) => {
      const run = {
        new: actions.newPlan,
        'new-demo': actions.newFromDemo,
        open: actions.open,
        save: actions.save,
        'save-as': actions.saveAs,
        revert: actions.revert,
        undo: doc.undo,
        redo: doc.redo,
        about: () => setAboutOpen(true),
      }[command];
      run();
    });
  });

  // Keyboard shortcuts outside text fields (inside them the field's own undo applies).
  useEffect(() => {
    const onKey = (event: KeyboardEvent): void => {
      const target = event.target as HTMLElement | null;
      const inField =
        target !== null && (target.tagName === 'INPUT' || target.tagName === 'TEXTAREA' || target.tagName === 'SELECT');
      const mod = event.ctrlKey || event.metaKey;
      if (!mod) return;
      const key = event.key.toLowerCase();
      if (key === 's') {
        event.preventDefault();
        if (event.shiftKey) actions.saveAs();
        else actions.save();
      } else if (key === 'o') {
        event.preventDefault();
        actions.open();
      } else if (!inField && key === 'z') {
        event.preventDefault();
        if (event.shiftKey) doc.redo();
        else doc.undo();
      } else if (!inField && key === 'y') {
        event.preventDefault();
        doc.redo();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  });

  // Leaving the page with unsaved changes asks first (the autosave keeps them anyway).
  useEffect(() => {
    const onLeave = (event: BeforeUnloadEvent): void => {
      if (dirty) event.preventDefault();
    };
    window.addEventListener('beforeunload', onLeave);
    return () => window.removeEventListener('beforeunload', onLeave);
  }, [dirty]);

  const title = `${state.project.name}${dirty ? ' •' : ''}`;
  useEffect(() => {
    document.title = `${title} — Plumbline`;
  }, [title]);

  return (
    <div className="app">
      <header className="app-header">
        <h1>Plumbline</h1>
        <span className="plan-title" data-testid="plan-title">
          {state.project.name}
          {dirty ? (
            <span className="dirty-mark" title="Unsaved changes" aria-label="unsaved changes" data-testid="dirty-mark">
              {' '}
              • unsaved
            </span>
          ) : null}
        </span>
        <span className="muted small">{state.path ?? 'not saved yet'}</span>
        <Toolbar
          actions={actions}
          canUndo={state.past.length > 0}
          canRedo={state.future.length > 0}
          canRevert={state.path !== null && dirty}
          undoLabel={state.lastLabel}
          redoLabel={state.future[0]?.label ?? null}
        />
        <button type="button" className="link" onClick={() => setAboutOpen(true)}>
          About{info ? ` · v${info.version}` : ''}
        </button>
      </header>
      <Cautions />
      {status ? (
        <p className="status" role="status" data-testid="status">
          {status}
        </p>
      ) : null}
      {lockWarning ? (
        <p className="status warn-mark" role="alert" data-testid="lock-warning">
          {lockWarning}
        </p>
      ) : null}
      {recoverable.length > 0 ? (
        <RecoveryPrompt
          items={recoverable}
          onRestore={(item) => {
            call('restoreRecovery', { documentId: item.documentId }).then((restored) => {
              doc.load(restored.project, restored.originalPath, { saved: false, documentId: restored.documentId });
              setRecoverable([]);
              report(
                `Restored the unsaved work on "${restored.project.name}" from ${new Date(restored.savedAt).toLocaleString()}. Save it to keep it.`,
              );
            }, fail('The unsaved work could not be restored'));
          }}
          onDiscard={(item) => {
            call('discardRecovery', { documentId: item.documentId }).then(
              () => setRecoverable((items) => items.filter((i) => i.documentId !== item.documentId)),
              fail('The unsaved work could not be discarded'),
            );
          }}
          onLater={() => setRecoverable([])}
        />
      ) : null}
      <main>
        {ready ? (
          <Workspace
            key={doc.documentId}
            project={state.project}
            planner={enginePlanner}
            onEdit={doc.edit}
            onExportPopulation={exportPopulation}
            onStatus={report}
          />
        ) : (
          <p className="muted">Loading…</p>
        )}
      </main>
      {reportOpen ? (
        <ReportDialog
          project={state.project}
          planPath={state.path}
          planner={enginePlanner}
          baseName={fileNameFor(state.project).replace(/\.plumb$/, '')}
          pick={pick}
          onClose={() => setReportOpen(false)}
        />
      ) : null}
      {aboutOpen ? <AboutDialog version={info?.version ?? null} onClose={() => setAboutOpen(false)} /> : null}
      {picking ? (
        <FilePicker
          purpose={picking.purpose}
          {...(picking.suggestedName === undefined ? {} : { suggestedName: picking.suggestedName })}
          {...(state.path === null ? {} : { startFolder: state.path.replace(/[\\/][^\\/]*$/, '') })}
          onCancel={() => setPicking(null)}
          onChoose={(path) => {
            const then = picking.then;
            setPicking(null);
            then(path);
          }}
        />
      ) : null}
    </div>
  );
}
