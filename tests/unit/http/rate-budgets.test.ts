import { describe, expect, it } from 'vitest';
import { ROUTE_BUDGETS, SIGN_IN_BUDGETS, reserveFor, retryAfterSeconds, scaledPoints, SIGN_IN_DELAY, signInDelayMs } from '~/lib/http/rate-budgets.ts';

describe('rate budget arithmetic', () => {
  it('sign-in delay: none below the threshold, then doubling from firstMs, capped at maxMs', () => {
    expect(signInDelayMs(0)).toBe(0);
    expect(signInDelayMs(SIGN_IN_DELAY.afterFailures - 1)).toBe(0);
    expect(signInDelayMs(SIGN_IN_DELAY.afterFailures)).toBe(SIGN_IN_DELAY.firstMs);
    expect(signInDelayMs(SIGN_IN_DELAY.afterFailures + 1)).toBe(2 * SIGN_IN_DELAY.firstMs);
    expect(signInDelayMs(SIGN_IN_DELAY.afterFailures + 2)).toBe(4 * SIGN_IN_DELAY.firstMs);
    expect(signInDelayMs(10_000)).toBe(SIGN_IN_DELAY.maxMs);
    expect(SIGN_IN_DELAY.maxMs).toBeLessThanOrEqual(3000);
  });

  it('Retry-After is whole seconds rounded up, never below 1', () => {
    expect(retryAfterSeconds(0)).toBe(1);
    expect(retryAfterSeconds(1)).toBe(1);
    expect(retryAfterSeconds(1001)).toBe(2);
    expect(retryAfterSeconds(45_000)).toBe(45);
  });

  it('scaled points: the budget times the scale, at least 1', () => {
    expect(scaledPoints({ points: 60, seconds: 60 }, 1)).toBe(60);
    expect(scaledPoints({ points: 60, seconds: 60 }, 1000)).toBe(60_000);
    expect(scaledPoints({ points: 3, seconds: 60 }, 0.01)).toBe(1);
  });
});

describe('reserved blocks for large budgets', () => {
  it('counts the big cheap-route budgets in blocks of 2 % and everything else request by request', () => {
    expect(reserveFor(ROUTE_BUDGETS.layout.perAddress)).toBe(24);
    expect(reserveFor(ROUTE_BUDGETS.thumbnail.perAddress)).toBe(12);
    expect(reserveFor(ROUTE_BUDGETS.export.perAddress)).toBe(1);
    expect(reserveFor(SIGN_IN_BUDGETS.perAccountAndAddress)).toBe(1);
    // A budget scaled for load tests is blocked by its scaled size.
    expect(reserveFor(ROUTE_BUDGETS.export.perAddress, 1000)).toBe(1200);
  });
});
