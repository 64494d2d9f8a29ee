/** Reads the fake SMTP server's outbox (OUTBOX_DIR); it files messages asynchronously, so poll. */
import { readOutbox, type OutboxMessage } from '~/lib/mail/outbox.server.ts';

export async function waitForMail(match: (m: OutboxMessage) => boolean, timeoutMs = 10_000): Promise<OutboxMessage> {
  const dir = process.env.OUTBOX_DIR;
  if (!dir) throw new Error('OUTBOX_DIR is not set (run the tests through npm test)');
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await readOutbox(dir)).find(match);
    if (found) return found;
    if (Date.now() > deadline) throw new Error('no matching e-mail arrived in the outbox');
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

/** The proof link in a message's text. */
export function proofLinkIn(text: string): string {
  const link = /https?:\/\/\S+\/p\/[A-Za-z0-9_-]{22}/.exec(text)?.[0];
  if (!link) throw new Error('no proof link in the e-mail');
  return link;
}
