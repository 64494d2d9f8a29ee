/**
 * Deposits end to end without a browser: real MariaDB, the run's fake payment service on
 * loopback (driven through the SDK by the app's code), and the app's route handlers. The fake
 * holds its own webhook deliveries for the whole file; each test takes the events the fake made
 * and delivers them to the webhook route, signed as the SDK verifies them: that way a test also
 * decides when, and how often, they arrive.
 */
import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { setShopTimeZone } from '~/lib/accounts/users.server.ts';
import { depositPayments, depositRefunds, paymentEvents, shops } from '~/lib/db/schema.ts';
import { DEPOSIT_SUBJECTS } from '~/lib/payments/deposit-mails.server.ts';
import type { DepositSummary } from '~/lib/schemas/deposit.ts';
import type { CreatedProof, ProofSummary } from '~/lib/schemas/proof.ts';
import * as boardProofsRoute from '~/pages/api/boards/[id]/proofs.ts';
import * as tokenCheckoutRoute from '~/pages/api/p/[token]/deposit-checkout.ts';
import * as tokenDecisionRoute from '~/pages/api/p/[token]/decision.ts';
import * as webhookRoute from '~/pages/api/payments/webhook.ts';
import * as depositRoute from '~/pages/api/proofs/[proofId]/deposit/index.ts';
import * as refundsRoute from '~/pages/api/proofs/[proofId]/deposit/refunds.ts';
import * as revokeRoute from '~/pages/api/proofs/[proofId]/revoke.ts';
import { fixtureDesign, insertBoard } from '../support/designs.ts';
import { eventsAbout, fakeSessions, holdWebhooks, releaseWebhooks, signatureFor, submitPayPage, TEST_CARDS } from '../support/fake-payments.ts';
import { mailsTo, waitForMail, waitForMailCount } from '../support/outbox.ts';
import { callRoute } from '../support/route-call.ts';
import { addShopUser, newShopUser, type TestUser } from '../support/sessions.ts';
import { closeDb, db } from '../support/test-db.ts';

const DAY_MS = 86_400_000;
const DEPOSIT = { amountMinor: 50_000, currency: 'EUR', description: 'Deposit for the fanned 7-string build' };

let owner: TestUser;
let builder: TestUser;
let client: TestUser;
let otherOwner: TestUser;
let boardId: number;

beforeAll(async () => {
  await holdWebhooks();
  owner = await newShopUser('owner');
  // Dated back: these tests send more proofs than a brand-new shop's mail budget allows.
  await db().update(shops).set({ createdAt: new Date(Date.now() - 2 * DAY_MS) }).where(eq(shops.id, owner.shopId));
  await setShopTimeZone(owner.shopId, 'Europe/Berlin');
  builder = await addShopUser(owner.shopId, 'builder');
  client = await addShopUser(owner.shopId, 'client');
  otherOwner = await newShopUser('owner');
  boardId = await insertBoard(owner.shopId, builder.id, fixtureDesign('seven-string-fan'));
});
// Released to the app's origin, where no server listens during these tests: they go nowhere.
afterAll(async () => {
  await releaseWebhooks();
  await closeDb();
});

let mailCounter = 0;
const clientEmail = () => `deposit-${Date.now()}-${++mailCounter}@wrenfield.example`;
const tokenOf = (link: string) => link.slice(link.lastIndexOf('/') + 1);

function sendProof(user: TestUser | null, body: Record<string, unknown>): Promise<Response> {
  return callRoute(boardProofsRoute.POST, { method: 'POST', path: `/api/boards/${boardId}/proofs`, user, params: { id: String(boardId) }, body });
}

async function proofWithDeposit(deposit: Record<string, unknown> = DEPOSIT): Promise<{ created: CreatedProof; token: string; email: string }> {
  const email = clientEmail();
  const response = await sendProof(builder, { clientName: 'Ines Calloway', clientEmail: email, deposit });
  expect(response.status).toBe(201);
  const created = (await response.json()) as CreatedProof;
  return { created, token: tokenOf(created.link), email };
}

async function approve(token: string): Promise<void> {
  const response = await callRoute(tokenDecisionRoute.POST, {
    method: 'POST', path: `/api/p/${token}/decision`, params: { token }, clientAddress: '192.0.2.40',
    body: { decision: 'approved', name: 'Ines Calloway', confirmed: true },
  });
  expect(response.status).toBe(200);
}

function checkout(token: string, body: unknown = {}): Promise<Response> {
  return callRoute(tokenCheckoutRoute.POST, { method: 'POST', path: `/api/p/${token}/deposit-checkout`, params: { token }, body, clientAddress: '192.0.2.40' });
}

async function payUrl(token: string): Promise<string> {
  const response = await checkout(token);
  expect(response.status).toBe(200);
  return ((await response.json()) as { url: string }).url;
}

const sessionIdOf = (url: string) => url.slice(url.lastIndexOf('/') + 1);

function deliver(payload: string, signature = signatureFor(payload)): Promise<Response> {
  return callRoute(webhookRoute.POST, { method: 'POST', path: '/api/payments/webhook', body: payload, headers: { 'stripe-signature': signature } });
}

/** Delivers every event the fake made about the session (in order), as the service would. */
async function deliverAll(sessionId: string, type?: string): Promise<string[]> {
  const outcomes: string[] = [];
  for (const event of await eventsAbout(sessionId)) {
    if (type && event.type !== type) continue;
    const response = await deliver(event.payload);
    expect(response.status).toBe(200);
    outcomes.push(((await response.json()) as { outcome: string }).outcome);
  }
  return outcomes;
}

async function depositOf(proofId: number): Promise<DepositSummary | null> {
  const response = await callRoute(boardProofsRoute.GET, { path: `/api/boards/${boardId}/proofs`, user: builder, params: { id: String(boardId) } });
  const { proofs } = (await response.json()) as { proofs: (ProofSummary & { deposit: DepositSummary | null })[] };
  return proofs.find((p) => p.id === proofId)?.deposit ?? null;
}

function refund(user: TestUser | null, proofId: number, body: unknown = {}): Promise<Response> {
  return callRoute(refundsRoute.POST, { method: 'POST', path: `/api/proofs/${proofId}/deposit/refunds`, user, params: { proofId: String(proofId) }, body });
}

describe('a deposit on a proof', () => {
  it('is shown in the client\'s e-mail with its amount, and in the builder\'s list as not paid yet', async () => {
    const { created, email } = await proofWithDeposit();
    const mail = await waitForMail(email, /ready for your review/);
    expect(mail.text).toContain('€500.00');
    expect(mail.text).toContain(DEPOSIT.description);
    expect(await depositOf(created.proof.id)).toMatchObject({ amountMinor: 50_000, currency: 'EUR', state: 'awaiting_payment', paidMinor: 0 });
  });

  it('takes the shop\'s default currency when none is given', async () => {
    const { created } = await proofWithDeposit({ amountMinor: 12_500 });
    expect((await depositOf(created.proof.id))?.currency).toBe('USD');
  });

  it('refuses zero, negative, fractional and too large amounts and unknown currencies, naming the field, and sends nothing', async () => {
    const email = clientEmail();
    const cases: [Record<string, unknown>, string][] = [
      [{ amountMinor: 0 }, 'deposit.amountMinor'],
      [{ amountMinor: -500 }, 'deposit.amountMinor'],
      [{ amountMinor: 12.5 }, 'deposit.amountMinor'],
      [{ amountMinor: 100_000_000 }, 'deposit.amountMinor'],
      [{ amountMinor: '500' }, 'deposit.amountMinor'],
      [{ amountMinor: 500, currency: 'EURO' }, 'deposit.currency'],
      [{ amountMinor: 500, currency: 'XYZ' }, 'deposit.currency'],
    ];
    for (const [deposit, field] of cases) {
      const response = await sendProof(builder, { clientName: 'Ines Calloway', clientEmail: email, deposit });
      expect(response.status, JSON.stringify(deposit)).toBe(400);
      expect(((await response.json()) as { field: string }).field).toBe(field);
    }
    expect(await mailsTo(email)).toHaveLength(0);
  });

  it('can be attached or changed while the proof is open (owner or builder), not after the answer', async () => {
    const email = clientEmail();
    const response = await sendProof(builder, { clientName: 'Ines Calloway', clientEmail: email });
    const created = (await response.json()) as CreatedProof;
    const put = (user: TestUser | null, body: unknown, id = created.proof.id) =>
      callRoute(depositRoute.PUT, { method: 'PUT', path: `/api/proofs/${id}/deposit`, user, params: { proofId: String(id) }, body });
    expect((await put(builder, { amountMinor: 30_000, currency: 'gbp' })).status).toBe(200);
    expect((await put(owner, { amountMinor: 35_000, currency: 'GBP', description: 'Half now' })).status).toBe(200);
    expect(await depositOf(created.proof.id)).toMatchObject({ amountMinor: 35_000, currency: 'GBP', description: 'Half now' });
    const bad = await put(builder, { amountMinor: 0 });
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { field: string }).field).toBe('amountMinor');
    expect((await put(client, { amountMinor: 100 })).status).toBe(403);
    expect((await put(null, { amountMinor: 100 })).status).toBe(401);
    expect((await put(otherOwner, { amountMinor: 100 })).status).toBe(404);
    await approve(tokenOf(created.link));
    expect((await put(builder, { amountMinor: 100 })).status).toBe(409);
    expect((await depositOf(created.proof.id))?.amountMinor).toBe(35_000);
  });
});

describe('approve, then pay', () => {
  it('pays only once the signed webhook arrives, never on the way back; the receipt is dated in the shop\'s time zone', async () => {
    const { created, token, email } = await proofWithDeposit();
    expect((await checkout(token)).status).toBe(409); // not approved yet
    await approve(token);
    const url = await payUrl(token);
    const paid = await submitPayPage(url, 'pay');
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toMatch(new RegExp(`/p/${token}\\?deposit=returned$`));
    // Back on the proof page, nothing is recorded yet: the webhook has not been delivered here.
    expect((await depositOf(created.proof.id))?.state).toBe('awaiting_payment');

    expect(await deliverAll(sessionIdOf(url), 'checkout.session.completed')).toEqual(['recorded']);
    const deposit = await depositOf(created.proof.id);
    expect(deposit).toMatchObject({ state: 'paid', paidMinor: 50_000, currency: 'EUR' });
    const receipt = await waitForMail(email, new RegExp(DEPOSIT_SUBJECTS.paid));
    expect(receipt.text).toContain('€500.00');
    expect(receipt.text).toContain('(Europe/Berlin)');
    expect(receipt.text).not.toMatch(/4242/);
    // Paid: no second pay page.
    expect((await checkout(token)).status).toBe(409);
  });

  it('records one payment for the same event delivered twice, and one receipt', async () => {
    const { created, token, email } = await proofWithDeposit();
    await approve(token);
    const url = await payUrl(token);
    await submitPayPage(url, 'pay');
    const [event] = (await eventsAbout(sessionIdOf(url))).filter((e) => e.type === 'checkout.session.completed');
    expect(await deliverAll(sessionIdOf(url), 'checkout.session.completed')).toEqual(['recorded']);
    const again = await deliver(event!.payload);
    expect(again.status).toBe(200);
    expect(await again.json()).toMatchObject({ outcome: 'duplicate' });
    const rows = await db().select().from(depositPayments).where(eq(depositPayments.sessionId, sessionIdOf(url)));
    expect(rows).toHaveLength(1);
    expect((await depositOf(created.proof.id))?.paidMinor).toBe(50_000);
    await waitForMailCount(email, new RegExp(DEPOSIT_SUBJECTS.paid), 1);
    expect((await mailsTo(email)).filter((m) => m.subject === DEPOSIT_SUBJECTS.paid)).toHaveLength(1);
  });

  it('a decline and a cancel leave the deposit unpaid and the approval standing; paying later works', async () => {
    const { created, token } = await proofWithDeposit();
    await approve(token);
    const first = await payUrl(token);
    expect((await submitPayPage(first, 'decline')).status).toBe(402);
    expect((await submitPayPage(first, 'pay', TEST_CARDS.declined)).status).toBe(402);
    await deliverAll(sessionIdOf(first)); // the failed attempts' events change nothing
    expect((await depositOf(created.proof.id))?.state).toBe('awaiting_payment');
    // Cancelled (the client followed the cancel link): later, a new pay page from the proof page.
    const later = await payUrl(token);
    expect(later).not.toBe(first);
    await submitPayPage(later, 'pay');
    await deliverAll(sessionIdOf(later), 'checkout.session.completed');
    expect((await depositOf(created.proof.id))?.state).toBe('paid');
  });

  it('ignores an amount and currency sent by the browser: the pay page asks for the deposit', async () => {
    const { token } = await proofWithDeposit();
    await approve(token);
    const response = await checkout(token, { amountMinor: 1, currency: 'JPY', unit_amount: 1 });
    expect(response.status).toBe(200);
    const { url } = (await response.json()) as { url: string };
    const session = (await fakeSessions()).find((s) => s.id === sessionIdOf(url));
    expect(session).toMatchObject({ amount_total: 50_000, currency: 'eur' });
  });

  it('records the amount and currency the event carries, not the deposit asked for', async () => {
    const { created, token } = await proofWithDeposit();
    await approve(token);
    const url = await payUrl(token);
    await submitPayPage(url, 'pay');
    const [event] = (await eventsAbout(sessionIdOf(url))).filter((e) => e.type === 'checkout.session.completed');
    // A payment the service says was smaller (signed by the service: the secret is the run's).
    const payload = event!.payload.replace('"amount_total":50000', '"amount_total":20000').replace(event!.id, `${event!.id}_smaller`);
    expect((await deliver(payload)).status).toBe(200);
    expect(await depositOf(created.proof.id)).toMatchObject({ state: 'paid', paidMinor: 20_000, amountMinor: 50_000 });
  });

  it('a revoked proof gets no pay page', async () => {
    const { created, token } = await proofWithDeposit();
    const revoked = await callRoute(revokeRoute.POST, { method: 'POST', path: `/api/proofs/${created.proof.id}/revoke`, user: builder, params: { proofId: String(created.proof.id) } });
    expect(revoked.status).toBe(200);
    const before = (await fakeSessions()).length;
    expect((await checkout(token)).status).toBe(404);
    expect((await fakeSessions()).length).toBe(before);
  });
});

describe('the webhook route', () => {
  async function paidEvent(): Promise<{ payload: string; proofId: number }> {
    const { created, token } = await proofWithDeposit();
    await approve(token);
    const url = await payUrl(token);
    await submitPayPage(url, 'pay');
    const [event] = (await eventsAbout(sessionIdOf(url))).filter((e) => e.type === 'checkout.session.completed');
    return { payload: event!.payload, proofId: created.proof.id };
  }

  it('refuses a forged signature, a changed body, a missing signature and an old timestamp with 400, recording nothing', async () => {
    const { payload, proofId } = await paidEvent();
    const [before] = await db().select({ n: count() }).from(paymentEvents);
    const forged = await deliver(payload, signatureFor(payload, { secret: 'whsec_not_the_endpoints' }));
    expect(forged.status).toBe(400);
    expect(((await forged.json()) as { field: string }).field).toBe('stripe-signature');
    expect((await deliver(payload.replace('50000', '1'), signatureFor(payload))).status).toBe(400);
    const unsigned = await callRoute(webhookRoute.POST, { method: 'POST', path: '/api/payments/webhook', body: payload });
    expect(unsigned.status).toBe(400);
    // The SDK's tolerance is 300 s (webhooks.DEFAULT_TOLERANCE).
    const stale = await deliver(payload, signatureFor(payload, { timestamp: Math.floor(Date.now() / 1000) - 301 }));
    expect(stale.status).toBe(400);
    expect(((await stale.json()) as { error: string }).error).toMatch(/too old/);
    const [after] = await db().select({ n: count() }).from(paymentEvents);
    expect(after?.n).toBe(before?.n);
    expect((await depositOf(proofId))?.state).toBe('awaiting_payment');
    expect((await deliver(payload)).status).toBe(200);
    expect((await depositOf(proofId))?.state).toBe('paid');
  });
});

describe('refunds (owner only), recorded from their webhook', () => {
  it('refunds in part, then the rest; refuses more than is left; receipts for each', async () => {
    const { created, token, email } = await proofWithDeposit();
    await approve(token);
    const url = await payUrl(token);
    await submitPayPage(url, 'pay');
    await deliverAll(sessionIdOf(url), 'checkout.session.completed');
    const proofId = created.proof.id;

    expect((await refund(builder, proofId, { amountMinor: 100 })).status).toBe(403);
    expect((await refund(client, proofId, { amountMinor: 100 })).status).toBe(403);
    expect((await refund(null, proofId, { amountMinor: 100 })).status).toBe(401);
    expect((await refund(otherOwner, proofId, { amountMinor: 100 })).status).toBe(404);
    const zero = await refund(owner, proofId, { amountMinor: 0 });
    expect(zero.status).toBe(400);
    expect(((await zero.json()) as { field: string }).field).toBe('amountMinor');

    const part = await refund(owner, proofId, { amountMinor: 15_000 });
    expect(part.status).toBe(202);
    expect(((await part.json()) as { deposit: DepositSummary }).deposit).toMatchObject({ state: 'paid', refundPendingMinor: 15_000, refundedMinor: 0 });
    const tooMuch = await refund(owner, proofId, { amountMinor: 35_001 });
    expect(tooMuch.status).toBe(400);
    expect(((await tooMuch.json()) as { field: string }).field).toBe('amountMinor');

    await waitForRefundEvents(sessionIdOf(url), 1);
    await deliverAll(sessionIdOf(url), 'refund.created');
    expect(await depositOf(proofId)).toMatchObject({ state: 'partly_refunded', refundedMinor: 15_000, refundPendingMinor: 0 });
    const first = await waitForMail(email, new RegExp(DEPOSIT_SUBJECTS.refunded));
    expect(first.text).toContain('€150.00');
    expect(first.text).toContain('(Europe/Berlin)');

    const rest = await refund(owner, proofId, {});
    expect(rest.status).toBe(202);
    await waitForRefundEvents(sessionIdOf(url), 2);
    const outcomes = await deliverAll(sessionIdOf(url), 'refund.created');
    expect(outcomes).toEqual(['duplicate', 'recorded']);
    expect(await depositOf(proofId)).toMatchObject({ state: 'refunded', refundedMinor: 50_000 });
    await waitForMailCount(email, new RegExp(DEPOSIT_SUBJECTS.refunded), 2);
    expect((await refund(owner, proofId, {})).status).toBe(400);
    const rows = await db().select().from(depositRefunds).innerJoin(depositPayments, eq(depositPayments.id, depositRefunds.paymentId)).where(eq(depositPayments.sessionId, sessionIdOf(url)));
    expect(rows.map((r) => [r.deposit_refunds.amountMinor, r.deposit_refunds.status, r.deposit_refunds.requestedBy])).toEqual([
      [15_000, 'succeeded', owner.id],
      [35_000, 'succeeded', owner.id],
    ]);
  });

  it('refuses a refund of an unpaid deposit', async () => {
    const { created, token } = await proofWithDeposit();
    await approve(token);
    expect((await refund(owner, created.proof.id, {})).status).toBe(409);
  });
});

/** The fake sends a refund's webhook just after answering the SDK: wait until it has made it. */
async function waitForRefundEvents(sessionId: string, n: number): Promise<void> {
  for (let i = 0; i < 100; i++) {
    if ((await eventsAbout(sessionId)).filter((e) => e.type === 'refund.created').length >= n) return;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`fewer than ${n} refund events for ${sessionId}`);
}
