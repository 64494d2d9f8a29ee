/** Sign-in security on the built server, over plain HTTP as a browser or a script would see it. */
import { afterAll, describe, expect, it } from 'vitest';
import { BASE_URL } from '../support/browser.ts';
import { startBuiltServer, type BuiltServer } from '../support/built-server.ts';
import { uniqueEmail } from '../support/outbox.ts';
import { newShopUser } from '../support/sessions.ts';
import { closeDb } from '../support/test-db.ts';

afterAll(() => closeDb());

const TEST_PASSWORD = 'test-password-1'; // what tests/support/sessions.ts gives its users

function post(path: string, fields: Record<string, string>, headers: Record<string, string> = {}): Promise<Response> {
  return fetch(`${BASE_URL}${path}`, {
    method: 'POST',
    headers: { origin: BASE_URL, 'content-type': 'application/x-www-form-urlencoded', ...headers },
    body: new URLSearchParams(fields).toString(),
    redirect: 'manual',
  });
}

const get = (path: string, cookie?: string) => fetch(`${BASE_URL}${path}`, { headers: cookie ? { cookie } : {}, redirect: 'manual' });

function sessionCookieOf(response: Response): string {
  const line = response.headers.getSetCookie().find((c) => c.startsWith('kerfline_session='));
  if (!line) throw new Error('no session cookie set');
  return line;
}

/** The page's <main>, with the given e-mail replaced, so answers can be compared. */
async function mainText(response: Response, email: string): Promise<string> {
  const html = await response.text();
  return (html.match(/<main[\s\S]*<\/main>/)?.[0] ?? '').split(email).join('EMAIL');
}

describe('session cookie and sessions', () => {
  it('sets a HttpOnly, SameSite=Lax cookie on sign-in (not Secure over http) and rotates the session', async () => {
    const user = await newShopUser('builder');
    expect((await get('/account', user.cookie)).status).toBe(200);
    const response = await post('/sign-in', { email: user.email, password: TEST_PASSWORD, next: '/account' }, { cookie: user.cookie });
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe('/account');
    const cookie = sessionCookieOf(response);
    expect(cookie).toMatch(/;\s*HttpOnly/i);
    expect(cookie).toMatch(/;\s*SameSite=Lax/i);
    expect(cookie).toMatch(/;\s*Path=\//i);
    expect(cookie).not.toMatch(/;\s*Secure/i);
    const fresh = cookie.split(';')[0]!;
    expect(fresh).not.toBe(user.cookie);
    expect((await get('/account', fresh)).status).toBe(200);
    // The session the browser had before signing in no longer works.
    expect((await get('/account', user.cookie)).status).toBe(302);
  });

  it('only follows same-site relative next paths after sign-in', async () => {
    const user = await newShopUser('owner');
    for (const next of ['https://elsewhere.example/', '//elsewhere.example/x', '/\\elsewhere.example']) {
      const response = await post('/sign-in', { email: user.email, password: TEST_PASSWORD, next });
      expect(response.status).toBe(303);
      expect(response.headers.get('location')).toBe('/boards');
    }
  });

  it('sign-out ends every session of the account', async () => {
    const user = await newShopUser('client');
    const signedIn = await post('/sign-in', { email: user.email, password: TEST_PASSWORD });
    const browserB = sessionCookieOf(signedIn).split(';')[0]!;
    const out = await post('/sign-out', {}, { cookie: browserB });
    expect(out.status).toBe(303);
    expect(sessionCookieOf(out)).toMatch(/kerfline_session=;|Max-Age=0/);
    expect((await get('/account', browserB)).status).toBe(302);
    expect((await get('/account', user.cookie)).status).toBe(302);
  });
});

describe('CSRF: every non-GET request needs this site as its Origin', () => {
  const layout = (headers: Record<string, string>) =>
    fetch(`${BASE_URL}/api/layout`, { method: 'POST', headers: { 'content-type': 'application/json', ...headers }, body: '{}' });

  it('refuses JSON without an Origin, or from another origin, with 403', async () => {
    expect((await layout({})).status).toBe(403);
    expect((await layout({ origin: 'https://evil.example' })).status).toBe(403);
    expect((await layout({ origin: BASE_URL.replace('127.0.0.1', 'localhost') })).status).toBe(403);
    const ok = await layout({ origin: BASE_URL });
    expect(ok.status).toBe(400); // past the check: the empty design is refused on its merits
  });

  it('refuses cross-site form posts, and other methods, with 403', async () => {
    const user = await newShopUser('owner');
    const forged = await post('/members?_action=members.invite', { email: uniqueEmail('victim'), role: 'owner' }, { cookie: user.cookie, origin: 'https://evil.example' });
    expect(forged.status).toBe(403);
    expect((await fetch(`${BASE_URL}/sign-out`, { method: 'POST', headers: { cookie: user.cookie } })).status).toBe(403);
    expect((await fetch(`${BASE_URL}/api/version`, { method: 'DELETE' })).status).toBe(403);
    expect((await get('/account', user.cookie)).status).toBe(200);
  });
});

describe('no account enumeration', () => {
  it('sign-in answers a wrong password and an unknown e-mail alike', async () => {
    const user = await newShopUser('builder');
    const unknown = uniqueEmail('ghost');
    const a = await post('/sign-in', { email: user.email, password: 'wrong-password' });
    const b = await post('/sign-in', { email: unknown, password: 'wrong-password' });
    expect(a.status).toBe(401);
    expect(b.status).toBe(a.status);
    expect(await mainText(a, user.email)).toBe(await mainText(b, unknown));
  });

  it('forgot-password and create-shop answer known and unknown e-mails alike', async () => {
    const user = await newShopUser('client');
    const unknown = uniqueEmail('ghost');
    for (const [path, fields] of [
      ['/forgot-password', (email: string) => ({ email })],
      ['/create-shop', (email: string) => ({ shopName: 'Echo Shop', email })],
    ] as const) {
      const a = await post(path, fields(user.email));
      const b = await post(path, fields(unknown));
      expect(a.status).toBe(200);
      expect(b.status).toBe(200);
      expect(await mainText(a, user.email)).toBe(await mainText(b, unknown));
    }
  });
});

describe('rate limits', () => {
  it('sign-in: after 10 failures for one e-mail, 429 with Retry-After', async () => {
    const email = uniqueEmail('guesser');
    for (let i = 0; i < 10; i++) expect((await post('/sign-in', { email, password: `guess-${i}` })).status).toBe(401);
    const limited = await post('/sign-in', { email, password: 'guess-10' });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(await limited.text()).toContain('Too many attempts');
  });

  it('forgot-password: after 10 requests for one e-mail, 429 with Retry-After', async () => {
    const email = uniqueEmail('spammed');
    for (let i = 0; i < 10; i++) expect((await post('/forgot-password', { email })).status).toBe(200);
    const limited = await post('/forgot-password', { email });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
  });
});

describe('bad input', () => {
  it('names the field: empty, malformed and over-long values', async () => {
    const empty = await post('/sign-in', { email: '', password: '' });
    expect(empty.status).toBe(400);
    const html = await empty.text();
    expect(html).toMatch(/id="f-email-error"[^>]*>Enter an e-mail address</);
    expect(html).toMatch(/aria-invalid="true" aria-describedby="f-email-error"/);
    const malformed = await post('/forgot-password', { email: 'not-an-address' });
    expect(malformed.status).toBe(400);
    expect(await malformed.text()).toContain('Enter an e-mail address like name@example.com');
    const long = await post('/create-shop', { shopName: 'x'.repeat(500), email: uniqueEmail('long') });
    expect(long.status).toBe(400);
    expect(await long.text()).toMatch(/id="f-shopName-error"[^>]*>Use at most 120 characters</);
  });

  it('refuses a wrong content type with 415 and an oversized body with 413', async () => {
    const wrongType = await fetch(`${BASE_URL}/sign-in`, { method: 'POST', headers: { origin: BASE_URL, 'content-type': 'text/csv' }, body: 'a,b' });
    expect(wrongType.status).toBe(415);
    expect(await wrongType.json()).toMatchObject({ field: 'content-type' });
    const huge = await post('/forgot-password', { email: `${'a'.repeat(40_000)}@b.example` });
    expect(huge.status).toBe(413);
  });

  it('gives forged and malformed links the same "no longer valid" page', async () => {
    for (const path of ['/invitations/AAAAAAAAAAAAAAAAAAAAAA', '/invitations/nonsense', '/reset-password/AAAAAAAAAAAAAAAAAAAAAA', '/reset-password/not%20a%20token']) {
      const response = await get(path);
      expect(response.status).toBe(410);
      expect(await response.text()).toContain('This link is no longer valid');
    }
  });
});

describe('development Outbox page', () => {
  let server: BuiltServer | undefined;
  afterAll(() => server?.stop());

  it('exists in demo mode, says it is a development fake, and is not there when KERFLINE_MODE is unset (production is the default)', async () => {
    const demo = await get('/outbox');
    expect(demo.status).toBe(200);
    expect(await demo.text()).toContain('Development fake');
    server = await startBuiltServer({ env: { KERFLINE_MODE: undefined } });
    const response = await fetch(`${server.url}/outbox`);
    expect(response.status).toBe(404);
    expect(await response.text()).not.toContain('Outbox');
  });

  it('in demo mode is served to this machine only: a client that a trusted proxy says is elsewhere gets 404', async () => {
    const proxied = await startBuiltServer({ env: { TRUSTED_PROXIES: 'loopback', KERFLINE_MODE: 'demo' } });
    try {
      const local = await fetch(`${proxied.url}/outbox`);
      expect(local.status).toBe(200);
      // 203.0.113.0/24 is a documentation range (RFC 5737): a header value here, no traffic goes there.
      const remote = await fetch(`${proxied.url}/outbox`, { headers: { 'x-forwarded-for': '203.0.113.7' } });
      expect(remote.status).toBe(404);
      expect(await remote.text()).not.toContain('Development fake');
    } finally {
      await proxied.stop();
    }
  });
});

describe('shop settings on the Members page', () => {
  it('the Owner sets the time zone and the deposit currency; an unknown zone or currency gets 400 with the message beside the field', async () => {
    const owner = await newShopUser('owner');
    const send = (timeZone: string, currency = 'EUR') => post('/members?_action=members.settings', { timeZone, currency }, { cookie: owner.cookie });
    const bad = await send('Mars/Olympus_Mons');
    expect(bad.status).toBe(400);
    expect(await bad.text()).toContain('choose a time zone from the list');
    const badCurrency = await send('Europe/London', 'EURO');
    expect(badCurrency.status).toBe(400);
    expect(await badCurrency.text()).toContain('must be an ISO 4217 currency code');
    const good = await send('Europe/London', 'gbp');
    expect(good.status).toBe(303);
    const page = await fetch(`${BASE_URL}/members`, { headers: { cookie: owner.cookie } });
    const html = await page.text();
    expect(html).toMatch(/<option value="Europe\/London" selected/);
    expect(html).toMatch(/<option value="GBP" selected/);
  });
});
