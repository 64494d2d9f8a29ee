/**
 * Makes a Boards save stop half-way on purpose: a second connection inserts the board's next
 * revision row in an open transaction, so the save's own insert waits on that key's lock.
 */
import type { Connection } from 'mysql2/promise';
import { getPool } from './test-db.ts';

export async function holdNextRevision(connection: Connection, boardId: number, revision: number, authorId: string): Promise<void> {
  // Without the foreign key check the blocker takes no lock on the head row, so the save gets past
  // its own lock on that row and stops at the revision insert, after it has begun writing.
  await connection.query('SET SESSION foreign_key_checks = 0');
  await connection.beginTransaction();
  await connection.execute('INSERT INTO board_revisions (board_id, revision, data, author_id) VALUES (?, ?, ?, ?)', [boardId, revision, '{}', authorId]);
}

/**
 * Resolves once another connection of ours is busy inserting a revision, i.e. waiting on the held
 * lock (polls every 20 ms, gives up after 10 s). The process list shows our own user's threads.
 */
export async function waitForLockWait(): Promise<void> {
  for (let i = 0; i < 500; i++) {
    const [rows] = await getPool().query(
      "SELECT COUNT(*) AS n FROM information_schema.PROCESSLIST WHERE COMMAND = 'Query' AND INFO LIKE 'insert into `board_revisions`%'",
    );
    if (Number((rows as { n: number }[])[0]?.n) > 0) return;
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
  throw new Error('no transaction started waiting for a lock within 10 s');
}
