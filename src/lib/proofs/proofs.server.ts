/**
 * Proofs: a design revision shared with a client through a link. The link's token is returned
 * once at creation and only its SHA-256 is stored. Every builder-side query is scoped by shop;
 * the client side finds a proof by its token, or by id for the signed-in client it was sent to.
 * Time is always passed in (`now`) so expiry can be tested with a fixed clock.
 */
import { and, desc, eq, gt, isNull, type SQL } from 'drizzle-orm';
import { newToken, sha256Hex } from '~/lib/auth/tokens.server.ts';
import { config } from '~/lib/config/env.server.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type {
  CreateProofInput,
  CreatedProof,
  DecisionInput,
  ProofDecision,
  ProofState,
  ProofSummary,
  SharedProof,
} from '~/lib/schemas/proof.ts';
import { db } from '~/lib/db/client.server.ts';
import { withRetry } from '~/lib/db/with-retry.server.ts';
import { checkpointLocked, findRevisionDesign, findShopBoard, lockBoard, refreshApproval, storedJson } from '~/lib/boards/boards.server.ts';
import { boardRevisions, boards, proofs, shops, users } from '~/lib/db/schema.ts';
import { depositsOfProofs, depositsOn, saveDeposit } from '~/lib/payments/deposits.server.ts';
import type { DepositSummary } from '~/lib/schemas/deposit.ts';
import { mailBuilderDecision, mailClientProof } from '~/lib/proofs/proof-mails.server.ts';
import type { Failure } from '~/lib/http/result.ts';

const DAY_MS = 86_400_000;

/** The signed-in builder or owner acting on proofs. */
export interface ProofWriter {
  id: string;
  shopId: number;
}

/** How the client side finds a proof: by link token, or by id for the signed-in client. */
export type ProofLocator = { token: string } | { proofId: number; shopId: number; clientEmail: string };

/** Everything the proof page shows: one revision of one design, and nothing that leads elsewhere. */
export interface ProofPage {
  shopName: string;
  boardName: string;
  revision: number;
  /** The pinned revision's fingerprint, as printed on the shop's exports of it. */
  fingerprint: string;
  /** The board has changed since this proof was made (the page still shows what was sent). */
  newerRevisionExists: boolean;
  clientName: string;
  message: string;
  expiresAt: string;
  design: Design;
  decision: ProofDecision | null;
  /** The deposit asked with this proof, and where it stands (docs/payments.md). */
  deposit: DepositSummary | null;
  /** Whether this server can take the deposit now (payment settings present). */
  paymentsOn: boolean;
  /** The shop's IANA time zone, for the dates the page writes. */
  timeZone: string;
}

export type DecideFailure = Failure<'not_found' | 'already_decided' | 'expired'>;
export type DecideResult = { ok: true; decision: ProofDecision; mailed: boolean } | DecideFailure;

type ProofRow = typeof proofs.$inferSelect;

export function proofLink(token: string): string {
  return `${config().appOrigin}/p/${token}`;
}

function decisionOf(row: ProofRow): ProofDecision | null {
  if (!row.decision || !row.decidedAt) return null;
  return { kind: row.decision, at: row.decidedAt.toISOString(), name: row.decidedName ?? '', comment: row.decisionComment ?? '' };
}

function stateOf(row: ProofRow, now: Date): ProofState {
  if (row.revokedAt) return 'revoked';
  if (row.decision) return row.decision;
  return row.expiresAt.getTime() <= now.getTime() ? 'expired' : 'open';
}

function toSummary(row: ProofRow, now: Date, deposit: DepositSummary | null = null): ProofSummary {
  return {
    deposit,
    id: row.id,
    revision: row.revision,
    fingerprint: row.fingerprint ?? '',
    clientName: row.clientName,
    clientEmail: row.clientEmail,
    message: row.message,
    createdAt: row.createdAt.toISOString(),
    expiresAt: row.expiresAt.toISOString(),
    revokedAt: row.revokedAt?.toISOString() ?? null,
    state: stateOf(row, now),
    decision: decisionOf(row),
  };
}

/** Where-clause of a locator; revoked proofs are never found from the client side. */
export function proofWhere(locator: ProofLocator): SQL | undefined {
  const notRevoked = isNull(proofs.revokedAt);
  if ('token' in locator) return and(eq(proofs.tokenHash, sha256Hex(locator.token)), notRevoked);
  return and(
    eq(proofs.id, locator.proofId),
    eq(proofs.shopId, locator.shopId),
    eq(proofs.clientEmail, locator.clientEmail.toLowerCase()),
    notRevoked,
  );
}

/**
 * Creates a proof of the board's working copy, pinned to a revision (one is made when the
 * working copy has changes not yet in a revision), works out the board's status again and
 * e-mails the client the link. Null when the design is not in the writer's shop.
 */
export async function createProof(writer: ProofWriter, boardId: number, input: CreateProofInput, now: Date): Promise<CreatedProof | null> {
  const token = newToken();
  const created = await db().transaction(async (tx) => {
    const locked = await lockBoard(tx, writer.shopId, boardId);
    if (!locked) return null;
    const pinned = await checkpointLocked(tx, writer, locked, 'proof', `Sent to ${input.clientName} in a proof`);
    const head = { name: locked.name };
    const [inserted] = await tx
      .insert(proofs)
      .values({
        shopId: writer.shopId,
        boardId,
        revision: pinned.revision,
        fingerprint: pinned.fingerprint,
        tokenHash: sha256Hex(token),
        clientName: input.clientName,
        clientEmail: input.clientEmail,
        message: input.message,
        expiresAt: new Date(now.getTime() + input.expiresInDays * DAY_MS),
        createdBy: writer.id,
        createdAt: now,
      })
      .$returningId();
    if (input.deposit) await saveDeposit(tx, writer.shopId, inserted!.id, writer.id, input.deposit);
    await refreshApproval(tx, writer.shopId, boardId);
    const [row] = await tx.select().from(proofs).where(eq(proofs.id, inserted!.id));
    const deposit = (await depositsOfProofs(tx, [inserted!.id])).get(inserted!.id) ?? null;
    return { head, row: row!, deposit };
  });
  if (!created) return null;
  const [shop] = await db().select({ name: shops.name, timeZone: shops.timeZone }).from(shops).where(eq(shops.id, writer.shopId));
  const link = proofLink(token);
  const mailed = await mailClientProof({
    to: created.row.clientEmail,
    clientName: created.row.clientName,
    shopName: shop?.name ?? '',
    boardName: created.head.name,
    revision: created.row.revision,
    message: created.row.message,
    expiresAt: created.row.expiresAt,
    link,
    timeZone: shop?.timeZone ?? 'UTC',
    deposit: created.deposit,
  });
  return { proof: toSummary(created.row, now, created.deposit), link, mailed };
}

/** The proof page's content, or null for unknown, revoked and expired proofs alike. */
export async function openProof(locator: ProofLocator, now: Date): Promise<ProofPage | null> {
  const [found] = await db()
    .select({ proof: proofs, shopName: shops.name, timeZone: shops.timeZone, workingFingerprint: boards.workingFingerprint })
    .from(proofs)
    .innerJoin(boards, eq(boards.id, proofs.boardId))
    .innerJoin(shops, eq(shops.id, proofs.shopId))
    .where(and(proofWhere(locator), gt(proofs.expiresAt, now)))
    .limit(1);
  if (!found) return null;
  const design = await findRevisionDesign(db(), found.proof.boardId, found.proof.revision);
  if (!design) return null;
  return {
    shopName: found.shopName,
    boardName: design.name,
    revision: found.proof.revision,
    fingerprint: found.proof.fingerprint ?? '',
    newerRevisionExists: found.workingFingerprint !== found.proof.fingerprint,
    clientName: found.proof.clientName,
    message: found.proof.message,
    expiresAt: found.proof.expiresAt.toISOString(),
    design,
    decision: decisionOf(found.proof),
    deposit: (await depositsOfProofs(db(), [found.proof.id])).get(found.proof.id) ?? null,
    paymentsOn: depositsOn(),
    timeZone: found.timeZone,
  };
}

/**
 * Records the client's answer once. The update itself re-checks "not decided, not revoked, not
 * expired", so two answers racing each other cannot both be recorded. The board's status is then
 * worked out again (boardApproval): the answer speaks for the pinned layout only, so it shows
 * on the board while the board still has that layout. The builder who sent it gets an e-mail.
 */
export async function decideProof(locator: ProofLocator, input: DecisionInput, now: Date): Promise<DecideResult> {
  const [row] = await db().select().from(proofs).where(proofWhere(locator)).limit(1);
  if (!row) return { ok: false, reason: 'not_found' };
  if (row.decision) return { ok: false, reason: 'already_decided' };
  if (row.expiresAt.getTime() <= now.getTime()) return { ok: false, reason: 'expired' };
  const comment = input.decision === 'changes_requested' ? input.comment : '';
  const recorded = await withRetry(() => db().transaction(async (tx) => {
    const [result] = await tx
      .update(proofs)
      .set({ decision: input.decision, decidedAt: now, decidedName: input.name, decisionComment: comment })
      .where(and(eq(proofs.id, row.id), isNull(proofs.decision), isNull(proofs.revokedAt), gt(proofs.expiresAt, now)));
    if (result.affectedRows !== 1) return null;
    await refreshApproval(tx, row.shopId, row.boardId);
    return findShopBoard(tx, row.shopId, row.boardId);
  }));
  if (!recorded) return { ok: false, reason: 'already_decided' };
  const decision: ProofDecision = { kind: input.decision, at: now.toISOString(), name: input.name, comment };
  const [builder] = await db().select({ email: users.email }).from(users).where(eq(users.id, row.createdBy));
  const [shop] = await db().select({ timeZone: shops.timeZone }).from(shops).where(eq(shops.id, row.shopId));
  const mailed = builder
    ? await mailBuilderDecision({
        to: builder.email,
        boardName: recorded.name,
        boardId: row.boardId,
        revision: row.revision,
        clientName: row.clientName,
        decision,
        timeZone: shop?.timeZone ?? 'UTC',
      })
    : false;
  return { ok: true, decision, mailed };
}

/** Revokes a proof of the shop (again is harmless). Null when there is no such proof in the shop. */
export type RevokeFailure = Failure<'not_found' | 'answered'>;
export type RevokeResult = { ok: true; proof: ProofSummary } | RevokeFailure;

/**
 * Revokes a proof of the shop that the client has not answered yet (an answer is a record of what
 * the client agreed to; it is never withdrawn). Revoking twice changes nothing.
 */
export async function revokeProof(shopId: number, proofId: number, now: Date): Promise<RevokeResult> {
  await db()
    .update(proofs)
    .set({ revokedAt: now })
    .where(and(eq(proofs.id, proofId), eq(proofs.shopId, shopId), isNull(proofs.revokedAt), isNull(proofs.decision)));
  const [row] = await db().select().from(proofs).where(and(eq(proofs.id, proofId), eq(proofs.shopId, shopId)));
  if (!row) return { ok: false, reason: 'not_found' };
  if (row.revokedAt) await refreshApproval(db(), shopId, row.boardId);
  if (row.decision && !row.revokedAt) return { ok: false, reason: 'answered' };
  return { ok: true, proof: toSummary(row, now, (await depositsOfProofs(db(), [row.id])).get(row.id) ?? null) };
}

/** The design's proofs, newest first; null when the design is not in the shop. */
export async function listDesignProofs(shopId: number, boardId: number, now: Date): Promise<ProofSummary[] | null> {
  const head = await findShopBoard(db(), shopId, boardId);
  if (!head) return null;
  const rows = await db()
    .select()
    .from(proofs)
    .where(and(eq(proofs.shopId, shopId), eq(proofs.boardId, boardId)))
    .orderBy(desc(proofs.createdAt), desc(proofs.id));
  const deposits = await depositsOfProofs(db(), rows.map((row) => row.id));
  return rows.map((row) => toSummary(row, now, deposits.get(row.id) ?? null));
}

/** The design name a stored revision carries. */
function revisionName(data: unknown): string {
  const value = storedJson(data);
  const name = (value as { name?: unknown } | null)?.name;
  return typeof name === 'string' ? name : '';
}

/** Proofs sent to a client's e-mail by the client's own shop, newest first ("Shared with me"). */
export async function listSharedWith(shopId: number, email: string, now: Date): Promise<SharedProof[]> {
  const rows = await db()
    .select({ proof: proofs, data: boardRevisions.data })
    .from(proofs)
    .innerJoin(boardRevisions, and(eq(boardRevisions.boardId, proofs.boardId), eq(boardRevisions.revision, proofs.revision)))
    .where(and(eq(proofs.shopId, shopId), eq(proofs.clientEmail, email.toLowerCase())))
    .orderBy(desc(proofs.createdAt), desc(proofs.id));
  return rows.map(({ proof, data }) => ({
    id: proof.id,
    boardName: revisionName(data),
    revision: proof.revision,
    createdAt: proof.createdAt.toISOString(),
    expiresAt: proof.expiresAt.toISOString(),
    state: stateOf(proof, now),
    decision: decisionOf(proof),
  }));
}
