/** Sending account e-mails: a failure is reported to the caller as a value, never thrown at a page. */
import { sendMail } from '~/lib/mail/send.server.ts';
import type { MailText } from './account-mail.ts';

export async function deliver(to: string, mail: MailText): Promise<boolean> {
  try {
    await sendMail({ to, ...mail });
    return true;
  } catch (error) {
    console.error(`kerfline: could not send "${mail.subject}": ${error instanceof Error ? error.message : String(error)}`);
    return false;
  }
}

/**
 * Runs account work that sends mail after the page has answered, so the answer and its timing
 * are the same whether or not the address has an account. Failures are logged, never shown.
 */
export function inBackground(work: Promise<unknown>, what: string): void {
  work.catch((error: unknown) => console.error(`kerfline: ${what} failed: ${error instanceof Error ? error.message : String(error)}`));
}
