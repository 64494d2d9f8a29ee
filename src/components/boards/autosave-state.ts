/**
 * The autosave state machine of an open board, as a pure reducer:
 *
 *   saved --edit--> unsaved --(debounce) start--> saving --succeeded--> saved (or unsaved if edited meanwhile)
 *                                                  saving --conflict--> conflict (the edit is kept)
 *                                                  saving --failed--> error (the edit is kept; retried on the next edit or retry)
 *   conflict --reloaded / savedAsCopy--> saved
 *
 * `version` is the board version the next save names; `editsSinceSave` counts edits made after
 * the save in flight started, so an edit during a save is never mistaken for saved.
 */
export type SaveStatus = 'saved' | 'unsaved' | 'saving' | 'conflict' | 'error';

export interface AutosaveState {
  status: SaveStatus;
  version: number;
  /** Edits not yet sent to the server. */
  pendingEdits: number;
  /** The server's board after a 409, to compare with and to reload. */
  conflict: { currentVersion: number; current: unknown } | null;
  error: string | null;
}

export type AutosaveEvent =
  | { type: 'edit' }
  | { type: 'start' }
  | { type: 'succeeded'; version: number }
  | { type: 'conflict'; currentVersion: number; current: unknown }
  | { type: 'failed'; message: string }
  /** The user took the server's board (reload) or saved theirs elsewhere (copy). */
  | { type: 'resolved'; version: number };

export function initialAutosave(version: number): AutosaveState {
  return { status: 'saved', version, pendingEdits: 0, conflict: null, error: null };
}

export function autosaveReducer(state: AutosaveState, event: AutosaveEvent): AutosaveState {
  switch (event.type) {
    case 'edit':
      // While a conflict is open, edits pile up but nothing is sent until the user chooses.
      if (state.status === 'conflict') return { ...state, pendingEdits: state.pendingEdits + 1 };
      return { ...state, status: state.status === 'saving' ? 'saving' : 'unsaved', pendingEdits: state.pendingEdits + 1, error: null };
    case 'start':
      if (state.status === 'conflict' || state.status === 'saving') return state;
      return { ...state, status: 'saving', pendingEdits: 0, error: null };
    case 'succeeded':
      return { ...state, status: state.pendingEdits > 0 ? 'unsaved' : 'saved', version: event.version, error: null };
    case 'conflict':
      return {
        ...state,
        status: 'conflict',
        pendingEdits: state.pendingEdits + 1,
        conflict: { currentVersion: event.currentVersion, current: event.current },
      };
    case 'failed':
      return { ...state, status: 'error', pendingEdits: state.pendingEdits + 1, error: event.message };
    case 'resolved':
      return initialAutosave(event.version);
  }
}

/** True when leaving the page would lose an edit (the page should ask first). */
export function hasUnsavedWork(state: AutosaveState): boolean {
  return state.status !== 'saved';
}

export const SAVE_STATUS_LABELS: Readonly<Record<SaveStatus, string>> = {
  saved: 'Saved',
  unsaved: 'Unsaved changes',
  saving: 'Saving…',
  conflict: 'Changed elsewhere',
  error: 'Not saved',
};
