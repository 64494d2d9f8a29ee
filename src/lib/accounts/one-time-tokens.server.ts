/**
 * Single-use links (invitations, password resets, new shops). The link carries a 128-bit random
 * token; the table keeps only its SHA-256, so a leaked database holds no usable link.
 */
import { and, eq, gt, inArray, isNull } from 'drizzle-orm';
import { isWellFormedToken, newToken, sha256Hex } from '~/lib/auth/index.server.ts';
import type { Db } from '~/lib/db/client.server.ts';
import { oneTimeTokens, type Role, type TOKEN_KINDS } from '~/lib/db/schema.ts';

/** A transaction or the pool: both can run these queries. */
type Runner = Pick<Db, 'select' | 'insert' | 'update'>;

export type TokenKind = (typeof TOKEN_KINDS)[number];
export type TokenRow = typeof oneTimeTokens.$inferSelect;

export interface NewToken {
  kind: TokenKind;
  /** Null only for a `new-shop` link, which names the shop to create instead. */
  shopId: number | null;
  shopName?: string;
  email: string;
  ttlMs: number;
  userId?: string | null;
  role?: Role | null;
  createdBy?: string | null;
}

/** Stores a new token's hash and returns the token itself (for the e-mailed link only). */
export async function issueToken(runner: Runner, spec: NewToken): Promise<string> {
  const token = newToken();
  await runner.insert(oneTimeTokens).values({
    kind: spec.kind,
    tokenHash: sha256Hex(token),
    shopId: spec.shopId,
    shopName: spec.shopName ?? null,
    email: spec.email,
    userId: spec.userId ?? null,
    role: spec.role ?? null,
    createdBy: spec.createdBy ?? null,
    expiresAt: new Date(Date.now() + spec.ttlMs),
  });
  return token;
}

const usable = (now: Date) => and(isNull(oneTimeTokens.usedAt), isNull(oneTimeTokens.revokedAt), gt(oneTimeTokens.expiresAt, now));

/**
 * The token's row when it can still be used; null for forged, unknown, expired, used or revoked
 * tokens alike (callers show one "link no longer valid" page for all of them).
 * With `lock`, the row stays locked until the surrounding transaction ends.
 */
export async function findUsableToken(
  runner: Runner,
  kind: TokenKind | readonly TokenKind[],
  token: string,
  lock = false,
): Promise<TokenRow | null> {
  if (!isWellFormedToken(token)) return null;
  const kinds = typeof kind === 'string' ? [kind] : [...kind];
  const query = runner
    .select()
    .from(oneTimeTokens)
    .where(and(eq(oneTimeTokens.tokenHash, sha256Hex(token)), inArray(oneTimeTokens.kind, kinds), usable(new Date())))
    .limit(1);
  const [row] = lock ? await query.for('update') : await query;
  return row ?? null;
}

export async function markTokenUsed(runner: Runner, id: number): Promise<void> {
  await runner.update(oneTimeTokens).set({ usedAt: new Date() }).where(eq(oneTimeTokens.id, id));
}

/** Revokes every still-usable token of `kind` for `email` in `shopId` (a new one replaces them). */
export async function revokePendingTokens(runner: Runner, kind: TokenKind, shopId: number, email: string): Promise<void> {
  await runner
    .update(oneTimeTokens)
    .set({ revokedAt: new Date() })
    .where(and(eq(oneTimeTokens.kind, kind), eq(oneTimeTokens.shopId, shopId), eq(oneTimeTokens.email, email), usable(new Date())));
}
