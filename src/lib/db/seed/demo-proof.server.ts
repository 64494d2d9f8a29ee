/**
 * Demo seed step: the demo client has a proof of the seven-string board waiting, with a deposit
 * to pay on approving, so "Shared with me" shows something after `npm start`. Needs that design (seeded by the Boards step); without it
 * this inserts nothing. The link token is thrown away (only its hash is stored, as for any proof):
 * the demo client opens the proof from "Shared with me".
 */
import { and, eq, like } from 'drizzle-orm';
import { newToken, sha256Hex } from '~/lib/auth/tokens.server.ts';
import { refreshApproval } from '~/lib/boards/boards.server.ts';
import { boards, proofs } from '~/lib/db/schema.ts';
import { saveDeposit } from '~/lib/payments/deposits.server.ts';
import type { SeedStep } from './demo-shop.server.ts';

const DEMO_CLIENT = { email: 'client@wrenfield.example', name: 'Ines Calloway' };
const DEMO_BUILDER_EMAIL = 'builder@wrenfield.example';
const DEMO_PROOF_DAYS = 365;
const DEMO_DEPOSIT_MINOR = 45_000;

export const seedDemoProof: SeedStep = async ({ db, shopId, people }) => {
  const [design] = await db
    .select({ id: boards.id, currentRevision: boards.currentRevision, fingerprint: boards.workingFingerprint })
    .from(boards)
    .where(and(eq(boards.shopId, shopId), like(boards.name, '%Seven-string%')))
    .limit(1);
  const builderId = people.get(DEMO_BUILDER_EMAIL);
  if (!design || !builderId) return;
  const [existing] = await db
    .select({ id: proofs.id })
    .from(proofs)
    .where(and(eq(proofs.boardId, design.id), eq(proofs.clientEmail, DEMO_CLIENT.email)))
    .limit(1);
  if (existing) return;
  await db.transaction(async (tx) => {
    const [proof] = await tx.insert(proofs).values({
      shopId,
      boardId: design.id,
      revision: design.currentRevision,
      fingerprint: design.fingerprint,
      tokenHash: sha256Hex(newToken()),
      clientName: DEMO_CLIENT.name,
      clientEmail: DEMO_CLIENT.email,
      message: 'Here is the fanned seven-string board as we discussed: 648 to 686 mm, square at fret 8.',
      expiresAt: new Date(Date.now() + DEMO_PROOF_DAYS * 86_400_000),
      createdBy: builderId,
    }).$returningId();
    // The deposit the demo client pays on approving (in the shop's currency; invented demo amount).
    await saveDeposit(tx, shopId, proof!.id, builderId, { amountMinor: DEMO_DEPOSIT_MINOR, description: 'Deposit to start the seven-string build' });
    await refreshApproval(tx, shopId, design.id);
  });
};
