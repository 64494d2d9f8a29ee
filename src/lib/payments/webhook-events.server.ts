/**
 * Verifies a webhook with the SDK (`webhooks.constructEvent`: the `Stripe-Signature` HMAC over
 * the raw body with the endpoint secret, and a timestamp within the SDK's tolerance, 300 s) and
 * reads the few events Kerfline acts on into plain facts. Amounts and currencies come from the
 * event alone.
 */
import Stripe from 'stripe';
import { config } from '~/lib/config/env.server.ts';
import { REFUND_STATUSES } from '~/lib/schemas/deposit.ts';
import type { Failure } from '~/lib/http/result.ts';

/** The SDK's webhook helpers need no API key; this instance only verifies. */
const verifier = new Stripe('sk_verify_only');

export type VerifiedEvent =
  | { ok: true; event: Stripe.Event }
  | WebhookRefusal;

export type WebhookRefusal = Failure<'off' | 'no_signature' | 'bad_signature' | 'stale'>;

/** Checks the signature and age of a webhook; `payload` must be the raw body as received. */
export function verifyWebhook(payload: string | Uint8Array, signature: string | null, nowSeconds?: number): VerifiedEvent {
  const settings = config().payments;
  if (!settings) return { ok: false, reason: 'off' };
  if (!signature) return { ok: false, reason: 'no_signature' };
  try {
    const event = verifier.webhooks.constructEvent(payload, signature, settings.webhookSecret, undefined, undefined, nowSeconds);
    return { ok: true, event };
  } catch (error) {
    if (error instanceof Stripe.errors.StripeSignatureVerificationError && /timestamp/i.test(error.message)) return { ok: false, reason: 'stale' };
    return { ok: false, reason: 'bad_signature' };
  }
}

export interface PaymentFact {
  kind: 'payment';
  eventId: string;
  sessionId: string;
  paymentIntentId: string;
  depositId: number;
  amountMinor: number;
  currency: string;
  at: Date;
}

export interface RefundFact {
  kind: 'refund';
  eventId: string;
  refundId: string;
  paymentIntentId: string;
  amountMinor: number;
  currency: string;
  status: (typeof REFUND_STATUSES)[number];
  at: Date;
}

export type EventFact = PaymentFact | RefundFact | { kind: 'ignored'; eventId: string; type: string };

function idOf(value: string | { id: string } | null | undefined): string {
  return typeof value === 'string' ? value : value?.id ?? '';
}


/** What a verified event means for deposits. */
export function eventFact(event: Stripe.Event): EventFact {
  const at = new Date(event.created * 1000);
  if (event.type === 'checkout.session.completed' || event.type === 'checkout.session.async_payment_succeeded') {
    const session = event.data.object;
    const depositId = Number(session.metadata?.deposit_id);
    const paymentIntentId = idOf(session.payment_intent);
    if (session.payment_status === 'paid' && Number.isSafeInteger(depositId) && depositId > 0 && paymentIntentId && session.amount_total !== null && session.currency) {
      return { kind: 'payment', eventId: event.id, sessionId: session.id, paymentIntentId, depositId, amountMinor: session.amount_total, currency: session.currency.toUpperCase(), at };
    }
  }
  if (event.type === 'refund.created' || event.type === 'refund.updated' || event.type === 'refund.failed') {
    const refund = event.data.object;
    const status = REFUND_STATUSES.find((s) => s === refund.status);
    const paymentIntentId = idOf(refund.payment_intent);
    if (status && paymentIntentId) {
      return { kind: 'refund', eventId: event.id, refundId: refund.id, paymentIntentId, amountMinor: refund.amount, currency: refund.currency.toUpperCase(), status, at };
    }
  }
  return { kind: 'ignored', eventId: event.id, type: event.type };
}
