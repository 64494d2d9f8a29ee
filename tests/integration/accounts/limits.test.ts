/**
 * Account rate limits on the shared store. Sign-in follows OWASP ASVS 2.2.1 and the OWASP
 * Authentication Cheat Sheet ("Account lockout"): failures are counted per (account, address)
 * and per address, a point is taken before the password check, and failures for one account
 * from everywhere only slow answers down, so an attacker cannot lock the owner out.
 */
import { randomInt } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { afterPasswordCheck, attemptSucceeded, beforePasswordCheck, limitRequest } from '~/lib/accounts/limits.server.ts';
import { ACCOUNT_BUDGETS, SIGN_IN_BUDGETS } from '~/lib/http/rate-budgets.ts';
import { uniqueEmail } from '../../support/outbox.ts';
import { closeDb } from '../../support/test-db.ts';

afterAll(() => closeDb());

/** A documentation-range address (RFC 5737) no other test uses. */
const address = () => `203.0.113.${randomInt(1, 255)}-${randomInt(1e9)}`;

describe('account form limits (per address and per person)', () => {
  it('refuses the same e-mail after perPerson requests, even from new addresses', async () => {
    const email = uniqueEmail('spammed');
    for (let i = 0; i < ACCOUNT_BUDGETS.perPerson.points; i++) expect((await limitRequest('forgot-password', { address: address(), person: email })).ok).toBe(true);
    const refused = await limitRequest('forgot-password', { address: address(), person: email });
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.retryAfterSeconds).toBeGreaterThan(0);
    expect((await limitRequest('forgot-password', { address: address(), person: uniqueEmail('other') })).ok).toBe(true);
  });

  it('refuses one address after perAddress requests over many e-mails', async () => {
    const from = address();
    for (let i = 0; i < ACCOUNT_BUDGETS.perAddress.points; i++) expect((await limitRequest('forgot-password', { address: from, person: uniqueEmail('p') })).ok).toBe(true);
    expect((await limitRequest('forgot-password', { address: from, person: uniqueEmail('fresh') })).ok).toBe(false);
  });

  it('create-shop mails a link to any address: one client address gets newShopMailsPerAddress an hour', async () => {
    const from = address();
    for (let i = 0; i < ACCOUNT_BUDGETS.newShopMailsPerAddress.points; i++) expect((await limitRequest('create-shop', { address: from, person: uniqueEmail('p') })).ok).toBe(true);
    const refused = await limitRequest('create-shop', { address: from, person: uniqueEmail('fresh') });
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.retryAfterSeconds).toBeGreaterThan(15 * 60);
  });

  it('keeps actions apart', async () => {
    const who = { address: address(), person: uniqueEmail('x') };
    for (let i = 0; i < ACCOUNT_BUDGETS.perPerson.points; i++) await limitRequest('forgot-password', who);
    expect((await limitRequest('forgot-password', who)).ok).toBe(false);
    expect((await limitRequest('create-shop', who)).ok).toBe(true);
  });

  it('change-password: a right answer gives its points back, so only failures add up', async () => {
    const who = { address: address(), person: uniqueEmail('changer') };
    for (let i = 0; i < 3 * ACCOUNT_BUDGETS.perPerson.points; i++) {
      expect((await limitRequest('change-password', who)).ok).toBe(true);
      await attemptSucceeded('change-password', who);
    }
    for (let i = 0; i < ACCOUNT_BUDGETS.perPerson.points; i++) expect((await limitRequest('change-password', who)).ok).toBe(true);
    expect((await limitRequest('change-password', who)).ok).toBe(false);
  });
});

async function fail(who: { address: string; email: string }): Promise<boolean> {
  const allowed = await beforePasswordCheck(who);
  if (allowed.ok) await afterPasswordCheck(who, false);
  return allowed.ok;
}

describe('sign-in lock-outs lock out attackers, not owners (OWASP ASVS 2.2.1)', () => {
  it('correct sign-ins never count: 3 budgets of them from one address all go through', async () => {
    const who = { address: address(), email: uniqueEmail('owner') };
    for (let i = 0; i < 3 * SIGN_IN_BUDGETS.perAddress.points; i++) {
      expect((await beforePasswordCheck(who)).ok).toBe(true);
      await afterPasswordCheck(who, true);
    }
  });

  it('after perAccountAndAddress failures that address is refused, while the owner elsewhere still signs in', async () => {
    const email = uniqueEmail('target');
    const attacker = address();
    for (let i = 0; i < SIGN_IN_BUDGETS.perAccountAndAddress.points; i++) expect(await fail({ address: attacker, email })).toBe(true);
    const refused = await beforePasswordCheck({ address: attacker, email });
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.retryAfterSeconds).toBeGreaterThan(60);
    // The owner's own address has not failed: allowed, after the per-account delay.
    expect((await beforePasswordCheck({ address: address(), email })).ok).toBe(true);
  });

  it('a distributed guesser (one failure from each of many addresses) never refuses the owner', async () => {
    const email = uniqueEmail('spread');
    for (let i = 0; i < 14; i++) expect(await fail({ address: address(), email })).toBe(true);
    const owner = { address: address(), email };
    expect((await beforePasswordCheck(owner)).ok).toBe(true);
    await afterPasswordCheck(owner, true);
  });

  it('a correct password clears its (account, address) counter', async () => {
    const who = { address: address(), email: uniqueEmail('typo') };
    for (let i = 0; i < SIGN_IN_BUDGETS.perAccountAndAddress.points - 1; i++) await fail(who);
    expect((await beforePasswordCheck(who)).ok).toBe(true);
    await afterPasswordCheck(who, true);
    for (let i = 0; i < SIGN_IN_BUDGETS.perAccountAndAddress.points; i++) expect(await fail(who)).toBe(true);
    expect((await beforePasswordCheck(who)).ok).toBe(false);
  });

  it('password spraying (one password, many accounts, one address) hits the per-address budget', async () => {
    const sprayer = address();
    for (let i = 0; i < SIGN_IN_BUDGETS.perAddress.points; i++) expect(await fail({ address: sprayer, email: uniqueEmail('sprayed') })).toBe(true);
    expect((await beforePasswordCheck({ address: sprayer, email: uniqueEmail('next') })).ok).toBe(false);
  });

  it('behind a shared connection, people who signed in there before still can while a guesser spent its budget', async () => {
    const office = address();
    const member = { address: office, email: uniqueEmail('member') };
    expect((await beforePasswordCheck(member)).ok).toBe(true);
    await afterPasswordCheck(member, true);
    for (let i = 0; i < SIGN_IN_BUDGETS.perAddress.points; i++) await fail({ address: office, email: uniqueEmail('guessed') });
    expect((await beforePasswordCheck({ address: office, email: uniqueEmail('stranger') })).ok).toBe(false);
    expect((await beforePasswordCheck(member)).ok).toBe(true);
  });

  it('30 concurrent wrong sign-ins for one account from one address reach the password check at most 10 times', async () => {
    const who = { address: address(), email: uniqueEmail('burst') };
    const allowed = await Promise.all(Array.from({ length: 30 }, () => fail(who)));
    expect(allowed.filter(Boolean)).toHaveLength(SIGN_IN_BUDGETS.perAccountAndAddress.points);
  });
});
