/**
 * The role-by-route matrix, run against the built server: every page and API route answers each
 * kind of visitor with the expected status, and every file under src/pages has at least one case.
 */
import { readdirSync } from 'node:fs';
import { join, relative } from 'node:path';
import { asc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { newToken, sha256Hex } from '~/lib/auth/index.server.ts';
import { fretWires, proofs, shops, templates, users } from '~/lib/db/schema.ts';
import { DEMO_SHOP_NAME } from '~/lib/db/seed/demo-shop.server.ts';
import { ROUTE_CASES } from '../route-matrix/index.ts';
import type { Actor, MatrixIds, RouteCase } from '../route-matrix/types.ts';
import { BASE_URL } from '../support/browser.ts';
import { ensureDesign } from '../support/designs.ts';
import { newShopUser, signInAs } from '../support/sessions.ts';
import { closeDb, db } from '../support/test-db.ts';

const ACTORS: readonly Actor[] = ['anonymous', 'client', 'builder', 'owner', 'otherOwner'];
const DEMO_EMAILS: Record<Exclude<Actor, 'anonymous' | 'otherOwner'>, string> = {
  client: 'client@wrenfield.example',
  builder: 'builder@wrenfield.example',
  owner: 'owner@wrenfield.example',
};
/** Larger than any id the test database hands out: "a row that does not exist". */
const MISSING_ID = 2_000_000_000;

let ids: MatrixIds;
let otherOwnerEmail: string;

async function resolveIds(): Promise<MatrixIds> {
  const [shop] = await db().select({ id: shops.id }).from(shops).where(eq(shops.name, DEMO_SHOP_NAME));
  if (!shop) throw new Error('the demo shop is not seeded');
  const [builder] = await db().select({ id: users.id }).from(users).where(eq(users.email, DEMO_EMAILS.builder));
  const boardId = await ensureDesign(shop.id, builder!.id, 'Seven-string', 'seven-string-fan');
  const [template] = await db().select({ id: templates.id }).from(templates).where(eq(templates.shopId, shop.id)).orderBy(asc(templates.id)).limit(1);
  // Proof links are stored hashed, so none can be read back: this run issues its own.
  const proofToken = newToken();
  await db().insert(proofs).values({
    shopId: shop.id,
    boardId,
    revision: 1,
    tokenHash: sha256Hex(proofToken),
    clientName: 'Ines Calloway',
    clientEmail: DEMO_EMAILS.client,
    message: 'Route matrix proof',
    expiresAt: new Date(Date.now() + 86_400_000),
    createdBy: builder!.id,
  });
  const [wire] = await db().select({ id: fretWires.id }).from(fretWires).where(eq(fretWires.shopId, shop.id)).orderBy(asc(fretWires.id)).limit(1);
  return { boardId, templateId: template?.id ?? MISSING_ID, wireId: wire?.id ?? MISSING_ID, proofToken, demoBuilderId: builder!.id };
}

/** A fresh session per request, since some routes (sign-out) end every session of the user. */
async function cookieFor(actor: Actor): Promise<string | undefined> {
  if (actor === 'anonymous') return undefined;
  return (await signInAs(actor === 'otherOwner' ? otherOwnerEmail : DEMO_EMAILS[actor])).cookie;
}

interface Answer {
  status: number;
  cacheControl: string | null;
}

async function send(route: RouteCase, actor: Actor): Promise<Answer> {
  const path = typeof route.path === 'function' ? route.path(ids) : route.path;
  const headers: Record<string, string> = { origin: BASE_URL };
  const cookie = await cookieFor(actor);
  if (cookie) headers.cookie = cookie;
  let body: string | null = null;
  if (route.method !== 'GET') {
    const value: unknown = typeof route.body === 'function' ? (route.body as (i: MatrixIds) => unknown)(ids) : route.body;
    if (route.contentType) {
      headers['content-type'] = route.contentType;
      body = String(value ?? '');
    } else {
      headers['content-type'] = 'application/json';
      body = JSON.stringify(value ?? {});
    }
  }
  const response = await fetch(`${BASE_URL}${path}`, { method: route.method, headers, body, redirect: 'manual' });
  await response.arrayBuffer();
  return { status: response.status, cacheControl: response.headers.get('cache-control') };
}

function pageFiles(): string[] {
  const root = join(process.cwd(), 'src', 'pages');
  return (readdirSync(root, { recursive: true, withFileTypes: true }) as import('node:fs').Dirent[])
    .filter((d) => d.isFile() && /\.(astro|ts|tsx|js|md|mdx|html)$/.test(d.name))
    .map((d) => `pages/${relative(root, join(d.parentPath, d.name)).split('\\').join('/')}`)
    .sort();
}

beforeAll(async () => {
  ids = await resolveIds();
  otherOwnerEmail = (await newShopUser('owner')).email;
});
afterAll(() => closeDb());

describe('role-by-route matrix (built server)', () => {
  it('has a case for every file under src/pages, and no case for a file that is gone', () => {
    const covered = new Set(ROUTE_CASES.map((c) => c.file));
    const files = pageFiles();
    expect(files.filter((f) => !covered.has(f)), 'page or route files without a RouteCase in tests/route-matrix').toEqual([]);
    expect([...covered].filter((f) => !files.includes(f)), 'RouteCases naming files that do not exist').toEqual([]);
  });

  it('answers every actor with the expected status on every route, never to be cached (Cache-Control: no-store, RFC 9111 5.2.2.5)', async () => {
    const wrong: string[] = [];
    const cacheable: string[] = [];
    for (const route of ROUTE_CASES) {
      for (const actor of ACTORS) {
        const { status, cacheControl } = await send(route, actor);
        if (!cacheControl?.split(',').some((d) => d.trim() === 'no-store')) {
          cacheable.push(`${route.method} ${typeof route.path === 'function' ? route.path(ids) : route.path} as ${actor}: cache-control ${cacheControl}`);
        }
        const expected = route.expect[actor];
        const allowed: readonly number[] = typeof expected === 'number' ? [expected] : expected;
        if (!allowed.includes(status)) {
          const path = typeof route.path === 'function' ? route.path(ids) : route.path;
          wrong.push(`${route.method} ${path} as ${actor}: got ${status}, expected ${allowed.join(' or ')}`);
        }
      }
    }
    expect(wrong).toEqual([]);
    expect(cacheable).toEqual([]);
  }, 120_000);
});
