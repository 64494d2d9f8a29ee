/** Runs the local fake SMTP server: SMTP_PORT (default 2525), OUTBOX_DIR (default .data/outbox). */
import { startFakeSmtp } from '../../src/lib/mail/fake-smtp.server.ts';

const port = Number(process.env.SMTP_PORT ?? 2525);
const dir = process.env.OUTBOX_DIR ?? '.data/outbox';

startFakeSmtp(port, dir).then(
  () => console.log(`kerfline: fake SMTP on 127.0.0.1:${port}, messages in ${dir}`),
  (error: unknown) => {
    console.error(`kerfline: fake SMTP could not listen on 127.0.0.1:${port}: ${String(error)}`);
    process.exit(1);
  },
);
