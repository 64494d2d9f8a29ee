import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../support/test-db.ts';

// The app reads its configuration once per process; this file runs in its own module graph, so
// it can pretend the app is served over HTTPS before anything reads the configuration.
process.env.APP_ORIGIN = 'https://shop.kerfline.example';
const { rotateSession } = await import('~/lib/auth/index.server.ts');
const { fakeCookies } = await import('../../support/fake-cookies.ts');
const { newShopUser } = await import('../../support/sessions.ts');

afterAll(() => closeDb());

describe('session cookie over HTTPS', () => {
  it('is Secure, HttpOnly and SameSite=Lax when APP_ORIGIN is https', async () => {
    const user = await newShopUser('client');
    const { cookies, set } = fakeCookies();
    await rotateSession(cookies, null, user.id);
    expect(set.at(-1)?.options).toMatchObject({ secure: true, httpOnly: true, sameSite: 'lax' });
  });
});
