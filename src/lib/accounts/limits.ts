/** What the account pages say and send when a rate limit refuses a request (pure). */

/** "in 3 minutes" / "in 1 minute": whole minutes, rounded up. */
export function inMinutes(retryAfterSeconds: number): string {
  const minutes = Math.max(1, Math.ceil(retryAfterSeconds / 60));
  return `in ${minutes} minute${minutes === 1 ? '' : 's'}`;
}

export function tooManyMessage(retryAfterSeconds: number): string {
  return `Too many attempts. Try again ${inMinutes(retryAfterSeconds)}.`;
}

/** Makes a page's response a 429 with Retry-After, and returns the message to show on the page. */
export function refuseTooMany(response: ResponseInit & { readonly headers: Headers }, retryAfterSeconds: number, message = tooManyMessage(retryAfterSeconds)): string {
  response.status = 429;
  response.headers.set('retry-after', String(retryAfterSeconds));
  return message;
}
