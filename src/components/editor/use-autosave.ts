/**
 * The editor's one autosave, for a scratch design and for a board alike: debounced saves of the
 * current design through the editor's store (design-store.ts: this browser's storage, or the
 * Boards API over the version last seen), a visible status, conflict handling that keeps the
 * user's edit, and a prompt before leaving the page with unsaved work. The editor owns the
 * design; this hook only watches it and saves it.
 */
import { useCallback, useEffect, useReducer, useRef } from 'react';
import { autosaveReducer, hasUnsavedWork, initialAutosave, type AutosaveState } from '~/components/boards/autosave-state.ts';
import { createBoard } from '~/components/boards/board-requests.ts';
import type { BoardDetail } from '~/lib/schemas/board.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type { DesignStore } from './design-store.ts';

export interface AutosaveOptions {
  /** Where the design is kept; null when nothing is kept (a read-only view): the hook does nothing. */
  store: DesignStore | null;
  /** The open board, or null for a scratch design; another id (a board just saved or copied) starts again from `version`. */
  boardId: number | null;
  /** The board version the editor loaded (a scratch design has no versions: any number). */
  version: number;
  /** The design as the editor has it now. */
  design: Design;
  /** Told after every save the server acknowledged (new version, revision and status). */
  onSaved?: (board: BoardDetail) => void;
  debounceMs?: number;
}

export interface Autosave {
  state: AutosaveState;
  /** Saves at once (e.g. a retry after a failure), skipping the debounce. */
  saveNow: () => void;
  /**
   * The editor now shows `shown`, the design of `board` as saved (after a restore, or taking the
   * server's board after a conflict): nothing is unsaved, and the next save names its version.
   */
  adopt: (board: BoardDetail, shown: Design) => void;
  /** After a conflict: keep the user's design as a new board; the editor then opens that one. */
  saveAsCopy: () => Promise<BoardDetail>;
  /** The builder has read the approval warning and keeps the change: it is saved now. */
  confirmApprovalChange: () => void;
}

export function useAutosave({ store, boardId, version, design, onSaved, debounceMs = 800 }: AutosaveOptions): Autosave {
  const [state, dispatch] = useReducer(autosaveReducer, version, initialAutosave);
  const latest = useRef(design);
  const seen = useRef(JSON.stringify(design));
  const stateRef = useRef(state);
  stateRef.current = state;
  const savedRef = useRef(onSaved);
  savedRef.current = onSaved;

  useEffect(() => dispatch({ type: 'resolved', version }), [boardId, version]);

  useEffect(() => {
    latest.current = design;
    const text = JSON.stringify(design);
    if (text === seen.current) return;
    seen.current = text;
    if (store) dispatch({ type: 'edit' });
  }, [design, store]);

  const save = useCallback(async () => {
    const current = stateRef.current;
    if (!store || current.status === 'saving' || current.status === 'conflict' || current.status === 'approval') return;
    dispatch({ type: 'start' });
    const result = await store.save(latest.current, current.version, { confirmApprovalChange: current.approvalConfirmed });
    if (result.state === 'saved') {
      dispatch({ type: 'succeeded', version: result.board?.version ?? current.version });
      if (result.board) savedRef.current?.(result.board);
    } else if (result.state === 'approval') {
      dispatch({ type: 'approvalNeeded', approval: result.approval });
    } else if (result.state === 'conflict') {
      dispatch({ type: 'conflict', currentVersion: result.current.version, current: result.current });
    } else {
      dispatch({ type: 'failed', message: result.state === 'error' ? result.message : 'The save failed' });
    }
  }, [store]);

  useEffect(() => {
    if (state.status !== 'unsaved') return;
    const timer = setTimeout(() => void save(), debounceMs);
    return () => clearTimeout(timer);
  }, [state.status, state.pendingEdits, debounceMs, save]);

  useEffect(() => {
    if (!hasUnsavedWork(state)) return;
    const ask = (event: BeforeUnloadEvent) => {
      event.preventDefault();
      // Older browsers show the prompt only when returnValue is set.
      event.returnValue = '';
    };
    window.addEventListener('beforeunload', ask);
    return () => window.removeEventListener('beforeunload', ask);
  }, [state]);

  const adopt = useCallback((board: BoardDetail, shown: Design) => {
    latest.current = shown;
    seen.current = JSON.stringify(shown);
    dispatch({ type: 'resolved', version: board.version });
  }, []);

  const saveAsCopy = useCallback(async () => {
    const copy = await createBoard(latest.current);
    dispatch({ type: 'resolved', version: copy.version });
    return copy;
  }, []);

  const confirmApprovalChange = useCallback(() => dispatch({ type: 'approvalConfirmed' }), []);

  return { state, saveNow: () => void save(), adopt, saveAsCopy, confirmApprovalChange };
}
