import { z } from 'zod';
import { isCurrencyCode } from '~/lib/payments/money.ts';

/**
 * A deposit on a proof: what the builder asks the client to pay when approving, and what the
 * owner refunds. Shared by the proof panel, the API routes and the database layer.
 */
export const DEPOSIT_LIMITS = {
  /**
   * The largest deposit, in minor units: eight digits, the most the common card services take
   * in one payment for two-decimal currencies (from memory; the service refuses more anyway).
   */
  maxMinor: 99_999_999,
  descriptionMaxChars: 200,
} as const;

const amountMinor = z
  .number({ invalid_type_error: 'must be a whole number of minor units (cents, pence)' })
  .int({ message: 'must be a whole number of minor units (cents, pence), not a fraction' })
  .min(1, { message: 'must be more than zero' })
  .max(DEPOSIT_LIMITS.maxMinor, { message: `must be at most ${DEPOSIT_LIMITS.maxMinor} minor units` });

export const currencySchema = z
  .string()
  .trim()
  .transform((code) => code.toUpperCase())
  .refine(isCurrencyCode, { message: 'must be an ISO 4217 currency code such as EUR, GBP or USD' });

/** The deposit a builder attaches to a proof; without `currency`, the shop's default currency. */
export const depositInputSchema = z
  .object({
    amountMinor,
    currency: currencySchema.optional(),
    description: z
      .string()
      .trim()
      .max(DEPOSIT_LIMITS.descriptionMaxChars, { message: `must be at most ${DEPOSIT_LIMITS.descriptionMaxChars} characters` })
      .default(''),
  })
  .strict();

export type DepositInput = z.infer<typeof depositInputSchema>;

/** A refund the owner asks for; without `amountMinor`, all that is left to refund. */
export const refundInputSchema = z.object({ amountMinor: amountMinor.optional() }).strict();

export type RefundInput = z.infer<typeof refundInputSchema>;

/**
 * Where a deposit stands. "awaiting payment": asked, nothing confirmed yet; "paid": the service's
 * signed webhook confirmed the payment; "partly refunded" / "refunded": refunds confirmed the same way.
 */
export type DepositState = 'awaiting_payment' | 'paid' | 'partly_refunded' | 'refunded';

export const DEPOSIT_STATE_LABELS: Readonly<Record<DepositState, string>> = {
  awaiting_payment: 'not paid yet',
  paid: 'deposit paid',
  partly_refunded: 'deposit paid, partly refunded',
  refunded: 'deposit refunded',
};

/** A deposit as the builder and the client see it. Amounts in minor units of `currency`. */
export interface DepositSummary {
  amountMinor: number;
  currency: string;
  description: string;
  state: DepositState;
  paidMinor: number;
  /** ISO 8601; null until the webhook confirmed a payment. */
  paidAt: string | null;
  refundedMinor: number;
  /** Refunds asked for whose confirmation has not arrived yet. */
  refundPendingMinor: number;
  /** Payments the service confirmed in another currency than the one asked (never added in). */
  otherPayments: { minor: number; currency: string }[];
}

/** What the Proofs panel needs to offer deposits (part of GET /api/boards/{id}/proofs). */
export interface DepositSettings {
  /** The shop's default currency (ISO 4217). */
  defaultCurrency: string;
  /** Why deposits are off on this server; null when they are on. */
  offMessage: string | null;
  /** The signed-in user may refund (the Owner). */
  canRefund: boolean;
}

/** Refund states as the payment service names them. */
export const REFUND_STATUSES = ['pending', 'succeeded', 'failed', 'canceled', 'requires_action'] as const;
