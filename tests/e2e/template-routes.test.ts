/**
 * The Template shelf's entries of the route matrix, called over HTTP on the built server for each
 * kind of visitor (authorisation on the server, shop isolation, 302 to sign-in for pages).
 */
import { and, asc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { templates } from '~/lib/db/schema';
import { seedDemoShop } from '~/lib/db/seed/demo-shop.server';
import { TEMPLATE_ROUTES } from '../route-matrix/templates';
import type { Actor, MatrixIds } from '../route-matrix/types';
import { BASE_URL } from '../support/browser';
import { newShopUser, signInAs } from '../support/sessions';
import { closeDb, db } from '../support/test-db';

afterAll(() => closeDb());

const cookies = new Map<Actor, string | null>();
let ids: MatrixIds;

beforeAll(async () => {
  const { shopId } = await seedDemoShop(db());
  const [first] = await db().select({ id: templates.id }).from(templates).where(and(eq(templates.shopId, shopId))).orderBy(asc(templates.id)).limit(1);
  if (!first) throw new Error('the demo shelf has no template (demo seed not run?)');
  ids = { designId: 0, templateId: first.id, proofToken: '' };
  cookies.set('anonymous', null);
  cookies.set('client', (await signInAs('client@wrenfield.example')).cookie);
  cookies.set('builder', (await signInAs('builder@wrenfield.example')).cookie);
  cookies.set('owner', (await signInAs('owner@wrenfield.example')).cookie);
  cookies.set('otherOwner', (await newShopUser('owner')).cookie);
});

describe('route matrix: Template shelf', () => {
  for (const route of TEMPLATE_ROUTES) {
    it(`${route.method} ${route.file}`, async () => {
      for (const actor of ['anonymous', 'client', 'builder', 'owner', 'otherOwner'] as const) {
        const path = typeof route.path === 'function' ? route.path(ids) : route.path;
        const body = typeof route.body === 'function' ? (route.body as (i: MatrixIds) => unknown)(ids) : route.body;
        const headers: Record<string, string> = {};
        const cookie = cookies.get(actor);
        if (cookie) headers['cookie'] = cookie;
        if (route.method !== 'GET') {
          headers['origin'] = BASE_URL;
          headers['content-type'] = 'application/json';
        }
        const response = await fetch(`${BASE_URL}${path}`, {
          method: route.method,
          headers,
          redirect: 'manual',
          ...(body !== undefined ? { body: JSON.stringify(body) } : {}),
        });
        const expected = route.expect[actor];
        const allowed = typeof expected === 'number' ? [expected] : expected;
        expect(allowed, `${actor} ${route.method} ${path}`).toContain(response.status);
      }
    });
  }

  it('refuses a cross-site POST (Origin of another site) before it reaches the shelf', async () => {
    const response = await fetch(`${BASE_URL}/api/templates`, {
      method: 'POST',
      headers: { cookie: cookies.get('builder')!, origin: 'http://evil.example', 'content-type': 'application/json' },
      body: JSON.stringify({ source: 'typed' }),
    });
    expect(response.status).toBe(403);
  });
});
