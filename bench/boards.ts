/**
 * Boards speed figures, measured over HTTP against a running server:
 *   - save latency p95: PATCH /api/boards/{id} with a changed design (a new revision each time);
 *   - list latency p95: GET /api/boards filtered, searched and sorted, with 1,000 boards in the shop.
 * Works in a throwaway shop it creates and deletes. Prints one JSON line per figure (bench/README.md).
 * Environment: BASE_URL = the running server, DATABASE_URL = its database (`npm run bench` sets both).
 */
import { eq } from 'drizzle-orm';
import { newToken, sha256Hex, SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { closeDb, db } from '~/lib/db/client.server.ts';
import { newUserId } from '~/lib/db/ids.server.ts';
import { boardRevisions, boards, sessions, shops, users } from '~/lib/db/schema.ts';
import { toMm } from '~/lib/format/units.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { INSTRUMENT_TYPES } from '~/lib/schemas/board.ts';
import { baseUrl, reportFigure } from './lib/figure.ts';
import { percentile } from './lib/samples.ts';

const BASE_URL = baseUrl();
const BOARDS = 1000;
const WARM_UP = 20;
const SAMPLES = 200;
const INSERT_BATCH = 200;

/** A figure rounded to 0.01; `under` is the goal's limit, left out for context figures. */
function report(figure: string, value: number, unit: string, under?: number): void {
  const rounded = Math.round(value * 100) / 100;
  reportFigure(under === undefined ? { figure, value: rounded, unit, goal: 'context' } : { figure, value: rounded, unit, goal: `< ${under}`, met: value < under });
}

async function throwawayShop(): Promise<{ shopId: number; userId: string; cookie: string }> {
  const [shop] = await db().insert(shops).values({ name: `Bench shop ${newToken().slice(0, 12)}` }).$returningId();
  const userId = newUserId();
  await db().insert(users).values({
    id: userId,
    shopId: shop!.id,
    email: `bench-${userId.slice(0, 12)}@bench.example`,
    displayName: 'Bench builder',
    role: 'builder',
    // Never signed in with: the session below is made directly.
    passwordHash: 'not-a-password-hash',
  });
  const token = newToken();
  await db().insert(sessions).values({ id: sha256Hex(token), userId, expiresAt: new Date(Date.now() + 3_600_000) });
  return { shopId: shop!.id, userId, cookie: `${SESSION_COOKIE}=${token}` };
}

/** 1,000 boards built from the demo boards, spread over instruments and names, one revision each. */
async function fillShop(shopId: number, userId: string): Promise<void> {
  for (let start = 0; start < BOARDS; start += INSERT_BATCH) {
    const rows = Array.from({ length: Math.min(INSERT_BATCH, BOARDS - start) }, (_, k) => {
      const i = start + k;
      const { design } = DEMO_DESIGNS[i % DEMO_DESIGNS.length]!;
      const named = { ...design, name: `Bench board ${i} ${design.name}` };
      return { named, row: {
        shopId,
        name: named.name,
        units: design.units,
        trebleScaleMm: toMm(design.scale.treble, design.units) + (i % 17),
        bassScaleMm: toMm(design.scale.bass, design.units) + (i % 17),
        instrumentType: INSTRUMENT_TYPES[i % INSTRUMENT_TYPES.length]!,
        clientName: i % 3 === 0 ? 'Ines Calloway' : 'Rafe Dunmore',
        createdBy: userId,
        updatedBy: userId,
      } };
    });
    await db().transaction(async (tx) => {
      for (const { named, row } of rows) {
        const [head] = await tx.insert(boards).values(row).$returningId();
        await tx.insert(boardRevisions).values({ boardId: head!.id, revision: 1, data: named, authorId: userId });
      }
    });
  }
}

async function timed(request: () => Promise<Response>): Promise<{ ms: number; response: Response }> {
  const started = performance.now();
  const response = await request();
  await response.arrayBuffer();
  return { ms: performance.now() - started, response };
}

async function benchSaves(cookie: string): Promise<number[]> {
  const headers = { cookie, origin: BASE_URL, 'content-type': 'application/json' };
  const { design } = DEMO_DESIGNS[0]!;
  const created = await fetch(`${BASE_URL}/api/boards`, { method: 'POST', headers, body: JSON.stringify({ design }) });
  if (created.status !== 201) throw new Error(`could not create the bench board: HTTP ${created.status}`);
  let { id, version } = (await created.json()) as { id: number; version: number };
  const times: number[] = [];
  for (let i = 0; i < WARM_UP + SAMPLES; i++) {
    // A different design every time, so every save writes a new revision.
    const body = JSON.stringify({ version, design: { ...design, perpendicularFret: (i % 2) + 7, endExtension: 6 + i / 1000 } });
    const { ms, response } = await timed(() => fetch(`${BASE_URL}/api/boards/${id}`, { method: 'PATCH', headers, body }));
    if (response.status !== 200) throw new Error(`save answered HTTP ${response.status}`);
    version += 1;
    if (i >= WARM_UP) times.push(ms);
  }
  return times;
}

async function benchList(cookie: string): Promise<number[]> {
  const path = '/api/boards?q=Bench%20board&instrument=guitar&status=active&sort=scale&dir=desc&page=2&pageSize=25';
  const times: number[] = [];
  for (let i = 0; i < WARM_UP + SAMPLES; i++) {
    const { ms, response } = await timed(() => fetch(`${BASE_URL}${path}`, { headers: { cookie } }));
    if (response.status !== 200) throw new Error(`list answered HTTP ${response.status}`);
    if (i >= WARM_UP) times.push(ms);
  }
  return times;
}

/** A request that touches no table, measured in the same run: how busy the machine is right now. */
async function benchBaseline(): Promise<number[]> {
  const times: number[] = [];
  for (let i = 0; i < WARM_UP + SAMPLES; i++) {
    const { ms } = await timed(() => fetch(`${BASE_URL}/api/version`));
    if (i >= WARM_UP) times.push(ms);
  }
  return times;
}

async function main(): Promise<void> {
  const shop = await throwawayShop();
  try {
    await fillShop(shop.shopId, shop.userId);
    const baseline = await benchBaseline();
    const saves = await benchSaves(shop.cookie);
    const lists = await benchList(shop.cookie);
    report('boards: save latency p95 (PATCH, new revision)', percentile(saves, 95), 'ms', 50);
    report(`boards: list latency p95 (${BOARDS} boards, search + filter + sort by scale)`, percentile(lists, 95), 'ms', 100);
    report('boards: save latency p50', percentile(saves, 50), 'ms');
    report('boards: list latency p50', percentile(lists, 50), 'ms');
    report('boards: baseline p95 (GET /api/version, same run)', percentile(baseline, 95), 'ms');
    report('boards: save p95 / baseline p95', percentile(saves, 95) / percentile(baseline, 95), 'ratio');
  } finally {
    await db().delete(shops).where(eq(shops.id, shop.shopId));
    await closeDb();
  }
}

main().catch(async (error: unknown) => {
  console.error(`bench/boards: ${error instanceof Error ? error.message : String(error)}`);
  await closeDb().catch(() => undefined);
  process.exit(1);
});
