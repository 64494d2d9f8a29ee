/**
 * Budgets of the e-mails Kerfline sends on someone's behalf (proofs, invitations, password
 * resets), per user and per shop per hour, lower for a shop younger than a day: making a shop is
 * free, so a new one is what someone would make to send mail from Kerfline's address.
 * Numbers: MAIL_BUDGETS in src/lib/http/rate-budgets.ts.
 */
import { shopCreatedAt } from '~/lib/accounts/users.server.ts';
import { MAIL_BUDGETS, YOUNG_SHOP_SECONDS, type MailKind } from '~/lib/http/rate-budgets.ts';
import { consumeEach, type LimitVerdict } from '~/lib/http/rate-limit.server.ts';

export interface MailSender {
  /** The user the mail is sent by (for a password reset: the account it is for). */
  userId: string;
  shopId: number;
}

/** True while the shop is younger than YOUNG_SHOP_SECONDS (an unknown shop counts as young). */
export async function isYoungShop(shopId: number, now: Date): Promise<boolean> {
  const createdAt = await shopCreatedAt(shopId);
  return !createdAt || now.getTime() - createdAt.getTime() < YOUNG_SHOP_SECONDS * 1000;
}

/**
 * Counts one `kind` e-mail for the sender and the shop. Young and grown-up shops count on the
 * same counters, only their ceilings differ, so a shop turning one day old keeps its count.
 */
export async function limitMail(kind: MailKind, sender: MailSender, now: Date): Promise<LimitVerdict> {
  const budgets = (await isYoungShop(sender.shopId, now)) ? MAIL_BUDGETS[kind].young : MAIL_BUDGETS[kind];
  return consumeEach([
    [{ name: `mail-${kind}-user`, budget: budgets.perUser }, sender.userId],
    [{ name: `mail-${kind}-shop`, budget: budgets.perShop }, String(sender.shopId)],
  ]);
}
