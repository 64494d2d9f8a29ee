import { and, count, eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { listBoards, listRevisions } from '~/lib/boards/boards.server.ts';
import { boards } from '~/lib/db/schema.ts';
import { seedDemoShop } from '~/lib/db/seed/demo-shop.server.ts';
import { DEMO_SEED_STEPS } from '~/lib/db/seed/steps.server.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { boardListQuerySchema } from '~/lib/schemas/board.ts';
import { closeDb, db } from '../support/test-db.ts';

afterAll(() => closeDb());

describe('demo boards seed step', () => {
  it('saves each demo instrument, ending at the fixture design after three revisions, and adds nothing when run again', async () => {
    const { shopId } = await seedDemoShop(db(), DEMO_SEED_STEPS);
    const countBoards = () => db().select({ n: count() }).from(boards).where(eq(boards.shopId, shopId));
    const [before] = await countBoards();
    await seedDemoShop(db(), DEMO_SEED_STEPS);
    const [after] = await countBoards();
    expect(after!.n).toBe(before!.n);
    for (const { design } of DEMO_DESIGNS) {
      // The first board of that name is the seeded one (tests may save more under the same name later).
      const [first] = await db().select({ id: boards.id }).from(boards).where(and(eq(boards.shopId, shopId), eq(boards.name, design.name))).orderBy(boards.id).limit(1);
      const revisions = await listRevisions(shopId, first!.id);
      expect(revisions?.map((r) => r.revision)).toEqual([3, 2, 1]);
      expect(revisions?.[0]?.design).toEqual(design);
    }
  });

  it('gives the two demo clients their commissions', async () => {
    const { shopId } = await seedDemoShop(db(), DEMO_SEED_STEPS);
    for (const client of ['Ines Calloway', 'Rafe Dunmore']) {
      const found = await listBoards(shopId, boardListQuerySchema.parse({ q: client, status: 'all', pageSize: 100 }));
      const instruments = new Set(found.items.filter((b) => b.name.startsWith('Demo:')).map((b) => b.instrumentType));
      expect(instruments.size).toBe(2);
    }
  });
});
