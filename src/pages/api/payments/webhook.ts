import type { APIRoute } from 'astro';
import { readBytes } from '~/lib/http/body.server.ts';
import { json, problem } from '~/lib/http/problem.ts';
import { PAYMENTS_OFF_MESSAGE } from '~/lib/payments/payment-service.server.ts';
import { failureAnswer, type FailureAnswers } from '~/lib/http/result.ts';
import { eventFact, verifyWebhook, type WebhookRefusal } from '~/lib/payments/webhook-events.server.ts';
import { recordEvent } from '~/lib/payments/webhook-records.server.ts';

export const prerender = false;

/** Events are small; the service's largest objects stay well under this. */
const BODY_MAX_BYTES = 256 * 1024;

const REFUSALS: FailureAnswers<WebhookRefusal> = {
  off: () => problem(503, PAYMENTS_OFF_MESSAGE),
  no_signature: () => problem(400, 'Missing Stripe-Signature header', { field: 'stripe-signature' }),
  bad_signature: () => problem(400, 'The webhook signature does not match this endpoint\'s secret', { field: 'stripe-signature' }),
  stale: () => problem(400, 'The webhook timestamp is too old (more than 300 s)', { field: 'stripe-signature' }),
};

/**
 * POST /api/payments/webhook: the payment service's signed events (docs/payments.md). Public: the
 * signature over the raw body is the permission (the same-origin check does not apply here).
 * 400 for a bad or missing signature or an old timestamp; 200 once recorded, and again for a
 * repeated delivery, which records nothing more; 503 while deposits are off.
 */
export const POST: APIRoute = async ({ request }) => {
  const body = await readBytes(request, { maxBytes: BODY_MAX_BYTES, types: ['application/json'] });
  if (!body.ok) return body.response;
  const verified = verifyWebhook(Buffer.from(body.value), request.headers.get('stripe-signature'));
  if (!verified.ok) return failureAnswer(verified, REFUSALS);
  const outcome = await recordEvent(eventFact(verified.event));
  return json({ received: true, outcome });
};
