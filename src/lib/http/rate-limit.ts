/**
 * A small in-memory fixed-window rate limiter, per process. Keys are free text, e.g.
 * `sign-in:ip:127.0.0.1` or `sign-in:email:a@b.example`. Good for one server process; a cluster
 * would need a shared store.
 */
export interface RateLimitOptions {
  /** Requests allowed per window. */
  limit: number;
  windowMs: number;
}

export type RateLimitResult = { ok: true } | { ok: false; retryAfterSeconds: number };

interface Window {
  startedAt: number;
  count: number;
}

const windows = new Map<string, Window>();
let lastSweep = 0;

function current(key: string, windowMs: number, now: number): Window {
  sweep(now, windowMs);
  const found = windows.get(key);
  if (found && now - found.startedAt < windowMs) return found;
  const fresh = { startedAt: now, count: 0 };
  windows.set(key, fresh);
  return fresh;
}

// Drops finished windows now and then so the map cannot grow without bound.
function sweep(now: number, windowMs: number): void {
  if (now - lastSweep < 60_000) return;
  lastSweep = now;
  for (const [key, w] of windows) if (now - w.startedAt >= Math.max(windowMs, 3_600_000)) windows.delete(key);
}

function retryAfter(w: Window, windowMs: number, now: number): number {
  return Math.max(1, Math.ceil((w.startedAt + windowMs - now) / 1000));
}

/** Counts one request under `key`; refuses once `limit` requests were counted in this window. */
export function rateLimit(key: string, options: RateLimitOptions, now = Date.now()): RateLimitResult {
  const w = current(key, options.windowMs, now);
  if (w.count >= options.limit) return { ok: false, retryAfterSeconds: retryAfter(w, options.windowMs, now) };
  w.count++;
  return { ok: true };
}

/** Like rateLimit but counts nothing: for limits that only count failures (see recordFailure). */
export function rateLimitStatus(key: string, options: RateLimitOptions, now = Date.now()): RateLimitResult {
  const w = current(key, options.windowMs, now);
  return w.count >= options.limit ? { ok: false, retryAfterSeconds: retryAfter(w, options.windowMs, now) } : { ok: true };
}

/** Counts one failure under `key` without checking (pair with rateLimitStatus). */
export function recordFailure(key: string, options: RateLimitOptions, now = Date.now()): void {
  current(key, options.windowMs, now).count++;
}

/** Test hook: forgets every window. */
export function resetRateLimits(): void {
  windows.clear();
  lastSweep = 0;
}
