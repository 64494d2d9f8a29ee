/**
 * The fake service's webhooks: each event is signed the way the SDK verifies it
 * (`webhooks.generateTestHeaderString` with the endpoint's secret, the `Stripe-Signature`
 * scheme) and posted to the app. Tests may hold events (to see the browser come back before
 * the webhook) and release them, or send one again (a duplicate delivery).
 */
import Stripe from 'stripe';
import { fakeId, unixNow } from './records.ts';

export interface SentEvent {
  id: string;
  type: string;
  payload: string;
  /** HTTP status the app answered with; null while held or when it could not be reached. */
  answered: number | null;
}

/** The SDK's helpers that need no key: signing uses only the endpoint secret. */
const signer = new Stripe('sk_test_fake_signer');

export class WebhookSender {
  readonly log: SentEvent[] = [];
  private held: SentEvent[] = [];
  holding = false;

  constructor(private readonly url: string, private readonly secret: string, private readonly apiVersion: string) {}

  /** Makes an event of `type` about `object` and delivers it (or holds it). */
  async emit(type: string, object: object): Promise<SentEvent> {
    const event = {
      id: fakeId('evt'),
      object: 'event',
      api_version: this.apiVersion,
      created: unixNow(),
      livemode: false,
      pending_webhooks: 1,
      type,
      data: { object },
    };
    const sent: SentEvent = { id: event.id, type, payload: JSON.stringify(event), answered: null };
    this.log.push(sent);
    if (this.holding) this.held.push(sent);
    else await this.deliver(sent);
    return sent;
  }

  /** Delivers every held event, oldest first, and stops holding. */
  async release(): Promise<void> {
    this.holding = false;
    const queue = this.held;
    this.held = [];
    for (const sent of queue) await this.deliver(sent);
  }

  /** Delivers an event already sent, with a fresh signature (as the service does on a retry). */
  async resend(id: string): Promise<SentEvent | null> {
    const sent = this.log.find((e) => e.id === id);
    if (!sent) return null;
    await this.deliver(sent);
    return sent;
  }

  private async deliver(sent: SentEvent): Promise<void> {
    const signature = signer.webhooks.generateTestHeaderString({ payload: sent.payload, secret: this.secret });
    try {
      const response = await fetch(this.url, {
        method: 'POST',
        headers: { 'content-type': 'application/json; charset=utf-8', 'stripe-signature': signature, 'user-agent': 'kerfline-fake-payments' },
        body: sent.payload,
      });
      sent.answered = response.status;
    } catch {
      sent.answered = null;
    }
  }
}
