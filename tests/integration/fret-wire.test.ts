/**
 * The Fret wire list against the real database: owners and builders keep it, clients never;
 * another shop's wire is a 404; bad input a 400 naming the field; the demo shop has the three
 * generic sizes marked "from memory"; a saved board's cut list counts stock of its chosen wire.
 */
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { boardRevisions, boards, fretWires, shops } from '~/lib/db/schema.ts';
import { DEMO_SHOP_NAME, seedDemoShop } from '~/lib/db/seed/demo-shop.server.ts';
import { DEMO_SEED_STEPS } from '~/lib/db/seed/steps.server.ts';
import type { FretWire } from '~/lib/schemas/fret-wire.ts';
import * as collection from '~/pages/api/fret-wire/index.ts';
import * as one from '~/pages/api/fret-wire/[id]/index.ts';
import * as boardExport from '~/pages/api/boards/[id]/export.ts';
import { callRoute } from '../support/route-call.ts';
import { addShopUser, newShopUser, type TestUser } from '../support/sessions.ts';
import { fixtureDesign, insertBoard } from '../support/designs.ts';
import { closeDb, db } from '../support/test-db.ts';

afterAll(() => closeDb());

const wire = { name: 'Shop medium', crownWidthMm: 2.4, crownHeightMm: 1.1, tangWidthMm: 0.5, tangDepthMm: 1.5, barbWidthMm: 0.7, stockLengthMm: 610, source: 'measured' };

let owner: TestUser;
let builder: TestUser;
let client: TestUser;
let other: TestUser;

beforeAll(async () => {
  owner = await newShopUser('owner');
  builder = await addShopUser(owner.shopId, 'builder');
  client = await addShopUser(owner.shopId, 'client');
  other = await newShopUser('owner');
});

const create = (user: TestUser | null, body: unknown) => callRoute(collection.POST, { method: 'POST', path: '/api/fret-wire', user, body });

describe('the Fret wire list', () => {
  it('lets a builder add, read, change and remove a wire of the shop', async () => {
    const created = await create(builder, wire);
    expect(created.status).toBe(201);
    const saved = (await created.json()) as FretWire;
    expect(saved).toMatchObject(wire);
    const listed = (await (await callRoute(collection.GET, { path: '/api/fret-wire', user: owner })).json()) as FretWire[];
    expect(listed.map((w) => w.name)).toContain('Shop medium');
    const changed = await callRoute(one.PUT, { method: 'PUT', path: `/api/fret-wire/${saved.id}`, params: { id: String(saved.id) }, user: owner, body: { ...wire, stockLengthMm: 600 } });
    expect(changed.status).toBe(200);
    expect(((await (await callRoute(one.GET, { path: '/', params: { id: String(saved.id) }, user: builder })).json()) as FretWire).stockLengthMm).toBe(600);
    expect((await callRoute(one.DELETE, { method: 'DELETE', path: '/', params: { id: String(saved.id) }, user: builder })).status).toBe(204);
    expect((await callRoute(one.GET, { path: '/', params: { id: String(saved.id) }, user: builder })).status).toBe(404);
  });

  it('refuses clients (403) and visitors (401), reading or writing', async () => {
    expect((await callRoute(collection.GET, { path: '/api/fret-wire', user: client })).status).toBe(403);
    expect((await create(client, { ...wire, name: 'Client wire' })).status).toBe(403);
    expect((await create(null, { ...wire, name: 'Visitor wire' })).status).toBe(401);
    const rows = await db().select().from(fretWires).where(eq(fretWires.shopId, owner.shopId));
    expect(rows.map((r) => r.name)).not.toContain('Client wire');
  });

  it("answers another shop's wire with 404 and leaves it as it was", async () => {
    const saved = (await (await create(owner, { ...wire, name: 'Private wire' })).json()) as FretWire;
    const params = { id: String(saved.id) };
    expect((await callRoute(one.GET, { path: '/', params, user: other })).status).toBe(404);
    expect((await callRoute(one.PUT, { method: 'PUT', path: '/', params, user: other, body: { ...wire, name: 'Taken' } })).status).toBe(404);
    expect((await callRoute(one.DELETE, { method: 'DELETE', path: '/', params, user: other })).status).toBe(404);
    const [row] = await db().select().from(fretWires).where(eq(fretWires.id, saved.id));
    expect(row?.name).toBe('Private wire');
  });

  it('answers bad input with a 400 naming the field, and a name the shop has with a 409', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ ...wire, tangWidthMm: -1 }, 'tangWidthMm'],
      [{ ...wire, name: '' }, 'name'],
      [{ ...wire, barbWidthMm: 0.4 }, 'barbWidthMm'],
      [{ ...wire, stockLengthMm: 'long' }, 'stockLengthMm'],
    ];
    for (const [body, field] of cases) {
      const response = await create(builder, body);
      expect(response.status, field).toBe(400);
      expect(((await response.json()) as { field: string }).field).toBe(field);
    }
    await create(builder, { ...wire, name: 'Twice' });
    const again = await create(owner, { ...wire, name: 'Twice' });
    expect(again.status).toBe(409);
    expect(((await again.json()) as { field: string }).field).toBe('name');
  });

  it('the demo shop has three generic sizes, each marked "from memory"', async () => {
    await seedDemoShop(db(), DEMO_SEED_STEPS);
    const [shop] = await db().select().from(shops).where(eq(shops.name, DEMO_SHOP_NAME));
    const rows = await db().select().from(fretWires).where(eq(fretWires.shopId, shop!.id));
    const generic = rows.filter((r) => r.name.startsWith('Generic'));
    expect(generic).toHaveLength(3);
    for (const row of generic) expect(row.source).toMatch(/from memory/);
  });

  it("a saved board's cut list counts stock lengths of the wire it names", async () => {
    const saved = (await (await create(owner, { ...wire, name: 'Cut list wire' })).json()) as FretWire;
    const id = await insertBoard(owner.shopId, owner.id, { ...fixtureDesign('seven-string-fan'), wire: { id: saved.id } });
    const response = await callRoute(boardExport.GET, { path: `/api/boards/${id}/export?format=cutlist`, params: { id: String(id) }, user: builder });
    expect(response.status).toBe(200);
    const text = await response.text();
    expect(text).toMatch(/^# stock pieces of 610 mm: \d+ /m);
    // Another shop's board naming this wire gets no stock count from it.
    const foreign = await insertBoard(other.shopId, other.id, { ...fixtureDesign('seven-string-fan'), wire: { id: saved.id } });
    const theirs = await callRoute(boardExport.GET, { path: `/api/boards/${foreign}/export?format=cutlist`, params: { id: String(foreign) }, user: other });
    expect(await theirs.text()).toMatch(/^# stock pieces: no stock length/m);
    await db().delete(boardRevisions).where(eq(boardRevisions.boardId, foreign));
    await db().delete(boards).where(eq(boards.id, foreign));
  });
});
