import { beforeEach, describe, expect, it } from 'vitest';
import { attemptAllowed, countFailure, limitRequest, PER_EMAIL, PER_IP } from '~/lib/accounts/limits.ts';
import { resetRateLimits } from '~/lib/http/rate-limit.ts';

beforeEach(() => resetRateLimits());

describe('account rate limits', () => {
  it('refuses the same e-mail after PER_EMAIL.limit requests, even from new IPs', () => {
    for (let i = 0; i < PER_EMAIL.limit; i++) expect(limitRequest('forgot-password', { ip: `10.0.0.${i}`, email: 'a@b.example' }).ok).toBe(true);
    const refused = limitRequest('forgot-password', { ip: '10.0.1.1', email: 'a@b.example' });
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.retryAfterSeconds).toBeGreaterThan(0);
    expect(limitRequest('forgot-password', { ip: '10.0.1.1', email: 'c@d.example' }).ok).toBe(true);
  });

  it('refuses one IP after PER_IP.limit requests over many e-mails', () => {
    for (let i = 0; i < PER_IP.limit; i++) expect(limitRequest('create-shop', { ip: '10.9.9.9', email: `p${i}@b.example` }).ok).toBe(true);
    expect(limitRequest('create-shop', { ip: '10.9.9.9', email: 'fresh@b.example' }).ok).toBe(false);
  });

  it('sign-in counts failures only: correct sign-ins never lock anyone out', () => {
    const who = { ip: '10.1.1.1', email: 'owner@wrenfield.example' };
    for (let i = 0; i < 100; i++) expect(attemptAllowed('sign-in', who).ok).toBe(true);
    for (let i = 0; i < PER_EMAIL.limit; i++) countFailure('sign-in', who);
    expect(attemptAllowed('sign-in', who).ok).toBe(false);
    expect(attemptAllowed('sign-in', { ip: '10.1.1.1', email: 'other@wrenfield.example' }).ok).toBe(true);
  });

  it('keeps actions apart', () => {
    for (let i = 0; i < PER_EMAIL.limit; i++) limitRequest('forgot-password', { ip: '1', email: 'x@y.example' });
    expect(limitRequest('create-shop', { ip: '1', email: 'x@y.example' }).ok).toBe(true);
  });
});
