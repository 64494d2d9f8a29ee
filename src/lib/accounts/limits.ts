/**
 * Rate limits on the account endpoints, per client IP and per e-mail address. Generous enough
 * for people (and for test suites that sign in often), far too low for guessing passwords.
 * Sign-in counts only failures, so signing in correctly never locks anyone out.
 */
import { rateLimit, rateLimitStatus, recordFailure, type RateLimitOptions, type RateLimitResult } from '~/lib/http/rate-limit.ts';

const WINDOW_MS = 15 * 60_000;
export const PER_EMAIL: RateLimitOptions = { limit: 10, windowMs: WINDOW_MS };
export const PER_IP: RateLimitOptions = { limit: 50, windowMs: WINDOW_MS };

export type LimitedAction = 'sign-in' | 'create-shop' | 'forgot-password' | 'reset-password' | 'accept-invitation' | 'invite' | 'change-password';

interface Who {
  ip: string;
  /** Lower-cased e-mail address (or another per-person key such as a user id). */
  email?: string;
}

function keys(action: LimitedAction, who: Who): [string, RateLimitOptions][] {
  const list: [string, RateLimitOptions][] = [[`${action}:ip:${who.ip}`, PER_IP]];
  if (who.email) list.push([`${action}:email:${who.email}`, PER_EMAIL]);
  return list;
}

function worst(results: RateLimitResult[]): RateLimitResult {
  let retry = 0;
  for (const r of results) if (!r.ok) retry = Math.max(retry, r.retryAfterSeconds);
  return retry > 0 ? { ok: false, retryAfterSeconds: retry } : { ok: true };
}

/** Counts this request against every key and says whether it may go on. */
export function limitRequest(action: LimitedAction, who: Who): RateLimitResult {
  return worst(keys(action, who).map(([key, options]) => rateLimit(key, options)));
}

/** For limits that count failures only: may another attempt be made? */
export function attemptAllowed(action: LimitedAction, who: Who): RateLimitResult {
  return worst(keys(action, who).map(([key, options]) => rateLimitStatus(key, options)));
}

export function countFailure(action: LimitedAction, who: Who): void {
  for (const [key, options] of keys(action, who)) recordFailure(key, options);
}

export function tooManyMessage(retryAfterSeconds: number): string {
  const minutes = Math.ceil(retryAfterSeconds / 60);
  return `Too many attempts. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`;
}

/** Makes a page's response a 429 with Retry-After, and returns the message to show on the page. */
export function refuseTooMany(response: ResponseInit & { readonly headers: Headers }, retryAfterSeconds: number): string {
  response.status = 429;
  response.headers.set('retry-after', String(retryAfterSeconds));
  return tooManyMessage(retryAfterSeconds);
}
