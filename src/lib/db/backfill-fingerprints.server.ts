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
import { refreshApproval, storedJson } from './designs.server.ts';
import { designRevisions, designs, proofs } from './schema.ts';

export async function backfillFingerprints(db: Db): Promise<number> {
  let filled = 0;
  const revisions = await db
    .select({ id: designRevisions.id, data: designRevisions.data })
    .from(designRevisions)
    .where(isNull(designRevisions.fingerprint));
  for (const row of revisions) {
    await db.update(designRevisions).set({ fingerprint: designFingerprint(storedJson(row.data)) }).where(eq(designRevisions.id, row.id));
    filled++;
  }
  const heads = await db
    .select({ id: designs.id, shopId: designs.shopId, data: designs.workingData })
    .from(designs)
    .where(isNull(designs.workingFingerprint));
  for (const head of heads) {
    await db.update(designs).set({ workingFingerprint: designFingerprint(storedJson(head.data)) }).where(eq(designs.id, head.id));
  }
  const pinned = await db
    .select({ id: proofs.id, fingerprint: designRevisions.fingerprint })
    .from(proofs)
    .innerJoin(designRevisions, and(eq(designRevisions.designId, proofs.designId), eq(designRevisions.revision, proofs.revision)))
    .where(isNull(proofs.fingerprint));
  for (const proof of pinned) await db.update(proofs).set({ fingerprint: proof.fingerprint }).where(eq(proofs.id, proof.id));
  for (const head of heads) await refreshApproval(db, head.shopId, head.id);
  return filled + heads.length + pinned.length;
}
