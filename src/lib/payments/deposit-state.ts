/**
 * Where a deposit stands, from what the payment service's signed webhooks recorded: payments
 * (one per completed pay page) and refunds (pending until their webhook says done). Pure: the
 * database layer feeds it rows. Amounts of another currency than the deposit's are never added
 * to it; such a payment shows as paid in its own currency (`otherPayments`).
 */
import type { DepositState, DepositSummary, REFUND_STATUSES } from '~/lib/schemas/deposit.ts';
import type { Money } from './money.ts';

export interface DepositFacts {
  asked: Money;
  description: string;
  payments: readonly (Money & { at: Date })[];
  refunds: readonly (Money & { status: (typeof REFUND_STATUSES)[number] })[];
}

function total(amounts: readonly Money[], currency: string): number {
  return amounts.filter((a) => a.currency === currency).reduce((sum, a) => sum + a.minor, 0);
}

export function depositSummary(facts: DepositFacts): DepositSummary {
  const { currency } = facts.asked;
  const paidMinor = total(facts.payments, currency);
  const refundedMinor = total(facts.refunds.filter((r) => r.status === 'succeeded'), currency);
  const refundPendingMinor = total(facts.refunds.filter((r) => r.status === 'pending' || r.status === 'requires_action'), currency);
  const firstPaid = facts.payments.filter((p) => p.currency === currency).map((p) => p.at).sort((a, b) => a.getTime() - b.getTime())[0];
  let state: DepositState = 'awaiting_payment';
  if (paidMinor > 0) state = refundedMinor <= 0 ? 'paid' : refundedMinor >= paidMinor ? 'refunded' : 'partly_refunded';
  return {
    amountMinor: facts.asked.minor,
    currency,
    description: facts.description,
    state,
    paidMinor,
    paidAt: firstPaid?.toISOString() ?? null,
    refundedMinor,
    refundPendingMinor,
    otherPayments: facts.payments.filter((p) => p.currency !== currency).map((p) => ({ minor: p.minor, currency: p.currency })),
  };
}

/** What is left to refund: paid, less refunds done or still pending. */
export function refundableMinor(summary: DepositSummary): number {
  return Math.max(0, summary.paidMinor - summary.refundedMinor - summary.refundPendingMinor);
}

/** "paid in full", "paid €200.00 of €500.00": whether the payment matched what was asked. */
export function paidInFull(summary: DepositSummary): boolean {
  return summary.paidMinor >= summary.amountMinor;
}
