/**
 * The client's receipts: one when the payment service confirms the deposit was paid, one for
 * each refund it confirms. Sent from the webhook, through the one mail sender; a failed send is
 * `false`, never thrown (the payment is recorded either way). Amounts with Intl.NumberFormat,
 * dates in the shop's time zone. Subjects are fixed; names go only into the body.
 */
import { momentInZone } from '~/lib/format/dates.ts';
import { sendMail } from '~/lib/mail/send.server.ts';
import { formatMoney, type Money } from './money.ts';

export const DEPOSIT_SUBJECTS = {
  paid: 'Receipt: your deposit was paid',
  refunded: 'Receipt: a refund of your deposit',
} as const;

export interface ReceiptContext {
  to: string;
  clientName: string;
  shopName: string;
  boardName: string;
  revision: number;
  /** The shop's IANA time zone. */
  timeZone: string;
  /** The payment service's reference (payment or refund id), for the client's own records. */
  reference: string;
}

function send(to: string, subject: string, lines: string[]): Promise<boolean> {
  return sendMail({ to, subject, text: `${lines.join('\n')}\n` });
}

export function mailPaymentReceipt(mail: ReceiptContext & { paid: Money; asked: Money; at: Date }): Promise<boolean> {
  const shop = mail.shopName || 'The shop';
  const short = mail.paid.currency === mail.asked.currency && mail.paid.minor < mail.asked.minor;
  return send(mail.to, DEPOSIT_SUBJECTS.paid, [
    `Hello ${mail.clientName},`,
    '',
    `${shop} has received your deposit of ${formatMoney(mail.paid)} for the fret layout "${mail.boardName}" (revision ${mail.revision}).`,
    `Paid on ${momentInZone(mail.at, mail.timeZone)}.`,
    ...(short ? [`The deposit asked was ${formatMoney(mail.asked)}; the shop will be in touch about the rest.`] : []),
    `Payment reference: ${mail.reference}`,
    '',
    'Your card details were handled by the payment service only; the shop never sees them.',
  ]);
}

export function mailRefundReceipt(mail: ReceiptContext & { refund: Money; refundedSoFar: Money; paid: Money; at: Date }): Promise<boolean> {
  const shop = mail.shopName || 'The shop';
  return send(mail.to, DEPOSIT_SUBJECTS.refunded, [
    `Hello ${mail.clientName},`,
    '',
    `${shop} has refunded ${formatMoney(mail.refund)} of your deposit for the fret layout "${mail.boardName}" (revision ${mail.revision}).`,
    `Refunded on ${momentInZone(mail.at, mail.timeZone)}.`,
    `Deposit paid: ${formatMoney(mail.paid)}; refunded so far: ${formatMoney(mail.refundedSoFar)}.`,
    `Refund reference: ${mail.reference}`,
    '',
    'The money goes back to the card you paid with; your bank may take a few days to show it.',
  ]);
}
