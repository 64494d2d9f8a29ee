/**
 * Runs the local fake payment service on loopback (demo and tests):
 * PAYMENTS_FAKE_PORT, PAYMENTS_SECRET_KEY, PAYMENTS_WEBHOOK_SECRET, and APP_ORIGIN (webhooks go
 * to APP_ORIGIN/api/payments/webhook). docs/payments.md says what it does and does not do.
 */
import { PAYMENT_WEBHOOK_PATH } from '../../src/lib/payments/webhook-path.ts';
import { startFakePayments } from './fake/server.ts';

function required(name: string): string {
  const value = process.env[name];
  if (!value) {
    console.error(`kerfline: the fake payment service needs ${name}`);
    process.exit(1);
  }
  return value;
}

const port = Number(process.env.PAYMENTS_FAKE_PORT ?? 12111);
const appOrigin = process.env.APP_ORIGIN ?? 'http://127.0.0.1:4321';

startFakePayments({
  port,
  secretKey: required('PAYMENTS_SECRET_KEY'),
  webhookSecret: required('PAYMENTS_WEBHOOK_SECRET'),
  webhookUrl: `${appOrigin}${PAYMENT_WEBHOOK_PATH}`,
}).then(
  (fake) => console.log(`kerfline: fake payment service on ${fake.origin} (demo: no real money, nothing leaves this machine)`),
  (error: unknown) => {
    console.error(`kerfline: the fake payment service could not listen on 127.0.0.1:${port}: ${String(error)}`);
    process.exit(1);
  },
);
