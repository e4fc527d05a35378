import { describe, expect, it } from 'vitest';
import { documentReducer, initialDocument, isDirty } from '../../../src-renderer/src/state/document';
import type { Project } from '@shared/model/project';

const project = {
  format: 'plumbline-plan',
  schemaVersion: 2,
  name: 'Plan',
  description: '',
  outcome: 'continuous',
  model: { name: '', description: '', reportedPerformance: '' },
  updating: { enabled: false, targetShrinkage: 0.9, optimismMargin: 0.05, shrinkageForm: 'adjusted-r2-link' },
  study: {},
  populations: [],
} as Project;

const rename = (name: string) => ({
  type: 'edit' as const,
  label: `rename to ${name}`,
  change: (p: Project) => ({ ...p, name }),
});

describe('document state: undo, redo and the unsaved mark', () => {
  it('an edit marks the plan unsaved; undo back to the saved value clears the mark', () => {
    let state = initialDocument(project, '/plans/a.plumb');
    expect(isDirty(state)).toBe(false);
    state = documentReducer(state, rename('B'));
    expect(state.project.name).toBe('B');
    expect(isDirty(state)).toBe(true);
    state = documentReducer(state, { type: 'undo' });
    expect(state.project.name).toBe('Plan');
    expect(isDirty(state)).toBe(false);
  });

  it('redo replays undone edits in order; a new edit clears the redo list', () => {
    let state = initialDocument(project);
    state = documentReducer(state, rename('B'));
    state = documentReducer(state, rename('C'));
    state = documentReducer(state, { type: 'undo' });
    state = documentReducer(state, { type: 'undo' });
    expect(state.project.name).toBe('Plan');
    state = documentReducer(state, { type: 'redo' });
    expect(state.project.name).toBe('B');
    expect(state.lastLabel).toBe('rename to B');
    state = documentReducer(state, rename('D'));
    expect(state.future).toHaveLength(0);
    expect(documentReducer(state, { type: 'redo' })).toBe(state);
  });

  it('saving records the path and clears the mark; an edit that changes nothing is not recorded', () => {
    let state = initialDocument(project, null, false);
    expect(isDirty(state)).toBe(true);
    state = documentReducer(state, { type: 'saved', path: '/plans/new plan.plumb' });
    expect(state.path).toBe('/plans/new plan.plumb');
    expect(isDirty(state)).toBe(false);
    const same = documentReducer(state, { type: 'edit', label: 'nothing', change: (p) => p });
    expect(same).toBe(state);
  });
});
