import { describe, expect, it } from 'vitest';
import { depositSummary, refundableMinor } from '~/lib/payments/deposit-state.ts';

describe('where a deposit stands (from webhook records only)', () => {
  const asked = { minor: 50_000, currency: 'EUR' };
  const at = new Date('2026-12-03T10:00:00Z');

  it('is not paid until a payment is recorded, then paid, partly refunded, refunded', () => {
    expect(depositSummary({ asked, description: '', payments: [], refunds: [] }).state).toBe('awaiting_payment');
    const paid = depositSummary({ asked, description: '', payments: [{ ...asked, at }], refunds: [] });
    expect(paid).toMatchObject({ state: 'paid', paidMinor: 50_000, paidAt: at.toISOString() });
    expect(refundableMinor(paid)).toBe(50_000);
    const part = depositSummary({ asked, description: '', payments: [{ ...asked, at }], refunds: [{ minor: 10_000, currency: 'EUR', status: 'succeeded' }, { minor: 5_000, currency: 'EUR', status: 'pending' }] });
    expect(part).toMatchObject({ state: 'partly_refunded', refundedMinor: 10_000, refundPendingMinor: 5_000 });
    expect(refundableMinor(part)).toBe(35_000);
    const failed = depositSummary({ asked, description: '', payments: [{ ...asked, at }], refunds: [{ minor: 50_000, currency: 'EUR', status: 'failed' }] });
    expect(failed.state).toBe('paid');
    const all = depositSummary({ asked, description: '', payments: [{ ...asked, at }], refunds: [{ minor: 50_000, currency: 'EUR', status: 'succeeded' }] });
    expect(all.state).toBe('refunded');
    expect(refundableMinor(all)).toBe(0);
  });

  it('never adds a payment in another currency to the deposit', () => {
    const odd = depositSummary({ asked, description: '', payments: [{ minor: 50_000, currency: 'USD', at }], refunds: [] });
    expect(odd).toMatchObject({ state: 'awaiting_payment', paidMinor: 0, otherPayments: [{ minor: 50_000, currency: 'USD' }] });
  });
});
