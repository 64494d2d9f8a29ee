/** Reads e-mails the fake SMTP server caught (it writes them a moment after sending, so this polls). */
import { readOutbox, type OutboxMessage } from '~/lib/mail/outbox.server.ts';

export function outboxDir(): string {
  const dir = process.env.OUTBOX_DIR;
  if (!dir) throw new Error('OUTBOX_DIR is not set (npm test sets it)');
  return dir;
}

export async function mailsTo(email: string): Promise<OutboxMessage[]> {
  return (await readOutbox(outboxDir())).filter((m) => m.to.includes(email));
}

/** The newest mail to `email` whose subject (and optional test) match, waiting up to `ms` for it. */
export async function waitForMail(
  email: string,
  subject: RegExp,
  ms = 5000,
  also: (m: OutboxMessage) => boolean = () => true,
): Promise<OutboxMessage> {
  const until = Date.now() + ms;
  for (;;) {
    const found = (await mailsTo(email)).find((m) => subject.test(m.subject) && also(m));
    if (found) return found;
    if (Date.now() > until) throw new Error(`no mail to ${email} matching ${subject} within ${ms} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** Waits until `email` has `count` mails matching `subject` (for resends). */
export async function waitForMailCount(email: string, subject: RegExp, count: number, ms = 5000): Promise<OutboxMessage[]> {
  const until = Date.now() + ms;
  for (;;) {
    const found = (await mailsTo(email)).filter((m) => subject.test(m.subject));
    if (found.length >= count) return found;
    if (Date.now() > until) throw new Error(`only ${found.length} of ${count} mails to ${email} within ${ms} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** The first link in a mail whose path starts with `pathPrefix`, and its token (last path part). */
export function linkIn(message: OutboxMessage, pathPrefix: string): { url: string; token: string } {
  const url = message.text.match(/https?:\/\/\S+/g)?.find((u) => new URL(u).pathname.startsWith(pathPrefix));
  if (!url) throw new Error(`no ${pathPrefix} link in "${message.subject}"`);
  return { url, token: new URL(url).pathname.split('/').pop()! };
}

/** An address nobody else in the run uses. */
export function uniqueEmail(label: string): string {
  return `${label}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}@test.example`;
}
