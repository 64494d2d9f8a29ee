import { describe, expect, it } from 'vitest';
import { autosaveReducer, hasUnsavedWork, initialAutosave, type AutosaveEvent, type AutosaveState } from '~/components/boards/autosave-state.ts';

function run(events: AutosaveEvent[], from: AutosaveState = initialAutosave(3)): AutosaveState {
  return events.reduce(autosaveReducer, from);
}

describe('autosave state machine', () => {
  it('starts saved, becomes unsaved on an edit, saving on start and saved with the new version', () => {
    expect(run([]).status).toBe('saved');
    expect(run([{ type: 'edit' }]).status).toBe('unsaved');
    expect(run([{ type: 'edit' }, { type: 'start' }]).status).toBe('saving');
    expect(run([{ type: 'edit' }, { type: 'start' }, { type: 'succeeded', version: 4 }])).toMatchObject({ status: 'saved', version: 4 });
  });

  it('keeps an edit made during a save as unsaved after the save succeeds', () => {
    const state = run([{ type: 'edit' }, { type: 'start' }, { type: 'edit' }, { type: 'succeeded', version: 4 }]);
    expect(state).toMatchObject({ status: 'unsaved', version: 4, pendingEdits: 1 });
    expect(hasUnsavedWork(state)).toBe(true);
  });

  it('on a conflict keeps the edit, remembers the server board and sends nothing until resolved', () => {
    const current = { id: 1, version: 5 };
    const state = run([{ type: 'edit' }, { type: 'start' }, { type: 'conflict', currentVersion: 5, current }]);
    expect(state).toMatchObject({ status: 'conflict', version: 3, conflict: { currentVersion: 5, current } });
    expect(state.pendingEdits).toBeGreaterThan(0);
    expect(run([{ type: 'start' }], state).status).toBe('conflict');
    expect(run([{ type: 'edit' }], state).status).toBe('conflict');
    expect(run([{ type: 'resolved', version: 5 }], state)).toEqual(initialAutosave(5));
  });

  it('on a failure shows the error, keeps the edit pending and retries after the next edit', () => {
    const failed = run([{ type: 'edit' }, { type: 'start' }, { type: 'failed', message: 'database down' }]);
    expect(failed).toMatchObject({ status: 'error', error: 'database down', version: 3 });
    expect(hasUnsavedWork(failed)).toBe(true);
    expect(run([{ type: 'edit' }], failed)).toMatchObject({ status: 'unsaved', error: null });
    expect(run([{ type: 'start' }], failed).status).toBe('saving');
  });

  it('ignores a second start while a save is in flight', () => {
    const saving = run([{ type: 'edit' }, { type: 'start' }]);
    expect(run([{ type: 'start' }], saving)).toBe(saving);
  });

  it('has no unsaved work only when saved', () => {
    expect(hasUnsavedWork(initialAutosave(1))).toBe(false);
    expect(hasUnsavedWork(run([{ type: 'edit' }, { type: 'start' }]))).toBe(true);
  });
});
