/**
 * An approval belongs to one revision's layout: the board shows "approved" only while it has
 * exactly that layout, "changed since approval" after a change, and a change away from it needs
 * the builder to have seen the warning. Revisions are checkpoints: autosave makes none; proofs
 * and exports of unsaved changes make one, so every print names a revision. Real MariaDB.
 */
import { eq } from 'drizzle-orm';
import DxfParser from 'dxf-parser';
import { PDFDocument } from 'pdf-lib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { boards, shops } from '~/lib/db/schema.ts';
import { createProof, decideProof } from '~/lib/proofs/proofs.server.ts';
import type { BoardDetail, BoardList, BoardRevision } from '~/lib/schemas/board.ts';
import type { Design } from '~/lib/schemas/design.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import * as listRoute from '~/pages/api/boards/index.ts';
import * as boardRoute from '~/pages/api/boards/[id]/index.ts';
import * as exportRoute from '~/pages/api/boards/[id]/export.ts';
import * as restoreRoute from '~/pages/api/boards/[id]/restore.ts';
import * as revisionsRoute from '~/pages/api/boards/[id]/revisions.ts';
import { dxfComments } from '../support/dxf-comments.ts';
import { pageText } from '../support/pdf-readback.ts';
import { callRoute } from '../support/route-call.ts';
import { addShopUser, newShopUser, type TestUser } from '../support/sessions.ts';
import { closeDb, db } from '../support/test-db.ts';

const DAY_MS = 86_400_000;
let builder: TestUser;
let secondBuilder: TestUser;

beforeAll(async () => {
  builder = await newShopUser('builder');
  // Dated back: these tests send more proofs than a brand-new shop's mail budget allows.
  await db().update(shops).set({ createdAt: new Date(Date.now() - 2 * DAY_MS) }).where(eq(shops.id, builder.shopId));
  secondBuilder = await addShopUser(builder.shopId, 'builder');
});
afterAll(() => closeDb());

const fan = (): Design => DEMO_DESIGNS.find((d) => d.id === 'seven-string-fan')!.design;
const params = (id: number) => ({ id: String(id) });
let names = 0;

async function newBoard(): Promise<BoardDetail> {
  const response = await callRoute(listRoute.POST, { method: 'POST', path: '/api/boards', user: builder, body: { design: { ...fan(), name: `Approval test ${Date.now()} ${++names}` } } });
  expect(response.status).toBe(201);
  return (await response.json()) as BoardDetail;
}

function patch(user: TestUser, id: number, body: Record<string, unknown>): Promise<Response> {
  return callRoute(boardRoute.PATCH, { method: 'PATCH', path: `/api/boards/${id}`, user, params: params(id), body });
}

async function read(id: number): Promise<BoardDetail> {
  return (await (await callRoute(boardRoute.GET, { path: `/api/boards/${id}`, user: builder, params: params(id) })).json()) as BoardDetail;
}

function restore(id: number, body: Record<string, unknown>): Promise<Response> {
  return callRoute(restoreRoute.POST, { method: 'POST', path: `/api/boards/${id}/restore`, user: builder, params: params(id), body });
}

async function revisions(id: number): Promise<BoardRevision[]> {
  const response = await callRoute(revisionsRoute.GET, { path: `/api/boards/${id}/revisions`, user: builder, params: params(id) });
  return ((await response.json()) as { items: BoardRevision[] }).items;
}

function exported(id: number, query: string): Promise<Response> {
  return callRoute(exportRoute.GET, { path: `/api/boards/${id}/export?${query}`, user: builder, params: params(id) });
}

/** Sends a proof of the board as it is and records the client's answer. */
async function answer(id: number, decision: 'approved' | 'changes_requested'): Promise<number> {
  const created = await createProof(builder, id, { clientName: 'Ines Calloway', clientEmail: `ines-${Date.now()}-${++names}@wrenfield.example`, message: 'For approval', expiresInDays: 30 }, new Date());
  const token = created!.link.slice(created!.link.lastIndexOf('/') + 1);
  const body = decision === 'approved' ? { decision, name: 'Ines', confirmed: true as const } : { decision, name: 'Ines', comment: 'Smaller dots, please' };
  expect((await decideProof({ token }, body, new Date())).ok).toBe(true);
  return created!.proof.revision;
}

async function statusOf(id: number): Promise<string> {
  const [row] = await db().select({ status: boards.status }).from(boards).where(eq(boards.id, id));
  return row!.status;
}

describe('an approval belongs to one layout', () => {
  it('edit after approval: warned first (409 naming confirmApprovalChange, nothing saved), then "changed since approval" in the board and the list', async () => {
    const board = await newBoard();
    const approvedRevision = await answer(board.id, 'approved');
    const approved = await read(board.id);
    expect(approved).toMatchObject({ status: 'approved', approval: { revision: approvedRevision, fingerprint: approved.fingerprint } });

    const edit = { ...fan(), name: approved.name, perpendicularFret: 9 };
    const refused = await patch(builder, board.id, { version: approved.version, design: edit });
    expect(refused.status).toBe(409);
    expect(await refused.json()).toMatchObject({
      code: 'approval_change',
      field: 'confirmApprovalChange',
      error: `The client approved revision ${approvedRevision}; this change will need a new proof`,
    });
    expect(await read(board.id)).toMatchObject({ version: approved.version, status: 'approved', design: approved.design });

    const confirmed = await patch(builder, board.id, { version: approved.version, design: edit, confirmApprovalChange: true });
    expect(confirmed.status).toBe(200);
    const changed = (await confirmed.json()) as BoardDetail;
    expect(changed).toMatchObject({ status: 'changed_since_approval', approval: { revision: approvedRevision }, revision: null });
    expect(changed.fingerprint).not.toBe(approved.fingerprint);

    // Further edits need no confirmation: the board already differs from the approved layout.
    expect((await patch(builder, board.id, { version: changed.version, design: { ...edit, frets: 22, markers: [] } })).status).toBe(200);
    const list = await callRoute(listRoute.GET, { path: `/api/boards?q=${encodeURIComponent(approved.name)}&status=changed_since_approval`, user: builder });
    expect(((await list.json()) as BoardList).items.map((b) => [b.id, b.status])).toEqual([[board.id, 'changed_since_approval']]);
    const approvedList = await callRoute(listRoute.GET, { path: `/api/boards?q=${encodeURIComponent(approved.name)}&status=approved`, user: builder });
    expect(((await approvedList.json()) as BoardList).items).toEqual([]);
  });

  it('renaming an approved board changes neither its fingerprint nor its approval', async () => {
    const board = await newBoard();
    await answer(board.id, 'approved');
    const before = await read(board.id);
    const renamed = await patch(builder, board.id, { version: before.version, design: { ...(before.design as Design), name: `${before.name} (renamed)` } });
    expect(renamed.status).toBe(200);
    expect(await renamed.json()).toMatchObject({ status: 'approved', fingerprint: before.fingerprint });
  });

  it('restoring a revision the client rejected does not show "approved"; restoring the approved one does', async () => {
    const board = await newBoard();
    const approvedRevision = await answer(board.id, 'approved');
    let head = await read(board.id);
    const rejected = { ...(head.design as Design), perpendicularFret: 5 };
    head = (await (await patch(builder, board.id, { version: head.version, design: rejected, confirmApprovalChange: true })).json()) as BoardDetail;
    const rejectedRevision = await answer(board.id, 'changes_requested');
    expect(rejectedRevision).toBe(approvedRevision + 1);
    expect(await statusOf(board.id)).toBe('changes_requested');
    head = await read(board.id);
    head = (await (await patch(builder, board.id, { version: head.version, design: { ...rejected, perpendicularFret: 4 } })).json()) as BoardDetail;
    expect(head.status).toBe('changed_since_approval');

    const backToRejected = await restore(board.id, { revision: rejectedRevision, version: head.version });
    expect(backToRejected.status).toBe(200);
    head = (await backToRejected.json()) as BoardDetail;
    expect(head).toMatchObject({ status: 'changes_requested', revision: rejectedRevision, approval: { revision: approvedRevision } });

    const backToApproved = await restore(board.id, { revision: approvedRevision, version: head.version });
    head = (await backToApproved.json()) as BoardDetail;
    expect(head).toMatchObject({ status: 'approved', revision: approvedRevision, approval: { revision: approvedRevision, fingerprint: head.fingerprint } });
    // Restoring away from the approved layout again asks first.
    const away = await restore(board.id, { revision: rejectedRevision, version: head.version });
    expect(away.status).toBe(409);
    expect(await away.json()).toMatchObject({ code: 'approval_change' });
  });

  it('two builders editing an approved board at once: one change lands, the other gets the stale-version 409 with the board as it now is', async () => {
    const board = await newBoard();
    await answer(board.id, 'approved');
    const seen = await read(board.id);
    const [first, second] = await Promise.all([
      patch(builder, board.id, { version: seen.version, design: { ...(seen.design as Design), perpendicularFret: 6 }, confirmApprovalChange: true }),
      patch(secondBuilder, board.id, { version: seen.version, design: { ...(seen.design as Design), perpendicularFret: 10 }, confirmApprovalChange: true }),
    ]);
    expect([first.status, second.status].sort()).toEqual([200, 409]);
    const loser = (first.status === 409 ? first : second);
    const body = (await loser.json()) as { current: BoardDetail };
    expect(body.current).toMatchObject({ status: 'changed_since_approval', version: seen.version + 1 });
    expect(await statusOf(board.id)).toBe('changed_since_approval');
  });
});

describe('revisions are checkpoints', () => {
  it('autosave makes no revision; a proof of unsaved changes pins a new one', async () => {
    const board = await newBoard();
    let head = board;
    for (const fret of [3, 4, 5]) head = (await (await patch(builder, board.id, { version: head.version, design: { ...(head.design as Design), perpendicularFret: fret } })).json()) as BoardDetail;
    expect((await revisions(board.id)).map((r) => r.revision)).toEqual([1]);
    const revision = await answer(board.id, 'approved');
    expect(revision).toBe(2);
    const kept = await revisions(board.id);
    expect(kept[0]).toMatchObject({ revision: 2, reason: 'proof', fingerprint: head.fingerprint, design: { perpendicularFret: 5 } });
  });

  it('"save revision" keeps the working copy once, with its note; saving again makes nothing new', async () => {
    const board = await newBoard();
    const edited = (await (await patch(builder, board.id, { version: 1, design: { ...(board.design as Design), frets: 22, markers: [] } })).json()) as BoardDetail;
    const save = (note: string) => callRoute(revisionsRoute.POST, { method: 'POST', path: `/api/boards/${board.id}/revisions`, user: builder, params: params(board.id), body: { version: edited.version, note } });
    expect(await (await save('22 frets for the client')).json()).toMatchObject({ revision: 2, workingRevision: 2, version: edited.version });
    expect(await (await save('again')).json()).toMatchObject({ revision: 2 });
    expect((await revisions(board.id)).map((r) => [r.revision, r.note, r.reason])).toEqual([[2, '22 frets for the client', 'saved'], [1, '', 'created']]);
    const bad = await callRoute(revisionsRoute.POST, { method: 'POST', path: `/api/boards/${board.id}/revisions`, user: builder, params: params(board.id), body: { note: 'x'.repeat(501) } });
    expect(bad.status).toBe(400);
    expect(await bad.json()).toMatchObject({ field: 'note' });
  });
});

describe('every export says which revision it is', () => {
  it('an export of unsaved changes makes a revision; PDF, DXF, SVG, CSV and the board file carry its number and fingerprint', async () => {
    const board = await newBoard();
    const edited = (await (await patch(builder, board.id, { version: 1, design: { ...(board.design as Design), perpendicularFret: 7 } })).json()) as BoardDetail;
    expect(edited.revision).toBeNull();
    const fingerprint = edited.fingerprint;
    expect(fingerprint).toMatch(/^[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}$/);
    const slug = edited.name.toLowerCase().replace(/[^a-z0-9]+/g, '-');

    const pdf = await exported(board.id, 'format=pdf&paper=a4');
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get('content-disposition')).toBe(`attachment; filename="${slug}-r2-paper-template.pdf"`);
    const pdfBytes = new Uint8Array(await pdf.arrayBuffer());
    expect(pageText(pdfBytes, 1)).toContain(`revision 2 · fingerprint ${fingerprint}`);
    const doc = await PDFDocument.load(pdfBytes);
    expect(doc.getSubject()).toContain(`revision 2 · fingerprint ${fingerprint}`);
    expect(doc.getKeywords()).toContain(fingerprint);
    expect((await revisions(board.id))[0]).toMatchObject({ revision: 2, reason: 'export', fingerprint });

    const dxf = await exported(board.id, 'format=dxf');
    expect(dxf.headers.get('content-disposition')).toBe(`attachment; filename="${slug}-r2-slot-paths.dxf"`);
    const dxfText = await dxf.text();
    new DxfParser().parseSync(dxfText);
    expect(dxfComments(dxfText)[0]).toContain(`revision 2 - fingerprint ${fingerprint}`);

    const svg = await (await exported(board.id, 'format=svg')).text();
    expect(svg).toMatch(new RegExp(`<metadata>[^<]*revision 2 · fingerprint ${fingerprint}[^<]*</metadata>`));

    const plainCsv = await (await exported(board.id, 'format=csv')).text();
    expect(plainCsv.split('\n')[0]).toBe('fret,string,scale_length,from_nut,from_previous,x,y');
    const commentedCsv = await (await exported(board.id, 'format=csv&sourceComment=true')).text();
    expect(commentedCsv.split('\n')[0]).toMatch(new RegExp(`^# Kerfline: .*revision 2 · fingerprint ${fingerprint}`));
    expect(commentedCsv.split('\n')[1]).toBe('fret,string,scale_length,from_nut,from_previous,x,y');

    const file = await exported(board.id, 'format=json');
    expect(file.headers.get('content-disposition')).toBe(`attachment; filename="${slug}-r2-board.json"`);
    expect(await file.json()).toMatchObject({ revision: 2 });
    // Exporting again made nothing new: the working copy is revision 2.
    expect((await revisions(board.id)).map((r) => r.revision)).toEqual([2, 1]);
  });

  it('an export while the board differs from the approved layout says so on the print', async () => {
    const board = await newBoard();
    const approvedRevision = await answer(board.id, 'approved');
    const head = await read(board.id);
    await patch(builder, board.id, { version: head.version, design: { ...(head.design as Design), perpendicularFret: 2 }, confirmApprovalChange: true });
    const pdfBytes = new Uint8Array(await (await exported(board.id, 'format=pdf&paper=a4')).arrayBuffer());
    expect(pageText(pdfBytes, 1)).toContain('NOT THE APPROVED LAYOUT');
    const dxfText = await (await exported(board.id, 'format=dxf')).text();
    expect(dxfComments(dxfText)[0]).toContain(`NOT THE APPROVED LAYOUT: The client approved revision ${approvedRevision}`);
    // The approved revision itself prints without the warning.
    const approvedPdf = new Uint8Array(await (await exported(board.id, `format=pdf&paper=a4&revision=${approvedRevision}`)).arrayBuffer());
    expect(pageText(approvedPdf, 1)).not.toContain('NOT THE APPROVED LAYOUT');
  });
});
