import { count, eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { changeRole, listMembers, removeMember } from '~/lib/accounts/members.server.ts';
import { sessions, users } from '~/lib/db/schema.ts';
import { addShopUser, newShopUser } from '../../support/sessions.ts';
import { closeDb, db } from '../../support/test-db.ts';

afterAll(() => closeDb());

describe('members (Owner only in the app; these are the rules underneath)', () => {
  it('never demotes or removes the last Owner', async () => {
    const owner = await newShopUser('owner');
    expect(await changeRole(owner.shopId, owner.id, 'builder')).toMatchObject({ ok: false, status: 409, errors: { userId: expect.any(String) } });
    expect(await removeMember(owner.shopId, owner.id)).toMatchObject({ ok: false, status: 409 });
    expect((await listMembers(owner.shopId)).map((m) => m.role)).toEqual(['owner']);
  });

  it('with two Owners one may step down; then the other is the last again', async () => {
    const a = await newShopUser('owner');
    const b = await addShopUser(a.shopId, 'owner');
    expect((await changeRole(a.shopId, a.id, 'builder')).ok).toBe(true);
    expect(await changeRole(a.shopId, b.id, 'client')).toMatchObject({ ok: false, status: 409 });
  });

  it('two Owners demoting each other at the same moment still leave one Owner', async () => {
    const a = await newShopUser('owner');
    const b = await addShopUser(a.shopId, 'owner');
    const results = await Promise.all([changeRole(a.shopId, b.id, 'builder'), changeRole(a.shopId, a.id, 'builder')]);
    expect(results.filter((r) => r.ok)).toHaveLength(1);
    const owners = (await listMembers(a.shopId)).filter((m) => m.role === 'owner');
    expect(owners).toHaveLength(1);
  });

  it('changes roles and removes members (their sessions go too)', async () => {
    const owner = await newShopUser('owner');
    const builder = await addShopUser(owner.shopId, 'builder');
    expect((await changeRole(owner.shopId, builder.id, 'client')).ok).toBe(true);
    expect((await listMembers(owner.shopId)).find((m) => m.id === builder.id)?.role).toBe('client');
    expect((await removeMember(owner.shopId, builder.id)).ok).toBe(true);
    expect(await db().select().from(users).where(eq(users.id, builder.id))).toEqual([]);
    const left = await db().select({ n: count() }).from(sessions).where(eq(sessions.userId, builder.id));
    expect(left[0]!.n).toBe(0);
  });

  it("another shop's member is not found (404) and stays untouched", async () => {
    const owner = await newShopUser('owner');
    const foreign = await newShopUser('builder');
    expect(await changeRole(owner.shopId, foreign.id, 'owner')).toMatchObject({ ok: false, status: 404 });
    expect(await removeMember(owner.shopId, foreign.id)).toMatchObject({ ok: false, status: 404 });
    const [row] = await db().select().from(users).where(eq(users.id, foreign.id));
    expect(row?.role).toBe('builder');
  });
});
