import { and, count, eq } from 'drizzle-orm';
import DxfParser from 'dxf-parser';
import { dxfComments } from '../support/dxf-comments.ts';
import { pageText } from '../support/pdf-readback.ts';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SessionUser } from '~/lib/auth/index.server.ts';
import { createBoard, getBoard } from '~/lib/boards/boards.server.ts';
import { templateChecks, templates, users } from '~/lib/db/schema.ts';
import { seedDemoShop } from '~/lib/db/seed/demo-shop.server.ts';
import { DEMO_SEED_STEPS } from '~/lib/db/seed/steps.server.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import type { TemplateView } from '~/lib/schemas/template.ts';
import type { APIContext, APIRoute } from 'astro';
import * as checksRoute from '~/pages/api/templates/[id]/checks.ts';
import * as indexTemplateFile from '~/pages/api/templates/[id]/index-template.ts';
import * as templateRoute from '~/pages/api/templates/[id]/index.ts';
import * as labelFile from '~/pages/api/templates/[id]/label.ts';
import * as shelfRoute from '~/pages/api/templates/index.ts';
import { newShopUser, type TestUser } from '../support/sessions.ts';
import { closeDb, db } from '../support/test-db.ts';

afterAll(() => closeDb());

const ORIGIN = 'http://127.0.0.1:4321';

/** Calls a route module's handler as the router would, for `user` (no middleware). */
function call(route: APIRoute | undefined, user: SessionUser | null, request: Request, id?: string): Promise<Response> {
  if (!route) throw new Error('no such handler');
  const context = { request, url: new URL(request.url), params: id === undefined ? {} : { id }, locals: { user, sessionId: null } };
  return Promise.resolve(route(context as unknown as APIContext));
}
const get = (url: URL | string) => new Request(url, { method: 'GET' });
const templateUrl = (id: string, rest = '') => `${ORIGIN}/api/templates/${id}${rest}`;
const createRoute = (user: SessionUser, request: Request) => call(shelfRoute.POST, user, request);
const listRoute = (user: SessionUser, url: URL) => call(shelfRoute.GET, user, get(url));
const readRoute = (user: SessionUser, id: string) => call(templateRoute.GET, user, get(templateUrl(id)), id);
const updateRoute = (user: SessionUser, id: string, request: Request) => call(templateRoute.PATCH, user, request, id);
const retireRoute = (user: SessionUser, id: string) => call(templateRoute.DELETE, user, new Request(templateUrl(id), { method: 'DELETE' }), id);
const listChecksRoute = (user: SessionUser, id: string) => call(checksRoute.GET, user, get(templateUrl(id, '/checks')), id);
const postCheckRoute = (user: SessionUser, id: string, request: Request) => call(checksRoute.POST, user, request, id);
const labelRoute = (user: SessionUser, id: string, url: URL) => call(labelFile.GET, user, get(url), id);
const indexTemplateRoute = (user: SessionUser, id: string, url: URL) => call(indexTemplateFile.GET, user, get(url), id);

async function sessionUser(test: TestUser): Promise<SessionUser> {
  const [row] = await db().select().from(users).where(eq(users.id, test.id));
  return { id: row!.id, shopId: row!.shopId, email: row!.email, displayName: row!.displayName, role: row!.role, preferredUnits: row!.preferredUnits };
}

function jsonRequest(path: string, method: string, body: unknown): Request {
  return new Request(`${ORIGIN}${path}`, { method, headers: { 'content-type': 'application/json', origin: ORIGIN }, body: JSON.stringify(body) });
}

function csvRequest(path: string, csv: string): Request {
  return new Request(`${ORIGIN}${path}`, { method: 'POST', headers: { 'content-type': 'text/csv', origin: ORIGIN }, body: csv });
}

/** Saves a demo design as a new board in `shopId` (through the designs module). */
async function saveDesign(shopId: number, authorId: string, presetId: string): Promise<number> {
  const design = DEMO_DESIGNS.find((d) => d.id === presetId)!.design;
  return (await createBoard({ id: authorId, shopId }, { design, instrumentType: 'guitar', clientName: '', note: '' })).id;
}

const closedForm = (scale: number, fret: number) => scale * (1 - 2 ** (-fret / 12));
const typed = { source: 'typed', units: 'mm', trebleScale: 635, bassScale: 635, frets: 20, slotWidth: 0.6, keyWidth: 0.55 };

let builder: SessionUser;
let client: SessionUser;
let otherOwner: SessionUser;

beforeAll(async () => {
  const b = await newShopUser('builder');
  builder = await sessionUser(b);
  const c = await newShopUser('client');
  client = await sessionUser(c);
  otherOwner = await sessionUser(await newShopUser('owner'));
});

async function create(user: SessionUser, body: unknown): Promise<Response> {
  return createRoute(user, jsonRequest('/api/templates', 'POST', body));
}

async function createdTemplate(user: SessionUser, body: unknown): Promise<TemplateView> {
  const response = await create(user, body);
  expect(response.status).toBe(201);
  return (await response.json()) as TemplateView;
}

describe('Template shelf API', () => {
  it('creates from typed scale lengths; refuses bad fields with 400 naming the field; clients 403, visitors 401', async () => {
    const t = await createdTemplate(builder, { ...typed, name: 'Typed 635' });
    expect(t).toMatchObject({ name: 'Typed 635', boardId: null, trebleScale: 635, frets: 20, keyWidth: 0.55, condition: 'in_use' });
    const bad = await create(builder, { ...typed, name: 'Bad', trebleScale: -1 });
    expect(bad.status).toBe(400);
    expect(await bad.json()).toMatchObject({ field: 'trebleScale' });
    const badDate = await create(builder, { ...typed, name: 'Bad date', madeOn: '2025-02-30' });
    expect((await badDate.json()) as object).toMatchObject({ field: 'madeOn' });
    expect((await create(client, { ...typed, name: 'No' })).status).toBe(403);
    expect((await create(null as unknown as SessionUser, { ...typed, name: 'No' })).status).toBe(401);
  });

  it("creates from a design's current revision, copying scale, frets and slot width; another shop's design is 404", async () => {
    const boardId = await saveDesign(builder.shopId, builder.id, 'classical-650');
    const t = await createdTemplate(builder, { source: 'design', boardId, keyWidth: 0.5 });
    expect(t).toMatchObject({ boardId, revision: 1, name: 'Demo: 650 mm classical guitar', trebleScale: 650, bassScale: 650, frets: 19, slotWidth: 0.55, units: 'mm' });
    const foreign = await create(otherOwner, { source: 'design', boardId, keyWidth: 0.5 });
    expect(foreign.status).toBe(404);
    expect(await foreign.json()).toMatchObject({ field: 'boardId' });
    const noRevision = await create(builder, { source: 'design', boardId, revision: 9, keyWidth: 0.5 });
    expect(await noRevision.json()).toMatchObject({ field: 'revision' });
  });

  it('lists with search, condition filter, sort by scale and pages; only the own shop', async () => {
    const shop = await sessionUser(await newShopUser('owner'));
    for (const [name, scale, material] of [['Alpha', 650, 'aluminium'], ['Beta', 628.65, 'phenolic'], ['Gamma', 25.5, 'acrylic']] as const) {
      await createdTemplate(shop, { ...typed, name, trebleScale: scale, bassScale: scale, units: name === 'Gamma' ? 'in' : 'mm', slotWidth: 0.02, keyWidth: 0.02, material });
    }
    const list = async (query: string) => (await (await listRoute(shop, new URL(`${ORIGIN}/api/templates?${query}`))).json()) as { items: TemplateView[]; total: number };
    expect((await list('sort=scale&dir=asc')).items.map((t) => t.name)).toEqual(['Beta', 'Gamma', 'Alpha']); // 25.5 in = 647.7 mm
    expect((await list('q=phen')).items.map((t) => t.name)).toEqual(['Beta']);
    const page2 = await list('sort=name&dir=asc&pageSize=2&page=2');
    expect(page2.total).toBe(3);
    expect(page2.items.map((t) => t.name)).toEqual(['Gamma']);
    const retired = (await list('q=Alpha')).items[0]!;
    expect((await retireRoute(shop, String(retired.id))).status).toBe(200);
    expect((await list('condition=retired')).items.map((t) => t.name)).toEqual(['Alpha']);
    expect((await list('condition=in_use')).total).toBe(2);
    const badSort = await listRoute(shop, new URL(`${ORIGIN}/api/templates?sort=colour`));
    expect(badSort.status).toBe(400);
    expect(await badSort.json()).toMatchObject({ field: 'sort' });
  });

  it('records the last check on and its result; filters by last result (pass, fail, never) and sorts by last check', async () => {
    const shop = await sessionUser(await newShopUser('owner'));
    // One after another, so on a tie in the (whole-second) check time the later id sorts first.
    const failing = await createdTemplate(shop, { ...typed, name: 'Failing' });
    const passing = await createdTemplate(shop, { ...typed, name: 'Passing' });
    const never = await createdTemplate(shop, { ...typed, name: 'Never' });
    const check = (id: number, scale: number) =>
      postCheckRoute(shop, String(id), jsonRequest(`/api/templates/${id}/checks`, 'POST', {
        units: 'mm',
        tolerance: 0.05,
        measurements: Array.from({ length: 20 }, (_, i) => ({ fret: i + 1, fromNut: closedForm(scale, i + 1) })),
      }));
    expect((await check(failing.id, 628.65)).status).toBe(201);
    expect((await check(passing.id, 635)).status).toBe(201);
    const list = async (query: string) => (await (await listRoute(shop, new URL(`${ORIGIN}/api/templates?${query}`))).json()) as { items: TemplateView[] };
    const names = async (query: string) => (await list(query)).items.map((t) => t.name);
    expect(await names('lastResult=pass')).toEqual(['Passing']);
    expect(await names('lastResult=fail')).toEqual(['Failing']);
    expect(await names('lastResult=never')).toEqual(['Never']);
    // Newest check first; never-checked templates (no date) sort after every checked one.
    expect(await names('sort=lastChecked&dir=desc')).toEqual(['Passing', 'Failing', 'Never']);
    const rows = (await list('sort=name&dir=asc')).items;
    expect(rows.map((t) => [t.name, t.lastCheckPassed])).toEqual([['Failing', false], ['Never', null], ['Passing', true]]);
    expect(rows.find((t) => t.name === 'Never')!.lastCheckedOn).toBeNull();
    expect(Date.parse(rows.find((t) => t.name === 'Passing')!.lastCheckedOn!)).toBeGreaterThanOrEqual(Date.parse(rows.find((t) => t.name === 'Failing')!.lastCheckedOn!));
    expect(await names('lastResult=fail&condition=worn')).toEqual([]);
    const bad = await listRoute(shop, new URL(`${ORIGIN}/api/templates?lastResult=maybe`));
    expect(bad.status).toBe(400);
    expect(await bad.json()).toMatchObject({ field: 'lastResult' });
    expect(never.lastCheckedOn).toBeNull();
  });

  it("updates shelf fields; another shop's id and a malformed id are 404", async () => {
    const t = await createdTemplate(builder, { ...typed, name: 'To edit' });
    const updated = await updateRoute(builder, String(t.id), jsonRequest(`/api/templates/${t.id}`, 'PATCH', { storagePlace: 'Rack C', condition: 'worn' }));
    expect(await updated.json()).toMatchObject({ storagePlace: 'Rack C', condition: 'worn' });
    const bad = await updateRoute(builder, String(t.id), jsonRequest(`/api/templates/${t.id}`, 'PATCH', { condition: 'lost' }));
    expect(bad.status).toBe(400);
    expect((await readRoute(otherOwner, String(t.id))).status).toBe(404);
    expect((await updateRoute(otherOwner, String(t.id), jsonRequest(`/api/templates/${t.id}`, 'PATCH', { notes: 'x' }))).status).toBe(404);
    expect((await readRoute(builder, 'abc')).status).toBe(404);
    expect((await readRoute(client, String(t.id))).status).toBe(403);
  });
});

describe('Template check API', () => {
  it('saves a grid check with its verdict and records the last result on the template', async () => {
    const t = await createdTemplate(builder, { ...typed, name: 'Grid check' });
    const measurements = Array.from({ length: 20 }, (_, i) => ({ fret: i + 1, fromNut: closedForm(628.65, i + 1) }));
    const response = await postCheckRoute(builder, String(t.id), jsonRequest(`/api/templates/${t.id}/checks`, 'POST', { units: 'mm', tolerance: 0.05, measurements }));
    expect(response.status).toBe(201);
    const saved = (await response.json()) as { passed: boolean; result: { fits: { scale: { scaleLength: number } }[] } };
    expect(saved.passed).toBe(false);
    expect(Math.abs(saved.result.fits[0]!.scale.scaleLength - 628.65)).toBeLessThan(0.01); // mm
    const after = (await (await readRoute(builder, String(t.id))).json()) as TemplateView;
    expect(after.lastCheckPassed).toBe(false);
    expect(after.lastCheckedOn).not.toBeNull();
    const listed = (await (await listChecksRoute(builder, String(t.id))).json()) as { items: unknown[] };
    expect(listed.items).toHaveLength(1);
  });

  it('takes a CSV upload in inches; a bad CSV is 400 with the line and reason and saves nothing', async () => {
    const t = await createdTemplate(builder, { ...typed, name: 'CSV check' });
    const checksOf = async () => (await db().select({ n: count() }).from(templateChecks).where(eq(templateChecks.templateId, t.id)))[0]!.n;
    const bad = await postCheckRoute(builder, String(t.id), csvRequest(`/api/templates/${t.id}/checks?units=mm&tolerance=0.1`, 'fret,from_nut\n1,35.6\n1,35.7\n'));
    expect(bad.status).toBe(400);
    expect(await bad.json()).toMatchObject({ field: 'csv', line: 3, error: 'CSV line 3: duplicate fret: fret 1 is already listed' });
    const outOfRange = await postCheckRoute(builder, String(t.id), csvRequest(`/api/templates/${t.id}/checks?units=mm&tolerance=0.1`, 'fret,from_nut\n21,500\n'));
    expect(await outOfRange.json()).toMatchObject({ line: 2 });
    const noTolerance = await postCheckRoute(builder, String(t.id), csvRequest(`/api/templates/${t.id}/checks?units=mm`, '1,35.6\n'));
    expect(await noTolerance.json()).toMatchObject({ field: 'tolerance' });
    const tooBig = await postCheckRoute(builder, String(t.id), csvRequest(`/api/templates/${t.id}/checks?units=mm&tolerance=0.1`, '1,35.6\n'.repeat(10_000)));
    expect(tooBig.status).toBe(413);
    expect(await checksOf()).toBe(0);
    const inches = Array.from({ length: 20 }, (_, i) => `${i + 1},${closedForm(635, i + 1) / 25.4}`).join('\n');
    const good = await postCheckRoute(builder, String(t.id), csvRequest(`/api/templates/${t.id}/checks?units=in&tolerance=0.002`, `fret,from_nut\n${inches}\n`));
    expect(good.status).toBe(201);
    expect(await good.json()).toMatchObject({ passed: true });
    expect(await checksOf()).toBe(1);
    const wrongType = await postCheckRoute(builder, String(t.id), new Request(`${ORIGIN}/api/templates/${t.id}/checks`, { method: 'POST', headers: { 'content-type': 'image/png' }, body: 'x' }));
    expect(wrongType.status).toBe(415);
    expect((await postCheckRoute(otherOwner, String(t.id), csvRequest(`/api/templates/${t.id}/checks?units=mm&tolerance=0.1`, '1,35.6\n'))).status).toBe(404);
  });
});

describe('Template check API: lines named as before and now', () => {
  it('an older body naming string: N is still accepted and compared along string N; a new body names along', async () => {
    const t = await createdTemplate(builder, { ...typed, name: 'Older string body' });
    const measurements = Array.from({ length: 20 }, (_, i) => ({ fret: i + 1, string: 2, fromNut: closedForm(typed.bassScale, i + 1) }));
    const older = await postCheckRoute(builder, String(t.id), jsonRequest(`/api/templates/${t.id}/checks`, 'POST', { units: 'mm', tolerance: 0.05, measurements }));
    expect(older.status).toBe(201);
    const saved = (await older.json()) as { passed: boolean; result: { slots: { along: string }[] } };
    expect(saved.passed).toBe(true);
    expect(saved.result.slots.every((s) => s.along === 'string-2')).toBe(true);
    const renamed = measurements.map(({ string: _string, ...m }) => ({ ...m, along: 'string-2' }));
    const newer = await postCheckRoute(builder, String(t.id), jsonRequest(`/api/templates/${t.id}/checks`, 'POST', { units: 'mm', tolerance: 0.05, measurements: renamed }));
    expect(await newer.json()).toMatchObject({ passed: true });
    const both = await postCheckRoute(builder, String(t.id), jsonRequest(`/api/templates/${t.id}/checks`, 'POST', { units: 'mm', tolerance: 0.05, measurements: [{ fret: 1, string: 2, along: 'string-2', fromNut: 35 }] }));
    expect(both.status).toBe(400);
    expect(await both.json()).toMatchObject({ field: 'measurements.0.string' });
    const csvAlong = await postCheckRoute(builder, String(t.id), csvRequest(`/api/templates/${t.id}/checks?units=mm&tolerance=0.1&along=side`, '1,35.6\n'));
    expect(await csvAlong.json()).toMatchObject({ field: 'along' });
  });
});

describe('adding a template with the check made against its design', () => {
  const checkOf = (scale: number, frets: number) => ({
    units: 'mm',
    tolerance: 0.1,
    measurements: Array.from({ length: frets }, (_, i) => ({ fret: i + 1, fromNut: closedForm(scale, i + 1) })),
  });
  const named = async (shopId: number, name: string) => db().select().from(templates).where(and(eq(templates.shopId, shopId), eq(templates.name, name)));

  it('saves the template and its check together, the check against the chosen revision', async () => {
    const boardId = await saveDesign(builder.shopId, builder.id, 'classical-650');
    const t = await createdTemplate(builder, { source: 'design', boardId, revision: 1, name: 'Checked on arrival', keyWidth: 0.5, check: checkOf(628.65, 19) });
    expect(t).toMatchObject({ boardId, revision: 1, lastCheckPassed: false });
    expect(t.lastCheckedOn).not.toBeNull();
    const checks = (await (await listChecksRoute(builder, String(t.id))).json()) as { items: { passed: boolean; result: { fits: { scale: { scaleLength: number } }[] } }[] };
    expect(checks.items).toHaveLength(1);
    expect(Math.abs(checks.items[0]!.result.fits[0]!.scale.scaleLength - 628.65)).toBeLessThan(0.01); // mm
  });

  it('saves neither when the measurements do not fit the design (400 naming the measurement); another shop is 404', async () => {
    const boardId = await saveDesign(builder.shopId, builder.id, 'classical-650');
    const beyond = { units: 'mm', tolerance: 0.1, measurements: [{ fret: 1, fromNut: 36.4 }, { fret: 24, fromNut: 490 }] };
    const refused = await create(builder, { source: 'design', boardId, name: 'Never saved', keyWidth: 0.5, check: beyond });
    expect(refused.status).toBe(400);
    expect(await refused.json()).toMatchObject({ field: 'check.measurements.1' });
    expect(await named(builder.shopId, 'Never saved')).toHaveLength(0);
    const badTolerance = await create(builder, { source: 'design', boardId, name: 'Never saved', keyWidth: 0.5, check: { ...checkOf(650, 19), tolerance: -1 } });
    expect(await badTolerance.json()).toMatchObject({ field: 'check.tolerance' });
    const foreign = await create(otherOwner, { source: 'design', boardId, name: 'Never saved', keyWidth: 0.5, check: checkOf(650, 19) });
    expect(foreign.status).toBe(404);
    expect(await named(otherOwner.shopId, 'Never saved')).toHaveLength(0);
  });
});

describe('label and index template downloads', () => {
  it('label PDF for a known size; an unknown size is 400 naming size', async () => {
    const t = await createdTemplate(builder, { ...typed, name: 'Labelled' });
    const label = await labelRoute(builder, String(t.id), new URL(`${ORIGIN}/api/templates/${t.id}/label?size=100x50`));
    expect(label.status).toBe(200);
    expect(label.headers.get('content-type')).toBe('application/pdf');
    expect(new TextDecoder().decode((await label.arrayBuffer()).slice(0, 5))).toBe('%PDF-');
    const bad = await labelRoute(builder, String(t.id), new URL(`${ORIGIN}/api/templates/${t.id}/label?size=huge`));
    expect(await bad.json()).toMatchObject({ field: 'size' });
  });

  it("a template made from a saved board names the board revision and its fingerprint on the label, the index template and their file names", async () => {
    const boardId = await saveDesign(builder.shopId, builder.id, 'classical-650');
    const board = await getBoard(builder.shopId, boardId);
    const t = await createdTemplate(builder, { source: 'design', boardId, keyWidth: 0.5, name: 'Classical strip' });
    const label = await labelRoute(builder, String(t.id), new URL(`${ORIGIN}/api/templates/${t.id}/label?size=100x50`));
    expect(label.headers.get('content-disposition')).toBe(`inline; filename="classical-strip-${t.id}-r1-label-100x50.pdf"`);
    expect(pageText(new Uint8Array(await label.arrayBuffer()), 1)).toContain(`Board rev 1 · ${board!.fingerprint}`);
    const pdf = await indexTemplateRoute(builder, String(t.id), new URL(`${ORIGIN}/api/templates/${t.id}/index-template?format=pdf`));
    expect(pdf.headers.get('content-disposition')).toBe(`inline; filename="classical-strip-${t.id}-r1-index-template.pdf"`);
    expect(pageText(new Uint8Array(await pdf.arrayBuffer()), 1)).toContain(`Made from revision 1 of the board (fingerprint ${board!.fingerprint}).`);
    const dxf = await (await indexTemplateRoute(builder, String(t.id), new URL(`${ORIGIN}/api/templates/${t.id}/index-template?format=dxf`))).text();
    expect(dxfComments(dxf)).toContain(`Made from revision 1 of the board (fingerprint ${board!.fingerprint}).`);
  });

  it('index template DXF from a typed single-scale template', async () => {
    const t = await createdTemplate(builder, { ...typed, name: 'Strip' });
    const dxf = await indexTemplateRoute(builder, String(t.id), new URL(`${ORIGIN}/api/templates/${t.id}/index-template?format=dxf`));
    expect(dxf.status).toBe(200);
    const parsed = new DxfParser().parseSync(await dxf.text());
    expect(parsed?.header['$INSUNITS']).toBe(4);
  });

  it('a typed fanned template names the string spacing and perpendicular fret it lacks, and exports once they are given', async () => {
    const fan = await createdTemplate(builder, { ...typed, name: 'Typed fan', bassScale: 686 });
    const strip = (query: string) => indexTemplateRoute(builder, String(fan.id), new URL(`${ORIGIN}/api/templates/${fan.id}/index-template?${query}`));
    const refused = await strip('format=pdf');
    expect(refused.status).toBe(400);
    const body = (await refused.json()) as { error: string; field: string; issues: { path: string }[] };
    expect(body.field).toBe('nutSpacing');
    expect(body.issues.map((i) => i.path)).toEqual(['nutSpacing', 'saddleSpacing', 'perpendicularFret']);
    expect(body.error).toMatch(/string spacing at the nut and the string spacing at the saddle and the perpendicular fret/);
    expect(await (await strip('format=pdf&nutSpacing=48&saddleSpacing=75')).json()).toMatchObject({ field: 'perpendicularFret' });
    expect(await (await strip('format=pdf&nutSpacing=abc&saddleSpacing=75&perpendicularFret=8')).json()).toMatchObject({ field: 'nutSpacing' });
    expect(await (await strip('format=pdf&nutSpacing=48&saddleSpacing=75&perpendicularFret=21')).json()).toMatchObject({ field: 'perpendicularFret' });

    const dxf = await strip('format=dxf&nutSpacing=48&saddleSpacing=75&perpendicularFret=8');
    expect(dxf.status).toBe(200);
    const entities = new DxfParser().parseSync(await dxf.text())!.entities as unknown as { layer: string; text?: string; vertices: { x: number; y: number }[] }[];
    const centres = entities.filter((e) => e.layer === 'slot-centres');
    expect(centres).toHaveLength(21); // 20 frets and the nut slot
    // Fret 8 is the perpendicular fret: its slot is square to the strip, both ends at the same x.
    const square = centres.filter((e) => Math.abs(e.vertices[0]!.x - e.vertices[1]!.x) < 1e-9 && e.vertices[0]!.x > 0);
    expect(square).toHaveLength(1);
    expect(entities.filter((e) => e.layer === 'engraving').map((e) => e.text)).toContain('8 0.0%%d');
    const pdf = await strip('format=pdf&nutSpacing=48&saddleSpacing=75&perpendicularFret=0');
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get('content-type')).toBe('application/pdf');
  });
});

describe('demo seed: templates', () => {
  it('puts three templates and one saved check on the demo shelf, idempotently', async () => {
    const { shopId } = await seedDemoShop(db(), DEMO_SEED_STEPS);
    await seedDemoShop(db(), DEMO_SEED_STEPS);
    const rows = await db().select().from(templates).where(eq(templates.shopId, shopId));
    const names = ['Classical 650 master', 'Old 628.65 mm steel-string master', 'Mandolin 13.875 in master'];
    for (const name of names) expect(rows.filter((r) => r.name === name)).toHaveLength(1);
    const old = rows.find((r) => r.name === names[1])!;
    const checks = await db().select().from(templateChecks).where(and(eq(templateChecks.shopId, shopId), eq(templateChecks.templateId, old.id)));
    expect(checks).toHaveLength(1);
    expect(old.lastCheckPassed).toBe(checks[0]!.passed);
  });
});
