import type { RouteCase } from './types.ts';

/**
 * Deposit and payment routes (docs/payments.md). Ids no shop has, so the status shows who may
 * ask; the matrix's proof has no deposit, so its checkout is refused the same way for everyone.
 */
export const DEPOSIT_ROUTES: readonly RouteCase[] = [
  {
    file: 'pages/api/proofs/[proofId]/deposit/index.ts',
    method: 'PUT',
    path: '/api/proofs/999999999/deposit',
    body: { amountMinor: 10_000, currency: 'EUR' },
    expect: { anonymous: 401, client: 403, builder: 404, owner: 404, otherOwner: 404 },
  },
  {
    // Refunds are the owner's alone.
    file: 'pages/api/proofs/[proofId]/deposit/refunds.ts',
    method: 'POST',
    path: '/api/proofs/999999999/deposit/refunds',
    body: {},
    expect: { anonymous: 401, client: 403, builder: 403, owner: 404, otherOwner: 404 },
  },
  {
    // Public: the link is the permission; a proof without a deposit has nothing to pay.
    file: 'pages/api/p/[token]/deposit-checkout.ts',
    method: 'POST',
    path: (ids) => `/api/p/${ids.proofToken}/deposit-checkout`,
    body: {},
    expect: { anonymous: 409, client: 409, builder: 409, owner: 409, otherOwner: 409 },
  },
  {
    file: 'pages/api/shared/[proofId]/deposit-checkout.ts',
    method: 'POST',
    path: '/api/shared/999999999/deposit-checkout',
    body: {},
    expect: { anonymous: 401, client: 404, builder: 404, owner: 404, otherOwner: 404 },
  },
  {
    // Public: the service's signature is the permission; without one, 400 for everyone.
    file: 'pages/api/payments/webhook.ts',
    method: 'POST',
    path: '/api/payments/webhook',
    body: { id: 'evt_unsigned', object: 'event', type: 'checkout.session.completed' },
    expect: { anonymous: 400, client: 400, builder: 400, owner: 400, otherOwner: 400 },
  },
];
