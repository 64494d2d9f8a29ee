/**
 * A minimal in-memory fixed-window rate limiter for the public proof routes, one process wide.
 * Same call shape as the shared limiter being written for sign-in (`rateLimit(key, {limit,
 * windowMs})`), so the proof routes can switch to it by changing one import.
 */
export interface RateLimitOptions {
  /** Requests allowed per window. */
  limit: number;
  windowMs: number;
}

export type RateLimitResult = { ok: true } | { ok: false; retryAfterSeconds: number };

const windows = new Map<string, { startedAt: number; count: number }>();

/** Counts one request under `key`; refuses once `limit` requests were counted in this window. */
export function rateLimit(key: string, options: RateLimitOptions, now = Date.now()): RateLimitResult {
  // Finished windows are dropped as the map grows, so it cannot grow without bound.
  if (windows.size > 10_000) {
    for (const [k, w] of windows) if (now - w.startedAt >= options.windowMs) windows.delete(k);
  }
  let window = windows.get(key);
  if (!window || now - window.startedAt >= options.windowMs) {
    window = { startedAt: now, count: 0 };
    windows.set(key, window);
  }
  if (window.count >= options.limit) {
    return { ok: false, retryAfterSeconds: Math.max(1, Math.ceil((window.startedAt + options.windowMs - now) / 1000)) };
  }
  window.count++;
  return { ok: true };
}

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
