/**
 * Rate limits against the built server, as an attacker with no account would try them.
 *
 * The main test server trusts no proxy (TRUSTED_PROXIES unset), so every request from this
 * process comes from 127.0.0.1 whatever X-Forwarded-For says; the first test proves that. To act
 * from many addresses, the other tests use a second built server on the same database started
 * with TRUSTED_PROXIES=loopback: there, the right-most untrusted X-Forwarded-For entry is the
 * client, and each test picks documentation-range addresses (RFC 5737: 192.0.2.0/24,
 * 198.51.100.0/24, 203.0.113.0/24) of its own, so no test spends another's (or 127.0.0.1's)
 * budget. Lock-outs follow OWASP ASVS 2.2.1 and the OWASP Authentication Cheat Sheet.
 */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { MAIL_BUDGETS, ROUTE_BUDGETS, SIGN_IN_BUDGETS } from '~/lib/http/rate-budgets.ts';
import { PROOF_SUBJECTS } from '~/lib/proofs/proof-mails.server.ts';
import { BASE_URL, launchBrowser } from '../support/browser.ts';
import { startBuiltServer, type BuiltServer } from '../support/built-server.ts';
import { fixtureDesign, insertBoard } from '../support/designs.ts';
import { uniqueEmail, waitForMail } from '../support/outbox.ts';
import { newShopUser, type TestUser } from '../support/sessions.ts';
import { closeDb } from '../support/test-db.ts';

const TEST_PASSWORD = 'test-password-1'; // what tests/support/sessions.ts gives its users

let proxied: BuiltServer;
let browser: Browser | undefined;

beforeAll(async () => {
  proxied = await startBuiltServer({ env: { TRUSTED_PROXIES: 'loopback' } });
});
afterAll(async () => {
  await browser?.close();
  await proxied?.stop();
  await closeDb();
});

let addressesGiven = 0;
/** A documentation-range address no other test in this run gets (see the header). */
function testAddress(): string {
  const nets = ['192.0.2', '198.51.100', '203.0.113'];
  const n = addressesGiven++;
  return `${nets[Math.floor(n / 254) % nets.length]}.${(n % 254) + 1}`;
}

interface Send {
  /** X-Forwarded-For to send. */
  forwardedFor?: string;
  cookie?: string;
}

function postForm(base: string, path: string, fields: Record<string, string>, send: Send = {}): Promise<Response> {
  return fetch(`${base}${path}`, {
    method: 'POST',
    headers: {
      origin: base,
      'content-type': 'application/x-www-form-urlencoded',
      ...(send.forwardedFor ? { 'x-forwarded-for': send.forwardedFor } : {}),
      ...(send.cookie ? { cookie: send.cookie } : {}),
    },
    body: new URLSearchParams(fields).toString(),
    redirect: 'manual',
  });
}

const signIn = (base: string, email: string, password: string, send: Send = {}) => postForm(base, '/sign-in', { email, password }, send);

describe('client address: X-Forwarded-For counts only from a trusted proxy', () => {
  it('the main server (no trusted proxy): a new X-Forwarded-For on every guess changes nothing', async () => {
    const email = uniqueEmail('rotated');
    for (let i = 0; i < SIGN_IN_BUDGETS.perAccountAndAddress.points; i++) {
      expect((await signIn(BASE_URL, email, `guess-${i}`, { forwardedFor: `203.0.113.${i + 1}` })).status).toBe(401);
    }
    const limited = await signIn(BASE_URL, email, 'guess-x', { forwardedFor: '198.51.100.77' });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
  });

  it('behind a trusted proxy the right-most untrusted entry is the client: rotating the left ones changes nothing', async () => {
    const email = uniqueEmail('chained');
    const client = testAddress();
    for (let i = 0; i < SIGN_IN_BUDGETS.perAccountAndAddress.points; i++) {
      expect((await signIn(proxied.url, email, `guess-${i}`, { forwardedFor: `10.9.8.${i}, ${client}` })).status).toBe(401);
    }
    expect((await signIn(proxied.url, email, 'guess-x', { forwardedFor: `10.9.9.9, ${client}` })).status).toBe(429);
    expect((await signIn(proxied.url, email, 'guess-y', { forwardedFor: testAddress() })).status).toBe(401);
  });

  it('two app processes on one database keep one count', async () => {
    const email = uniqueEmail('two-servers');
    const half = SIGN_IN_BUDGETS.perAccountAndAddress.points / 2;
    // Both see 127.0.0.1: the main server as its socket, the proxied one as a trusted peer that forwarded nothing.
    for (let i = 0; i < half; i++) expect((await signIn(BASE_URL, email, `a-${i}`)).status).toBe(401);
    for (let i = 0; i < half; i++) expect((await signIn(proxied.url, email, `b-${i}`)).status).toBe(401);
    expect((await signIn(BASE_URL, email, 'c')).status).toBe(429);
    expect((await signIn(proxied.url, email, 'd')).status).toBe(429);
  });
});

describe('sign-in lock-outs lock out attackers, not owners (OWASP ASVS 2.2.1)', () => {
  it('the owner signs in from an address of their own while someone guesses from many others', async () => {
    const owner = await newShopUser('owner');
    const attacker = testAddress();
    for (let i = 0; i < SIGN_IN_BUDGETS.perAccountAndAddress.points; i++) {
      expect((await signIn(proxied.url, owner.email, `guess-${i}`, { forwardedFor: attacker })).status).toBe(401);
    }
    // The guesser's address is refused even with the right password...
    expect((await signIn(proxied.url, owner.email, TEST_PASSWORD, { forwardedFor: attacker })).status).toBe(429);
    // ...more guesses from elsewhere only slow the account's answers down...
    for (let i = 0; i < 3; i++) expect((await signIn(proxied.url, owner.email, `more-${i}`, { forwardedFor: testAddress() })).status).toBe(401);
    // ...and the owner, from an address that has not failed, gets in.
    const ownerIn = await signIn(proxied.url, owner.email, TEST_PASSWORD, { forwardedFor: testAddress() });
    expect(ownerIn.status).toBe(303);
    expect(ownerIn.headers.get('location')).toBe('/boards');
  });

  it('password spraying (one password, many accounts, one address) hits the per-address budget', async () => {
    const sprayer = testAddress();
    for (let i = 0; i < SIGN_IN_BUDGETS.perAddress.points; i++) {
      expect((await signIn(proxied.url, uniqueEmail('sprayed'), 'Summer2026!', { forwardedFor: sprayer })).status).toBe(401);
    }
    const next = await signIn(proxied.url, uniqueEmail('sprayed'), 'Summer2026!', { forwardedFor: sprayer });
    expect(next.status).toBe(429);
    expect(await next.text()).toContain('Too many attempts');
  });

  it('behind one shared connection, a guesser does not lock out people who signed in there before', async () => {
    const member = await newShopUser('builder');
    const office = testAddress();
    expect((await signIn(proxied.url, member.email, TEST_PASSWORD, { forwardedFor: office })).status).toBe(303);
    for (let i = 0; i < SIGN_IN_BUDGETS.perAddress.points; i++) await signIn(proxied.url, uniqueEmail('guessed'), 'guess', { forwardedFor: office });
    expect((await signIn(proxied.url, uniqueEmail('stranger'), 'guess', { forwardedFor: office })).status).toBe(429);
    expect((await signIn(proxied.url, member.email, TEST_PASSWORD, { forwardedFor: office })).status).toBe(303);
  });

  it('30 concurrent wrong sign-ins for one account from one address get at most the budget of real password checks', async () => {
    const owner = await newShopUser('owner');
    const from = testAddress();
    const statuses = await Promise.all(Array.from({ length: 30 }, (_, i) => signIn(proxied.url, owner.email, `burst-${i}`, { forwardedFor: from }).then((r) => r.status)));
    // A 401 is an answer after a real password check; a 429 was refused before it.
    const checked = statuses.filter((s) => s === 401).length;
    expect(checked).toBeLessThanOrEqual(SIGN_IN_BUDGETS.perAccountAndAddress.points);
    expect(checked).toBeGreaterThan(0);
    expect(statuses.filter((s) => s !== 401 && s !== 429)).toEqual([]);
  });
});

describe('route budgets on CPU-heavy public routes', () => {
  const exportBody = (base: string, send: Send) =>
    fetch(`${base}/api/export`, {
      method: 'POST',
      headers: { origin: base, 'content-type': 'application/json', ...(send.forwardedFor ? { 'x-forwarded-for': send.forwardedFor } : {}), ...(send.cookie ? { cookie: send.cookie } : {}) },
      body: '{}',
    });

  it('POST /api/export per address: 429 with Retry-After and a JSON error once the budget is used, however the path is spelled', async () => {
    const from = testAddress();
    const budget = ROUTE_BUDGETS.export.perAddress.points;
    const statuses = await Promise.all(Array.from({ length: budget }, () => exportBody(proxied.url, { forwardedFor: from }).then((r) => r.status)));
    expect(statuses.every((s) => s === 400)).toBe(true);
    const limited = await exportBody(proxied.url, { forwardedFor: from });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(await limited.json()).toMatchObject({ error: expect.stringMatching(/too many requests/i) });
    const slash = await fetch(`${proxied.url}/api/export/`, { method: 'POST', headers: { origin: proxied.url, 'content-type': 'application/json', 'x-forwarded-for': from }, body: '{}' });
    expect(slash.status).toBe(429);
    expect((await exportBody(proxied.url, { forwardedFor: testAddress() })).status).toBe(400);
  });

  it('per signed-in user too: one user spread over many addresses is refused once the user budget is used', async () => {
    const builder = await newShopUser('builder');
    const budget = ROUTE_BUDGETS.export.perUser.points;
    // IPv6 documentation addresses (RFC 3849), apart from every other test's.
    for (let i = 0; i < budget; i++) expect((await exportBody(proxied.url, { forwardedFor: `2001:db8::${(i + 1).toString(16)}`, cookie: builder.cookie })).status).toBe(400);
    expect((await exportBody(proxied.url, { forwardedFor: '2001:db8::ffff', cookie: builder.cookie })).status).toBe(429);
  });

  it('the proof page per address: 429 with Retry-After and the proof-page headers', async () => {
    const from = testAddress();
    const path = `${proxied.url}/p/AAAAAAAAAAAAAAAAAAAAAA`;
    for (let i = 0; i < ROUTE_BUDGETS['proof-page'].perAddress.points; i++) expect((await fetch(path, { headers: { 'x-forwarded-for': from } })).status).toBe(404);
    const limited = await fetch(path, { headers: { 'x-forwarded-for': from } });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(limited.headers.get('referrer-policy')).toBe('no-referrer');
  });
});

describe('no mail cannon: proofs and invitations per user and per shop per hour', () => {
  /** Text a sender would like to mail from Kerfline's address, to an outside inbox. */
  const proofFor = (n: number) => {
    const to = uniqueEmail('outside');
    return { to, body: JSON.stringify({ clientName: `Visitor ${n} WIN A PRIZE`, clientEmail: to, message: 'Click here: http://spam.example' }) };
  };

  it('a shop younger than a day sends its young budget of proofs, then 429 with Retry-After; subjects stay fixed; the panel says when to try again', async () => {
    const builder = await newShopUser('builder', 'Brand New Shop: WIN A PRIZE');
    const boardId = await insertBoard(builder.shopId, builder.id, { ...fixtureDesign('seven-string-fan'), name: 'FREE GUITARS click now' });
    const post = (body: string) =>
      fetch(`${BASE_URL}/api/boards/${boardId}/proofs`, { method: 'POST', headers: { origin: BASE_URL, 'content-type': 'application/json', cookie: builder.cookie }, body });
    const young = MAIL_BUDGETS.proof.young.perUser.points;
    const first = proofFor(0);
    expect((await post(first.body)).status).toBe(201);
    for (let i = 1; i < young; i++) expect((await post(proofFor(i).body)).status).toBe(201);
    const limited = await post(proofFor(young).body);
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(((await limited.json()) as { error: string }).error).toMatch(/try again in \d+ minutes?/);

    // The sender's words are quoted in the body, never in the subject.
    const mail = await waitForMail(first.to, /./);
    expect(mail.subject).toBe(PROOF_SUBJECTS.toClient);
    expect(mail.text).toContain('FREE GUITARS click now');

    browser ??= await launchBrowser();
    const context = await browser.newContext();
    await context.addCookies([{ name: SESSION_COOKIE, value: builder.token, url: BASE_URL }]);
    const panel = await context.newPage();
    await panel.goto(`${BASE_URL}/boards/${boardId}/proofs`);
    await panel.getByLabel('Client name').fill('Ines Calloway');
    await panel.getByLabel('Client e-mail').fill(uniqueEmail('client'));
    await panel.getByRole('button', { name: 'Send proof of the current revision' }).click();
    const alert = panel.getByRole('alert').filter({ hasText: /try again in/ });
    await alert.waitFor();
    expect(await alert.textContent()).toMatch(/as many proofs as it may for now; try again in \d+ minutes?/);
    await context.close();
  });

  it('invitations: a young shop\'s owner gets 429 with Retry-After and "Try again in" once the young budget is used', async () => {
    const owner: TestUser = await newShopUser('owner');
    const from = testAddress();
    const young = MAIL_BUDGETS.invitation.young.perUser.points;
    for (let i = 0; i < young; i++) {
      const sent = await postForm(proxied.url, '/members?_action=members.invite', { email: uniqueEmail('invitee'), role: 'client' }, { cookie: owner.cookie, forwardedFor: from });
      expect(sent.status).toBe(303);
    }
    const limited = await postForm(proxied.url, '/members?_action=members.invite', { email: uniqueEmail('invitee'), role: 'client' }, { cookie: owner.cookie, forwardedFor: from });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(await limited.text()).toMatch(/as many invitations as it may for now\. Try again in \d+ minutes?/);
  });
});
