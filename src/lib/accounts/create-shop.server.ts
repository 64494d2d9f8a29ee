/**
 * Creating a shop. The form answers "check your e-mail" whether or not the address already has
 * an account, so it cannot be used to find out who has one: a new address gets a link to finish
 * (choose name and password, becoming the shop's Owner); a known address gets a note instead.
 * Until the link is used only the link's row exists: the shop is created when it is used.
 */
import { config } from '~/lib/config/env.server.ts';
import { db } from '~/lib/db/client.server.ts';
import type { CreateShopInput } from '~/lib/schemas/account.ts';
import { existingAccountMail, newShopMail } from './account-mail.ts';
import { INVITATION_TTL_MS } from './links.ts';
import { sendMail } from '~/lib/mail/send.server.ts';
import { issueToken } from './one-time-tokens.server.ts';
import { findUserByEmail } from './users.server.ts';

export async function requestNewShop(input: CreateShopInput): Promise<void> {
  const origin = config().appOrigin;
  if (await findUserByEmail(input.email)) {
    await sendMail({ to: input.email, ...existingAccountMail(origin) });
    return;
  }
  const token = await issueToken(db(), {
    kind: 'new-shop',
    shopId: null,
    shopName: input.shopName,
    email: input.email,
    role: 'owner',
    ttlMs: INVITATION_TTL_MS,
  });
  await sendMail({ to: input.email, ...newShopMail(origin, input.shopName, token) });
}
