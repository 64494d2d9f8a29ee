/**
 * The one mapping from a deposit checkout's outcome to its answer, for the two client routes
 * (by link, and signed in): 200 `{ url }`, 404 unknown, 409 not yet approved / no deposit /
 * already paid, 503 deposits off, 502 the payment service refused or could not be reached.
 */
import { json, problem } from '~/lib/http/problem.ts';
import type { CheckoutResult } from './deposits.server.ts';

const STATUS: Record<Exclude<CheckoutResult, { ok: true }>['reason'], number> = {
  not_found: 404,
  not_approved: 409,
  no_deposit: 409,
  already_paid: 409,
  off: 503,
  service: 502,
};

export function checkoutAnswer(result: CheckoutResult): Response {
  if (result.ok) return json({ url: result.url });
  return problem(STATUS[result.reason], result.message);
}
