/**
 * The two proof e-mails: the link to the client, and the client's answer to the builder. A failed
 * send is reported as `false` rather than thrown, so the proof itself is never lost over mail.
 * Nothing here logs: the client's message carries the link token. Subjects are fixed: names and
 * messages someone typed go only into the body (see account-mail.ts).
 */
import { config } from '~/lib/config/env.server.ts';
import { dayInZone, momentInZone } from '~/lib/format/dates.ts';
import type { ProofDecision } from '~/lib/schemas/proof.ts';
import { sendMail } from '~/lib/mail/send.server.ts';
import { formatMoney } from '~/lib/payments/money.ts';
import type { DepositSummary } from '~/lib/schemas/deposit.ts';

export interface ClientProofMail {
  to: string;
  clientName: string;
  shopName: string;
  boardName: string;
  revision: number;
  message: string;
  expiresAt: Date;
  link: string;
  /** The shop's IANA time zone: the dates are written in it. */
  timeZone: string;
  /** The deposit asked on approval, if any. */
  deposit: DepositSummary | null;
}

export interface BuilderDecisionMail {
  to: string;
  boardName: string;
  boardId: number;
  revision: number;
  clientName: string;
  decision: ProofDecision;
  timeZone: string;
}

export const PROOF_SUBJECTS = {
  toClient: 'A fret layout is ready for your review',
  approved: 'Proof approved: a client answered on Kerfline',
  changesRequested: 'Changes requested: a client answered on Kerfline',
} as const;


function send(to: string, subject: string, lines: string[]): Promise<boolean> {
  return sendMail({ to, subject, text: `${lines.join('\n')}\n` });
}

export function mailClientProof(mail: ClientProofMail): Promise<boolean> {
  const from = mail.shopName || 'Your luthier';
  return send(mail.to, PROOF_SUBJECTS.toClient, [
    `Hello ${mail.clientName},`,
    '',
    `${from} has shared the fret layout "${mail.boardName}" (revision ${mail.revision}) for your review.`,
    ...(mail.message ? ['', 'Their message:', ...mail.message.split('\n').map((line) => `  ${line}`)] : []),
    '',
    'Open it here (no account needed):',
    mail.link,
    '',
    'On that page you can look at the board and its fret table, then approve it or ask for changes.',
    ...(mail.deposit
      ? [
          '',
          `Deposit: ${formatMoney({ minor: mail.deposit.amountMinor, currency: mail.deposit.currency })}${mail.deposit.description ? ` (${mail.deposit.description})` : ''}.`,
          'When you approve, the page takes you to the payment service to pay it; you can also pay later from the same page.',
        ]
      : []),
    `The link works until ${dayInZone(mail.expiresAt, mail.timeZone)}. Anyone with the link can answer, so please keep it to yourself.`,
  ]);
}

export function mailBuilderDecision(mail: BuilderDecisionMail): Promise<boolean> {
  const approved = mail.decision.kind === 'approved';
  const subject = approved ? PROOF_SUBJECTS.approved : PROOF_SUBJECTS.changesRequested;
  return send(mail.to, subject, [
    approved
      ? `${mail.decision.name} approved revision ${mail.revision} of "${mail.boardName}" on ${momentInZone(new Date(mail.decision.at), mail.timeZone)}.`
      : `${mail.decision.name} asked for changes to revision ${mail.revision} of "${mail.boardName}" on ${momentInZone(new Date(mail.decision.at), mail.timeZone)}.`,
    `The proof was sent to ${mail.clientName}.`,
    ...(mail.decision.comment ? ['', 'Their comment:', ...mail.decision.comment.split('\n').map((line) => `  ${line}`)] : []),
    '',
    'The design\'s proofs and their history:',
    `${config().appOrigin}/boards/${mail.boardId}/proofs`,
  ]);
}
