/** A local SMTP server that accepts every message and files it in the outbox (dev and tests). */
import { randomUUID } from 'node:crypto';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { saveToOutbox } from './outbox.server.ts';

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(field) ? field : field ? [field] : [];
  return list.flatMap((a) => a.value.map((v) => v.address ?? '')).filter(Boolean);
}

export function startFakeSmtp(port: number, outboxDir: string): Promise<SMTPServer> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    size: 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((mail) =>
          saveToOutbox(outboxDir, {
            id: `${Date.now()}-${randomUUID()}`,
            receivedAt: new Date().toISOString(),
            from: addresses(mail.from)[0] ?? '',
            to: addresses(mail.to),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
          }),
        )
        .then(() => callback(), (error: Error) => callback(error));
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve(server));
  });
}
