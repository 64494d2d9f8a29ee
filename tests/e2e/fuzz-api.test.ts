/**
 * Property-based fuzzing (fast-check) of every API route file under src/pages/api against the
 * built server: random bodies, query strings, headers, methods and path ids, all anonymous.
 * Properties: never a 5xx; bad input answers carry a JSON `error`; no table's row count changes.
 * FUZZ_RUNS sets the runs per route (default 200); a failure prints the seed to replay it.
 */
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { apiRoutes, HTTP_METHODS, routePath, type ApiRoute, type HttpMethod } from '../support/api-routes.ts';
import { BASE_URL } from '../support/browser.ts';
import { tableCounts } from '../support/table-counts.ts';
import { closeDb } from '../support/test-db.ts';

const RUNS = Number(process.env.FUZZ_RUNS ?? 200);
const DESIGN: unknown = JSON.parse(readFileSync('fixtures/designs/seven-string-fan.json', 'utf8'));
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

const mutatedDesign = fc
  .array(fc.tuple(fc.constantFrom(...leafPaths(DESIGN)), nastyValue), { minLength: 1, maxLength: 3 })
  .map((mutations) => jsonText(mutations.reduce<unknown>((design, [path, value]) => setPath(design, path, value), DESIGN)));

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
  const url = new URL(routePath(route, () => request.id), BASE_URL);
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

beforeAll(async () => {
  before = await tableCounts();
});
afterAll(() => closeDb());

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
        const url = new URL(routePath(route, () => '1'), BASE_URL);
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
    const response = await fetch(`${BASE_URL}/api/health`);
    expect(response.status).toBe(200);
  });
});
