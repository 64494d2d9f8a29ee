/** What `npm start` prints once the app answers: the URL and the demo sign-ins. */
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_SHOP_NAME } from '../src/lib/db/seed/demo-shop.server.ts';

const origin = process.env.APP_ORIGIN ?? 'http://127.0.0.1:4321';
const demo = process.env.KERFLINE_MODE === 'demo';
const fakePayments = process.env.PAYMENTS_API_URL?.startsWith('http://127.0.0.1:') ?? false;
const payments = !process.env.PAYMENTS_SECRET_KEY || !process.env.PAYMENTS_WEBHOOK_SECRET
  ? ['  Deposits are off: no payment settings (PAYMENTS_SECRET_KEY, PAYMENTS_WEBHOOK_SECRET; see docs/payments.md).']
  : fakePayments
    ? [`  Deposits go to the local fake payment service at ${process.env.PAYMENTS_API_URL} (test cards only, no real money).`]
    : [`  Deposits go to the payment service at ${process.env.PAYMENTS_API_URL ?? 'https://api.stripe.com'}.`];
const lines = [
  '',
  `  Kerfline is running: ${origin}`,
  ...(demo
    ? [
        '  Demo mode (KERFLINE_MODE=demo): e-mails go to a local fake mail server, shown to this machine only at',
        `  ${origin}/outbox. Set KERFLINE_MODE=production to turn the Outbox off.`,
      ]
    : ['  Production mode: no Outbox page; e-mails go to SMTP_URL.']),
  ...payments,
  '',
  `  Demo sign-ins for ${DEMO_SHOP_NAME} (password for all: ${DEMO_PASSWORD}):`,
  ...DEMO_PEOPLE.map((p) => `    ${p.role.padEnd(8)} ${p.email}`),
  '',
  '  Ctrl-C stops the app and MariaDB; your data stays in .data/.',
  '',
];
console.log(lines.join('\n'));
