/**
 * Property-based fuzzing (fast-check) of every API route file under src/pages/api against the
 * built server: random bodies, query strings, headers, methods and path ids.
 * Anonymous: never a 5xx; bad input answers carry a JSON `error`; no table's row count changes.
 * Signed in (a Builder of a shop of its own, and a Client of the demo shop), with real ids of
 * both shops: never a 5xx, and a rejected (4xx) request changes nothing: neither any
 * table's row count nor the rows it named. Uploads: size limits before parsing, wrong types 415.
 * FUZZ_RUNS sets the anonymous runs per route (default 200), FUZZ_SIGNED_IN_RUNS the signed-in
 * runs per route and user (default 30); a failure prints the seed to replay it.
 *
 * Requests go to a second built server of its own (same database, same public origin) started
 * with RATE_LIMIT_SCALE=1000: fuzzing sends each route hundreds of requests a minute from
 * 127.0.0.1, past the real per-address budgets, and a 429 would hide what the route itself
 * answers. Its counters live under their own key prefix, so the main server's budgets stay
 * whole. The budgets are tested in rate-limits.test.ts against the real numbers.
 */
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { apiRoutes, HTTP_METHODS, routePath, type ApiRoute, type HttpMethod } from '../support/api-routes.ts';
import { eq } from 'drizzle-orm';
import { shops, users } from '~/lib/db/schema.ts';
import { DEMO_SHOP_NAME } from '~/lib/db/seed/demo-shop.server.ts';
import { BASE_URL } from '../support/browser.ts';
import { startBuiltServer, type BuiltServer } from '../support/built-server.ts';
import { ensureDesign } from '../support/designs.ts';
import { addShopUser, newShopUser, type TestUser } from '../support/sessions.ts';
import { databaseState, shopRows, type ShopRows } from '../support/shop-rows.ts';
import { tableCounts } from '../support/table-counts.ts';
import { closeDb, db } from '../support/test-db.ts';

const RUNS = Number(process.env.FUZZ_RUNS ?? 200);
const SIGNED_IN_RUNS = Number(process.env.FUZZ_SIGNED_IN_RUNS ?? 30);
const DESIGN: unknown = JSON.parse(readFileSync('src/lib/boards/demo/seven-string-fan.json', 'utf8'));
/** Stand-in replaced by raw JSON number text (1e999 parses to Infinity, which JSON.stringify cannot make). */
const RAW_MARK = '\u0000raw:';

const printable = (max: number) => fc.stringMatching(new RegExp(`^[\\x20-\\x7e]{0,${max}}$`));

const nastyString = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 40 }),
  fc.constantFrom('NaN', 'Infinity', '-Infinity', '1e309', '-0', '0x1F', 'null', 'true', '', ' ', '\u0000', '\uFEFF12', '../../etc/passwd', "' OR 1=1 --", '<script>x</script>', '%00', '١٢', '🎸'),
  fc.nat(70_000).map((n) => 'x'.repeat(n)),
);

const nastyNumber = fc.oneof(
  fc.double(),
  fc.integer(),
  fc.constantFrom(1e308, -1e308, 2 ** 53 + 2, -(2 ** 63), 5e-324, 0, -1, 0.5, 1e6, 1e12),
  fc.constantFrom('1e999', '-1e999', '123456789012345678901234567890', '-0.0e-0').map((raw) => `${RAW_MARK}${raw}`),
);

const nastyValue: fc.Arbitrary<unknown> = fc.oneof(nastyNumber, nastyString, fc.jsonValue({ maxDepth: 2 }), fc.constant(undefined));

/** Every path to a value in `value` (objects and arrays walked), e.g. ['scale', 'treble']. */
function leafPaths(value: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  if (value === null || typeof value !== 'object') return [prefix];
  const entries = Array.isArray(value) ? value.map((v, i) => [i, v] as const) : Object.entries(value);
  return [prefix, ...entries.flatMap(([k, v]) => leafPaths(v, [...prefix, k]))];
}

function setPath(target: unknown, path: (string | number)[], value: unknown): unknown {
  if (path.length === 0) return value;
  const copy = (Array.isArray(target) ? [...(target as unknown[])] : { ...(target as object) }) as Record<string | number, unknown>;
  const [head, ...rest] = path as [string | number, ...(string | number)[]];
  copy[head] = setPath(copy[head], rest, value);
  return copy;
}

function jsonText(value: unknown): string {
  return (JSON.stringify(value) ?? 'null').replace(new RegExp(`"${RAW_MARK.replace('\u0000', '\\\\u0000')}([^"]*)"`, 'g'), '$1');
}

const mutatedDesignValue = fc
  .array(fc.tuple(fc.constantFrom(...leafPaths(DESIGN)), nastyValue), { minLength: 1, maxLength: 3 })
  .map((mutations) => mutations.reduce<unknown>((design, [path, value]) => setPath(design, path, value), DESIGN));
const mutatedDesign = mutatedDesignValue.map(jsonText);

/** Bodies shaped like the signed-in routes' own (board saves, archive, restore, proofs, decisions), with random values. */
const routeShapedBody = fc
  .dictionary(
    fc.constantFrom('version', 'design', 'revision', 'archived', 'note', 'clientName', 'instrumentType', 'decision', 'name', 'comment', 'confirmed', 'condition', 'units', 'tolerance', 'measurements'),
    fc.oneof(nastyValue, mutatedDesignValue, fc.nat(40), fc.boolean()),
    { minKeys: 1, maxKeys: 5 },
  )
  .map(jsonText);

const sclText = fc
  .tuple(printable(30), fc.nat(200), fc.array(fc.oneof(fc.double().map(String), fc.tuple(fc.integer(), fc.integer()).map(([a, b]) => `${a}/${b}`), nastyString), { maxLength: 20 }))
  .map(([description, count, lines]) => `! fuzz.scl\n${description}\n ${count}\n!\n${lines.join('\n')}\n`);

const body: fc.Arbitrary<string | Uint8Array<ArrayBuffer> | undefined> = fc.oneof(
  { arbitrary: mutatedDesign, weight: 5 },
  { arbitrary: fc.jsonValue({ maxDepth: 5 }).map((v) => JSON.stringify(v)), weight: 2 },
  { arbitrary: fc.nat(3000).map((n) => `${'['.repeat(n)}${']'.repeat(n)}`), weight: 1 },
  { arbitrary: fc.nat(500).map((n) => `${'{"a":'.repeat(n)}1${'}'.repeat(n)}`), weight: 1 },
  { arbitrary: sclText, weight: 2 },
  { arbitrary: nastyString, weight: 1 },
  { arbitrary: fc.uint8Array({ maxLength: 200 }).map((bytes) => new Uint8Array(bytes)), weight: 1 },
  { arbitrary: fc.constant(undefined), weight: 1 },
);

const contentType = fc.oneof(
  fc.constantFrom('application/json', 'application/json; charset=utf-8', 'text/plain', 'application/octet-stream', 'application/x-www-form-urlencoded', 'multipart/form-data; boundary=x', 'text/csv', 'APPLICATION/JSON'),
  printable(40),
  fc.constant(undefined),
);
const origin = fc.oneof(fc.constant(BASE_URL), fc.constant(undefined), fc.constantFrom('http://elsewhere.example', 'null', `${BASE_URL}.evil.example`), printable(30));
const accept = fc.oneof(fc.constantFrom('application/json', 'text/csv', '*/*', 'text/html', 'text/csv;q=0.1, application/json'), printable(30), fc.constant(undefined));
const cookie = fc.oneof(fc.constant(undefined), printable(60).map((t) => `${SESSION_COOKIE}=${t}`), printable(80));
const pathId = fc.oneof(fc.nat().map(String), fc.uuid(), fc.constantFrom('0', '-1', '99999999999999999999', '1.5', 'NaN', '1e999'), nastyString.filter((s) => s.length > 0 && s.length < 300));
const query = fc.dictionary(fc.oneof(fc.constantFrom('format', 'q', 'page', 'limit', 'sort', 'id', 'shop', 'units'), fc.string({ maxLength: 10 })), nastyString.map((s) => s.slice(0, 2000)), { maxKeys: 4 });

interface FuzzRequest {
  method: HttpMethod;
  id: string;
  query: Record<string, string>;
  headers: Record<string, string | undefined>;
  body: string | Uint8Array<ArrayBuffer> | undefined;
}

function requestFor(route: ApiRoute): fc.Arbitrary<FuzzRequest> {
  const methods = route.methods.length > 0 ? route.methods : [...HTTP_METHODS];
  return fc.record({
    method: fc.oneof({ arbitrary: fc.constantFrom(...methods), weight: 5 }, { arbitrary: fc.constantFrom(...HTTP_METHODS), weight: 1 }),
    id: pathId,
    query,
    headers: fc.record({ 'content-type': contentType, origin, accept, cookie }),
    body,
  });
}

async function send(route: ApiRoute, request: FuzzRequest): Promise<Response> {
  const url = new URL(routePath(route, () => request.id), target.url);
  for (const [k, v] of Object.entries(request.query)) url.searchParams.append(k, v);
  const headers = Object.fromEntries(Object.entries(request.headers).filter((e): e is [string, string] => e[1] !== undefined));
  const body = request.method === 'GET' ? undefined : request.body;
  return fetch(url, { method: request.method, headers, ...(body === undefined ? {} : { body }), signal: AbortSignal.timeout(10_000) });
}

/** Bad-input answers are ours (src/lib/http/problem.ts): JSON naming what was wrong. */
async function expectSaneAnswer(response: Response, label: string): Promise<void> {
  expect(response.status, label).toBeLessThan(500);
  if ([400, 413, 415].includes(response.status)) {
    expect(response.headers.get('content-type'), label).toMatch(/^application\/json/);
    const payload = (await response.json()) as { error?: unknown };
    expect(typeof payload.error === 'string' && payload.error.length > 0, label).toBe(true);
  } else {
    await response.arrayBuffer();
  }
}

const routes = apiRoutes();
let before: Record<string, number>;

/** RATE_LIMIT_SCALE of the fuzzing server (README, Configuration): load and fuzz testing only. */
const FUZZ_RATE_LIMIT_SCALE = '1000';
let target: BuiltServer;

beforeAll(async () => {
  // The main server's origin, so the Origin headers the arbitraries send mean the same here.
  target = await startBuiltServer({ env: { RATE_LIMIT_SCALE: FUZZ_RATE_LIMIT_SCALE, APP_ORIGIN: BASE_URL } });
  before = await tableCounts();
});
afterAll(async () => {
  await target?.stop();
  await closeDb();
});

describe('API fuzzing on the built server (anonymous requests)', () => {
  it('finds the route files, including the ones that exist today', () => {
    const files = routes.map((r) => r.file);
    expect(files).toEqual(expect.arrayContaining(['src/pages/api/layout.ts', 'src/pages/api/scala.ts', 'src/pages/api/health.ts', 'src/pages/api/version.ts']));
    expect(routes.find((r) => r.file.endsWith('/layout.ts'))?.methods).toEqual(['POST']);
  });

  for (const route of routes) {
    it(`${route.file}: random requests never get a 5xx and change no table`, async () => {
      await fc.assert(
        fc.asyncProperty(requestFor(route), async (request) => {
          const response = await send(route, request);
          await expectSaneAnswer(response, `${request.method} ${route.file}`);
        }),
        { numRuns: RUNS },
      );
      expect(await tableCounts()).toEqual(before);
    });

    it(`${route.file}: bodies over the size limit, declared or streamed, are refused without a 5xx`, async () => {
      const big = 'x'.repeat(2 * 1024 * 1024);
      for (const method of route.methods.filter((m) => m !== 'GET')) {
        const url = new URL(routePath(route, () => '1'), target.url);
        const headers = { 'content-type': 'application/json', origin: BASE_URL };
        const declared = await fetch(url, { method, headers, body: big, signal: AbortSignal.timeout(10_000) });
        await expectSaneAnswer(declared, `${method} ${route.file} with Content-Length`);
        expect(declared.status).not.toBe(200);
        const stream = new ReadableStream<Uint8Array>({
          start(controller) {
            for (let i = 0; i < 32; i++) controller.enqueue(new TextEncoder().encode('y'.repeat(64 * 1024)));
            controller.close();
          },
        });
        const streamed = await fetch(url, { method, headers, body: stream, duplex: 'half', signal: AbortSignal.timeout(10_000) } as RequestInit);
        await expectSaneAnswer(streamed, `${method} ${route.file} streamed`);
        expect(streamed.status).not.toBe(200);
      }
      expect(await tableCounts()).toEqual(before);
    });
  }

  it('leaves the server healthy afterwards', async () => {
    const response = await fetch(`${target.url}/api/health`);
    expect(response.status).toBe(200);
  });
});

interface SignedInRequest {
  method: HttpMethod;
  /** Which shop's ids fill the path: 0 = the user's own (or the demo shop for the client), 1 = the other. */
  shop: 0 | 1;
  /** A random id instead of a real one. */
  randomId: string | null;
  query: Record<string, string>;
  headers: Record<string, string | undefined>;
  body: string | Uint8Array<ArrayBuffer> | undefined;
}

const signedInBody: fc.Arbitrary<string | Uint8Array<ArrayBuffer> | undefined> = fc.oneof({ arbitrary: routeShapedBody, weight: 3 }, { arbitrary: body, weight: 2 });
const signedInQuery = fc.dictionary(
  fc.oneof(fc.constantFrom('format', 'q', 'page', 'pageSize', 'sort', 'dir', 'status', 'instrument', 'units', 'revision', 'size', 'tolerance'), fc.string({ maxLength: 10 })),
  nastyString.map((s) => s.slice(0, 2000)),
  { maxKeys: 4 },
);

function signedInRequestFor(route: ApiRoute): fc.Arbitrary<SignedInRequest> {
  const methods = route.methods.length > 0 ? route.methods : [...HTTP_METHODS];
  return fc.record({
    method: fc.oneof({ arbitrary: fc.constantFrom(...methods), weight: 8 }, { arbitrary: fc.constantFrom(...HTTP_METHODS), weight: 1 }),
    shop: fc.constantFrom(0 as const, 1 as const),
    randomId: fc.option(pathId, { freq: 4 }),
    query: signedInQuery,
    // Mostly what the app's own pages send, so requests get past the same-origin check to the route.
    headers: fc.record({
      'content-type': fc.oneof({ arbitrary: fc.constant('application/json'), weight: 4 }, { arbitrary: contentType, weight: 1 }),
      origin: fc.oneof({ arbitrary: fc.constant(BASE_URL), weight: 6 }, { arbitrary: origin, weight: 1 }),
      accept,
    }),
    body: signedInBody,
  });
}

/** The real id a route's parameter names, in `rows`. */
function idFor(route: ApiRoute, param: string, rows: ShopRows): string {
  if (param === 'token') return rows.proofToken;
  if (param === 'proofId') return String(rows.proofId);
  return String(route.file.includes('/templates/') ? rows.templateId : rows.boardId);
}

interface SignedInActor {
  label: string;
  user: TestUser;
  /** [own shop's rows, other shop's rows]. */
  rows: [ShopRows, ShopRows];
}

const actors: SignedInActor[] = [];
let actorsReady: Promise<void> | undefined;

/** The signed-in users and the rows they name, made once for every describe that needs them. */
function signedInActors(): Promise<void> {
  actorsReady ??= (async () => {
    const [demoShop] = await db().select({ id: shops.id }).from(shops).where(eq(shops.name, DEMO_SHOP_NAME));
    const [demoBuilder] = await db().select({ id: users.id }).from(users).where(eq(users.email, 'builder@wrenfield.example'));
    const demoBoard = await ensureDesign(demoShop!.id, demoBuilder!.id, 'Seven-string', 'seven-string-fan');
    // A client of the demo shop of its own, with proofs from both shops: the demo Client's
    // decision budget (counted per user by the server) stays whole for the proof tests.
    const client = await addShopUser(demoShop!.id, 'client');
    const demoRows = await shopRows(demoShop!.id, demoBuilder!.id, client.email, 'Fuzz board', demoBoard);
    // The Builder writes in a shop of its own: random requests that are valid really save, and
    // must not reshape the demo boards other tests read. The demo shop is its "other shop".
    const builder = await newShopUser('builder', 'Fuzz shop');
    const builderRows = await shopRows(builder.shopId, builder.id, client.email, 'Fuzz board');
    actors.push({ label: 'builder', user: builder, rows: [builderRows, demoRows] }, { label: 'client', user: client, rows: [demoRows, builderRows] });
  })();
  return actorsReady;
}

async function sendSignedIn(actor: SignedInActor, route: ApiRoute, request: SignedInRequest): Promise<Response> {
  const rows = actor.rows[request.shop];
  const url = new URL(routePath(route, (param) => request.randomId ?? idFor(route, param, rows)), target.url);
  for (const [k, v] of Object.entries(request.query)) url.searchParams.append(k, v);
  const headers = { ...Object.fromEntries(Object.entries(request.headers).filter((e): e is [string, string] => e[1] !== undefined)), cookie: actor.user.cookie };
  const payload = request.method === 'GET' ? undefined : request.body;
  return fetch(url, { method: request.method, headers, ...(payload === undefined ? {} : { body: payload }), signal: AbortSignal.timeout(10_000) });
}

describe('API fuzzing on the built server (signed in, real ids of two shops)', () => {
  beforeAll(signedInActors);

  for (const route of routes) {
    it(`${route.file}: random requests as a builder and as a client never get a 5xx; a rejected one changes nothing`, async () => {
      for (const actor of actors) {
        await fc.assert(
          fc.asyncProperty(signedInRequestFor(route), async (request) => {
            const state = await databaseState(actor.rows);
            const response = await sendSignedIn(actor, route, request);
            const label = `${request.method} ${route.file} as ${actor.label} (${request.shop === 0 ? 'own' : 'other'} shop ids)`;
            await expectSaneAnswer(response, label);
            if (response.status >= 400) expect(await databaseState(actor.rows), `${label}: answered ${response.status}`).toEqual(state);
          }),
          { numRuns: SIGNED_IN_RUNS },
        );
      }
    });
  }
});

/** A body that never ends within the limit and carries no Content-Length (chunked upload). */
function streamOf(bytes: number, fill: string): ReadableStream<Uint8Array> {
  const chunk = new TextEncoder().encode(fill.repeat(Math.ceil(16 * 1024 / fill.length)).slice(0, 16 * 1024));
  return new ReadableStream<Uint8Array>({
    start(controller) {
      for (let sent = 0; sent < bytes; sent += chunk.byteLength) controller.enqueue(chunk);
      controller.close();
    },
  });
}

describe('uploads (.scl, fret measurements CSV, board JSON import) on the built server', () => {
  beforeAll(signedInActors);
  interface Upload {
    label: string;
    path: () => string;
    /** Content types the route takes, each with a body of the right kind that is also broken. */
    type: string;
    limitBytes: number;
  }
  const builder = () => actors.find((a) => a.label === 'builder')!;
  const uploads: Upload[] = [
    { label: '.scl (POST /api/scala)', path: () => '/api/scala', type: 'text/plain', limitBytes: 64 * 1024 },
    { label: 'measurements CSV (POST /api/templates/{id}/checks)', path: () => `/api/templates/${builder().rows[0].templateId}/checks?units=mm&tolerance=0.1`, type: 'text/csv', limitBytes: 64 * 1024 },
    { label: 'board JSON import (POST /api/boards/import)', path: () => '/api/boards/import', type: 'application/json', limitBytes: 256 * 1024 },
    { label: 'board JSON import as a form file', path: () => '/api/boards/import', type: 'multipart/form-data; boundary=kerfline-upload', limitBytes: 256 * 1024 + 8 * 1024 },
  ];

  async function post(upload: Upload, type: string, payload: BodyInit): Promise<Response> {
    return fetch(new URL(upload.path(), target.url), {
      method: 'POST',
      headers: { 'content-type': type, origin: BASE_URL, cookie: builder().user.cookie },
      body: payload,
      duplex: 'half',
      signal: AbortSignal.timeout(10_000),
    } as RequestInit);
  }

  for (const upload of uploads) {
    it(`${upload.label}: an over-limit body is refused with 413 before it is parsed, declared or streamed, and stores nothing`, async () => {
      const state = await databaseState(builder().rows);
      // Unparsable as well as too large: a 413 (not a 400) shows the size was checked first.
      const broken = '\u0000{not "parsable" at all,\n'.repeat(Math.ceil((upload.limitBytes + 1024) / 25));
      const declared = await post(upload, upload.type, broken);
      expect(declared.status).toBe(413);
      expect(await declared.json()).toMatchObject({ error: expect.stringMatching(/larger than/i) });
      const streamed = await post(upload, upload.type, streamOf(upload.limitBytes + 64 * 1024, broken.slice(0, 25)));
      expect(streamed.status).toBe(413);
      expect(await databaseState(builder().rows)).toEqual(state);
    });

    it(`${upload.label}: a wrong file type is refused with 415 and stores nothing`, async () => {
      const state = await databaseState(builder().rows);
      for (const type of ['image/png', 'application/pdf', 'application/x-www-form-urlencoded']) {
        const response = await post(upload, type, new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
        expect(response.status, type).toBe(415);
        expect(await response.json()).toMatchObject({ field: 'content-type' });
      }
      expect(await databaseState(builder().rows)).toEqual(state);
    });
  }

  it('board JSON import: a form file that is not a JSON text file (PNG bytes, or too large inside the form) is refused and stores nothing', async () => {
    const state = await databaseState(builder().rows);
    const send = (file: Blob) => {
      const form = new FormData();
      form.set('file', file, 'board.json');
      return fetch(new URL('/api/boards/import', target.url), { method: 'POST', headers: { origin: BASE_URL, cookie: builder().user.cookie }, body: form });
    };
    const png = await send(new Blob([new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0xff, 0xfe])], { type: 'image/png' }));
    expect(png.status).toBe(400);
    expect(await png.json()).toMatchObject({ field: 'file' });
    const big = await send(new Blob(['{'.repeat(300 * 1024)], { type: 'application/json' }));
    expect(big.status).toBe(413);
    expect(await databaseState(builder().rows)).toEqual(state);
  });
});
