/**
 * The one way the app sends e-mail: nodemailer over SMTP to SMTP_URL. A failure is reported as
 * `false` and logged with the (fixed, never user-written) subject only, so a mail that could not
 * go out never loses the work that asked for it and no link or message text reaches the log.
 */
import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '~/lib/config/env.server.ts';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
}

let transport: Transporter | undefined;

export async function sendMail(message: MailMessage): Promise<boolean> {
  try {
    transport ??= nodemailer.createTransport(config().smtpUrl);
    await transport.sendMail({ from: config().mailFrom, ...message });
    return true;
  } catch (error) {
    console.error(`kerfline: could not send "${message.subject}": ${error instanceof Error ? error.message : String(error)}`);
    return false;
  }
}

/**
 * Runs work that sends mail after the page has answered, so the answer and its timing are the
 * same whether or not an address has an account. Failures are logged, never shown.
 */
export function inBackground(work: Promise<unknown>, what: string): void {
  work.catch((error: unknown) => console.error(`kerfline: ${what} failed: ${error instanceof Error ? error.message : String(error)}`));
}
