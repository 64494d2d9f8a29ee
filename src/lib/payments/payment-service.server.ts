/**
 * The only code that talks to the payment service, through its official SDK (`stripe`): a
 * Checkout Session for a deposit, and refunds. The SDK is pointed at PAYMENTS_API_URL (host,
 * port, protocol), which `npm start` and the tests set to the local fake. Calls return values,
 * never throw: a failure is `{ ok: false, message }` the route maps to 502.
 */
import Stripe from 'stripe';
import { config, type PaymentSettings } from '~/lib/config/env.server.ts';
import type { Money } from './money.ts';

export const PAYMENTS_OFF_MESSAGE =
  'Deposits are off on this server: it has no payment settings (PAYMENTS_SECRET_KEY and PAYMENTS_WEBHOOK_SECRET; see docs/payments.md).';

let client: { settings: PaymentSettings; sdk: Stripe } | undefined;

/** The SDK client for the configured service, or null when deposits are off. */
export function paymentClient(): Stripe | null {
  const settings = config().payments;
  if (!settings) return null;
  if (client?.settings !== settings) {
    const sdk = new Stripe(settings.secretKey, {
      host: settings.apiHost,
      port: settings.apiPort,
      protocol: settings.apiProtocol,
      timeout: 15_000,
      maxNetworkRetries: 2,
      telemetry: false,
      appInfo: { name: 'Kerfline' },
    });
    client = { settings, sdk };
  }
  return client.sdk;
}

export type ServiceResult<T> = { ok: true; value: T } | { ok: false; message: string };

/** What the service's error says, without anything the caller sent (never a key or card detail). */
function failure(error: unknown): { ok: false; message: string } {
  if (error instanceof Stripe.errors.StripeError) return { ok: false, message: `The payment service refused: ${error.message}` };
  return { ok: false, message: 'The payment service could not be reached; try again in a moment.' };
}

export interface CheckoutRequest {
  depositId: number;
  shopId: number;
  money: Money;
  /** The line the client sees on the pay page ("Deposit for …"). */
  title: string;
  description: string;
  clientEmail: string;
  successUrl: string;
  cancelUrl: string;
}

export interface CheckoutSession {
  id: string;
  /** The service's pay page for this session. */
  url: string;
}

/** A one-off payment of exactly the deposit, in its currency; the browser never names the amount. */
export async function createCheckoutSession(request: CheckoutRequest): Promise<ServiceResult<CheckoutSession>> {
  const sdk = paymentClient();
  if (!sdk) return { ok: false, message: PAYMENTS_OFF_MESSAGE };
  try {
    const session = await sdk.checkout.sessions.create({
      mode: 'payment',
      line_items: [
        {
          quantity: 1,
          price_data: {
            currency: request.money.currency.toLowerCase(),
            unit_amount: request.money.minor,
            product_data: { name: request.title, ...(request.description ? { description: request.description } : {}) },
          },
        },
      ],
      customer_email: request.clientEmail,
      client_reference_id: `deposit-${request.depositId}`,
      metadata: { deposit_id: String(request.depositId), shop_id: String(request.shopId) },
      success_url: request.successUrl,
      cancel_url: request.cancelUrl,
    });
    if (!session.url) return { ok: false, message: 'The payment service gave no pay page for this deposit.' };
    return { ok: true, value: { id: session.id, url: session.url } };
  } catch (error) {
    return failure(error);
  }
}

export interface RefundRequest {
  paymentIntentId: string;
  amountMinor: number;
  depositId: number;
  requestedBy: string;
}

export interface RequestedRefund {
  id: string;
  amountMinor: number;
  currency: string;
}

/** Asks the service to refund part or all of a payment; the refund is recorded when its webhook says so. */
export async function requestRefund(request: RefundRequest): Promise<ServiceResult<RequestedRefund>> {
  const sdk = paymentClient();
  if (!sdk) return { ok: false, message: PAYMENTS_OFF_MESSAGE };
  try {
    const refund = await sdk.refunds.create({
      payment_intent: request.paymentIntentId,
      amount: request.amountMinor,
      metadata: { deposit_id: String(request.depositId), requested_by: request.requestedBy },
    });
    return { ok: true, value: { id: refund.id, amountMinor: refund.amount, currency: refund.currency.toUpperCase() } };
  } catch (error) {
    return failure(error);
  }
}
