/**
 * The fake payment service on loopback: the SDK's API under /v1 (bearer key checked), the pay
 * page under /pay/{session}, and a few test controls under /_fake (hold and release webhooks,
 * list and resend them). Memory only: a restart forgets everything.
 */
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import { answerApi } from './api.ts';
import { parseFormBody } from './form-body.ts';
import { closedPage, declinedPage, payPage, TEST_CARDS } from './pay-page.ts';
import { FakeRecords, unixNow } from './records.ts';
import { WebhookSender } from './webhook-sender.ts';

export interface FakePaymentsOptions {
  port: number;
  /** The key the SDK must send (the app's PAYMENTS_SECRET_KEY). */
  secretKey: string;
  /** Where webhooks go (the app's /api/payments/webhook) and the secret they are signed with. */
  webhookUrl: string;
  webhookSecret: string;
}

export interface FakePayments {
  server: Server;
  origin: string;
  records: FakeRecords;
  events: WebhookSender;
  close(): Promise<void>;
}

const BODY_LIMIT = 64 * 1024;
const API_VERSION = '2026-10-28.endive';

function readBody(request: IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    let size = 0;
    const chunks: Buffer[] = [];
    request.on('data', (chunk: Buffer) => {
      size += chunk.length;
      if (size > BODY_LIMIT) reject(new Error('body too large'));
      else chunks.push(chunk);
    });
    request.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    request.on('error', reject);
  });
}

function send(response: ServerResponse, status: number, type: string, body: string, headers: Record<string, string> = {}): void {
  response.writeHead(status, { 'content-type': type, 'cache-control': 'no-store', ...headers });
  response.end(body);
}

const sendJson = (response: ServerResponse, status: number, body: unknown) => send(response, status, 'application/json', JSON.stringify(body));
const sendHtml = (response: ServerResponse, status: number, body: string) => send(response, status, 'text/html; charset=utf-8', body);

function digits(card: string): string {
  return card.replace(/[\s-]/g, '');
}

async function answerPay(fake: FakePayments, method: string, id: string, body: string, response: ServerResponse): Promise<void> {
  const session = fake.records.sessions.get(id);
  if (session?.status === 'open' && session.expires_at <= unixNow()) session.status = 'expired';
  if (!session || session.status !== 'open') return sendHtml(response, session ? 410 : 404, closedPage(session));
  if (method === 'GET') return sendHtml(response, 200, payPage(session));
  const form = new URLSearchParams(body);
  const card = digits(form.get('card') ?? '');
  if (form.get('choice') === 'decline' || card === digits(TEST_CARDS.declined)) {
    await fake.events.emit('payment_intent.payment_failed', { id: `pi_declined_${session.id}`, object: 'payment_intent', amount: session.amount_total, currency: session.currency, status: 'requires_payment_method', metadata: session.metadata });
    return sendHtml(response, 402, declinedPage(session));
  }
  if (card !== digits(TEST_CARDS.pays)) return sendHtml(response, 400, payPage(session, 'Use one of the test card numbers listed below.'));
  const paid = fake.records.pay(session.id);
  if (paid) await fake.events.emit('checkout.session.completed', paid);
  send(response, 303, 'text/plain; charset=utf-8', 'Paid', { location: session.success_url });
}

async function answerControl(fake: FakePayments, method: string, path: string, response: ServerResponse): Promise<void> {
  if (method === 'GET' && path === '/_fake/health') return sendJson(response, 200, { ok: true });
  if (method === 'GET' && path === '/_fake/events') return sendJson(response, 200, fake.events.log);
  if (method === 'GET' && path === '/_fake/sessions') return sendJson(response, 200, [...fake.records.sessions.values()]);
  if (method === 'POST' && path === '/_fake/hold') {
    fake.events.holding = true;
    return sendJson(response, 200, { holding: true });
  }
  if (method === 'POST' && path === '/_fake/release') {
    await fake.events.release();
    return sendJson(response, 200, { holding: false });
  }
  const resend = /^\/_fake\/events\/([\w]+)\/resend$/.exec(path);
  if (method === 'POST' && resend) {
    const sent = await fake.events.resend(resend[1] ?? '');
    return sent ? sendJson(response, 200, sent) : sendJson(response, 404, { error: 'no such event' });
  }
  sendJson(response, 404, { error: 'unknown control' });
}

async function route(fake: FakePayments, options: FakePaymentsOptions, request: IncomingMessage, response: ServerResponse): Promise<void> {
  const method = request.method ?? 'GET';
  const path = new URL(request.url ?? '/', fake.origin).pathname;
  const body = method === 'POST' ? await readBody(request) : '';
  if (path.startsWith('/v1/')) {
    if (request.headers.authorization !== `Bearer ${options.secretKey}`) {
      return sendJson(response, 401, { error: { type: 'invalid_request_error', message: 'Invalid API Key provided.' } });
    }
    const answer = await answerApi(method, path.slice(3), parseFormBody(body), fake.records, fake.events, fake.origin);
    if (answer) return sendJson(response, answer.status, answer.body);
    return sendJson(response, 404, { error: { type: 'invalid_request_error', message: `Unrecognized request URL (${method}: ${path}). This fake answers only what Kerfline calls.` } });
  }
  const pay = /^\/pay\/([\w]+)$/.exec(path);
  if (pay && (method === 'GET' || method === 'POST')) return answerPay(fake, method, pay[1] ?? '', body, response);
  if (path.startsWith('/_fake/')) return answerControl(fake, method, path, response);
  sendHtml(response, 404, '<!doctype html><title>Not found</title><p>Nothing here.</p>');
}

/** Starts the fake on 127.0.0.1:`port` (0 picks a free port). */
export function startFakePayments(options: FakePaymentsOptions): Promise<FakePayments> {
  const records = new FakeRecords();
  const events = new WebhookSender(options.webhookUrl, options.webhookSecret, API_VERSION);
  const server = createServer();
  const fake: FakePayments = {
    server,
    origin: '',
    records,
    events,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
  server.on('request', (request: IncomingMessage, response: ServerResponse) => {
    route(fake, options, request, response).catch((error: unknown) => {
      if (!response.headersSent) sendJson(response, 500, { error: { type: 'api_error', message: String(error) } });
    });
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : options.port;
      fake.origin = `http://127.0.0.1:${port}`;
      resolve(fake);
    });
  });
}
