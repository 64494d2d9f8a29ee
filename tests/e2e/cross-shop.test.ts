/**
 * Another shop's owner tries every route of the role-by-route matrix that names a row of the demo
 * shop and expects 404 for them (tests/route-matrix: `otherOwner`). The 404 must not leak: its body
 * holds none of the demo shop's names, people, clients, notes or proof messages, and nothing in the
 * database changes.
 */
import { eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { boards, fretWires, proofs, shops, templates, users } from '~/lib/db/schema.ts';
import { DEMO_SHOP_NAME } from '~/lib/db/seed/demo-shop.server.ts';
import { ROUTE_CASES } from '../route-matrix/index.ts';
import type { MatrixIds, RouteCase } from '../route-matrix/types.ts';
import { BASE_URL } from '../support/browser.ts';
import { ensureDesign } from '../support/designs.ts';
import { newShopUser, type TestUser } from '../support/sessions.ts';
import { databaseState, shopRows, type ShopRows } from '../support/shop-rows.ts';
import { closeDb, db } from '../support/test-db.ts';

/** Texts shorter than this are too common to mean a leak (e.g. "mm"). */
const MIN_SECRET_CHARS = 5;

let ids: MatrixIds;
let demoRows: ShopRows;
let otherOwner: TestUser;
let secrets: string[];

const refusedToOthers = (c: RouteCase) => {
  const expected = c.expect.otherOwner;
  return typeof expected === 'number' ? expected === 404 : expected.includes(404);
};

/** Every text the demo shop keeps that another shop must never see. */
async function demoShopTexts(shopId: number): Promise<string[]> {
  const [shop] = await db().select({ name: shops.name }).from(shops).where(eq(shops.id, shopId));
  const people = await db().select({ email: users.email, name: users.displayName }).from(users).where(eq(users.shopId, shopId));
  const boardRows = await db().select({ name: boards.name, client: boards.clientName }).from(boards).where(eq(boards.shopId, shopId));
  const shelf = await db()
    .select({ name: templates.name, material: templates.material, place: templates.storagePlace, notes: templates.notes })
    .from(templates)
    .where(eq(templates.shopId, shopId));
  const links = await db()
    .select({ client: proofs.clientName, email: proofs.clientEmail, message: proofs.message })
    .from(proofs)
    .where(inArray(proofs.shopId, [shopId]));
  const texts = [shop?.name, ...people.flatMap((p) => [p.email, p.name]), ...boardRows.flatMap((b) => [b.name, b.client])];
  texts.push(...shelf.flatMap((t) => [t.name, t.material, t.place, t.notes]), ...links.flatMap((l) => [l.client, l.email, l.message]));
  return [...new Set(texts.filter((t): t is string => typeof t === 'string' && t.trim().length >= MIN_SECRET_CHARS))];
}

beforeAll(async () => {
  const [demoShop] = await db().select({ id: shops.id }).from(shops).where(eq(shops.name, DEMO_SHOP_NAME));
  const [builder] = await db().select({ id: users.id }).from(users).where(eq(users.email, 'builder@wrenfield.example'));
  const boardId = await ensureDesign(demoShop!.id, builder!.id, 'Seven-string', 'seven-string-fan');
  demoRows = await shopRows(demoShop!.id, builder!.id, 'client@wrenfield.example', 'Cross-shop board', boardId);
  const [wire] = await db().select({ id: fretWires.id }).from(fretWires).where(eq(fretWires.shopId, demoShop!.id)).limit(1);
  ids = { boardId, templateId: demoRows.templateId, wireId: wire!.id, proofToken: demoRows.proofToken, demoBuilderId: builder!.id };
  otherOwner = await newShopUser('owner', 'Cross-shop visitor shop');
  secrets = await demoShopTexts(demoShop!.id);
});
afterAll(() => closeDb());

describe("another shop's owner on every route that names a demo shop row", () => {
  it('knows what to look for: the demo shop has names, people and clients to leak', () => {
    expect(secrets).toEqual(expect.arrayContaining([DEMO_SHOP_NAME, 'builder@wrenfield.example', 'Demo: seven-string multi-scale guitar']));
    expect(ROUTE_CASES.filter(refusedToOthers).length).toBeGreaterThan(10);
  });

  it('answers 404 with nothing of the demo shop in the body, and changes nothing', async () => {
    const problems: string[] = [];
    const before = await databaseState([demoRows]);
    for (const route of ROUTE_CASES.filter(refusedToOthers)) {
      const path = typeof route.path === 'function' ? route.path(ids) : route.path;
      const value: unknown = typeof route.body === 'function' ? (route.body as (i: MatrixIds) => unknown)(ids) : route.body;
      const headers: Record<string, string> = { origin: BASE_URL, cookie: otherOwner.cookie };
      let body: string | null = null;
      if (route.method !== 'GET') {
        headers['content-type'] = route.contentType ?? 'application/json';
        body = route.contentType ? String(value ?? '') : JSON.stringify(value ?? {});
      }
      const response = await fetch(`${BASE_URL}${path}`, { method: route.method, headers, body, redirect: 'manual' });
      const text = await response.text();
      if (response.status !== 404) problems.push(`${route.method} ${path}: ${response.status}, expected 404`);
      const leaked = secrets.filter((s) => text.toLowerCase().includes(s.toLowerCase()));
      if (leaked.length > 0) problems.push(`${route.method} ${path}: the 404 body shows ${leaked.map((s) => JSON.stringify(s)).join(', ')}`);
    }
    expect(problems).toEqual([]);
    expect(await databaseState([demoRows])).toEqual(before);
  });
});
