/**
 * Deposits on proofs: attaching one (owner or builder), where it stands (from the payment
 * service's webhooks only), the client's way to the pay page, and refunds (owner). Builder-side
 * queries are scoped by shop; the client side finds the proof by its link (or, signed in, by id
 * and e-mail) through the proofs module's locator, so a revoked or expired link finds nothing.
 */
import { and, asc, eq, inArray, type SQL } from 'drizzle-orm';
import { config } from '~/lib/config/env.server.ts';
import { db, type Db } from '~/lib/db/client.server.ts';
import { depositPayments, depositRefunds, deposits, proofs, shops } from '~/lib/db/schema.ts';
import type { DepositInput, DepositSummary, RefundInput } from '~/lib/schemas/deposit.ts';
import { depositSummary } from './deposit-state.ts';
import { createCheckoutSession, requestRefund, PAYMENTS_OFF_MESSAGE } from './payment-service.server.ts';
import { formatMoney } from './money.ts';
import type { Failure } from '~/lib/http/result.ts';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
type DepositRow = typeof deposits.$inferSelect;

/** Whether this server can take deposits (payment settings present). */
export function depositsOn(): boolean {
  return config().payments !== null;
}

/** The shop's default currency (ISO 4217), for a deposit that names none. */
export async function shopCurrency(q: Db | Tx, shopId: number): Promise<string> {
  const [row] = await q.select({ currency: shops.currency }).from(shops).where(eq(shops.id, shopId)).limit(1);
  return row?.currency ?? 'USD';
}

/** Writes the proof's deposit (one per proof: a second call replaces the amount and description). */
export async function saveDeposit(q: Db | Tx, shopId: number, proofId: number, createdBy: string, input: DepositInput): Promise<void> {
  const currency = input.currency ?? (await shopCurrency(q, shopId));
  await q
    .insert(deposits)
    .values({ shopId, proofId, amountMinor: input.amountMinor, currency, description: input.description, createdBy })
    .onDuplicateKeyUpdate({ set: { amountMinor: input.amountMinor, currency, description: input.description, createdBy } });
}

/** The deposits of these proofs with where each stands, by proof id. */
export async function depositsOfProofs(q: Db | Tx, proofIds: readonly number[]): Promise<Map<number, DepositSummary>> {
  const out = new Map<number, DepositSummary>();
  if (proofIds.length === 0) return out;
  const rows = await q.select().from(deposits).where(inArray(deposits.proofId, [...proofIds]));
  if (rows.length === 0) return out;
  const ids = rows.map((r) => r.id);
  const [payments, refunds] = await Promise.all([
    q.select().from(depositPayments).where(inArray(depositPayments.depositId, ids)).orderBy(asc(depositPayments.id)),
    q
      .select({ depositId: depositPayments.depositId, refund: depositRefunds })
      .from(depositRefunds)
      .innerJoin(depositPayments, eq(depositPayments.id, depositRefunds.paymentId))
      .where(inArray(depositPayments.depositId, ids)),
  ]);
  for (const row of rows) out.set(row.proofId, summaryOf(row, payments, refunds));
  return out;
}

function summaryOf(
  row: DepositRow,
  payments: readonly (typeof depositPayments.$inferSelect)[],
  refunds: readonly { depositId: number; refund: typeof depositRefunds.$inferSelect }[],
): DepositSummary {
  return depositSummary({
    asked: { minor: row.amountMinor, currency: row.currency },
    description: row.description,
    payments: payments.filter((p) => p.depositId === row.id).map((p) => ({ minor: p.amountMinor, currency: p.currency, at: p.paidAt })),
    refunds: refunds.filter((r) => r.depositId === row.id).map(({ refund }) => ({ minor: refund.amountMinor, currency: refund.currency, status: refund.status })),
  });
}

export type SetDepositResult = { ok: true; deposit: DepositSummary } | Failure<'not_found' | 'closed'>;

/** Attaches (or replaces) the deposit of an open proof of the shop: not answered, not revoked. */
export async function setProofDeposit(shopId: number, proofId: number, userId: string, input: DepositInput): Promise<SetDepositResult> {
  return db().transaction(async (tx) => {
    const [proof] = await tx.select().from(proofs).where(and(eq(proofs.id, proofId), eq(proofs.shopId, shopId))).for('update');
    if (!proof) return { ok: false, reason: 'not_found' };
    if (proof.decision || proof.revokedAt) return { ok: false, reason: 'closed' };
    await saveDeposit(tx, shopId, proofId, userId, input);
    const deposit = (await depositsOfProofs(tx, [proofId])).get(proofId);
    return deposit ? { ok: true, deposit } : { ok: false, reason: 'not_found' };
  });
}

export type CheckoutResult =
  | { ok: true; url: string }
  | Failure<'not_found' | 'not_approved' | 'no_deposit' | 'already_paid' | 'off' | 'service', { message: string }>;

/** Where the client comes back to from the pay page: the proof page they left. */
export interface ReturnPaths {
  /** e.g. `/p/{token}`; `?deposit=returned` / `?deposit=cancelled` is added. */
  proofPath: string;
}

/**
 * A pay page for the approved proof's deposit: a Checkout Session of exactly the deposit's amount
 * and currency, from the database. `where` finds the proof (not revoked, not expired).
 */
export async function startDepositCheckout(where: SQL | undefined, paths: ReturnPaths, now: Date): Promise<CheckoutResult> {
  if (!depositsOn()) return { ok: false, reason: 'off', message: PAYMENTS_OFF_MESSAGE };
  const [found] = await db()
    .select({ proof: proofs, deposit: deposits, shopName: shops.name })
    .from(proofs)
    .innerJoin(shops, eq(shops.id, proofs.shopId))
    .leftJoin(deposits, eq(deposits.proofId, proofs.id))
    .where(where)
    .limit(1);
  if (!found || found.proof.expiresAt.getTime() <= now.getTime()) return { ok: false, reason: 'not_found', message: 'This proof is not available' };
  if (!found.deposit) return { ok: false, reason: 'no_deposit', message: 'This proof asks for no deposit' };
  if (found.proof.decision !== 'approved') return { ok: false, reason: 'not_approved', message: 'Approve the layout first; the deposit is paid after approving' };
  const summary = (await depositsOfProofs(db(), [found.proof.id])).get(found.proof.id);
  if (summary && summary.state !== 'awaiting_payment') return { ok: false, reason: 'already_paid', message: 'The deposit has already been paid' };
  const origin = config().appOrigin;
  const money = { minor: found.deposit.amountMinor, currency: found.deposit.currency };
  const shop = found.shopName || 'the shop';
  const session = await createCheckoutSession({
    depositId: found.deposit.id,
    shopId: found.proof.shopId,
    money,
    title: `Deposit to ${shop}: ${formatMoney(money)}`,
    description: found.deposit.description,
    clientEmail: found.proof.clientEmail,
    successUrl: `${origin}${paths.proofPath}?deposit=returned`,
    cancelUrl: `${origin}${paths.proofPath}?deposit=cancelled`,
  });
  if (!session.ok) return { ok: false, reason: 'service', message: session.message };
  return { ok: true, url: session.value.url };
}

export type RefundResult =
  | { ok: true; deposit: DepositSummary }
  | Failure<'not_found' | 'no_deposit' | 'not_paid' | 'too_much' | 'off' | 'service', { message: string }>;

/**
 * Asks the service to refund part or all of a paid deposit of the shop. The refund counts as
 * pending at once (so a second click cannot refund the same money twice) and as done when its
 * webhook says so. One refund comes out of one payment: at most what is left of it.
 */
export async function refundDeposit(shopId: number, proofId: number, userId: string, input: RefundInput, now: Date): Promise<RefundResult> {
  if (!depositsOn()) return { ok: false, reason: 'off', message: PAYMENTS_OFF_MESSAGE };
  const [deposit] = await db().select().from(deposits).where(and(eq(deposits.proofId, proofId), eq(deposits.shopId, shopId))).limit(1);
  if (!deposit) {
    const [proof] = await db().select({ id: proofs.id }).from(proofs).where(and(eq(proofs.id, proofId), eq(proofs.shopId, shopId)));
    return proof ? { ok: false, reason: 'no_deposit', message: 'This proof has no deposit' } : { ok: false, reason: 'not_found', message: 'No such proof in your shop' };
  }
  const payments = await db().select().from(depositPayments).where(and(eq(depositPayments.depositId, deposit.id), eq(depositPayments.currency, deposit.currency)));
  const refunds = payments.length
    ? await db().select().from(depositRefunds).where(inArray(depositRefunds.paymentId, payments.map((p) => p.id)))
    : [];
  const left = payments
    .map((p) => {
      const held = refunds.filter((r) => r.paymentId === p.id && r.status !== 'failed' && r.status !== 'canceled').reduce((sum, r) => sum + r.amountMinor, 0);
      return { payment: p, left: p.amountMinor - held };
    })
    .sort((a, b) => b.left - a.left)[0];
  if (!left || left.left <= 0) {
    return payments.length
      ? { ok: false, reason: 'too_much', message: 'amountMinor: nothing is left to refund' }
      : { ok: false, reason: 'not_paid', message: 'The deposit has not been paid; there is nothing to refund' };
  }
  const amount = input.amountMinor ?? left.left;
  if (amount > left.left) {
    return { ok: false, reason: 'too_much', message: `amountMinor: must be at most ${left.left} (${formatMoney({ minor: left.left, currency: deposit.currency })}, what is left to refund)` };
  }
  const refund = await requestRefund({ paymentIntentId: left.payment.paymentIntentId, amountMinor: amount, depositId: deposit.id, requestedBy: userId });
  if (!refund.ok) return { ok: false, reason: 'service', message: refund.message };
  // The webhook may have come first; then only who asked for it is added.
  await db()
    .insert(depositRefunds)
    .values({
      shopId,
      paymentId: left.payment.id,
      refundId: refund.value.id,
      amountMinor: refund.value.amountMinor,
      currency: refund.value.currency,
      status: 'pending',
      requestedBy: userId,
      requestedAt: now,
    })
    .onDuplicateKeyUpdate({ set: { requestedBy: userId, requestedAt: now } });
  const summary = (await depositsOfProofs(db(), [proofId])).get(proofId);
  return summary ? { ok: true, deposit: summary } : { ok: false, reason: 'not_found', message: 'No such proof in your shop' };
}
