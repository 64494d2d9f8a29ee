/**
 * What the fake payment service keeps, in memory only: Checkout Sessions, the payments they made
 * and refunds, shaped like the service's own objects as far as Kerfline reads them.
 */
import { randomBytes } from 'node:crypto';

export interface FakeSession {
  id: string;
  object: 'checkout.session';
  mode: 'payment';
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  amount_total: number;
  amount_subtotal: number;
  currency: string;
  /** What the pay page shows for the one line. */
  line_name: string;
  line_description: string;
  success_url: string;
  cancel_url: string;
  url: string;
  client_reference_id: string | null;
  customer_email: string | null;
  metadata: Record<string, string>;
  payment_intent: string | null;
  created: number;
  expires_at: number;
  livemode: false;
}

export interface FakePayment {
  id: string;
  sessionId: string;
  amount: number;
  currency: string;
  refunded: number;
}

export interface FakeRefund {
  id: string;
  object: 'refund';
  amount: number;
  currency: string;
  payment_intent: string;
  charge: string;
  status: 'succeeded';
  reason: string | null;
  metadata: Record<string, string>;
  created: number;
}

export function fakeId(prefix: string): string {
  return `${prefix}_test_${randomBytes(12).toString('hex')}`;
}

export function unixNow(): number {
  return Math.floor(Date.now() / 1000);
}

export class FakeRecords {
  readonly sessions = new Map<string, FakeSession>();
  readonly payments = new Map<string, FakePayment>();
  readonly refunds = new Map<string, FakeRefund>();

  /** Marks an open session paid and makes its payment; null when it is not open. */
  pay(sessionId: string): FakeSession | null {
    const session = this.sessions.get(sessionId);
    if (!session || session.status !== 'open') return null;
    const payment: FakePayment = { id: fakeId('pi'), sessionId, amount: session.amount_total, currency: session.currency, refunded: 0 };
    this.payments.set(payment.id, payment);
    Object.assign(session, { status: 'complete', payment_status: 'paid', payment_intent: payment.id });
    return session;
  }
}
