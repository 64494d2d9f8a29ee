/**
 * The texts of the account e-mails (plain text: every mail client shows it, links stay visible).
 * Subjects are fixed: text someone else typed (a shop or person's name) goes only into the body,
 * where it is quoted as theirs, so nobody can use Kerfline's address to mail a subject of their own.
 */
import type { Role } from '~/lib/db/schema.ts';
import { invitationUrl, resetUrl } from './links.ts';

export interface MailText {
  subject: string;
  text: string;
}

const ROLE_NAMES: Record<Role, string> = { owner: 'Owner', builder: 'Builder', client: 'Client' };

export function newShopMail(origin: string, shopName: string, token: string): MailText {
  return {
    subject: 'Finish setting up your Kerfline shop',
    text: [
      `Someone (we hope you) asked to create the shop "${shopName}" on Kerfline with this e-mail address.`,
      '',
      'Open this link within 7 days to choose your name and password; you will be the shop\'s Owner:',
      invitationUrl(origin, token),
      '',
      'If it was not you, ignore this e-mail: nothing happens without the link.',
    ].join('\n'),
  };
}

/** Sent instead of a new shop when the address already has an account (the form says the same). */
export function existingAccountMail(origin: string): MailText {
  return {
    subject: 'You already have a Kerfline account',
    text: [
      'Someone asked to create a new Kerfline shop with this e-mail address, but it already has an account.',
      '',
      `Sign in: ${origin}/sign-in`,
      `Forgot your password? ${origin}/forgot-password`,
      '',
      'If it was not you, ignore this e-mail: nothing was changed.',
    ].join('\n'),
  };
}

export function invitationMail(origin: string, shopName: string, role: Role, invitedBy: string, token: string): MailText {
  return {
    subject: 'You are invited to a shop on Kerfline',
    text: [
      `${invitedBy} invites you to join ${shopName} on Kerfline as ${ROLE_NAMES[role]}.`,
      '',
      'Open this link within 7 days to choose your name and password:',
      invitationUrl(origin, token),
      '',
      'The link works once. If you did not expect this, ignore this e-mail.',
    ].join('\n'),
  };
}

export function resetMail(origin: string, token: string): MailText {
  return {
    subject: 'Reset your Kerfline password',
    text: [
      'Someone (we hope you) asked to reset the password of your Kerfline account.',
      '',
      'Open this link within 1 hour to choose a new password:',
      resetUrl(origin, token),
      '',
      'The link works once. If it was not you, ignore this e-mail: your password stays as it is.',
    ].join('\n'),
  };
}
