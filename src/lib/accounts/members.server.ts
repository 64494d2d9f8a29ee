/**
 * The shop's members, as the Owner manages them. Every query is scoped by the shop, so another
 * shop's member id is "not found". A shop always keeps at least one Owner.
 */
import { and, asc, eq } from 'drizzle-orm';
import { db } from '~/lib/db/client.server.ts';
import { users, type Role } from '~/lib/db/schema.ts';
import { done, refused, type Outcome } from './outcome.ts';

export interface Member {
  id: string;
  email: string;
  displayName: string;
  role: Role;
}

const LAST_OWNER = 'A shop needs at least one Owner: make someone else Owner first.';

export async function listMembers(shopId: number): Promise<Member[]> {
  return db()
    .select({ id: users.id, email: users.email, displayName: users.displayName, role: users.role })
    .from(users)
    .where(eq(users.shopId, shopId))
    .orderBy(asc(users.role), asc(users.displayName));
}

type Change = { kind: 'role'; role: Role } | { kind: 'remove' };

/**
 * Locks the shop's Owner rows and the target row, so two Owners demoting each other at once
 * cannot leave the shop without one.
 */
async function changeMember(shopId: number, userId: string, change: Change): Promise<Outcome> {
  return db().transaction(async (tx) => {
    const owners = await tx.select({ id: users.id }).from(users).where(and(eq(users.shopId, shopId), eq(users.role, 'owner'))).for('update');
    const [target] = await tx.select({ role: users.role }).from(users).where(and(eq(users.id, userId), eq(users.shopId, shopId))).for('update');
    if (!target) return refused(404, { userId: 'No such member in this shop.' });
    const losesOwner = target.role === 'owner' && (change.kind === 'remove' || change.role !== 'owner');
    if (losesOwner && owners.length <= 1) return refused(409, { userId: LAST_OWNER }, LAST_OWNER);
    if (change.kind === 'remove') await tx.delete(users).where(eq(users.id, userId));
    else await tx.update(users).set({ role: change.role }).where(eq(users.id, userId));
    return done(undefined);
  });
}

/** Roles take effect on the member's next request (sessions read the role from the database). */
export const changeRole = (shopId: number, userId: string, role: Role) => changeMember(shopId, userId, { kind: 'role', role });

/** Removes the member; their sessions go with the row. */
export const removeMember = (shopId: number, userId: string) => changeMember(shopId, userId, { kind: 'remove' });
