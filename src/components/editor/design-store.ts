/**
 * Where the editor keeps its design. The Layout screen works without an account: the design is a
 * scratch copy in this browser's local storage. A design saved to the shop's Boards is kept on
 * the server through the Boards API, over the board version the editor last saw, so a save never
 * silently overwrites someone else's (a stale version comes back as a conflict). The editor only
 * talks to this interface; useAutosave (use-autosave.ts) decides when to
 * save and keeps the version.
 */
import { BoardRequestError, fetchBoard, saveBoard } from '~/components/boards/board-requests.ts';
import type { BoardDetail } from '~/lib/schemas/board.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';

export type DesignStorage = { kind: 'scratch' } | { kind: 'board'; boardId: number };

export type SaveStatus =
  | { state: 'idle' }
  | { state: 'saving' }
  /** `board`: the saved board as the server now has it (boards only). */
  | { state: 'saved'; at: Date; board?: BoardDetail }
  /** The board was saved elsewhere since `version`: the server's board, to compare and reload. */
  | { state: 'conflict'; current: BoardDetail }
  /** The client approved the board as it stands: saving this change needs `confirmApprovalChange`. */
  | { state: 'approval'; approval: { revision: number; fingerprint: string } }
  | { state: 'error'; message: string };

export interface DesignStore {
  /** Short description of where the design is kept, shown in the toolbar. */
  readonly place: string;
  /** The kept design, or null when there is none (or it no longer validates). */
  load(): Promise<Design | null>;
  /**
   * Keeps a valid design; never throws, failures come back as an error status. `version` is the
   * board version last seen (boards need it; the scratch copy ignores it).
   */
  save(design: Design, version?: number, options?: SaveOptions): Promise<SaveStatus>;
}

export interface SaveOptions {
  /** The builder has seen that this change moves an approved board off its approved layout. */
  confirmApprovalChange?: boolean;
}

export const SCRATCH_STORAGE_KEY = 'kerfline.scratchDesign';

export function createDesignStore(storage: DesignStorage): DesignStore {
  switch (storage.kind) {
    case 'scratch':
      return scratchStore(globalThis.localStorage);
    case 'board':
      return boardStore(storage.boardId);
  }
}

/** The scratch design in local storage (or any Storage, for tests). */
export function scratchStore(storage: Pick<Storage, 'getItem' | 'setItem'> | undefined): DesignStore {
  return {
    place: 'Scratch design, kept in this browser only',
    async load() {
      const text = storage?.getItem(SCRATCH_STORAGE_KEY);
      if (!text) return null;
      try {
        const validation = validateDesign(JSON.parse(text));
        return validation.ok ? validation.design : null;
      } catch {
        return null;
      }
    },
    async save(design) {
      if (!storage) return { state: 'error', message: 'this browser does not keep local data' };
      try {
        storage.setItem(SCRATCH_STORAGE_KEY, JSON.stringify(design));
        return { state: 'saved', at: new Date() };
      } catch (error) {
        return { state: 'error', message: `could not keep the design in this browser (${String(error)})` };
      }
    },
  };
}

/** The Boards API calls a board store makes (the real ones by default; tests pass fakes). */
export interface BoardRequests {
  fetchBoard: (id: number) => Promise<BoardDetail>;
  saveBoard: (id: number, version: number, design: unknown, options?: SaveOptions) => Promise<BoardDetail>;
}

/** A board saved in the shop's Boards: its current revision, saved over the version last seen. */
export function boardStore(boardId: number, requests: BoardRequests = { fetchBoard, saveBoard }): DesignStore {
  return {
    place: 'Saved in Boards',
    async load() {
      try {
        const validation = validateDesign((await requests.fetchBoard(boardId)).design);
        return validation.ok ? validation.design : null;
      } catch {
        return null;
      }
    },
    async save(design, version, options = {}) {
      if (version === undefined) return { state: 'error', message: 'the board version is not known; reload the page' };
      try {
        return { state: 'saved', at: new Date(), board: await requests.saveBoard(boardId, version, design, options) };
      } catch (error) {
        if (error instanceof BoardRequestError && error.status === 409 && error.body.code === 'approval_change') {
          return { state: 'approval', approval: error.body.approval as { revision: number; fingerprint: string } };
        }
        if (error instanceof BoardRequestError && error.status === 409) return { state: 'conflict', current: error.body.current as BoardDetail };
        if (error instanceof BoardRequestError) return { state: 'error', message: error.message };
        return { state: 'error', message: 'the server could not be reached; your edit is kept here' };
      }
    },
  };
}
