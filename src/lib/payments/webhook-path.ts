/**
 * Where the payment service posts its webhooks. The route proves itself with the service's
 * signature, not with an Origin header, so the same-origin check lets this one path through.
 */
export const PAYMENT_WEBHOOK_PATH = '/api/payments/webhook';
