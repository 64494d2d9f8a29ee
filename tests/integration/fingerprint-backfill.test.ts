/**
 * Boards saved before checkpoints and fingerprints (migration 0004) keep their whole history: the
 * migration copies each board's current revision into its working copy and marks old revisions
 * as autosaves; the start-up backfill then fingerprints every old revision, working copy and
 * proof, and works out each board's status from its proofs. Here a board is written the way such
 * a row looks right after the SQL steps (no fingerprints anywhere) and the backfill is run on it.
 */
import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { designFingerprint } from '~/lib/boards/fingerprint.server.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { backfillFingerprints } from '~/lib/db/backfill-fingerprints.server.ts';
import { getBoard, listRevisions } from '~/lib/boards/boards.server.ts';
import { boardRevisions, boards, proofs } from '~/lib/db/schema.ts';
import { newShopUser } from '../support/sessions.ts';
import { closeDb, db } from '../support/test-db.ts';

afterAll(() => closeDb());

describe('start-up backfill of fingerprints for boards older than checkpoints', () => {
  it('keeps every old revision, fingerprints each, pins the old proof to its revision and derives the status', async () => {
    const user = await newShopUser('builder');
    const base = DEMO_DESIGNS.find((d) => d.id === 'mandolin')!.design;
    const steps = [14, 16, 17].map((frets) => ({ ...base, frets, markers: base.markers.filter((m) => m.fret <= frets) }));
    const [head] = await db()
      .insert(boards)
      .values({
        shopId: user.shopId, name: base.name, units: base.units, trebleScaleMm: 352.425, bassScaleMm: 352.425,
        currentRevision: 3, workingData: steps[2], workingRevision: 3, status: 'approved', createdBy: user.id, updatedBy: user.id,
      })
      .$returningId();
    const id = head!.id;
    for (const [i, data] of steps.entries()) {
      await db().insert(boardRevisions).values({ boardId: id, revision: i + 1, data, reason: i === 0 ? 'created' : 'autosave', authorId: user.id });
    }
    await db().insert(proofs).values({
      shopId: user.shopId, boardId: id, revision: 3, tokenHash: 'f'.repeat(60) + String(id).padStart(4, '0').slice(-4), clientName: 'Ines Calloway',
      clientEmail: 'ines@wrenfield.example', message: '', expiresAt: new Date(Date.now() + 86_400_000), createdBy: user.id,
      decision: 'approved', decidedAt: new Date(), decidedName: 'Ines',
    });

    expect(await backfillFingerprints(db())).toBeGreaterThanOrEqual(5);

    const history = await listRevisions(user.shopId, id);
    expect(history!.map((r) => [r.revision, r.reason, r.fingerprint])).toEqual([
      [3, 'autosave', designFingerprint(steps[2])],
      [2, 'autosave', designFingerprint(steps[1])],
      [1, 'created', designFingerprint(steps[0])],
    ]);
    const [proof] = await db().select({ fingerprint: proofs.fingerprint }).from(proofs).where(eq(proofs.boardId, id));
    expect(proof!.fingerprint).toBe(designFingerprint(steps[2]));
    expect(await getBoard(user.shopId, id)).toMatchObject({
      status: 'approved', revision: 3, fingerprint: designFingerprint(steps[2]), approval: { revision: 3, fingerprint: designFingerprint(steps[2]) },
    });
    // Run again: nothing left to fill for this board.
    await backfillFingerprints(db());
    expect((await listRevisions(user.shopId, id))!.length).toBe(3);
  });
});
