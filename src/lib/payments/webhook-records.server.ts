/**
 * Records what a verified webhook says, once: the event id goes into `payment_events` in the
 * same transaction as its effect, so a second delivery changes nothing. A payment is recorded
 * per pay page (session id unique), with the amount and currency of the event; a refund by its
 * service id (pending rows made when the owner asked become done or failed). The client's
 * receipt goes out after the commit, only when this delivery changed something.
 */
import { and, eq } from 'drizzle-orm';
import { db } from '~/lib/db/client.server.ts';
import { withRetry } from '~/lib/db/with-retry.server.ts';
import { depositPayments, depositRefunds, deposits, boards, paymentEvents, proofs, shops } from '~/lib/db/schema.ts';
import { mailPaymentReceipt, mailRefundReceipt, type ReceiptContext } from './deposit-mails.server.ts';
import type { EventFact, PaymentFact, RefundFact } from './webhook-events.server.ts';

export type RecordOutcome = 'recorded' | 'duplicate' | 'ignored' | 'unknown_deposit';

type Tx = Parameters<Parameters<ReturnType<typeof db>['transaction']>[0]>[0];

/** Marks the event handled; false when it already was (a repeated delivery). */
async function firstDelivery(tx: Tx, eventId: string, type: string): Promise<boolean> {
  const [result] = await tx.insert(paymentEvents).ignore().values({ eventId, type });
  return result.affectedRows === 1;
}

async function recordPayment(tx: Tx, fact: PaymentFact): Promise<{ outcome: RecordOutcome; depositId?: number }> {
  const [deposit] = await tx.select().from(deposits).where(eq(deposits.id, fact.depositId)).limit(1);
  if (!deposit) return { outcome: 'unknown_deposit' };
  const [result] = await tx.insert(depositPayments).ignore().values({
    shopId: deposit.shopId,
    depositId: deposit.id,
    sessionId: fact.sessionId,
    paymentIntentId: fact.paymentIntentId,
    amountMinor: fact.amountMinor,
    currency: fact.currency,
    paidAt: fact.at,
    eventId: fact.eventId,
  });
  return result.affectedRows === 1 ? { outcome: 'recorded', depositId: deposit.id } : { outcome: 'duplicate' };
}

async function recordRefund(tx: Tx, fact: RefundFact): Promise<{ outcome: RecordOutcome; paymentId?: number }> {
  const [payment] = await tx.select().from(depositPayments).where(eq(depositPayments.paymentIntentId, fact.paymentIntentId)).limit(1);
  if (!payment) return { outcome: 'unknown_deposit' };
  const [before] = await tx.select({ status: depositRefunds.status }).from(depositRefunds).where(eq(depositRefunds.refundId, fact.refundId)).for('update');
  await tx
    .insert(depositRefunds)
    .values({ shopId: payment.shopId, paymentId: payment.id, refundId: fact.refundId, amountMinor: fact.amountMinor, currency: fact.currency, status: fact.status, settledAt: fact.at })
    .onDuplicateKeyUpdate({ set: { amountMinor: fact.amountMinor, currency: fact.currency, status: fact.status, settledAt: fact.at } });
  const newlyDone = fact.status === 'succeeded' && before?.status !== 'succeeded';
  return newlyDone ? { outcome: 'recorded', paymentId: payment.id } : { outcome: 'ignored' };
}

/** Who gets the receipt and what it names, for a deposit. */
async function receiptContext(depositId: number, reference: string): Promise<(ReceiptContext & { asked: { minor: number; currency: string } }) | null> {
  const [row] = await db()
    .select({ deposit: deposits, proof: proofs, shopName: shops.name, timeZone: shops.timeZone, boardName: boards.name })
    .from(deposits)
    .innerJoin(proofs, eq(proofs.id, deposits.proofId))
    .innerJoin(shops, eq(shops.id, deposits.shopId))
    .innerJoin(boards, eq(boards.id, proofs.boardId))
    .where(eq(deposits.id, depositId))
    .limit(1);
  if (!row) return null;
  return {
    to: row.proof.clientEmail,
    clientName: row.proof.clientName,
    shopName: row.shopName,
    boardName: row.boardName,
    revision: row.proof.revision,
    timeZone: row.timeZone,
    reference,
    asked: { minor: row.deposit.amountMinor, currency: row.deposit.currency },
  };
}

async function sendPaymentReceipt(fact: PaymentFact): Promise<void> {
  const context = await receiptContext(fact.depositId, fact.paymentIntentId);
  if (context) await mailPaymentReceipt({ ...context, paid: { minor: fact.amountMinor, currency: fact.currency }, at: fact.at });
}

async function sendRefundReceipt(fact: RefundFact, paymentId: number): Promise<void> {
  const [payment] = await db().select().from(depositPayments).where(eq(depositPayments.id, paymentId));
  if (!payment) return;
  const done = await db()
    .select({ amountMinor: depositRefunds.amountMinor })
    .from(depositRefunds)
    .where(and(eq(depositRefunds.paymentId, paymentId), eq(depositRefunds.status, 'succeeded'), eq(depositRefunds.currency, payment.currency)));
  const context = await receiptContext(payment.depositId, fact.refundId);
  if (!context) return;
  await mailRefundReceipt({
    ...context,
    refund: { minor: fact.amountMinor, currency: fact.currency },
    refundedSoFar: { minor: done.reduce((sum, r) => sum + r.amountMinor, 0), currency: payment.currency },
    paid: { minor: payment.amountMinor, currency: payment.currency },
    at: fact.at,
  });
}

/** Records a verified event's effect once, then sends the receipt it calls for. */
export async function recordEvent(fact: EventFact): Promise<RecordOutcome> {
  const type = fact.kind === 'ignored' ? fact.type : fact.kind;
  const result = await withRetry(() =>
    db().transaction(async (tx): Promise<{ outcome: RecordOutcome; paymentId?: number }> => {
      if (!(await firstDelivery(tx, fact.eventId, type))) return { outcome: 'duplicate' };
      if (fact.kind === 'payment') return recordPayment(tx, fact);
      if (fact.kind === 'refund') return recordRefund(tx, fact);
      return { outcome: 'ignored' };
    }),
  );
  if (result.outcome === 'recorded' && fact.kind === 'payment') await sendPaymentReceipt(fact);
  if (result.outcome === 'recorded' && fact.kind === 'refund' && result.paymentId !== undefined) await sendRefundReceipt(fact, result.paymentId);
  return result.outcome;
}
