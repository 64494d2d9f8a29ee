/**
 * Mail budgets (MAIL_BUDGETS in src/lib/http/rate-budgets.ts): proofs, invitations and password
 * resets per user and per shop per hour, with lower ceilings for a shop younger than a day.
 */
import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { startPasswordReset } from '~/lib/accounts/password-reset.server.ts';
import { shops } from '~/lib/db/schema.ts';
import { MAIL_BUDGETS, YOUNG_SHOP_SECONDS } from '~/lib/http/rate-budgets.ts';
import { isYoungShop, limitMail } from '~/lib/mail/mail-budgets.server.ts';
import * as designProofsRoute from '~/pages/api/boards/[id]/proofs.ts';
import { fixtureDesign, insertBoard } from '../support/designs.ts';
import { mailsTo, uniqueEmail } from '../support/outbox.ts';
import { callRoute } from '../support/route-call.ts';
import { addShopUser, newShopUser, type TestUser } from '../support/sessions.ts';
import { closeDb, db } from '../support/test-db.ts';

afterAll(() => closeDb());

/** Dates the user's shop back, so it is no longer young. */
async function ageShop(user: TestUser, seconds = 2 * YOUNG_SHOP_SECONDS): Promise<void> {
  await db().update(shops).set({ createdAt: new Date(Date.now() - seconds * 1000) }).where(eq(shops.id, user.shopId));
}

async function sendUntilRefused(kind: 'proof' | 'invitation' | 'password-reset', user: TestUser, limit: number): Promise<number> {
  let allowed = 0;
  for (let i = 0; i <= limit + 1; i++) if ((await limitMail(kind, { userId: user.id, shopId: user.shopId }, new Date())).ok) allowed++;
  return allowed;
}

describe('mail budgets per user and per shop', () => {
  it('a shop is young for its first day; existing shops (the demo shop included) count as grown up', async () => {
    const user = await newShopUser('builder');
    expect(await isYoungShop(user.shopId, new Date())).toBe(true);
    expect(await isYoungShop(user.shopId, new Date(Date.now() + (YOUNG_SHOP_SECONDS + 60) * 1000))).toBe(false);
    await ageShop(user);
    expect(await isYoungShop(user.shopId, new Date())).toBe(false);
  });

  it('young shops get the lower per-user budget; grown-up shops the full one', async () => {
    const young = await newShopUser('builder');
    expect(await sendUntilRefused('invitation', young, MAIL_BUDGETS.invitation.perUser.points)).toBe(MAIL_BUDGETS.invitation.young.perUser.points);
    const grown = await newShopUser('builder');
    await ageShop(grown);
    expect(await sendUntilRefused('invitation', grown, MAIL_BUDGETS.invitation.perUser.points)).toBe(MAIL_BUDGETS.invitation.perUser.points);
  });

  it('the shop budget holds across its users', async () => {
    const first = await newShopUser('builder');
    await ageShop(first);
    const second = await addShopUser(first.shopId, 'owner');
    expect(await sendUntilRefused('proof', first, MAIL_BUDGETS.proof.perUser.points)).toBe(MAIL_BUDGETS.proof.perUser.points);
    const left = MAIL_BUDGETS.proof.perShop.points - MAIL_BUDGETS.proof.perUser.points;
    expect(await sendUntilRefused('proof', second, MAIL_BUDGETS.proof.perUser.points)).toBe(Math.min(left, MAIL_BUDGETS.proof.perUser.points));
    const third = await addShopUser(first.shopId, 'builder');
    expect((await limitMail('proof', { userId: third.id, shopId: third.shopId }, new Date())).ok).toBe(false);
  });

  it('POST /api/boards/{id}/proofs: 429 with Retry-After and a "try again" message once the budget is used; nothing is stored', async () => {
    const builder = await newShopUser('builder');
    const boardId = await insertBoard(builder.shopId, builder.id, fixtureDesign('mandolin'));
    const post = () =>
      callRoute(designProofsRoute.POST, { method: 'POST', path: `/api/boards/${boardId}/proofs`, user: builder, params: { id: String(boardId) }, body: { clientName: 'Ines', clientEmail: uniqueEmail('c') } });
    for (let i = 0; i < MAIL_BUDGETS.proof.young.perUser.points; i++) expect((await post()).status).toBe(201);
    const refused = await post();
    expect(refused.status).toBe(429);
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(((await refused.json()) as { error: string }).error).toMatch(/try again in \d+ minutes?/);
    const listed = await callRoute(designProofsRoute.GET, { path: `/api/boards/${boardId}/proofs`, user: builder, params: { id: String(boardId) } });
    expect(((await listed.json()) as { proofs: unknown[] }).proofs).toHaveLength(MAIL_BUDGETS.proof.young.perUser.points);
  });

  it('password resets: the account gets its budget of reset mails per hour, then none (the page answers the same)', async () => {
    const user = await newShopUser('client');
    await ageShop(user);
    for (let i = 0; i < MAIL_BUDGETS['password-reset'].perUser.points + 2; i++) await startPasswordReset(user.email);
    // The fake SMTP server acknowledges a message only after writing it, so the count is final.
    expect(await mailsTo(user.email)).toHaveLength(MAIL_BUDGETS['password-reset'].perUser.points);
  });
});
