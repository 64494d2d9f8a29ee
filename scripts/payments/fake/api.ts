/**
 * The part of the service's HTTP API the fake answers, as the SDK calls it: create and read a
 * Checkout Session (one-off payments), expire one, and refund a payment in full or in part.
 * Answers are JSON in the service's shapes; errors are `{ error: { type, message, param } }`.
 */
import { list, metadataOf, nested, text, type FormObject } from './form-body.ts';
import { fakeId, unixNow, type FakeRecords, type FakeRefund, type FakeSession } from './records.ts';
import type { WebhookSender } from './webhook-sender.ts';

export interface ApiAnswer {
  status: number;
  body: unknown;
}

/** The largest amount the fake takes, in minor units (eight digits, as the service's cards allow; from memory). */
const MAX_AMOUNT = 99_999_999;
const SESSION_SECONDS = 24 * 3600;

function refusal(status: number, message: string, param?: string): ApiAnswer {
  return { status, body: { error: { type: 'invalid_request_error', message, ...(param ? { param } : {}) } } };
}

function missing(name: string): string {
  return `Missing required param: ${name}.`;
}

function createSession(records: FakeRecords, form: FormObject, payOrigin: string): ApiAnswer {
  if (text(form.mode) !== 'payment') return refusal(400, 'This fake takes mode=payment only.', 'mode');
  const success = text(form.success_url);
  const cancel = text(form.cancel_url);
  if (!success) return refusal(400, missing('success_url'), 'success_url');
  if (!cancel) return refusal(400, missing('cancel_url'), 'cancel_url');
  const items = list(form.line_items).map((item) => nested(item));
  if (items.length !== 1) return refusal(400, 'This fake takes exactly one line item.', 'line_items');
  const item = items[0]!;
  const price = nested(item.price_data);
  const currency = text(price.currency)?.toLowerCase() ?? '';
  const unit = Number(text(price.unit_amount));
  const quantity = Number(text(item.quantity) ?? '1');
  if (!/^[a-z]{3}$/.test(currency)) return refusal(400, 'Invalid currency.', 'line_items[0][price_data][currency]');
  if (!Number.isInteger(unit) || unit < 1 || unit > MAX_AMOUNT) return refusal(400, 'Invalid integer amount.', 'line_items[0][price_data][unit_amount]');
  if (quantity !== 1) return refusal(400, 'This fake takes quantity 1.', 'line_items[0][quantity]');
  const product = nested(price.product_data);
  const id = fakeId('cs');
  const session: FakeSession = {
    id,
    object: 'checkout.session',
    mode: 'payment',
    status: 'open',
    payment_status: 'unpaid',
    amount_total: unit,
    amount_subtotal: unit,
    currency,
    line_name: text(product.name) ?? '',
    line_description: text(product.description) ?? '',
    success_url: success.replaceAll('{CHECKOUT_SESSION_ID}', id),
    cancel_url: cancel,
    url: `${payOrigin}/pay/${id}`,
    client_reference_id: text(form.client_reference_id) ?? null,
    customer_email: text(form.customer_email) ?? null,
    metadata: metadataOf(form.metadata),
    payment_intent: null,
    created: unixNow(),
    expires_at: unixNow() + SESSION_SECONDS,
    livemode: false,
  };
  records.sessions.set(id, session);
  return { status: 200, body: session };
}

async function expireSession(records: FakeRecords, events: WebhookSender, id: string): Promise<ApiAnswer> {
  const session = records.sessions.get(id);
  if (!session) return refusal(404, `No such checkout.session: '${id}'`, 'session');
  if (session.status !== 'open') return refusal(400, 'Only an open session can be expired.');
  session.status = 'expired';
  await events.emit('checkout.session.expired', session);
  return { status: 200, body: session };
}

async function createRefund(records: FakeRecords, events: WebhookSender, form: FormObject): Promise<ApiAnswer> {
  const intent = text(form.payment_intent);
  if (!intent) return refusal(400, missing('payment_intent'), 'payment_intent');
  const payment = records.payments.get(intent);
  if (!payment) return refusal(404, `No such payment_intent: '${intent}'`, 'payment_intent');
  const left = payment.amount - payment.refunded;
  const asked = text(form.amount);
  const amount = asked === undefined ? left : Number(asked);
  if (!Number.isInteger(amount) || amount < 1) return refusal(400, 'Invalid integer amount.', 'amount');
  if (amount > left) return refusal(400, `Refund amount (${amount}) is greater than the unrefunded amount (${left}).`, 'amount');
  payment.refunded += amount;
  const refund: FakeRefund = {
    id: fakeId('re'),
    object: 'refund',
    amount,
    currency: payment.currency,
    payment_intent: payment.id,
    charge: payment.id.replace(/^pi_/, 'ch_'),
    status: 'succeeded',
    reason: text(form.reason) ?? null,
    metadata: metadataOf(form.metadata),
    created: unixNow(),
  };
  records.refunds.set(refund.id, refund);
  // The answer goes back first; the webhook follows, as the service sends it on its own time.
  setImmediate(() => void events.emit('refund.created', refund));
  return { status: 200, body: refund };
}

/** Answers one API call (`path` after /v1), or null for a path the fake does not know. */
export async function answerApi(
  method: string,
  path: string,
  form: FormObject,
  records: FakeRecords,
  events: WebhookSender,
  payOrigin: string,
): Promise<ApiAnswer | null> {
  if (method === 'POST' && path === '/checkout/sessions') return createSession(records, form, payOrigin);
  const session = /^\/checkout\/sessions\/([\w]+)(\/expire)?$/.exec(path);
  if (session) {
    const id = session[1] ?? '';
    if (method === 'POST' && session[2]) return expireSession(records, events, id);
    if (method === 'GET' && !session[2]) {
      const found = records.sessions.get(id);
      return found ? { status: 200, body: found } : refusal(404, `No such checkout.session: '${id}'`, 'session');
    }
  }
  if (method === 'POST' && path === '/refunds') return createRefund(records, events, form);
  return null;
}
