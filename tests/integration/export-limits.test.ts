/**
 * Issue 15, "no single request can take Kerfline down", through the route handlers and the
 * server's own export pool: an export over the caps is refused before any job starts, and
 * /api/health and a Boards list answer while the heaviest allowed export is running.
 * Ordering is read from the pool's counters, never from time.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exportPool } from '~/lib/export/worker/export-pool.server.ts';
import { DESIGN_LIMITS } from '~/lib/schemas/design.ts';
import * as boardsListRoute from '~/pages/api/boards/index.ts';
import * as savedExportRoute from '~/pages/api/boards/[id]/export.ts';
import * as exportRoute from '~/pages/api/export.ts';
import * as healthRoute from '~/pages/api/health.ts';
import { designInput } from '../support/design-builders.ts';
import { callRoute } from '../support/route-call.ts';
import { newShopUser, type TestUser } from '../support/sessions.ts';
import { closeDb } from '../support/test-db.ts';

/** The largest design validateDesign takes; `spacingMm` sets how wide the board is. */
const largest = (spacingMm: number) =>
  designInput({
    name: 'Largest board',
    strings: DESIGN_LIMITS.maxStrings,
    frets: DESIGN_LIMITS.maxFrets,
    scale: { treble: DESIGN_LIMITS.mm.length, bass: DESIGN_LIMITS.mm.length },
    stringSpacing: { nut: spacingMm, bridge: spacingMm },
  });

let builder: TestUser;
beforeAll(async () => {
  builder = await newShopUser('builder');
});
afterAll(() => closeDb());

describe('export caps on the server', () => {
  it('refuses the request for thousands of pages (largest design, Letter, overlap 99.9) with 422 naming paper, and starts no job', async () => {
    const before = exportPool().stats();
    const response = await callRoute(exportRoute.POST, {
      method: 'POST',
      path: '/api/export?format=pdf&paper=letter&overlap=99.9',
      body: largest(DESIGN_LIMITS.mm.length),
    });
    expect(response.status).toBe(422);
    const body = (await response.json()) as { error: string; field: string };
    expect(body.field).toBe('paper');
    expect(body.error).toMatch(/^this paper template would print \d{1,2},\d{3} pages; the most is 200: use a larger paper, less overlap or paper "fit"$/);
    expect(exportPool().stats()).toEqual(before);
  });

  it('refuses a saved board the same way (GET /api/boards/{id}/export)', async () => {
    const created = await callRoute(boardsListRoute.POST, { method: 'POST', path: '/api/boards', user: builder, body: { design: largest(DESIGN_LIMITS.mm.length) } });
    expect(created.status).toBe(201);
    const { id } = (await created.json()) as { id: number };
    const before = exportPool().stats();
    const response = await callRoute(savedExportRoute.GET, { path: `/api/boards/${id}/export?format=pdf&paper=a4&overlap=50`, user: builder, params: { id: String(id) } });
    expect(response.status).toBe(422);
    expect(await response.json()).toMatchObject({ field: 'paper' });
    expect(exportPool().stats()).toEqual(before);
  });
});

describe('the server keeps answering during the heaviest allowed export', () => {
  it('answers /api/health and a Boards list with 200 while a 200-page template is being built in the pool', async () => {
    let finished = false;
    const exported = callRoute(exportRoute.POST, {
      method: 'POST',
      path: '/api/export?format=pdf&paper=letter&overlap=99.9',
      body: largest(500),
    }).then((response) => {
      finished = true;
      return response;
    });
    const pool = exportPool();
    while (pool.stats().running === 0 && !finished) await new Promise((resolve) => setImmediate(resolve));
    expect(pool.stats().running).toBe(1);

    const health = await callRoute(healthRoute.GET, { path: '/api/health' });
    const list = await callRoute(boardsListRoute.GET, { path: '/api/boards', user: builder });
    // Both answered while the worker was still building the file.
    expect(pool.stats().running).toBe(1);
    expect(finished).toBe(false);
    expect(health.status).toBe(200);
    expect(await health.json()).toEqual({ status: 'ok', db: 'ok' });
    expect(list.status).toBe(200);

    const response = await exported;
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('application/pdf');
    const bytes = new Uint8Array(await response.arrayBuffer());
    expect(new TextDecoder().decode(bytes.subarray(0, 5))).toBe('%PDF-');
    expect(pool.stats()).toMatchObject({ running: 0, inFlight: 0 });
  });
});
