/** The one way the app sends e-mail: nodemailer over SMTP to SMTP_URL. */
import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '~/lib/config/env.server.ts';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
}

let transport: Transporter | undefined;

export async function sendMail(message: MailMessage): Promise<void> {
  transport ??= nodemailer.createTransport(config().smtpUrl);
  await transport.sendMail({ from: config().mailFrom, ...message });
}
