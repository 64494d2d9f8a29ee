import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { sha256Hex } from '~/lib/auth/index.server.ts';
import { setShopTimeZone } from '~/lib/accounts/users.server.ts';
import { createProof, decideProof, listDesignProofs, listSharedWith, openProof, revokeProof } from '~/lib/proofs/proofs.server.ts';
import { boards, deposits, proofs, shops } from '~/lib/db/schema.ts';
import { seedDemoProof } from '~/lib/db/seed/demo-proof.server.ts';
import { decisionAnswer } from '~/lib/proofs/proof-answers.server.ts';
import { PROOF_LIMITS, type CreatedProof } from '~/lib/schemas/proof.ts';
import * as designProofsRoute from '~/pages/api/boards/[id]/proofs.ts';
import * as tokenDecisionRoute from '~/pages/api/p/[token]/decision.ts';
import * as revokeRoute from '~/pages/api/proofs/[proofId]/revoke.ts';
import * as sharedDecisionRoute from '~/pages/api/shared/[proofId]/decision.ts';
import { addRevision, fixtureDesign, insertBoard } from '../support/designs.ts';
import { linkIn, waitForMail } from '../support/outbox.ts';
import { callRoute } from '../support/route-call.ts';
import { addShopUser, newShopUser, type TestUser } from '../support/sessions.ts';
import { closeDb, db } from '../support/test-db.ts';

const DAY_MS = 86_400_000;
const T0 = new Date('2026-03-02T10:00:00.000Z');

let builder: TestUser;
let owner: TestUser;
let client: TestUser;
let otherOwner: TestUser;
let boardId: number;

beforeAll(async () => {
  builder = await newShopUser('builder');
  // Dated back two days: these tests send more proofs than a brand-new shop's mail budget allows
  // (that budget is tested in mail-budgets.test.ts).
  await db().update(shops).set({ createdAt: new Date(Date.now() - 2 * DAY_MS) }).where(eq(shops.id, builder.shopId));
  owner = await addShopUser(builder.shopId, 'owner');
  client = await addShopUser(builder.shopId, 'client');
  otherOwner = await newShopUser('owner');
  boardId = await insertBoard(builder.shopId, builder.id, fixtureDesign('seven-string-fan'));
});
afterAll(() => closeDb());

/** A unique client e-mail per test, so each test finds its own messages in the outbox. */
let mailCounter = 0;
function clientEmail(): string {
  return `client-${Date.now()}-${++mailCounter}@wrenfield.example`;
}

async function created(response: Response): Promise<CreatedProof> {
  expect(response.status).toBe(201);
  return (await response.json()) as CreatedProof;
}

function tokenOf(link: string): string {
  return link.slice(link.lastIndexOf('/') + 1);
}

async function postProof(user: TestUser | null, id: number | string, body: unknown): Promise<Response> {
  return callRoute(designProofsRoute.POST, { method: 'POST', path: `/api/boards/${id}/proofs`, user, params: { id: String(id) }, body });
}

function decide(token: string, body: unknown, clientAddress = '192.0.2.10'): Promise<Response> {
  return callRoute(tokenDecisionRoute.POST, { method: 'POST', path: `/api/p/${token}/decision`, params: { token }, body, clientAddress });
}

async function boardStatus(id: number): Promise<string> {
  const [row] = await db().select({ status: boards.status }).from(boards).where(eq(boards.id, id));
  return row!.status;
}

describe('creating a proof', () => {
  it('pins the current revision, stores only the token hash, marks the design shared and e-mails the link', async () => {
    const email = clientEmail();
    const result = await created(await postProof(builder, boardId, { clientName: 'Ines Calloway', clientEmail: email, message: 'Fan as discussed.' }));
    expect(result.link).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/p\/[A-Za-z0-9_-]{22}$/);
    expect(result.mailed).toBe(true);
    expect(result.proof).toMatchObject({ revision: 1, state: 'open', clientEmail: email, decision: null });
    const days = (Date.parse(result.proof.expiresAt) - Date.parse(result.proof.createdAt)) / DAY_MS;
    expect(Math.abs(days - PROOF_LIMITS.defaultExpiryDays)).toBeLessThan(1 / 86_400 + 1e-9);

    const token = tokenOf(result.link);
    const [row] = await db().select().from(proofs).where(eq(proofs.id, result.proof.id));
    expect(row!.tokenHash).toBe(sha256Hex(token));
    expect(JSON.stringify(row)).not.toContain(token);
    expect(await boardStatus(boardId)).toBe('shared');

    const mail = await waitForMail(email, /./);
    expect(linkIn(mail, '/p/').url).toBe(result.link);
    expect(mail.text).toContain('Fan as discussed.');
  });

  it('e-mails write dates as people do, in the shop time zone (Pacific/Auckland is UTC+13 in December, tz database)', async () => {
    const shop = await newShopUser('builder', 'Time zone test shop');
    await setShopTimeZone(shop.shopId, 'Pacific/Auckland');
    const boardId = await insertBoard(shop.shopId, shop.id, fixtureDesign('seven-string-fan'));
    const email = clientEmail();
    // Sent 2026-12-03 11:30 UTC for 2 days: the link ends 2026-12-05 11:30 UTC, 00:30 on the 6th in Auckland.
    const sent = new Date('2026-12-03T11:30:00Z');
    const result = await createProof(shop, boardId, { clientName: 'Ines', clientEmail: email, message: '', expiresInDays: 2 }, sent);
    const mail = await waitForMail(email, /./);
    expect(mail.text).toContain('The link works until 6 December 2026.');
    expect(mail.text).not.toMatch(/\d{4}-\d{2}-\d{2}/);
    // Answered at 2026-12-03 11:45 UTC: 00:45 on 4 December in Auckland.
    const answer = await decideProof({ token: tokenOf(result!.link) }, { decision: 'approved', name: 'Ines', confirmed: true }, new Date('2026-12-03T11:45:00Z'));
    expect(answer.ok).toBe(true);
    const decided = await waitForMail(shop.email, /^Proof approved/);
    expect(decided.text).toContain('on 4 December 2026, 00:45 (Pacific/Auckland).');
  });

  it('400 naming the field for a bad e-mail, an expiry out of range and an unknown field', async () => {
    for (const [body, field] of [
      [{ clientName: 'A', clientEmail: 'not-an-address' }, 'clientEmail'],
      [{ clientName: 'A', clientEmail: clientEmail(), expiresInDays: 0 }, 'expiresInDays'],
      [{ clientName: '', clientEmail: clientEmail() }, 'clientName'],
      [{ clientName: 'A', clientEmail: clientEmail(), message: 'x'.repeat(PROOF_LIMITS.messageMaxChars + 1) }, 'message'],
    ] as const) {
      const response = await postProof(builder, boardId, body);
      expect(response.status).toBe(400);
      expect(((await response.json()) as { field: string }).field).toBe(field);
    }
  });

  it('is for builders and owners of the design\'s own shop: 401, 403, 404 otherwise', async () => {
    const body = { clientName: 'A', clientEmail: clientEmail() };
    expect((await postProof(null, boardId, body)).status).toBe(401);
    expect((await postProof(client, boardId, body)).status).toBe(403);
    expect((await postProof(otherOwner, boardId, body)).status).toBe(404);
    expect((await postProof(owner, 'abc', body)).status).toBe(404);
    expect((await postProof(owner, boardId, body)).status).toBe(201);
    const list = await callRoute(designProofsRoute.GET, { path: `/api/boards/${boardId}/proofs`, user: otherOwner, params: { id: String(boardId) } });
    expect(list.status).toBe(404);
  });

  it('reads ids strictly, as every route does: "7e0", "07" or " 7" name no design (404), though Number() would say 7', async () => {
    for (const raw of [`${boardId}e0`, `0${boardId}`, ` ${boardId}`, `${boardId}.0`]) {
      const list = await callRoute(designProofsRoute.GET, { path: `/api/boards/${encodeURIComponent(raw)}/proofs`, user: owner, params: { id: raw } });
      expect(list.status, raw).toBe(404);
    }
    const plain = await callRoute(designProofsRoute.GET, { path: `/api/boards/${boardId}/proofs`, user: owner, params: { id: String(boardId) } });
    expect(plain.status).toBe(200);
  });
});

describe('opening a proof', () => {
  it('shows the pinned revision and says when a newer one exists', async () => {
    const id = await insertBoard(builder.shopId, builder.id, fixtureDesign('classical-650'));
    const result = await createProof(builder, id, { clientName: 'C', clientEmail: clientEmail(), message: 'Hello', expiresInDays: 30 }, T0);
    const token = tokenOf(result!.link);
    const first = await openProof({ token }, new Date(T0.getTime() + 1000));
    expect(first).toMatchObject({ revision: 1, newerRevisionExists: false, message: 'Hello', decision: null });
    expect(first!.design.scale.treble).toBe(650);

    await addRevision(id, builder.id, { ...fixtureDesign('classical-650'), name: 'Renamed', scale: { treble: 640, bass: 640 } });
    const later = await openProof({ token }, new Date(T0.getTime() + 2000));
    expect(later).toMatchObject({ revision: 1, newerRevisionExists: true });
    expect(later!.boardName).toBe(first!.boardName);
    expect(later!.design.scale.treble).toBe(650);
  });
});

describe('answering a proof', () => {
  it('approve: records name, time and revision, sets the design approved, e-mails the builder; a second answer is 409', async () => {
    const id = await insertBoard(builder.shopId, builder.id, fixtureDesign('mandolin'));
    const result = await created(await postProof(builder, id, { clientName: 'Ines', clientEmail: clientEmail() }));
    const token = tokenOf(result.link);

    const response = await decide(token, { decision: 'approved', name: 'Ines Calloway', confirmed: true });
    expect(response.status).toBe(200);
    expect(await boardStatus(id)).toBe('approved');
    const [row] = await db().select().from(proofs).where(eq(proofs.id, result.proof.id));
    expect(row).toMatchObject({ decision: 'approved', decidedName: 'Ines Calloway', revision: 1 });
    expect(row!.decidedAt).toBeInstanceOf(Date);

    const mail = await waitForMail(builder.email, /^Proof approved/);
    expect(mail.text).toContain('Ines Calloway approved revision 1');
    expect(mail.text).not.toContain(token);

    const again = await decide(token, { decision: 'changes_requested', name: 'Ines', comment: 'Wait' });
    expect(again.status).toBe(409);
    const page = await openProof({ token }, new Date());
    expect(page!.decision).toMatchObject({ kind: 'approved', name: 'Ines Calloway' });
  });

  it('approve needs the confirmation ticked and a name (400 naming the field)', async () => {
    const result = await created(await postProof(builder, boardId, { clientName: 'Ines', clientEmail: clientEmail() }));
    const token = tokenOf(result.link);
    const unticked = await decide(token, { decision: 'approved', name: 'Ines', confirmed: false });
    expect(unticked.status).toBe(400);
    expect(((await unticked.json()) as { field: string }).field).toBe('confirmed');
    const nameless = await decide(token, { decision: 'approved', name: '  ', confirmed: true });
    expect(((await nameless.json()) as { field: string }).field).toBe('name');
  });

  it('request changes: stores the comment, sets the design to changes requested and e-mails the builder', async () => {
    const id = await insertBoard(builder.shopId, builder.id, fixtureDesign('tenor-ukulele'));
    const result = await created(await postProof(builder, id, { clientName: 'Rafe', clientEmail: clientEmail() }));
    const response = await decide(tokenOf(result.link), { decision: 'changes_requested', name: 'Rafe Dunmore', comment: 'Please make it 20 frets.' });
    expect(response.status).toBe(200);
    expect(await boardStatus(id)).toBe('changes_requested');
    const list = await listDesignProofs(builder.shopId, id, new Date());
    expect(list![0]).toMatchObject({ state: 'changes_requested', decision: { kind: 'changes_requested', name: 'Rafe Dunmore', comment: 'Please make it 20 frets.' } });
    const mail = await waitForMail(builder.email, /./, 5000, (m) => m.text.includes('Please make it 20 frets.'));
    expect(mail.subject).toMatch(/^Changes requested/);
  });

  it('an over-long comment is a 400 naming "comment", and nothing is recorded', async () => {
    const result = await created(await postProof(builder, boardId, { clientName: 'Ines', clientEmail: clientEmail() }));
    const response = await decide(tokenOf(result.link), { decision: 'changes_requested', name: 'Ines', comment: 'x'.repeat(PROOF_LIMITS.commentMaxChars + 1) });
    expect(response.status).toBe(400);
    expect(((await response.json()) as { field: string }).field).toBe('comment');
    const [row] = await db().select().from(proofs).where(eq(proofs.id, result.proof.id));
    expect(row!.decision).toBeNull();
  });

  it('an answer to an older revision is recorded but leaves the design\'s status to the newer proof', async () => {
    const id = await insertBoard(builder.shopId, builder.id, fixtureDesign('short-scale-bass'));
    const old = await createProof(builder, id, { clientName: 'R', clientEmail: clientEmail(), message: '', expiresInDays: 30 }, new Date());
    await addRevision(id, builder.id, { ...fixtureDesign('short-scale-bass'), frets: 22 });
    await createProof(builder, id, { clientName: 'R', clientEmail: clientEmail(), message: '', expiresInDays: 30 }, new Date());
    const answer = await decideProof({ token: tokenOf(old!.link) }, { decision: 'approved', name: 'R', confirmed: true }, new Date());
    expect(answer.ok).toBe(true);
    expect(await boardStatus(id)).toBe('shared');
  });
});

describe('revoking, expiry and links that do not open', () => {
  it('revoke: the link stops opening and answering (404), the list shows it revoked; other shops get 404', async () => {
    const result = await created(await postProof(builder, boardId, { clientName: 'Ines', clientEmail: clientEmail() }));
    const token = tokenOf(result.link);
    const path = `/api/proofs/${result.proof.id}/revoke`;
    const params = { proofId: String(result.proof.id) };
    expect((await callRoute(revokeRoute.POST, { method: 'POST', path, params, user: otherOwner })).status).toBe(404);
    expect((await callRoute(revokeRoute.POST, { method: 'POST', path, params, user: client })).status).toBe(403);
    const response = await callRoute(revokeRoute.POST, { method: 'POST', path, params, user: builder });
    expect(response.status).toBe(200);
    expect(await openProof({ token }, new Date())).toBeNull();
    expect((await decide(token, { decision: 'approved', name: 'Ines', confirmed: true })).status).toBe(404);
    const list = await listDesignProofs(builder.shopId, boardId, new Date());
    expect(list!.find((p) => p.id === result.proof.id)).toMatchObject({ state: 'revoked', decision: null });
    expect(await revokeProof(otherOwner.shopId, result.proof.id, new Date())).toEqual({ ok: false, reason: 'not_found' });
  });

  it('an answered proof is not revoked: 409, and the answer and link stay as they were', async () => {
    const result = await created(await postProof(builder, boardId, { clientName: 'Ines', clientEmail: clientEmail() }));
    const token = tokenOf(result.link);
    expect((await decide(token, { decision: 'approved', name: 'Ines', confirmed: true })).status).toBe(200);
    const path = `/api/proofs/${result.proof.id}/revoke`;
    const response = await callRoute(revokeRoute.POST, { method: 'POST', path, params: { proofId: String(result.proof.id) }, user: builder });
    expect(response.status).toBe(409);
    const list = await listDesignProofs(builder.shopId, boardId, new Date());
    expect(list!.find((p) => p.id === result.proof.id)).toMatchObject({ state: 'approved', revokedAt: null, decision: { kind: 'approved', name: 'Ines' } });
  });

  it('expiry (clock injected): opens until the expiry time, then neither opens nor takes an answer (409)', async () => {
    const result = await createProof(builder, boardId, { clientName: 'C', clientEmail: clientEmail(), message: '', expiresInDays: 2 }, T0);
    const token = tokenOf(result!.link);
    const justBefore = new Date(T0.getTime() + 2 * DAY_MS - 1000);
    const justAfter = new Date(T0.getTime() + 2 * DAY_MS + 1000);
    expect(await openProof({ token }, justBefore)).not.toBeNull();
    expect(await openProof({ token }, justAfter)).toBeNull();
    // What the decision route answers, at a given time.
    const answerAt = async (now: Date) => decisionAnswer(await decideProof({ token }, { decision: 'approved', name: 'C', confirmed: true }, now));
    const late = await answerAt(justAfter);
    expect(late.status).toBe(409);
    expect(((await late.json()) as { error: string }).error).toMatch(/expired/);
    const list = await listDesignProofs(builder.shopId, boardId, justAfter);
    expect(list!.find((p) => p.id === result!.proof.id)?.state).toBe('expired');
    expect((await answerAt(justBefore)).status).toBe(200);
  });

  it('unknown, expired, revoked and malformed tokens get the same 404 answer from the decision route', async () => {
    const expired = await createProof(builder, boardId, { clientName: 'C', clientEmail: clientEmail(), message: '', expiresInDays: 1 }, new Date(Date.now() - 2 * DAY_MS));
    const revoked = await createProof(builder, boardId, { clientName: 'C', clientEmail: clientEmail(), message: '', expiresInDays: 30 }, new Date());
    await revokeProof(builder.shopId, revoked!.proof.id, new Date());
    const body = { decision: 'approved', name: 'C', confirmed: true };
    const unknownToken = 'AAAAAAAAAAAAAAAAAAAAAA';
    const answers = [];
    for (const token of [unknownToken, tokenOf(revoked!.link), 'short', 'has spaces and is too long!!']) {
      const response = await decide(token, body, '192.0.2.30');
      answers.push({ status: response.status, body: await response.text() });
    }
    expect(new Set(answers.map((a) => JSON.stringify(a))).size).toBe(1);
    expect(answers[0]!.status).toBe(404);
    for (const token of [unknownToken, tokenOf(revoked!.link), tokenOf(expired!.link), 'short']) {
      expect(await openProof({ token }, new Date())).toBeNull();
    }
  });

  it('rate limits answers per address: 429 with Retry-After once the budget is used', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 12; i++) statuses.push((await decide('malformed', { decision: 'approved', name: 'x', confirmed: true }, '198.51.100.7')).status);
    expect(statuses.slice(0, 10).every((s) => s === 404)).toBe(true);
    expect(statuses.slice(10)).toEqual([429, 429]);
    const limited = await decide('malformed', {}, '198.51.100.7');
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    expect((await decide('malformed', {}, '198.51.100.8')).status).toBe(404);
  });
});

describe('history, Shared with me and logs', () => {
  it('GET lists the design\'s proofs newest first with state and answers', async () => {
    const response = await callRoute(designProofsRoute.GET, { path: `/api/boards/${boardId}/proofs`, user: owner, params: { id: String(boardId) } });
    expect(response.status).toBe(200);
    const { proofs: list } = (await response.json()) as { proofs: { createdAt: string; state: string }[] };
    expect(list.length).toBeGreaterThan(3);
    const times = list.map((p) => Date.parse(p.createdAt));
    expect([...times].sort((a, b) => b - a)).toEqual(times);
    expect(new Set(list.map((p) => p.state))).toEqual(new Set(['open', 'approved', 'revoked', 'expired']));
  });

  it('a client account sees the proofs sent to its e-mail by its own shop, and can answer them', async () => {
    const result = await createProof(builder, boardId, { clientName: 'Acct', clientEmail: client.email.toUpperCase(), message: '', expiresInDays: 30 }, new Date());
    const elsewhereDesign = await insertBoard(otherOwner.shopId, otherOwner.id, fixtureDesign('mandolin'));
    await createProof(otherOwner, elsewhereDesign, { clientName: 'Acct', clientEmail: client.email, message: '', expiresInDays: 30 }, new Date());
    const shared = await listSharedWith(client.shopId, client.email, new Date());
    expect(shared.map((p) => p.id)).toEqual([result!.proof.id]);
    expect(shared[0]).toMatchObject({ boardName: 'Demo: seven-string multi-scale guitar', state: 'open' });

    const stranger = await addShopUser(builder.shopId, 'client');
    const params = { proofId: String(result!.proof.id) };
    const path = `/api/shared/${result!.proof.id}/decision`;
    const body = { decision: 'approved', name: 'Acct', confirmed: true };
    expect((await callRoute(sharedDecisionRoute.POST, { method: 'POST', path, params, body, user: stranger })).status).toBe(404);
    expect((await callRoute(sharedDecisionRoute.POST, { method: 'POST', path, params, body, user: null })).status).toBe(401);
    expect((await callRoute(sharedDecisionRoute.POST, { method: 'POST', path, params, body, user: client })).status).toBe(200);
    expect((await listSharedWith(client.shopId, client.email, new Date()))[0]?.state).toBe('approved');
  });

  it('no link token reaches the console while proofs are created, opened and answered', async () => {
    const spies = (['log', 'info', 'warn', 'error', 'debug'] as const).map((m) => vi.spyOn(console, m));
    try {
      const result = await created(await postProof(builder, boardId, { clientName: 'Log', clientEmail: clientEmail() }));
      const token = tokenOf(result.link);
      await openProof({ token }, new Date());
      await decide(token, { decision: 'approved', name: 'Log', confirmed: true }, '192.0.2.40');
      await decide(token, { decision: 'approved', name: 'Log', confirmed: true }, '192.0.2.40');
      const printed = spies.flatMap((s) => s.mock.calls.flat().map((arg) => String(arg)));
      expect(printed.filter((text) => text.includes(token))).toEqual([]);
    } finally {
      for (const s of spies) s.mockRestore();
    }
  });
});

describe('demo seed step', () => {
  it('adds one proof of the seven-string design for the demo client, once; nothing without designs', async () => {
    const shopOwner = await newShopUser('owner');
    const people = new Map([['builder@wrenfield.example', shopOwner.id]]);
    await seedDemoProof({ db: db(), shopId: shopOwner.shopId, people });
    expect(await db().select().from(proofs).where(eq(proofs.shopId, shopOwner.shopId))).toEqual([]);

    const id = await insertBoard(shopOwner.shopId, shopOwner.id, fixtureDesign('seven-string-fan'));
    await seedDemoProof({ db: db(), shopId: shopOwner.shopId, people });
    await seedDemoProof({ db: db(), shopId: shopOwner.shopId, people });
    const rows = await db().select().from(proofs).where(eq(proofs.shopId, shopOwner.shopId));
    expect(rows.map((r) => [r.boardId, r.clientEmail])).toEqual([[id, 'client@wrenfield.example']]);
    expect(await boardStatus(id)).toBe('shared');
    // The deposit the demo client is asked for, in the shop's default currency.
    const seeded = await db().select().from(deposits).where(eq(deposits.proofId, rows[0]!.id));
    expect(seeded.map((d) => [d.amountMinor, d.currency])).toEqual([[45_000, 'USD']]);
  });
});
