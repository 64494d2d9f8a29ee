/**
 * One row of each kind a route can name by id (board, template, proof with its link token) in a
 * shop, and a snapshot of the database that shows whether a request changed anything: the row
 * count of every table, plus the rows named by id.
 */
import { asc, eq, inArray } from 'drizzle-orm';
import { newToken, sha256Hex } from '~/lib/auth/index.server.ts';
import { boards, proofs, templates } from '~/lib/db/schema.ts';
import { fixtureDesign, insertBoard } from './designs.ts';
import { tableCounts } from './table-counts.ts';
import { db } from './test-db.ts';

export interface ShopRows {
  shopId: number;
  boardId: number;
  templateId: number;
  proofId: number;
  /** The proof link's token (only its hash is stored). */
  proofToken: string;
}

/** A proof of `boardId` revision 1 for `clientEmail`, with a fresh link token. */
export async function issueProof(shopId: number, boardId: number, createdBy: string, clientEmail: string): Promise<{ proofId: number; proofToken: string }> {
  const proofToken = newToken();
  const [row] = await db()
    .insert(proofs)
    .values({
      shopId,
      boardId,
      revision: 1,
      tokenHash: sha256Hex(proofToken),
      clientName: 'Ines Calloway',
      clientEmail,
      message: 'Shop rows proof',
      expiresAt: new Date(Date.now() + 86_400_000),
      createdBy,
    })
    .$returningId();
  return { proofId: row!.id, proofToken };
}

/** The shop's oldest template, or a new typed one named `name`. */
async function templateOf(shopId: number, name: string): Promise<number> {
  const [found] = await db().select({ id: templates.id }).from(templates).where(eq(templates.shopId, shopId)).orderBy(asc(templates.id)).limit(1);
  if (found) return found.id;
  const [row] = await db()
    .insert(templates)
    .values({ shopId, name, units: 'mm', trebleScale: 648, bassScale: 686, frets: 24, slotWidth: 0.6, keyWidth: 0.55, notes: '' })
    .$returningId();
  return row!.id;
}

/** Rows for a shop: `boardId` when given (e.g. a seeded board), otherwise a new board named `name`. */
export async function shopRows(shopId: number, userId: string, clientEmail: string, name: string, boardId?: number): Promise<ShopRows> {
  const board = boardId ?? (await insertBoard(shopId, userId, { ...fixtureDesign('seven-string-fan'), name }));
  const proof = await issueProof(shopId, board, userId, clientEmail);
  return { shopId, boardId: board, templateId: await templateOf(shopId, name), ...proof };
}

/** Everything a rejected request must leave as it was, for the rows of `shops`. */
export async function databaseState(shops: readonly ShopRows[]): Promise<unknown> {
  const boardIds = shops.map((s) => s.boardId);
  const [counts, boardRows, templateRows, proofRows] = await Promise.all([
    tableCounts(),
    db()
      .select({ id: boards.id, version: boards.version, updatedAt: boards.updatedAt, currentRevision: boards.currentRevision, archivedAt: boards.archivedAt, name: boards.name })
      .from(boards)
      .where(inArray(boards.id, boardIds))
      .orderBy(asc(boards.id)),
    db().select({ id: templates.id, updatedAt: templates.updatedAt }).from(templates).where(inArray(templates.id, shops.map((s) => s.templateId))).orderBy(asc(templates.id)),
    db()
      .select({ id: proofs.id, decision: proofs.decision, revokedAt: proofs.revokedAt })
      .from(proofs)
      .where(inArray(proofs.id, shops.map((s) => s.proofId)))
      .orderBy(asc(proofs.id)),
  ]);
  return { counts, boardRows, templateRows, proofRows };
}
