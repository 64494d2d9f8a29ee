/**
 * The local fake payment service driven by the real SDK (`stripe`, pointed at it with host, port
 * and protocol), and its webhooks verified by the SDK's constructEvent: no database, no app.
 */
import { createServer, type Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import Stripe from 'stripe';
import { startFakePayments, type FakePayments } from '../../../scripts/payments/fake/server.ts';
import { TEST_CARDS } from '../../../scripts/payments/fake/pay-page.ts';
import { createCheckoutSession, requestRefund } from '~/lib/payments/payment-service.server.ts';
import { eventFact, verifyWebhook } from '~/lib/payments/webhook-events.server.ts';

const SECRET_KEY = 'sk_test_unit_fake';
const WEBHOOK_SECRET = 'whsec_unit_fake';

interface Received {
  body: string;
  signature: string;
}

let fake: FakePayments;
let receiver: Server;
const received: Received[] = [];

beforeAll(async () => {
  receiver = createServer((request, response) => {
    const chunks: Buffer[] = [];
    request.on('data', (c: Buffer) => chunks.push(c));
    request.on('end', () => {
      received.push({ body: Buffer.concat(chunks).toString('utf8'), signature: String(request.headers['stripe-signature'] ?? '') });
      response.end('{}');
    });
  });
  await new Promise<void>((resolve) => receiver.listen(0, '127.0.0.1', resolve));
  const address = receiver.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  fake = await startFakePayments({ port: 0, secretKey: SECRET_KEY, webhookSecret: WEBHOOK_SECRET, webhookUrl: `http://127.0.0.1:${port}/hook` });
  process.env.PAYMENTS_SECRET_KEY = SECRET_KEY;
  process.env.PAYMENTS_WEBHOOK_SECRET = WEBHOOK_SECRET;
  process.env.PAYMENTS_API_URL = fake.origin;
});

afterAll(async () => {
  await fake.close();
  await new Promise<void>((resolve) => receiver.close(() => resolve()));
});

const checkout = (minor: number) =>
  createCheckoutSession({
    depositId: 41,
    shopId: 3,
    money: { minor, currency: 'EUR' },
    title: 'Deposit: test board',
    description: '',
    clientEmail: 'client@example.test',
    successUrl: 'http://127.0.0.1:1/p/tok?deposit=returned',
    cancelUrl: 'http://127.0.0.1:1/p/tok?deposit=cancelled',
  });

async function payWith(url: string, form: Record<string, string>): Promise<Response> {
  return fetch(url, { method: 'POST', body: new URLSearchParams(form), redirect: 'manual' });
}

function lastEvent(type: string): Received | undefined {
  return [...received].reverse().find((r) => (JSON.parse(r.body) as { type: string }).type === type);
}

describe('fake payment service through the SDK', () => {
  it('creates a session for the exact amount, takes the test card, and posts a webhook the SDK verifies', async () => {
    const created = await checkout(50_000);
    if (!created.ok) throw new Error(created.message);
    expect(created.value.url.startsWith(`${fake.origin}/pay/`)).toBe(true);
    const page = await (await fetch(created.value.url)).text();
    expect(page).toContain('€500.00');
    expect(page).toContain(TEST_CARDS.pays);

    const paid = await payWith(created.value.url, { card: TEST_CARDS.pays, choice: 'pay' });
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe('http://127.0.0.1:1/p/tok?deposit=returned');
    const hook = lastEvent('checkout.session.completed');
    if (!hook) throw new Error('no webhook arrived');
    const verified = verifyWebhook(hook.body, hook.signature);
    if (!verified.ok) throw new Error(verified.reason);
    const fact = eventFact(verified.event);
    expect(fact).toMatchObject({ kind: 'payment', depositId: 41, amountMinor: 50_000, currency: 'EUR', sessionId: created.value.id });
  });

  it('declines with the decline button and the declined test card, and makes no payment', async () => {
    const created = await checkout(1_000);
    if (!created.ok) throw new Error(created.message);
    const before = fake.records.payments.size;
    expect((await payWith(created.value.url, { card: '', choice: 'decline' })).status).toBe(402);
    expect((await payWith(created.value.url, { card: TEST_CARDS.declined, choice: 'pay' })).status).toBe(402);
    expect((await payWith(created.value.url, { card: '4111 1111 1111 1111', choice: 'pay' })).status).toBe(400);
    expect(fake.records.payments.size).toBe(before);
    expect(fake.records.sessions.get(created.value.id)?.status).toBe('open');
  });

  it('refunds in part and then the rest, and refuses more than is left', async () => {
    const created = await checkout(20_000);
    if (!created.ok) throw new Error(created.message);
    await payWith(created.value.url, { card: TEST_CARDS.pays, choice: 'pay' });
    const intent = fake.records.sessions.get(created.value.id)?.payment_intent ?? '';
    const part = await requestRefund({ paymentIntentId: intent, amountMinor: 5_000, depositId: 41, requestedBy: 'u1' });
    expect(part).toEqual({ ok: true, value: expect.objectContaining({ amountMinor: 5_000, currency: 'EUR' }) });
    const tooMuch = await requestRefund({ paymentIntentId: intent, amountMinor: 15_001, depositId: 41, requestedBy: 'u1' });
    expect(tooMuch.ok).toBe(false);
    const rest = await requestRefund({ paymentIntentId: intent, amountMinor: 15_000, depositId: 41, requestedBy: 'u1' });
    expect(rest.ok).toBe(true);
    // The refund webhooks follow the answers, on the service's own time.
    const refunds = () => received.map((r) => JSON.parse(r.body) as { type: string; data: { object: { amount: number } } }).filter((e) => e.type === 'refund.created');
    await vi.waitFor(() => expect(refunds()).toHaveLength(2), { timeout: 10_000 });
    expect(refunds().map((e) => e.data.object.amount)).toEqual([5_000, 15_000]);
  });

  it('refuses a call with the wrong key', async () => {
    const sdk = new Stripe('sk_test_wrong', { host: '127.0.0.1', port: new URL(fake.origin).port, protocol: 'http', maxNetworkRetries: 0 });
    await expect(sdk.checkout.sessions.retrieve('cs_test_x')).rejects.toThrow(/Invalid API Key/);
  });
});

describe('webhook verification (SDK constructEvent)', () => {
  const payload = JSON.stringify({ id: 'evt_test_1', object: 'event', type: 'checkout.session.completed', created: 1, data: { object: {} } });
  const signer = new Stripe('sk_test_signer');

  it('refuses a signature made with another secret, a changed body, no signature and an old timestamp', () => {
    const forged = signer.webhooks.generateTestHeaderString({ payload, secret: 'whsec_someone_else' });
    expect(verifyWebhook(payload, forged)).toEqual({ ok: false, reason: 'bad_signature' });
    const good = signer.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET });
    expect(verifyWebhook(payload.replace('evt_test_1', 'evt_test_2'), good)).toEqual({ ok: false, reason: 'bad_signature' });
    expect(verifyWebhook(payload, null)).toEqual({ ok: false, reason: 'no_signature' });
    // The SDK's default tolerance is 300 s (webhooks.DEFAULT_TOLERANCE).
    const old = signer.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET, timestamp: Math.floor(Date.now() / 1000) - 301 });
    expect(verifyWebhook(payload, old)).toEqual({ ok: false, reason: 'stale' });
    expect(verifyWebhook(payload, good).ok).toBe(true);
  });
});
