import { count, eq } from 'drizzle-orm';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { endAllSessions, resolveSession, rotateSession, SESSION_COOKIE, sha256Hex } from '~/lib/auth/index.server.ts';
import { changePassword } from '~/lib/accounts/account-settings.server.ts';
import { checkCredentials } from '~/lib/accounts/sign-in.server.ts';
import { sessions, users } from '~/lib/db/schema.ts';
import { fakeCookies } from '../../support/fake-cookies.ts';
import { addShopUser, newShopUser } from '../../support/sessions.ts';
import { closeDb, db } from '../../support/test-db.ts';

// Counts argon2 verify calls, to show unknown e-mails cost the same hashing work as known ones.
const argon = vi.hoisted(() => ({ verifyCalls: 0 }));
vi.mock('@node-rs/argon2', async (importOriginal) => {
  const real = await importOriginal<typeof import('@node-rs/argon2')>();
  return { ...real, verify: (...args: Parameters<typeof real.verify>) => (argon.verifyCalls++, real.verify(...args)) };
});

afterAll(() => closeDb());

const TEST_PASSWORD = 'test-password-1'; // what tests/support/sessions.ts gives its users
const sessionCount = async (userId: string) => (await db().select({ n: count() }).from(sessions).where(eq(sessions.userId, userId)))[0]!.n;

describe('sign-in checks', () => {
  it('accepts the right password, refuses a wrong one, and looks e-mails up case-insensitively', async () => {
    const user = await newShopUser('builder');
    expect(await checkCredentials(user.email.toUpperCase(), TEST_PASSWORD)).toEqual({ ok: true, userId: user.id, role: 'builder' });
    expect(await checkCredentials(user.email, 'not-the-password')).toEqual({ ok: false });
  });

  it('does one argon2 verify for an unknown e-mail, as for a known one (no timing tell)', async () => {
    const user = await newShopUser('client');
    argon.verifyCalls = 0;
    expect((await checkCredentials(user.email, 'wrong-password-here')).ok).toBe(false);
    const known = argon.verifyCalls;
    argon.verifyCalls = 0;
    expect((await checkCredentials('nobody-at-all@test.example', 'wrong-password-here')).ok).toBe(false);
    expect(known).toBe(1);
    expect(argon.verifyCalls).toBe(known);
  });
});

describe('sessions', () => {
  it('rotates on sign-in: the session the browser had before stops working', async () => {
    const user = await newShopUser('builder');
    const { cookies, set } = fakeCookies({ [SESSION_COOKIE]: user.token });
    const before = await resolveSession(cookies);
    expect(before?.user.id).toBe(user.id);
    await rotateSession(cookies, before!.sessionId, user.id);
    const fresh = set.at(-1)!;
    expect(fresh.name).toBe(SESSION_COOKIE);
    expect(fresh.value).not.toBe(user.token);
    expect(fresh.options).toMatchObject({ httpOnly: true, sameSite: 'lax', path: '/' });
    const [old] = await db().select().from(sessions).where(eq(sessions.id, sha256Hex(user.token)));
    expect(old).toBeUndefined();
    expect(await resolveSession(fakeCookies({ [SESSION_COOKIE]: fresh.value }).cookies)).not.toBeNull();
    expect(await resolveSession(fakeCookies({ [SESSION_COOKIE]: user.token }).cookies)).toBeNull();
  });

  it('stores only the SHA-256 of the cookie token as the session id', async () => {
    const user = await newShopUser('client');
    const { cookies, set } = fakeCookies();
    await rotateSession(cookies, null, user.id);
    const token = set.at(-1)!.value;
    expect(token).toMatch(/^[A-Za-z0-9_-]{22}$/); // 16 random bytes, base64url
    const ids = (await db().select({ id: sessions.id }).from(sessions).where(eq(sessions.userId, user.id))).map((s) => s.id);
    expect(ids).toContain(sha256Hex(token));
    expect(ids).not.toContain(token);
  });

  it('sign-out ends every session of the account and blanks the cookie', async () => {
    const user = await newShopUser('owner');
    const other = await addShopUser(user.shopId, 'builder');
    const { cookies, set } = fakeCookies();
    await rotateSession(cookies, null, user.id);
    expect(await sessionCount(user.id)).toBe(2);
    await endAllSessions(cookies, user.id);
    expect(await sessionCount(user.id)).toBe(0);
    expect(await sessionCount(other.id)).toBe(1);
    expect(set.at(-1)).toMatchObject({ name: SESSION_COOKIE, value: '' });
  });

  it('changing the password needs the current one and ends every other session', async () => {
    const user = await newShopUser('builder');
    const { cookies, set } = fakeCookies();
    await rotateSession(cookies, null, user.id);
    const keep = sha256Hex(set.at(-1)!.value);
    expect(await sessionCount(user.id)).toBe(2);

    const wrong = await changePassword(user.id, keep, 'not-my-password', 'brand-new-password');
    expect(wrong).toMatchObject({ ok: false, status: 400, errors: { currentPassword: expect.any(String) } });
    expect(await sessionCount(user.id)).toBe(2);

    expect((await changePassword(user.id, keep, TEST_PASSWORD, 'brand-new-password')).ok).toBe(true);
    const left = await db().select({ id: sessions.id }).from(sessions).where(eq(sessions.userId, user.id));
    expect(left.map((s) => s.id)).toEqual([keep]);
    const [row] = await db().select().from(users).where(eq(users.id, user.id));
    expect((await checkCredentials(row!.email, 'brand-new-password')).ok).toBe(true);
    expect((await checkCredentials(row!.email, TEST_PASSWORD)).ok).toBe(false);
  });
});
