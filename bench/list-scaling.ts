/**
 * Boards list latency as a shop grows: 100, 1,000 and 10,000 boards. In a throwaway shop it
 * creates (and deletes) it bulk-inserts rows directly (multi-row INSERTs: heads, then one
 * revision each), then times sequential GET /api/boards requests at each size: the default first
 * page, and search + instrument filter + sort by scale, page 2. Prints p95s and p50s, and the
 * ratio of the 10,000-board p95 to the 100-board p95 (both in this run).
 * Environment: BASE_URL and DATABASE_URL (`npm run bench` sets both).
 */
import { eq, sql } from 'drizzle-orm';
import { newToken, sha256Hex, SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { closeDb, db } from '~/lib/db/client.server.ts';
import { newUserId } from '~/lib/db/ids.server.ts';
import { boards, sessions, shops, users } from '~/lib/db/schema.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { INSTRUMENT_TYPES } from '~/lib/schemas/board.ts';
import { baseUrl, reportFigure } from './lib/figure.ts';
import { percentile } from './lib/samples.ts';

const SIZES = [100, 1000, 10_000];
const INSERT_BATCH = 1000;
const WARM_UP = 10;
const SAMPLES = 100;
/** The list goal of the Boards issue (p95 under 100 ms with 1,000 boards) held up to every size. */
const LIST_GOAL_MS = 100;

const QUERIES = {
  'first page, newest first': '/api/boards',
  'search + filter + sort by scale, page 2': '/api/boards?q=board&instrument=guitar&status=active&sort=scale&dir=desc&page=2&pageSize=25',
} as const;

async function throwawayShop(): Promise<{ shopId: number; userId: string; cookie: string }> {
  const [shop] = await db().insert(shops).values({ name: `Bench list shop ${newToken().slice(0, 12)}` }).$returningId();
  const userId = newUserId();
  // Never signed in with a password: the session below is made directly.
  await db().insert(users).values({ id: userId, shopId: shop!.id, email: `list-${userId.slice(0, 12)}@bench.example`, displayName: 'Bench builder', role: 'builder', passwordHash: 'not-a-password-hash' });
  const token = newToken();
  await db().insert(sessions).values({ id: sha256Hex(token), userId, expiresAt: new Date(Date.now() + 3_600_000) });
  return { shopId: shop!.id, userId, cookie: `${SESSION_COOKIE}=${token}` };
}

/** Adds boards `from`..`to - 1` to the shop: head rows in batches, then their first revisions in one statement. */
async function addBoards(shopId: number, userId: string, from: number, to: number): Promise<void> {
  for (let start = from; start < to; start += INSERT_BATCH) {
    const rows = Array.from({ length: Math.min(INSERT_BATCH, to - start) }, (_, k) => {
      const i = start + k;
      const { design } = DEMO_DESIGNS[i % DEMO_DESIGNS.length]!;
      return {
        shopId,
        name: `Bench board ${i} ${design.name}`.slice(0, 120),
        units: design.units,
        trebleScaleMm: 600 + (i % 250),
        bassScaleMm: 620 + (i % 250),
        instrumentType: INSTRUMENT_TYPES[i % INSTRUMENT_TYPES.length]!,
        clientName: i % 3 === 0 ? 'Ines Calloway' : 'Rafe Dunmore',
        createdBy: userId,
        updatedBy: userId,
      };
    });
    await db().insert(boards).values(rows);
  }
  const data = JSON.stringify(DEMO_DESIGNS[0]!.design);
  await db().execute(sql`INSERT INTO board_revisions (board_id, revision, data, author_id)
    SELECT d.id, 1, ${data}, ${userId} FROM boards d
    WHERE d.shop_id = ${shopId} AND NOT EXISTS (SELECT 1 FROM board_revisions r WHERE r.board_id = d.id)`);
}

async function latencies(path: string, cookie: string): Promise<number[]> {
  const times: number[] = [];
  for (let i = 0; i < WARM_UP + SAMPLES; i++) {
    const started = performance.now();
    const response = await fetch(`${baseUrl()}${path}`, { headers: { cookie } });
    await response.arrayBuffer();
    if (response.status !== 200) throw new Error(`${path} answered HTTP ${response.status}`);
    if (i >= WARM_UP) times.push(performance.now() - started);
  }
  return times;
}

const round = (value: number) => Math.round(value * 100) / 100;

async function main(): Promise<void> {
  const shop = await throwawayShop();
  const p95s = new Map<string, number>();
  try {
    let boards = 0;
    for (const size of SIZES) {
      await addBoards(shop.shopId, shop.userId, boards, size);
      boards = size;
      await db().execute(sql`ANALYZE TABLE boards`);
      for (const [label, path] of Object.entries(QUERIES)) {
        const times = await latencies(path, shop.cookie);
        const p95 = percentile(times, 95);
        p95s.set(`${label}/${size}`, p95);
        reportFigure({ figure: `list scaling: ${size} boards, ${label}: p95`, value: round(p95), unit: 'ms', goal: `< ${LIST_GOAL_MS}`, met: p95 < LIST_GOAL_MS });
        reportFigure({ figure: `list scaling: ${size} boards, ${label}: p50`, value: round(percentile(times, 50)), unit: 'ms', goal: 'context' });
      }
    }
    for (const label of Object.keys(QUERIES)) {
      const first = SIZES[0]!;
      const last = SIZES.at(-1)!;
      reportFigure({
        figure: `list scaling: ${label}, p95 at ${last} / p95 at ${first} boards`,
        value: round(p95s.get(`${label}/${last}`)! / p95s.get(`${label}/${first}`)!),
        unit: 'ratio',
        goal: `context (${last / first}x the boards)`,
      });
    }
  } finally {
    await db().delete(shops).where(eq(shops.id, shop.shopId));
    await closeDb();
  }
}

main().catch(async (error: unknown) => {
  console.error(`bench/list-scaling: ${error instanceof Error ? error.message : String(error)}`);
  await closeDb().catch(() => undefined);
  process.exit(1);
});
