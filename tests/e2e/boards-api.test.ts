import mysql from 'mysql2/promise';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { config } from '~/lib/config/env.server.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import type { BoardDetail, BoardList, BoardRevision } from '~/lib/schemas/board.ts';
import { BASE_URL } from '../support/browser.ts';
import { holdNextRevision, waitForLockWait } from '../support/revision-lock.ts';
import { newShopUser, signInAs, type TestUser } from '../support/sessions.ts';
import { closeDb, startDatabase, stopDatabase } from '../support/test-db.ts';

const fan = () => structuredClone(DEMO_DESIGNS.find((d) => d.id === 'seven-string-fan')!.design);

function api(user: TestUser | null, path: string, init: { method?: string; body?: unknown; origin?: string | null } = {}): Promise<Response> {
  const headers: Record<string, string> = {};
  if (user) headers.cookie = user.cookie;
  if (init.body !== undefined) headers['content-type'] = 'application/json';
  if (init.origin !== null) headers.origin = init.origin ?? BASE_URL;
  return fetch(`${BASE_URL}${path}`, {
    method: init.method ?? 'GET',
    headers,
    body: init.body === undefined ? null : JSON.stringify(init.body),
    redirect: 'manual',
  });
}

let builder: TestUser;
beforeAll(async () => {
  builder = await signInAs('builder@wrenfield.example');
});
afterAll(() => closeDb());

describe('Boards API through the built server', () => {
  it('creates, finds by search, updates with its version and answers a stale version with 409', async () => {
    const name = `Fan seven ${Date.now()}`;
    const created = await api(builder, '/api/boards', { method: 'POST', body: { design: { ...fan(), name }, clientName: 'Ines Calloway' } });
    expect(created.status).toBe(201);
    const board = (await created.json()) as BoardDetail;
    const found = (await (await api(builder, `/api/boards?q=${encodeURIComponent(name)}&sort=scale`)).json()) as BoardList;
    expect(found.items.map((b) => b.id)).toEqual([board.id]);
    const saved = await api(builder, `/api/boards/${board.id}`, { method: 'PATCH', body: { version: 1, design: { ...fan(), name, perpendicularFret: 7 } } });
    expect(saved.status).toBe(200);
    const stale = await api(builder, `/api/boards/${board.id}`, { method: 'PATCH', body: { version: 1, design: { ...fan(), name, frets: 22, markers: [] } } });
    expect(stale.status).toBe(409);
    expect(await stale.json()).toMatchObject({ currentVersion: 2, current: { design: { perpendicularFret: 7 } } });
  });

  it('answers the old /api/designs paths with a 308 to /api/boards, so older clients keep working', async () => {
    const name = `Old path ${Date.now()}`;
    const moved = await api(builder, '/api/designs', { method: 'POST', body: { design: { ...fan(), name } } });
    expect(moved.status).toBe(308);
    expect(moved.headers.get('location')).toBe('/api/boards');
    const listed = await api(builder, `/api/designs?q=${encodeURIComponent('Fan seven')}&sort=name`);
    expect(listed.status).toBe(308);
    expect(listed.headers.get('location')).toBe(`/api/boards?q=${encodeURIComponent('Fan seven')}&sort=name`);
    const found = (await (await api(builder, `/api/boards?q=${encodeURIComponent(name)}`)).json()) as BoardList;
    expect(found.total).toBe(0); // the redirect itself saved nothing
  });

  it('refuses a write without a same-site Origin (403) and writes nothing', async () => {
    const before = ((await (await api(builder, '/api/boards?status=all')).json()) as BoardList).total;
    const response = await api(builder, '/api/boards', { method: 'POST', body: { design: fan() }, origin: 'http://evil.example' });
    expect(response.status).toBe(403);
    expect(((await (await api(builder, '/api/boards?status=all')).json()) as BoardList).total).toBe(before);
  });

  it('keeps Boards from clients (403 page and API) and hides a board from another shop (404)', async () => {
    const client = await signInAs('client@wrenfield.example');
    expect((await api(client, '/boards')).status).toBe(403);
    expect((await api(client, '/api/boards')).status).toBe(403);
    const [demoBoard] = ((await (await api(builder, '/api/boards?sort=name')).json()) as BoardList).items;
    const stranger = await newShopUser('owner');
    expect((await api(stranger, `/api/boards/${demoBoard!.id}`)).status).toBe(404);
    expect((await api(stranger, `/api/boards/${demoBoard!.id}/archive`, { method: 'POST', body: { archived: true } })).status).toBe(404);
  });

  it('answers 503 when MariaDB stops during a save, and the previous revision is still current afterwards', async () => {
    const design = { ...fan(), name: `Half-way save ${Date.now()}` };
    const created = (await (await api(builder, '/api/boards', { method: 'POST', body: { design } })).json()) as BoardDetail;
    const blocker = await mysql.createConnection({ ...config().database });
    blocker.on('error', () => undefined);
    let status = 0;
    try {
      await holdNextRevision(blocker, created.id, 2, builder.id);
      const save = api(builder, `/api/boards/${created.id}`, { method: 'PATCH', body: { version: 1, design: { ...design, perpendicularFret: 2 }, saveRevision: true } });
      await waitForLockWait();
      stopDatabase();
      status = (await save).status;
    } finally {
      blocker.destroy();
      startDatabase();
    }
    expect(status).toBe(503);
    const after = (await (await api(builder, `/api/boards/${created.id}`)).json()) as BoardDetail;
    expect(after).toMatchObject({ version: 1, currentRevision: 1, design });
    const revisions = (await (await api(builder, `/api/boards/${created.id}/revisions`)).json()) as { items: BoardRevision[] };
    expect(revisions.items.map((r) => r.revision)).toEqual([1]);
  });
});
