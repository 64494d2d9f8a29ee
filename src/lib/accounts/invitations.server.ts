/**
 * Invitations to a shop (also the link that finishes creating a new shop, with role Owner):
 * a single-use link valid 7 days; accepting it creates the account with the invited role.
 */
import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import { hashPassword } from '~/lib/auth/index.server.ts';
import { config } from '~/lib/config/env.server.ts';
import { db, type Db } from '~/lib/db/client.server.ts';
import { newUserId } from '~/lib/db/ids.server.ts';
import { withRetry } from '~/lib/db/with-retry.server.ts';
import { oneTimeTokens, shops, users, type Role } from '~/lib/db/schema.ts';
import type { AcceptInvitationInput } from '~/lib/schemas/account.ts';
import { invitationMail } from './account-mail.ts';
import { INVITATION_TTL_MS } from './links.ts';
import { sendMail } from '~/lib/mail/send.server.ts';
import { findUsableToken, issueToken, markTokenUsed, revokePendingTokens } from './one-time-tokens.server.ts';
import { done, refused, type Outcome } from './outcome.ts';
import { findUserByEmail, shopName } from './users.server.ts';

export const LINK_NO_LONGER_VALID = 'This link is no longer valid.';

export interface Inviter {
  shopId: number;
  userId: string;
  displayName: string;
}

export interface PendingInvitation {
  id: number;
  email: string;
  role: Role;
  expiresAt: Date;
}

const NOT_SENT = 'The invitation is saved, but the e-mail could not be sent. Try "Resend" in a moment.';

async function issueAndMail(inviter: Inviter, email: string, role: Role): Promise<Outcome> {
  const token = await withRetry(() => db().transaction(async (tx) => {
    await revokePendingTokens(tx, 'invite', inviter.shopId, email);
    return issueToken(tx, { kind: 'invite', shopId: inviter.shopId, email, role, createdBy: inviter.userId, ttlMs: INVITATION_TTL_MS });
  }));
  const mail = invitationMail(config().appOrigin, await shopName(inviter.shopId), role, inviter.displayName, token);
  return (await sendMail({ to: email, ...mail })) ? done(undefined) : refused(502, {}, NOT_SENT);
}

/** Invites `email` with `role`; a pending invitation for the same address is replaced. */
export async function inviteMember(inviter: Inviter, email: string, role: Role): Promise<Outcome> {
  const existing = await findUserByEmail(email);
  if (existing?.shopId === inviter.shopId) return refused(409, { email: 'This person is already a member of the shop.' });
  return issueAndMail(inviter, email, role);
}

/** Sends a fresh link (valid 7 days again) for a pending invitation of this shop; 404 otherwise. */
export async function resendInvitation(inviter: Inviter, invitationId: number): Promise<Outcome> {
  const pending = (await listPendingInvitations(inviter.shopId)).find((i) => i.id === invitationId);
  if (!pending) return refused(404, { invitationId: 'No such pending invitation.' });
  return issueAndMail(inviter, pending.email, pending.role);
}

export async function revokeInvitation(shopId: number, invitationId: number): Promise<Outcome> {
  const [result] = await db()
    .update(oneTimeTokens)
    .set({ revokedAt: new Date() })
    .where(and(eq(oneTimeTokens.id, invitationId), eq(oneTimeTokens.shopId, shopId), eq(oneTimeTokens.kind, 'invite'), isNull(oneTimeTokens.usedAt), isNull(oneTimeTokens.revokedAt)));
  return result.affectedRows === 1 ? done(undefined) : refused(404, { invitationId: 'No such pending invitation.' });
}

export async function listPendingInvitations(shopId: number): Promise<PendingInvitation[]> {
  const rows = await db()
    .select({ id: oneTimeTokens.id, email: oneTimeTokens.email, role: oneTimeTokens.role, expiresAt: oneTimeTokens.expiresAt })
    .from(oneTimeTokens)
    .where(and(eq(oneTimeTokens.shopId, shopId), eq(oneTimeTokens.kind, 'invite'), isNull(oneTimeTokens.usedAt), isNull(oneTimeTokens.revokedAt), gt(oneTimeTokens.expiresAt, new Date())))
    .orderBy(asc(oneTimeTokens.email));
  return rows.map((r) => ({ ...r, role: r.role ?? 'client' }));
}

export interface InvitationView {
  shopName: string;
  email: string;
  role: Role;
}

/** The links the invitation page accepts: a shop's invitation, or the one that creates a shop. */
const JOIN_LINKS = ['invite', 'new-shop'] as const;

/** What the invitation page shows; null when the link cannot be used. */
export async function describeInvitation(token: string): Promise<InvitationView | null> {
  const row = await findUsableToken(db(), JOIN_LINKS, token);
  if (!row?.role) return null;
  if (row.kind === 'new-shop') return row.shopName ? { shopName: row.shopName, email: row.email, role: row.role } : null;
  if (row.shopId === null) return null;
  const [shop] = await db().select({ name: shops.name }).from(shops).where(eq(shops.id, row.shopId));
  return shop ? { shopName: shop.name, email: row.email, role: row.role } : null;
}

/**
 * Creates the account and marks the link used, in one transaction; a `new-shop` link creates its
 * shop in the same transaction, so a link never used leaves no shop behind. 410 when the link
 * cannot be used; 409 when the address got an account meanwhile (e-mail addresses are unique).
 */
export async function acceptInvitation(token: string, input: AcceptInvitationInput): Promise<Outcome<{ userId: string; email: string }>> {
  const passwordHash = await hashPassword(input.password);
  const result = await withRetry(() => db().transaction(async (tx) => {
    const row = await findUsableToken(tx, JOIN_LINKS, token, true);
    if (!row?.role) return 'gone' as const;
    const [taken] = await tx.select({ id: users.id }).from(users).where(eq(users.email, row.email)).limit(1);
    if (taken) return 'taken' as const;
    const shopId = row.kind === 'new-shop' ? await createShop(tx, row.shopName) : row.shopId;
    if (shopId === null) return 'gone' as const;
    const id = newUserId();
    await tx.insert(users).values({ id, shopId, email: row.email, displayName: input.displayName, passwordHash, role: row.role });
    await markTokenUsed(tx, row.id);
    return { userId: id, email: row.email };
  }));
  if (result === 'gone') return refused(410, {}, LINK_NO_LONGER_VALID);
  if (result === 'taken') {
    return refused(409, {}, 'This e-mail address already has a Kerfline account. Sign in with it, or ask the shop to invite another address.');
  }
  return done(result);
}

async function createShop(tx: Pick<Db, 'insert'>, name: string | null): Promise<number | null> {
  if (!name) return null;
  const [shop] = await tx.insert(shops).values({ name }).$returningId();
  return shop?.id ?? null;
}
