import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { boardRevisions, boards } from '~/lib/db/schema.ts';
import { FRET_TABLE_HEADER } from '~/lib/export/csv.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import type { BoardDetail, BoardList, BoardRevision } from '~/lib/schemas/board.ts';
import type { Design } from '~/lib/schemas/design.ts';
import * as listRoute from '~/pages/api/boards/index.ts';
import * as boardRoute from '~/pages/api/boards/[id]/index.ts';
import * as archiveRoute from '~/pages/api/boards/[id]/archive.ts';
import * as duplicateRoute from '~/pages/api/boards/[id]/duplicate.ts';
import * as exportRoute from '~/pages/api/boards/[id]/export.ts';
import * as restoreRoute from '~/pages/api/boards/[id]/restore.ts';
import * as revisionsRoute from '~/pages/api/boards/[id]/revisions.ts';
import * as thumbnailRoute from '~/pages/api/boards/[id]/thumbnail.svg.ts';
import * as importRoute from '~/pages/api/boards/import.ts';
import { callRoute } from '../support/route-call.ts';
import { addShopUser, newShopUser, type TestUser } from '../support/sessions.ts';
import { closeDb, db } from '../support/test-db.ts';

function demo(id: string): Design {
  const found = DEMO_DESIGNS.find((d) => d.id === id);
  if (!found) throw new Error(`no demo design ${id}`);
  return structuredClone(found.design);
}

const fan = () => demo('seven-string-fan');

let builder: TestUser;
let owner: TestUser;
let client: TestUser;
let otherOwner: TestUser;

beforeAll(async () => {
  builder = await newShopUser('builder');
  owner = await addShopUser(builder.shopId, 'owner');
  client = await addShopUser(builder.shopId, 'client');
  otherOwner = await newShopUser('owner');
});
afterAll(() => closeDb());

async function create(user: TestUser, body: Record<string, unknown>): Promise<BoardDetail> {
  const response = await callRoute(listRoute.POST, { method: 'POST', path: '/api/boards', user, body });
  expect(response.status).toBe(201);
  return (await response.json()) as BoardDetail;
}

async function patch(user: TestUser, id: number, body: Record<string, unknown>): Promise<Response> {
  return callRoute(boardRoute.PATCH, { method: 'PATCH', path: `/api/boards/${id}`, user, params: { id: String(id) }, body });
}

async function revisions(user: TestUser, id: number): Promise<BoardRevision[]> {
  const response = await callRoute(revisionsRoute.GET, { path: `/api/boards/${id}/revisions`, user, params: { id: String(id) } });
  expect(response.status).toBe(200);
  return ((await response.json()) as { items: BoardRevision[] }).items;
}

async function rowCounts(shopId: number): Promise<{ boards: number; revisions: number }> {
  const [boardCount] = await db().select({ n: count() }).from(boards).where(eq(boards.shopId, shopId));
  const [revs] = await db()
    .select({ n: count() })
    .from(boardRevisions)
    .innerJoin(boards, eq(boards.id, boardRevisions.boardId))
    .where(eq(boards.shopId, shopId));
  return { boards: boardCount!.n, revisions: revs!.n };
}

describe('POST /api/boards and GET /api/boards/{id}', () => {
  it('saves a new board at revision 1 and reads it back with its design', async () => {
    const created = await create(builder, { design: fan(), instrumentType: 'guitar', clientName: 'Ines Calloway' });
    expect(created).toMatchObject({ name: fan().name, units: 'mm', status: 'draft', currentRevision: 1, revision: 1, version: 1, trebleScaleMm: 648, bassScaleMm: 686 });
    const read = await callRoute(boardRoute.GET, { path: `/api/boards/${created.id}`, user: owner, params: { id: String(created.id) } });
    expect(read.status).toBe(200);
    expect(((await read.json()) as BoardDetail).design).toEqual(fan());
  });

  it('stores scale lengths of a design in inches as millimetres for sorting (1 in = 25.4 mm exactly)', async () => {
    const created = await create(builder, { design: demo('mandolin'), instrumentType: 'mandolin' });
    expect(Math.abs(created.trebleScaleMm - 13.875 * 25.4)).toBeLessThan(1e-9);
  });

  it('rejects an invalid design with 400 naming the field, and writes nothing', async () => {
    const before = await rowCounts(builder.shopId);
    const bad = { ...fan(), scale: { treble: -1, bass: 686 } };
    const response = await callRoute(listRoute.POST, { method: 'POST', path: '/api/boards', user: builder, body: { design: bad } });
    expect(response.status).toBe(400);
    expect(await response.json()).toMatchObject({ field: 'design.scale.treble' });
    expect(await rowCounts(builder.shopId)).toEqual(before);
  });

  it('rejects an unknown instrument type with 400 naming the field', async () => {
    const response = await callRoute(listRoute.POST, { method: 'POST', path: '/api/boards', user: builder, body: { design: fan(), instrumentType: 'harp' } });
    expect(response.status).toBe(400);
    expect(await response.json()).toMatchObject({ field: 'instrumentType' });
  });

  it('reads an older revision with ?revision=N and 404s a revision that does not exist', async () => {
    const board = await create(builder, { design: fan() });
    await patch(builder, board.id, { version: 1, design: { ...fan(), frets: 22, markers: [] } });
    const old = await callRoute(boardRoute.GET, { path: `/api/boards/${board.id}?revision=1`, user: builder, params: { id: String(board.id) } });
    expect(((await old.json()) as BoardDetail).design).toMatchObject({ frets: 24 });
    const missing = await callRoute(boardRoute.GET, { path: `/api/boards/${board.id}?revision=9`, user: builder, params: { id: String(board.id) } });
    expect(missing.status).toBe(404);
  });
});

describe('PATCH /api/boards/{id}', () => {
  it('autosave changes the working copy only; saveRevision keeps it as a new revision and the old one unchanged', async () => {
    const board = await create(builder, { design: fan() });
    const changed = { ...fan(), perpendicularFret: 7 };
    const autosaved = await patch(owner, board.id, { version: 1, design: changed });
    expect(autosaved.status).toBe(200);
    expect(await autosaved.json()).toMatchObject({ currentRevision: 1, workingRevision: null, revision: null, version: 2, design: changed });
    expect(await revisions(builder, board.id)).toHaveLength(1);
    const kept = await patch(owner, board.id, { version: 2, design: changed, note: 'perpendicular at 7', saveRevision: true });
    expect(await kept.json()).toMatchObject({ currentRevision: 2, workingRevision: 2, revision: 2, version: 2 });
    const history = await revisions(builder, board.id);
    expect(history.map((r) => [r.revision, r.note, r.reason])).toEqual([[2, 'perpendicular at 7', 'saved'], [1, '', 'created']]);
    expect(history[1]!.design).toEqual(fan());
    expect(history[0]!.design).toEqual(changed);
  });

  it('editing back to the newest revision makes the working copy that revision again', async () => {
    const board = await create(builder, { design: fan() });
    await patch(builder, board.id, { version: 1, design: { ...fan(), frets: 22, markers: [] } });
    const back = await patch(builder, board.id, { version: 2, design: fan() });
    expect(await back.json()).toMatchObject({ workingRevision: 1, revision: 1, version: 3 });
  });

  it('changes client and instrument without a new revision, and writes nothing for an unchanged save', async () => {
    const board = await create(builder, { design: fan() });
    const meta = await patch(builder, board.id, { version: 1, clientName: 'Rafe Dunmore', instrumentType: 'bass' });
    expect(await meta.json()).toMatchObject({ clientName: 'Rafe Dunmore', instrumentType: 'bass', currentRevision: 1, version: 2 });
    const same = await patch(builder, board.id, { version: 2, design: fan() });
    expect(await same.json()).toMatchObject({ currentRevision: 1, version: 2 });
  });

  it('answers a stale version with 409 and the current board; both edits stay recoverable', async () => {
    const board = await create(builder, { design: fan() });
    const first = { ...fan(), perpendicularFret: 6 };
    const second = { ...fan(), frets: 22, markers: [] };
    expect((await patch(builder, board.id, { version: 1, design: first })).status).toBe(200);
    const stale = await patch(owner, board.id, { version: 1, design: second });
    expect(stale.status).toBe(409);
    const body = (await stale.json()) as { currentVersion: number; current: BoardDetail };
    expect(body.currentVersion).toBe(2);
    expect(body.current.design).toEqual(first);
    // The second editor saw the first edit in the 409 and saves theirs on top of it.
    expect((await patch(owner, board.id, { version: body.currentVersion, design: second, saveRevision: true })).status).toBe(200);
    const history = await revisions(builder, board.id);
    expect(history.map((r) => r.design)).toEqual([second, fan()]);
  });

  it('rejects an invalid design with 400 and leaves the board as it was', async () => {
    const board = await create(builder, { design: fan() });
    const response = await patch(builder, board.id, { version: 1, design: { ...fan(), frets: 99 } });
    expect(response.status).toBe(400);
    expect(await response.json()).toMatchObject({ field: 'design.frets' });
    expect(await revisions(builder, board.id)).toHaveLength(1);
    const read = await callRoute(boardRoute.GET, { path: `/api/boards/${board.id}`, user: builder, params: { id: String(board.id) } });
    expect(await read.json()).toMatchObject({ version: 1, currentRevision: 1 });
  });

  it('requires the version the client last saw (400 naming "version")', async () => {
    const board = await create(builder, { design: fan() });
    const response = await patch(builder, board.id, { design: fan() });
    expect(response.status).toBe(400);
    expect(await response.json()).toMatchObject({ field: 'version' });
  });
});

describe('duplicate, restore, archive', () => {
  it('duplicates the current revision into a new board named "Copy of …"', async () => {
    const board = await create(builder, { design: fan(), clientName: 'Ines Calloway' });
    const response = await callRoute(duplicateRoute.POST, { method: 'POST', path: `/api/boards/${board.id}/duplicate`, user: builder, params: { id: String(board.id) } });
    expect(response.status).toBe(201);
    const copy = (await response.json()) as BoardDetail;
    expect(copy.id).not.toBe(board.id);
    expect(copy).toMatchObject({ name: `Copy of ${fan().name}`, clientName: 'Ines Calloway', currentRevision: 1 });
    expect(copy.design).toEqual({ ...fan(), name: `Copy of ${fan().name}` });
  });

  it('restores an old revision as the working copy (no new revision), with a stale version refused', async () => {
    const board = await create(builder, { design: fan() });
    await patch(builder, board.id, { version: 1, design: { ...fan(), perpendicularFret: 5 }, saveRevision: true });
    const call = (body: unknown) =>
      callRoute(restoreRoute.POST, { method: 'POST', path: `/api/boards/${board.id}/restore`, user: builder, params: { id: String(board.id) }, body });
    expect((await call({ revision: 1, version: 1 })).status).toBe(409);
    expect((await call({ revision: 7, version: 2 })).status).toBe(404);
    const restored = await call({ revision: 1, version: 2 });
    expect(restored.status).toBe(200);
    expect(await restored.json()).toMatchObject({ currentRevision: 2, workingRevision: 1, revision: 1, version: 3, design: fan() });
    const history = await revisions(builder, board.id);
    expect(history.map((r) => r.revision)).toEqual([2, 1]);
  });

  it('archives and unarchives; the list shows it only under "archived" while archived', async () => {
    const name = `Archive me ${Date.now()}`;
    const board = await create(builder, { design: { ...fan(), name } });
    const archive = (archived: boolean) =>
      callRoute(archiveRoute.POST, { method: 'POST', path: `/api/boards/${board.id}/archive`, user: builder, params: { id: String(board.id) }, body: { archived } });
    const list = async (status: string) => {
      const response = await callRoute(listRoute.GET, { path: `/api/boards?q=${encodeURIComponent(name)}&status=${status}`, user: builder });
      return ((await response.json()) as BoardList).items.map((i) => i.id);
    };
    expect(await (await archive(true)).json()).toMatchObject({ status: 'archived' });
    expect(await list('active')).toEqual([]);
    expect(await list('archived')).toEqual([board.id]);
    expect(await (await archive(false)).json()).toMatchObject({ status: 'draft' });
    expect(await list('active')).toEqual([board.id]);
    expect(await list('archived')).toEqual([]);
  });
});

describe('GET /api/boards (search, filters, sort, pages)', () => {
  let shopBuilder: TestUser;
  beforeAll(async () => {
    shopBuilder = await newShopUser('builder');
    const rows: [string, string, string][] = [
      ['seven-string-fan', 'guitar', 'Ines Calloway'],
      ['short-scale-bass', 'bass', 'Rafe Dunmore'],
      ['classical-650', 'classical', ''],
      ['mandolin', 'mandolin', 'Ines Calloway'],
      ['tenor-ukulele', 'ukulele', 'Rafe Dunmore'],
    ];
    for (const [id, instrumentType, clientName] of rows) await create(shopBuilder, { design: demo(id), instrumentType, clientName });
  });

  async function list(query: string): Promise<BoardList> {
    const response = await callRoute(listRoute.GET, { path: `/api/boards?${query}`, user: shopBuilder });
    expect(response.status).toBe(200);
    return (await response.json()) as BoardList;
  }

  it('searches names and client names (case-insensitive, % is literal)', async () => {
    expect((await list('q=mandolin')).items.map((i) => i.instrumentType)).toEqual(['mandolin']);
    expect((await list('q=rafe&sort=name')).items.map((i) => i.instrumentType).sort()).toEqual(['bass', 'ukulele']);
    expect((await list('q=%25')).total).toBe(0);
  });

  it('filters by instrument type and units', async () => {
    expect((await list('instrument=classical')).items).toHaveLength(1);
    const inches = await list('units=in');
    expect(inches.items.map((i) => i.instrumentType).sort()).toEqual(['mandolin', 'ukulele']);
  });

  it('sorts by scale (treble, mm) both ways and by name', async () => {
    const ascending = (await list('sort=scale')).items.map((i) => i.trebleScaleMm);
    expect(ascending).toEqual([...ascending].sort((a, b) => a - b));
    const descending = (await list('sort=scale&dir=desc')).items.map((i) => i.trebleScaleMm);
    expect(descending).toEqual([...ascending].reverse());
    const names = (await list('sort=name')).items.map((i) => i.name);
    expect(names).toEqual([...names].sort((a, b) => a.localeCompare(b, 'en', { sensitivity: 'base' })));
  });

  it('pages with the total of all matches', async () => {
    const first = await list('sort=name&pageSize=2&page=1');
    const third = await list('sort=name&pageSize=2&page=3');
    expect(first.total).toBe(5);
    expect(first.items).toHaveLength(2);
    expect(third.items).toHaveLength(1);
  });

  it('refuses pageSize over 100 and an unknown sort with 400 naming the field', async () => {
    for (const [query, field] of [['pageSize=101', 'pageSize'], ['sort=colour', 'sort'], ['status=gone', 'status']]) {
      const response = await callRoute(listRoute.GET, { path: `/api/boards?${query}`, user: shopBuilder });
      expect(response.status).toBe(400);
      expect(await response.json()).toMatchObject({ field });
    }
  });

  it('filters by status', async () => {
    const [bass] = (await list('instrument=bass')).items;
    await db().update(boards).set({ status: 'approved' }).where(eq(boards.id, bass!.id));
    expect((await list('status=approved')).items.map((i) => i.id)).toEqual([bass!.id]);
    expect((await list('status=draft')).total).toBe(4);
  });
});

describe('import and export', () => {
  it('exports the board file as JSON and imports it as a new board (never overwriting)', async () => {
    const board = await create(builder, { design: fan(), clientName: 'Ines Calloway', instrumentType: 'guitar' });
    const exported = await callRoute(exportRoute.GET, { path: `/api/boards/${board.id}/export?format=json`, user: builder, params: { id: String(board.id) } });
    expect(exported.status).toBe(200);
    expect(exported.headers.get('content-disposition')).toMatch(/attachment; filename=".+-r1-board\.json"/);
    const text = await exported.text();
    const imported = await callRoute(importRoute.POST, { method: 'POST', path: '/api/boards/import', user: builder, body: text, headers: { 'content-type': 'application/json' } });
    expect(imported.status).toBe(201);
    const copy = (await imported.json()) as BoardDetail;
    expect(copy.id).not.toBe(board.id);
    // The shop has a board of that name already: the import takes the next free "(n)".
    const taken = await callRoute(importRoute.POST, { method: 'POST', path: '/api/boards/import', user: builder, body: text, headers: { 'content-type': 'application/json' } });
    const third = (await taken.json()) as BoardDetail;
    const numberOf = (n: string) => Number(/ \((\d+)\)$/.exec(n)?.[1]);
    expect(copy.name.startsWith(`${fan().name} (`)).toBe(true);
    expect(numberOf(copy.name)).toBeGreaterThanOrEqual(2);
    expect(numberOf(third.name)).toBe(numberOf(copy.name) + 1);
    expect(copy).toMatchObject({ clientName: 'Ines Calloway', design: { ...fan(), name: copy.name }, currentRevision: 1 });
    expect(await revisions(builder, board.id)).toHaveLength(1);
  });

  it('an imported name that the shop has gets " (2)", " (3)", …; % and _ in a name are only characters', async () => {
    const name = `50%_off ${Date.now()}`;
    await create(builder, { design: { ...fan(), name } });
    await create(builder, { design: { ...fan(), name: `50%Xoff ${name.slice(8)} (2)` } });
    const send = () =>
      callRoute(importRoute.POST, { method: 'POST', path: '/api/boards/import', user: builder, body: JSON.stringify({ ...fan(), name }), headers: { 'content-type': 'application/json' } });
    const first = (await (await send()).json()) as BoardDetail;
    const second = (await (await send()).json()) as BoardDetail;
    expect([first.name, second.name]).toEqual([`${name} (2)`, `${name} (3)`]);
    expect((first.design as { name: string }).name).toBe(first.name);
    // Another shop's names do not count.
    const other = (await (await callRoute(importRoute.POST, { method: 'POST', path: '/api/boards/import', user: otherOwner, body: JSON.stringify({ ...fan(), name }), headers: { 'content-type': 'application/json' } })).json()) as BoardDetail;
    expect(other.name).toBe(name);
  });

  it('imports a bare design uploaded as a multipart file', async () => {
    const form = new FormData();
    form.set('file', new Blob([JSON.stringify(demo('tenor-ukulele'))], { type: 'application/json' }), 'uke.json');
    const response = await callRoute(importRoute.POST, { method: 'POST', path: '/api/boards/import', user: builder, body: form });
    expect(response.status).toBe(201);
    expect(await response.json()).toMatchObject({ units: 'in', design: demo('tenor-ukulele') });
  });

  it('refuses a bad file with a clear 4xx and writes nothing', async () => {
    const before = await rowCounts(builder.shopId);
    const send = (body: string) =>
      callRoute(importRoute.POST, { method: 'POST', path: '/api/boards/import', user: builder, body, headers: { 'content-type': 'application/json' } });
    const notJson = await send('{ not json');
    expect(notJson.status).toBe(400);
    expect(await notJson.json()).toMatchObject({ field: 'file' });
    const invalidDesign = await send(JSON.stringify({ ...fan(), strings: 1 }));
    expect(await invalidDesign.json()).toMatchObject({ field: 'strings' });
    const invalidEnvelope = await send(JSON.stringify({ kind: 'kerfline-board', design: { ...fan(), units: 'cm' } }));
    expect(await invalidEnvelope.json()).toMatchObject({ field: 'design.units' });
    const tooLarge = await send(JSON.stringify({ ...fan(), padding: 'x'.repeat(256 * 1024) }));
    expect(tooLarge.status).toBe(413);
    expect(await rowCounts(builder.shopId)).toEqual(before);
  });

  it('exports the fret table CSV of a chosen revision', async () => {
    const board = await create(builder, { design: fan() });
    await patch(builder, board.id, { version: 1, design: { ...fan(), frets: 20, markers: [] } });
    const csv = async (query: string) => {
      const response = await callRoute(exportRoute.GET, { path: `/api/boards/${board.id}/export?${query}`, user: builder, params: { id: String(board.id) } });
      expect(response.headers.get('content-type')).toMatch(/^text\/csv/);
      return (await response.text()).trim().split('\n');
    };
    const current = await csv('format=csv');
    const first = await csv('format=csv&revision=1');
    expect(current[0]).toBe(FRET_TABLE_HEADER);
    // One row per fret and string: 20 x 7 now, 24 x 7 in revision 1.
    expect(current).toHaveLength(1 + 20 * 7);
    expect(first).toHaveLength(1 + 24 * 7);
  });

  it('exports the paper template (PDF) and slot paths (DXF, SVG) of a saved revision through the export engine', async () => {
    const board = await create(builder, { design: fan() });
    const download = async (query: string) => {
      const response = await callRoute(exportRoute.GET, { path: `/api/boards/${board.id}/export?${query}`, user: builder, params: { id: String(board.id) } });
      expect(response.status).toBe(200);
      return { type: response.headers.get('content-type'), disposition: response.headers.get('content-disposition'), bytes: new Uint8Array(await response.arrayBuffer()) };
    };
    const pdf = await download('format=pdf&paper=a4&revision=1');
    expect(pdf.type).toBe('application/pdf');
    expect(new TextDecoder().decode(pdf.bytes.slice(0, 5))).toBe('%PDF-');
    expect(pdf.disposition).toMatch(/paper-template\.pdf"$/);
    const dxf = await download('format=dxf');
    // $INSUNITS 4 = millimetres (AutoCAD DXF reference, header variables).
    expect(new TextDecoder().decode(dxf.bytes)).toMatch(/\$INSUNITS\s+70\s+4\b/);
    const svg = await download('format=svg&slots=outlines');
    expect(new TextDecoder().decode(svg.bytes)).toMatch(/<svg[^>]*width="[0-9.]+mm"/);
  });

  it('refuses an unknown export format or option with 400 naming it', async () => {
    const board = await create(builder, { design: fan() });
    for (const [query, field] of [['format=doc', 'format'], ['format=pdf&paper=napkin', 'paper'], ['format=pdf&revision=zero', 'revision']]) {
      const response = await callRoute(exportRoute.GET, { path: `/api/boards/${board.id}/export?${query}`, user: builder, params: { id: String(board.id) } });
      expect(response.status).toBe(400);
      expect(await response.json()).toMatchObject({ field });
    }
  });
});

describe('GET /api/boards/{id}/thumbnail.svg', () => {
  it('draws the board outline and one line per fret', async () => {
    const board = await create(builder, { design: fan() });
    const response = await callRoute(thumbnailRoute.GET, { path: `/api/boards/${board.id}/thumbnail.svg?revision=1`, user: builder, params: { id: String(board.id) } });
    expect(response.headers.get('content-type')).toBe('image/svg+xml');
    const svg = await response.text();
    expect(svg.startsWith('<svg')).toBe(true);
    expect(svg.match(/<polygon /g)).toHaveLength(1);
    // 24 frets (no zero fret on this board), the nut, the two outer strings and the centre line.
    expect(svg.match(/<line /g)).toHaveLength(24 + 1 + 2 + 1);
  });
});

describe('roles and shop isolation', () => {
  let board: BoardDetail;
  beforeAll(async () => {
    board = await create(builder, { design: fan() });
  });

  const calls = () => {
    const id = String(board.id);
    const params = { id };
    return [
      ['GET list', listRoute.GET, { path: '/api/boards' }],
      ['POST create', listRoute.POST, { method: 'POST', path: '/api/boards', body: { design: fan() } }],
      ['POST import', importRoute.POST, { method: 'POST', path: '/api/boards/import', body: fan() }],
      ['GET read', boardRoute.GET, { path: `/api/boards/${id}`, params }],
      ['PATCH update', boardRoute.PATCH, { method: 'PATCH', path: `/api/boards/${id}`, params, body: { version: 1, design: { ...fan(), frets: 22, markers: [] } } }],
      ['POST duplicate', duplicateRoute.POST, { method: 'POST', path: `/api/boards/${id}/duplicate`, params }],
      ['GET revisions', revisionsRoute.GET, { path: `/api/boards/${id}/revisions`, params }],
      ['POST restore', restoreRoute.POST, { method: 'POST', path: `/api/boards/${id}/restore`, params, body: { revision: 1, version: 1 } }],
      ['POST archive', archiveRoute.POST, { method: 'POST', path: `/api/boards/${id}/archive`, params, body: { archived: true } }],
      ['GET export', exportRoute.GET, { path: `/api/boards/${id}/export?format=json`, params }],
      ['GET thumbnail', thumbnailRoute.GET, { path: `/api/boards/${id}/thumbnail.svg`, params }],
    ] as const;
  };

  it("answers 404 for another shop's board on every route that names one, and changes nothing", async () => {
    for (const [label, route, call] of calls()) {
      if (!('params' in call)) continue;
      const response = await callRoute(route, { ...call, user: otherOwner });
      expect({ label, status: response.status }).toEqual({ label, status: 404 });
    }
    const read = await callRoute(boardRoute.GET, { path: `/api/boards/${board.id}`, user: builder, params: { id: String(board.id) } });
    expect(await read.json()).toMatchObject({ version: 1, currentRevision: 1, status: 'draft' });
  });

  it("never lists another shop's boards", async () => {
    const response = await callRoute(listRoute.GET, { path: `/api/boards?q=${encodeURIComponent(fan().name)}&pageSize=100`, user: otherOwner });
    expect(((await response.json()) as BoardList).total).toBe(0);
  });

  it('answers 403 to clients and 401 to visitors on every route', async () => {
    for (const [label, route, call] of calls()) {
      const asClient = await callRoute(route, { ...call, user: client });
      const asVisitor = await callRoute(route, { ...call, user: null });
      expect({ label, client: asClient.status, visitor: asVisitor.status }).toEqual({ label, client: 403, visitor: 401 });
    }
  });

  it('answers 404 to a malformed id', async () => {
    const response = await callRoute(boardRoute.GET, { path: '/api/boards/abc', user: builder, params: { id: 'abc' } });
    expect(response.status).toBe(404);
  });
});
