/**
 * Fingerprints for rows made before fingerprints existed (migration 0004 adds the columns; SQL
 * cannot compute them): each revision's, each board's working copy's and each proof's (its pinned
 * revision's), then every board's status and standing approval worked out again from its proofs.
 * Runs after the migrations at every start; rows that already have one are left alone, so it is
 * cheap once done.
 */
import { and, eq, isNull } from 'drizzle-orm';
import { designFingerprint } from '~/lib/boards/fingerprint.server.ts';
import type { Db } from './client.server.ts';
import { refreshApproval, storedJson } from '~/lib/boards/boards.server.ts';
import { boardRevisions, boards, proofs } from './schema.ts';

export async function backfillFingerprints(db: Db): Promise<number> {
  let filled = 0;
  const revisions = await db
    .select({ id: boardRevisions.id, data: boardRevisions.data })
    .from(boardRevisions)
    .where(isNull(boardRevisions.fingerprint));
  for (const row of revisions) {
    await db.update(boardRevisions).set({ fingerprint: designFingerprint(storedJson(row.data)) }).where(eq(boardRevisions.id, row.id));
    filled++;
  }
  const heads = await db
    .select({ id: boards.id, shopId: boards.shopId, data: boards.workingData })
    .from(boards)
    .where(isNull(boards.workingFingerprint));
  for (const head of heads) {
    await db.update(boards).set({ workingFingerprint: designFingerprint(storedJson(head.data)) }).where(eq(boards.id, head.id));
  }
  const pinned = await db
    .select({ id: proofs.id, fingerprint: boardRevisions.fingerprint })
    .from(proofs)
    .innerJoin(boardRevisions, and(eq(boardRevisions.boardId, proofs.boardId), eq(boardRevisions.revision, proofs.revision)))
    .where(isNull(proofs.fingerprint));
  for (const proof of pinned) await db.update(proofs).set({ fingerprint: proof.fingerprint }).where(eq(proofs.id, proof.id));
  for (const head of heads) await refreshApproval(db, head.shopId, head.id);
  return filled + heads.length + pinned.length;
}
