/**
 * What the editor's autosave shows when a save gets the app's 503 "database is not answering":
 * the request rejects with the server's message (not a conflict), and the autosave state turns to
 * "Not saved" with that message while keeping the edit. The 503 itself is checked on the built
 * server in tests/e2e/db-fault.test.ts.
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { autosaveReducer, initialAutosave, SAVE_STATUS_LABELS } from '~/components/boards/autosave-state.ts';
import { BoardRequestError, saveBoard } from '~/components/boards/board-requests.ts';

/** The body src/middleware.ts answers while MariaDB is down. */
const DATABASE_DOWN = { error: 'The database is not answering right now; nothing was changed. Try again in a moment.' };

afterEach(() => vi.unstubAllGlobals());

describe('a save answered 503 while the database is down', () => {
  it('rejects with the status and the server message, and autosave shows "Not saved" with the edit kept', async () => {
    vi.stubGlobal('fetch', async () => new Response(JSON.stringify(DATABASE_DOWN), { status: 503, headers: { 'content-type': 'application/json' } }));
    const failure = await saveBoard(7, 3, { name: 'x' }).then(
      () => null,
      (error: unknown) => error,
    );
    expect(failure).toBeInstanceOf(BoardRequestError);
    expect((failure as BoardRequestError).status).toBe(503);
    expect((failure as BoardRequestError).message).toBe(DATABASE_DOWN.error);

    // useAutosave dispatches `failed` for every rejection except a 409.
    const saving = autosaveReducer(autosaveReducer(initialAutosave(3), { type: 'edit' }), { type: 'start' });
    const shown = autosaveReducer(saving, { type: 'failed', message: (failure as BoardRequestError).message });
    expect(shown).toMatchObject({ status: 'error', version: 3, error: DATABASE_DOWN.error });
    expect(shown.pendingEdits).toBeGreaterThan(0);
    expect(SAVE_STATUS_LABELS[shown.status]).toBe('Not saved');
  });
});
