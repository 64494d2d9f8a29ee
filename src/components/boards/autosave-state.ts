/**
 * The autosave state machine of an open board, as a pure reducer:
 *
 *   saved --edit--> unsaved --(debounce) start--> saving --succeeded--> saved (or unsaved if edited meanwhile)
 *                                                  saving --conflict--> conflict (the edit is kept)
 *                                                  saving --failed--> error (the edit is kept; retried on the next edit or retry)
 *   conflict --reloaded / savedAsCopy--> saved
 *                                                  saving --approvalNeeded--> approval (the board is approved as it stands:
 *                                                         the builder is asked first; the edit is kept)
 *   approval --approvalConfirmed--> unsaved (the next saves say the builder has seen the warning)
 *   approval --reloaded (undo the change)--> saved
 *
 * `version` is the board version the next save names; `editsSinceSave` counts edits made after
 * the save in flight started, so an edit during a save is never mistaken for saved.
 */
export type SaveStatus = 'saved' | 'unsaved' | 'saving' | 'conflict' | 'approval' | 'error';

export interface AutosaveState {
  status: SaveStatus;
  version: number;
  /** Edits not yet sent to the server. */
  pendingEdits: number;
  /** The server's board after a 409, to compare with and to reload. */
  conflict: { currentVersion: number; current: unknown } | null;
  /** The approval a save would move the board off (the server's 409 approval_change), until the builder answers. */
  approval: { revision: number; fingerprint: string } | null;
  /** The builder has seen the approval warning: saves go ahead (confirmApprovalChange). */
  approvalConfirmed: boolean;
  error: string | null;
}

export type AutosaveEvent =
  | { type: 'edit' }
  | { type: 'start' }
  | { type: 'succeeded'; version: number }
  | { type: 'conflict'; currentVersion: number; current: unknown }
  | { type: 'failed'; message: string }
  | { type: 'approvalNeeded'; approval: { revision: number; fingerprint: string } }
  | { type: 'approvalConfirmed' }
  /** The user took the server's board (reload) or saved theirs elsewhere (copy). */
  | { type: 'resolved'; version: number };

export function initialAutosave(version: number): AutosaveState {
  return { status: 'saved', version, pendingEdits: 0, conflict: null, approval: null, approvalConfirmed: false, error: null };
}

export function autosaveReducer(state: AutosaveState, event: AutosaveEvent): AutosaveState {
  switch (event.type) {
    case 'edit':
      // While a conflict or the approval question is open, edits pile up but nothing is sent until the user chooses.
      if (state.status === 'conflict' || state.status === 'approval') return { ...state, pendingEdits: state.pendingEdits + 1 };
      return { ...state, status: state.status === 'saving' ? 'saving' : 'unsaved', pendingEdits: state.pendingEdits + 1, error: null };
    case 'start':
      if (state.status === 'conflict' || state.status === 'approval' || state.status === 'saving') return state;
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
    case 'approvalNeeded':
      return { ...state, status: 'approval', pendingEdits: state.pendingEdits + 1, approval: event.approval };
    case 'approvalConfirmed':
      return state.status === 'approval' ? { ...state, status: 'unsaved', approval: null, approvalConfirmed: true } : state;
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
  approval: 'Waiting: approved board',
  error: 'Not saved',
};
