/** Rate limits of the public proof routes, on the shared limiter. */
import { rateLimit, type RateLimitOptions } from './rate-limit.ts';

/**
 * Budgets of the public proof routes per client address. Links carry 128 random bits, so these
 * are not what keeps tokens from being guessed; they keep one visitor from hammering the database
 * or the builder's inbox.
 */
export const PROOF_LIMITS_PER_ADDRESS = {
  page: { limit: 120, windowMs: 60_000 },
  decision: { limit: 10, windowMs: 60_000 },
} as const satisfies Record<string, RateLimitOptions>;

/** Counts one request of `address` to `route`: null when allowed, else seconds to wait (429). */
export function proofRateLimited(route: keyof typeof PROOF_LIMITS_PER_ADDRESS, address: string): number | null {
  const result = rateLimit(`proof-${route}:${address}`, PROOF_LIMITS_PER_ADDRESS[route]);
  return result.ok ? null : result.retryAfterSeconds;
}
