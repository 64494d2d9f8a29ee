/** What `npm start` prints once the app answers: the URL and the demo sign-ins. */
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_SHOP_NAME } from '../src/lib/db/seed/demo-shop.server.ts';

const origin = process.env.APP_ORIGIN ?? 'http://127.0.0.1:4321';
const lines = [
  '',
  `  Kerfline is running: ${origin}`,
  `  Outbox (e-mails sent by the app): ${origin}/outbox`,
  '',
  `  Demo sign-ins for ${DEMO_SHOP_NAME} (password for all: ${DEMO_PASSWORD}):`,
  ...DEMO_PEOPLE.map((p) => `    ${p.role.padEnd(8)} ${p.email}`),
  '',
  '  Ctrl-C stops the app and MariaDB; your data stays in .data/.',
  '',
];
console.log(lines.join('\n'));
