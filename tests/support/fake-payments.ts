/**
 * The test run's fake payment service (scripts/payments, started by scripts/test.sh on a free
 * loopback port): its test controls, its pay page driven without a browser, and webhooks signed
 * (or mis-signed) the way the SDK verifies them.
 */
import Stripe from 'stripe';
import type { FakeSession } from '../../scripts/payments/fake/records.ts';
import type { SentEvent } from '../../scripts/payments/fake/webhook-sender.ts';
import { TEST_CARDS } from '../../scripts/payments/fake/pay-page.ts';

export { TEST_CARDS };

function setting(name: 'PAYMENTS_API_URL' | 'PAYMENTS_WEBHOOK_SECRET'): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set (npm test starts the fake payment service and sets it)`);
  return value;
}

export const fakeOrigin = () => setting('PAYMENTS_API_URL');

async function control<T>(method: 'GET' | 'POST', path: string): Promise<T> {
  const response = await fetch(`${fakeOrigin()}/_fake/${path}`, { method });
  if (!response.ok) throw new Error(`fake payments ${method} ${path}: ${response.status}`);
  return (await response.json()) as T;
}

export const holdWebhooks = () => control('POST', 'hold');
export const releaseWebhooks = () => control('POST', 'release');
export const sentEvents = () => control<SentEvent[]>('GET', 'events');
export const resendEvent = (id: string) => control<SentEvent>('POST', `events/${id}/resend`);
export const fakeSessions = () => control<FakeSession[]>('GET', 'sessions');

/** The events the fake sent about `sessionId` or its payment (held ones included). */
export async function eventsAbout(sessionId: string): Promise<SentEvent[]> {
  const sessions = await fakeSessions();
  const intent = sessions.find((s) => s.id === sessionId)?.payment_intent ?? '';
  return (await sentEvents()).filter((e) => e.payload.includes(`"${sessionId}"`) || (intent !== '' && e.payload.includes(`"${intent}"`)));
}

/** Pays (or declines) on the fake's pay page as a browser would post it; the answer is not followed. */
export async function submitPayPage(payUrl: string, choice: 'pay' | 'decline', card: string = TEST_CARDS.pays): Promise<Response> {
  return fetch(payUrl, { method: 'POST', body: new URLSearchParams({ card, choice }), redirect: 'manual' });
}

const signer = new Stripe('sk_test_signer_only');

/** A `Stripe-Signature` header for `payload`: the run's secret unless told otherwise, now unless a time is given. */
export function signatureFor(payload: string, options: { secret?: string; timestamp?: number } = {}): string {
  return signer.webhooks.generateTestHeaderString({
    payload,
    secret: options.secret ?? setting('PAYMENTS_WEBHOOK_SECRET'),
    ...(options.timestamp !== undefined ? { timestamp: options.timestamp } : {}),
  });
}
