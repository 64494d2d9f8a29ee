import { beforeEach, describe, expect, it } from 'vitest';
import { rateLimit, rateLimitStatus, recordFailure, resetRateLimits } from '~/lib/http/rate-limit.ts';

const options = { limit: 3, windowMs: 60_000 };

beforeEach(() => resetRateLimits());

describe('fixed-window rate limiter', () => {
  it('allows `limit` requests per window, then refuses with the seconds left in the window', () => {
    const t0 = 1_000_000;
    for (let i = 0; i < 3; i++) expect(rateLimit('k', options, t0 + i)).toEqual({ ok: true });
    expect(rateLimit('k', options, t0 + 15_000)).toEqual({ ok: false, retryAfterSeconds: 45 });
  });

  it('opens a new window once the old one ends', () => {
    const t0 = 2_000_000;
    for (let i = 0; i < 4; i++) rateLimit('k', options, t0);
    expect(rateLimit('k', options, t0 + 60_000)).toEqual({ ok: true });
  });

  it('keeps keys apart', () => {
    for (let i = 0; i < 3; i++) rateLimit('a', options, 5);
    expect(rateLimit('a', options, 6).ok).toBe(false);
    expect(rateLimit('b', options, 6).ok).toBe(true);
  });

  it('status peeks without counting; recordFailure counts', () => {
    for (let i = 0; i < 10; i++) expect(rateLimitStatus('f', options, 7).ok).toBe(true);
    for (let i = 0; i < 3; i++) recordFailure('f', options, 7);
    expect(rateLimitStatus('f', options, 8)).toEqual({ ok: false, retryAfterSeconds: 60 });
  });

  it('never answers a Retry-After below 1 second', () => {
    for (let i = 0; i < 3; i++) rateLimit('r', options, 0);
    expect(rateLimit('r', options, 59_999)).toEqual({ ok: false, retryAfterSeconds: 1 });
  });
});
