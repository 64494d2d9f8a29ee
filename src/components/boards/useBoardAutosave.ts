/**
 * Autosave for a board open in the editor: debounced saves of the current design over the
 * version last seen, a visible status, conflict handling that keeps the user's edit, and a
 * prompt before leaving the page with unsaved work. The editor owns the design; this hook only
 * watches it and saves it.
 */
import { useCallback, useEffect, useReducer, useRef } from 'react';
import type { BoardDetail } from '~/lib/schemas/board.ts';
import { autosaveReducer, hasUnsavedWork, initialAutosave, type AutosaveState } from './autosave-state.ts';
import { BoardRequestError, createBoard, saveBoard } from './board-requests.ts';

export interface BoardAutosaveOptions {
  boardId: number;
  /** The board version the editor loaded. */
  version: number;
  /** The design as the editor has it now (any JSON; the server validates it). */
  design: unknown;
  debounceMs?: number;
}

export interface BoardAutosave {
  state: AutosaveState;
  /** Saves at once (e.g. Ctrl+S), skipping the debounce. */
  saveNow: () => void;
  /** After a conflict: take the server's board; returns its design for the editor to show. */
  reload: () => unknown;
  /** After a conflict: keep the user's design as a new board; the editor then opens that one. */
  saveAsCopy: () => Promise<BoardDetail>;
}

export function useBoardAutosave({ boardId, version, design, debounceMs = 800 }: BoardAutosaveOptions): BoardAutosave {
  const [state, dispatch] = useReducer(autosaveReducer, version, initialAutosave);
  const latest = useRef(design);
  const seen = useRef(JSON.stringify(design));
  const stateRef = useRef(state);
  stateRef.current = state;

  useEffect(() => dispatch({ type: 'resolved', version }), [boardId, version]);

  useEffect(() => {
    latest.current = design;
    const text = JSON.stringify(design);
    if (text === seen.current) return;
    seen.current = text;
    dispatch({ type: 'edit' });
  }, [design]);

  const save = useCallback(async () => {
    const current = stateRef.current;
    if (current.status === 'saving' || current.status === 'conflict') return;
    dispatch({ type: 'start' });
    try {
      const saved = await saveBoard(boardId, current.version, latest.current);
      dispatch({ type: 'succeeded', version: saved.version });
    } catch (error) {
      if (error instanceof BoardRequestError && error.status === 409) {
        dispatch({ type: 'conflict', currentVersion: Number(error.body.currentVersion), current: error.body.current });
      } else {
        dispatch({ type: 'failed', message: error instanceof Error ? error.message : 'The save failed' });
      }
    }
  }, [boardId]);

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

  const reload = useCallback(() => {
    const conflict = stateRef.current.conflict;
    if (!conflict) return latest.current;
    const board = conflict.current as BoardDetail;
    seen.current = JSON.stringify(board.design);
    dispatch({ type: 'resolved', version: conflict.currentVersion });
    return board.design;
  }, []);

  const saveAsCopy = useCallback(async () => {
    const copy = await createBoard(latest.current);
    dispatch({ type: 'resolved', version: copy.version });
    return copy;
  }, []);

  return { state, saveNow: () => void save(), reload, saveAsCopy };
}
