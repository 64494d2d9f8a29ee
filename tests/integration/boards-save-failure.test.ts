import mysql from 'mysql2/promise';
import { afterAll, describe, expect, it } from 'vitest';
import { config } from '~/lib/config/env.server.ts';
import { isDbUnavailable } from '~/lib/db/db-errors.ts';
import { createBoard, getBoard, listRevisions, updateBoard } from '~/lib/boards/boards.server.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { newShopUser } from '../support/sessions.ts';
import { closeDb, startDatabase, stopDatabase } from '../support/test-db.ts';
import { holdNextRevision, waitForLockWait } from '../support/revision-lock.ts';

afterAll(() => closeDb());

describe('a save that fails half-way (MariaDB stops mid-transaction)', () => {
  it('keeps the previous revision and head row intact, and fails with a "database unavailable" error', async () => {
    const user = await newShopUser('builder');
    const writer = { id: user.id, shopId: user.shopId };
    const design = DEMO_DESIGNS[0]!.design;
    const board = await createBoard(writer, { design, instrumentType: 'guitar', clientName: '', note: '' });
    const blocker = await mysql.createConnection({ ...config().database });
    blocker.on('error', () => undefined);
    let failure: unknown;
    try {
      // Another transaction holds revision 2, so the save locks the head row, then waits inside
      // its own transaction on the revision insert: that is where the database goes away.
      await holdNextRevision(blocker, board.id, 2, user.id);
      const save = updateBoard(writer, board.id, { version: 1, design: { ...design, perpendicularFret: 3 }, note: '', saveRevision: true }).catch((e: unknown) => e);
      await waitForLockWait();
      stopDatabase();
      failure = await save;
    } finally {
      blocker.destroy();
      startDatabase();
    }
    expect(isDbUnavailable(failure)).toBe(true);
    const after = await getBoard(user.shopId, board.id);
    expect(after).toMatchObject({ version: 1, currentRevision: 1, revision: 1, design });
    expect((await listRevisions(user.shopId, board.id))?.map((r) => r.revision)).toEqual([1]);
  });
});
