/**
 * Saved boards (Boards) and their revisions: the one module that reads and writes them (Boards,
 * the editor's page and proofs all come here). Every query is scoped by shop: a design of another
 * shop is simply not found. Every write runs in one transaction, so a failure half-way leaves the
 * previous revision and the head row as they were. Revision rows are only ever inserted.
 *
 * The head row holds the working copy, which autosave overwrites (guarded by `version`, so a
 * stale save is a 409). Revisions are checkpoints: made when a person saves one, when a proof is
 * sent and when an export is made from changes not yet in a revision, so every print and every
 * proof names one. After each change the status is worked out again from the board's proofs
 * (boardApproval), so an approval holds only for the exact layout the client saw.
 */
import { and, asc, desc, eq, isNotNull, isNull, like, or, sql, type SQL } from 'drizzle-orm';
import { toMm } from '~/lib/format/units.ts';
import {
  defaultDirection,
  type BoardDetail,
  type BoardList,
  type BoardListQuery,
  type BoardRevision,
  type BoardStatus,
  type BoardSummary,
  type InstrumentType,
} from '~/lib/schemas/board.ts';
import { DESIGN_LIMITS, validateDesign, type Design } from '~/lib/schemas/design.ts';
import { canonicalJson, designFingerprint } from '~/lib/boards/fingerprint.server.ts';
import { boardApproval, type Approval } from '~/lib/proofs/board-approval.ts';
import type { RevisionReason } from '~/lib/schemas/board.ts';
import { db, type Db } from '~/lib/db/client.server.ts';
import { boardRevisions, boards, proofs, users } from '~/lib/db/schema.ts';
import { withRetry } from '~/lib/db/with-retry.server.ts';
import type { Failure } from '~/lib/http/result.ts';

/** Who writes: the signed-in user's id and shop. */
export interface Writer {
  id: string;
  shopId: number;
}

export type WriteFailure =
  | Failure<'not_found'>
  | Failure<'conflict', { current: BoardDetail }>
  | Failure<'no_such_revision'>
  | Failure<'approval', { approval: Approval }>;
export type WriteResult<T> = { ok: true; value: T } | WriteFailure;

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
/** The pool, or an open transaction of another module (proofs write their own rows beside these). */
export type BoardReader = Db | Tx;
type Head = typeof boards.$inferSelect;

const summaryColumns = {
  id: boards.id,
  name: boards.name,
  instrumentType: boards.instrumentType,
  clientName: boards.clientName,
  units: boards.units,
  status: boards.status,
  archivedAt: boards.archivedAt,
  trebleScaleMm: boards.trebleScaleMm,
  bassScaleMm: boards.bassScaleMm,
  currentRevision: boards.currentRevision,
  workingRevision: boards.workingRevision,
  workingFingerprint: boards.workingFingerprint,
  approvedRevision: boards.approvedRevision,
  approvedFingerprint: boards.approvedFingerprint,
  version: boards.version,
  updatedAt: boards.updatedAt,
  createdAt: boards.createdAt,
};

type SummaryRow = Pick<Head, keyof typeof summaryColumns>;

function toSummary(row: SummaryRow): BoardSummary {
  return {
    id: row.id,
    name: row.name,
    instrumentType: row.instrumentType,
    clientName: row.clientName,
    units: row.units,
    status: (row.archivedAt ? 'archived' : row.status) satisfies BoardStatus,
    trebleScaleMm: row.trebleScaleMm,
    bassScaleMm: row.bassScaleMm,
    currentRevision: row.currentRevision,
    workingRevision: row.workingRevision,
    fingerprint: row.workingFingerprint ?? '',
    approval:
      row.approvedRevision !== null && row.approvedFingerprint !== null
        ? { revision: row.approvedRevision, fingerprint: row.approvedFingerprint }
        : null,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
    createdAt: row.createdAt.toISOString(),
  };
}

/** A revision's stored JSON as a value: MariaDB stores JSON as text, so the driver may hand back a string. */
export function storedJson(value: unknown): unknown {
  return typeof value === 'string' ? (JSON.parse(value) as unknown) : value;
}

/** The head-row columns of a working copy: the design, its fingerprint, and what lists search and sort by. */
function workingFields(design: Design, workingRevision: number | null) {
  return {
    workingData: design,
    workingRevision,
    workingFingerprint: designFingerprint(design),
    name: design.name,
    units: design.units,
    trebleScaleMm: toMm(design.scale.treble, design.units),
    bassScaleMm: toMm(design.scale.bass, design.units),
  };
}

function sameDesign(a: unknown, b: unknown): boolean {
  return canonicalJson(a) === canonicalJson(b);
}

/** `text` for a LIKE pattern: `%`, `_` and a backslash in it are literal characters, not wildcards. */
function likeLiteral(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

function containsPattern(text: string): string {
  return `%${likeLiteral(text)}%`;
}

function listConditions(shopId: number, query: BoardListQuery): SQL | undefined {
  const conditions: (SQL | undefined)[] = [eq(boards.shopId, shopId)];
  if (query.q) {
    const pattern = containsPattern(query.q);
    conditions.push(or(like(boards.name, pattern), like(boards.clientName, pattern)));
  }
  if (query.status === 'active') conditions.push(isNull(boards.archivedAt));
  else if (query.status === 'archived') conditions.push(isNotNull(boards.archivedAt));
  else if (query.status !== 'all') conditions.push(isNull(boards.archivedAt), eq(boards.status, query.status));
  if (query.instrument) conditions.push(eq(boards.instrumentType, query.instrument));
  if (query.units) conditions.push(eq(boards.units, query.units));
  return and(...conditions);
}

function listOrder(query: BoardListQuery): SQL[] {
  const by = (query.dir ?? defaultDirection(query.sort)) === 'asc' ? asc : desc;
  switch (query.sort) {
    case 'name':
      return [by(boards.name), by(boards.id)];
    case 'scale':
      return [by(boards.trebleScaleMm), by(boards.bassScaleMm), by(boards.id)];
    case 'updated':
      return [by(boards.updatedAt), by(boards.id)];
  }
}

/** One page of the shop's boards, with the total matching the filters. */
export async function listBoards(shopId: number, query: BoardListQuery): Promise<BoardList> {
  const where = listConditions(shopId, query);
  const [rows, totals] = await Promise.all([
    db()
      .select(summaryColumns)
      .from(boards)
      .where(where)
      .orderBy(...listOrder(query))
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize),
    db().select({ n: sql<number>`count(*)` }).from(boards).where(where),
  ]);
  return { items: rows.map(toSummary), total: Number(totals[0]?.n ?? 0), page: query.page, pageSize: query.pageSize };
}

async function readDetail(handle: Db | Tx, shopId: number, id: number, revision?: number): Promise<BoardDetail | null> {
  if (revision === undefined) {
    const [row] = await handle
      .select({ ...summaryColumns, data: boards.workingData })
      .from(boards)
      .where(and(eq(boards.id, id), eq(boards.shopId, shopId)))
      .limit(1);
    if (!row) return null;
    return { ...toSummary(row), revision: row.workingRevision, design: storedJson(row.data) };
  }
  const [row] = await handle
    .select({ ...summaryColumns, revision: boardRevisions.revision, data: boardRevisions.data, fingerprint: boardRevisions.fingerprint })
    .from(boards)
    .innerJoin(boardRevisions, eq(boardRevisions.boardId, boards.id))
    .where(and(eq(boards.id, id), eq(boards.shopId, shopId), eq(boardRevisions.revision, revision)))
    .limit(1);
  if (!row) return null;
  return { ...toSummary(row), revision: row.revision, fingerprint: row.fingerprint ?? '', design: storedJson(row.data) };
}

/**
 * A board with its working copy (`revision` is the revision it equals, null when it has changes
 * not yet in one), or the given revision's design; null when the shop has no such board or revision.
 */
export function getBoard(shopId: number, id: number, revision?: number): Promise<BoardDetail | null> {
  return readDetail(db(), shopId, id, revision);
}

/** True when the shop has a board with this id (to tell a missing board from a missing revision). */
export async function boardExists(shopId: number, id: number): Promise<boolean> {
  const [row] = await db().select({ id: boards.id }).from(boards).where(and(eq(boards.id, id), eq(boards.shopId, shopId))).limit(1);
  return !!row;
}

export interface NewBoard {
  design: Design;
  instrumentType: InstrumentType;
  clientName: string;
  note: string;
}

async function insertBoard(tx: Tx, writer: Writer, board: NewBoard, reason: RevisionReason): Promise<number> {
  const working = workingFields(board.design, 1);
  const [head] = await tx
    .insert(boards)
    .values({
      shopId: writer.shopId,
      ...working,
      instrumentType: board.instrumentType,
      clientName: board.clientName,
      createdBy: writer.id,
      updatedBy: writer.id,
    })
    .$returningId();
  const id = head!.id;
  await tx.insert(boardRevisions).values({
    boardId: id,
    revision: 1,
    data: board.design,
    note: board.note,
    reason,
    fingerprint: working.workingFingerprint,
    authorId: writer.id,
  });
  return id;
}

/** Saves a new board with its first revision (`reason` says whether it was made here or imported). */
export async function createBoard(writer: Writer, board: NewBoard, reason: RevisionReason = 'created'): Promise<BoardDetail> {
  return db().transaction(async (tx) => {
    const id = await insertBoard(tx, writer, board, reason);
    return (await readDetail(tx, writer.shopId, id))!;
  });
}

/** The locked head row with its working copy. */
interface Locked {
  head: Head;
  design: unknown;
}

/** Locks the shop's head row for the rest of the transaction and reads its working copy. */
async function lockHead(tx: Tx, shopId: number, id: number): Promise<Locked | undefined> {
  const [head] = await tx
    .select()
    .from(boards)
    .where(and(eq(boards.id, id), eq(boards.shopId, shopId)))
    .for('update');
  return head ? { head, design: storedJson(head.workingData) } : undefined;
}

function detailOf(head: Head): BoardDetail {
  return { ...toSummary(head), revision: head.workingRevision, design: storedJson(head.workingData) };
}

/** Inserts the next revision holding `design`; returns its number. */
async function appendRevision(tx: Tx, writer: Writer, head: Head, design: unknown, note: string, reason: RevisionReason): Promise<number> {
  const revision = head.currentRevision + 1;
  await tx.insert(boardRevisions).values({
    boardId: head.id,
    revision,
    data: design,
    note,
    reason,
    fingerprint: designFingerprint(design),
    authorId: writer.id,
  });
  return revision;
}

async function revisionData(tx: Tx, boardId: number, revision: number): Promise<unknown> {
  const [row] = await tx
    .select({ data: boardRevisions.data })
    .from(boardRevisions)
    .where(and(eq(boardRevisions.boardId, boardId), eq(boardRevisions.revision, revision)))
    .limit(1);
  return row ? storedJson(row.data) : undefined;
}

/**
 * The locked board's working copy as a revision: the revision it already equals, or a new one
 * made for `reason`. The working copy is unchanged, so the version stays (the editor's next
 * autosave is not a conflict). Returns the revision's number and fingerprint.
 */
export async function checkpointLocked(
  tx: Tx,
  writer: Writer,
  head: Head,
  reason: RevisionReason,
  note: string,
): Promise<{ revision: number; fingerprint: string; head: Head }> {
  const fingerprint = head.workingFingerprint ?? designFingerprint(storedJson(head.workingData));
  if (head.workingRevision !== null) return { revision: head.workingRevision, fingerprint, head };
  const revision = await appendRevision(tx, writer, head, storedJson(head.workingData), note, reason);
  await tx.update(boards).set({ currentRevision: revision, workingRevision: revision }).where(eq(boards.id, head.id));
  return { revision, fingerprint, head: { ...head, currentRevision: revision, workingRevision: revision } };
}

/** Locks a board of the shop for another module's transaction (proofs pin a revision this way). */
export function lockBoard(tx: Tx, shopId: number, id: number): Promise<Head | undefined> {
  return lockHead(tx, shopId, id).then((locked) => locked?.head);
}

/**
 * Works out the board's status and standing approval again from its proofs and working copy,
 * and stores them (the version is left alone: a client's answer is not an edit). Run after every
 * change to either.
 */
export async function refreshApproval(tx: BoardReader, shopId: number, boardId: number): Promise<void> {
  const [head] = await tx
    .select({ workingFingerprint: boards.workingFingerprint })
    .from(boards)
    .where(and(eq(boards.id, boardId), eq(boards.shopId, shopId)));
  if (!head?.workingFingerprint) return;
  const rows = await tx
    .select({
      revision: proofs.revision,
      fingerprint: proofs.fingerprint,
      decision: proofs.decision,
      decidedAt: proofs.decidedAt,
      createdAt: proofs.createdAt,
      revokedAt: proofs.revokedAt,
    })
    .from(proofs)
    .where(and(eq(proofs.shopId, shopId), eq(proofs.boardId, boardId)));
  const facts = rows.map((r) => ({ ...r, fingerprint: r.fingerprint ?? '', revoked: r.revokedAt !== null }));
  const { status, approval } = boardApproval(facts, head.workingFingerprint);
  await tx
    .update(boards)
    .set({ status, approvedRevision: approval?.revision ?? null, approvedFingerprint: approval?.fingerprint ?? null })
    .where(eq(boards.id, boardId));
}

/**
 * A change of layout on a board the client approved as it stands needs the writer to say so
 * (`confirmApprovalChange`): the editor shows the warning first. Null when the change may go ahead.
 */
function approvalGuard(head: Head, nextFingerprint: string, confirmed: boolean | undefined): WriteResult<never> | null {
  if (confirmed || head.approvedRevision === null || head.approvedFingerprint === null) return null;
  if (head.workingFingerprint !== head.approvedFingerprint || nextFingerprint === head.approvedFingerprint) return null;
  return { ok: false, reason: 'approval', approval: { revision: head.approvedRevision, fingerprint: head.approvedFingerprint } };
}

/**
 * Runs `change` on the locked head row when `expectedVersion` (if given) is still current; a stale
 * version is a conflict carrying the board as it now is, so the caller's edit is never lost.
 */
async function writeLocked<T>(
  writer: Writer,
  id: number,
  expectedVersion: number | undefined,
  change: (tx: Tx, locked: Locked) => Promise<WriteResult<T>>,
): Promise<WriteResult<T>> {
  return withRetry(() => db().transaction(async (tx) => {
    const locked = await lockHead(tx, writer.shopId, id);
    if (!locked) return { ok: false, reason: 'not_found' };
    if (expectedVersion !== undefined && expectedVersion !== locked.head.version) {
      return { ok: false, reason: 'conflict', current: detailOf(locked.head) };
    }
    return change(tx, locked);
  }));
}

/** Writes `fields` to the head row with the next version; returns the row as it now is. */
async function touchHead(tx: Tx, writer: Writer, head: Head, fields: Partial<Head>): Promise<Head> {
  const next: Head = { ...head, ...fields, version: head.version + 1, updatedBy: writer.id, updatedAt: new Date() };
  await tx
    .update(boards)
    .set({ ...fields, version: next.version, updatedBy: next.updatedBy, updatedAt: next.updatedAt })
    .where(eq(boards.id, head.id));
  return next;
}

export interface BoardChange {
  version: number;
  design?: Design | undefined;
  instrumentType?: InstrumentType | undefined;
  clientName?: string | undefined;
  note: string;
  /** Also keep the result as a revision (with `note`). */
  saveRevision?: boolean | undefined;
  /** The writer has seen that this change moves the board off the layout the client approved. */
  confirmApprovalChange?: boolean | undefined;
}

/**
 * Updates a board the writer last saw at `change.version`: the working copy takes the design
 * (no revision is made unless `saveRevision` asks for one); an update that changes nothing
 * writes nothing. Moving an approved board off its approved layout needs `confirmApprovalChange`.
 */
export function updateBoard(writer: Writer, id: number, change: BoardChange): Promise<WriteResult<BoardDetail>> {
  return writeLocked(writer, id, change.version, async (tx, { head, design: current }) => {
    const designChanged = change.design !== undefined && !sameDesign(change.design, current);
    const fields: Partial<Head> = {};
    if (change.instrumentType !== undefined && change.instrumentType !== head.instrumentType) fields.instrumentType = change.instrumentType;
    if (change.clientName !== undefined && change.clientName !== head.clientName) fields.clientName = change.clientName;
    if (designChanged && change.design) {
      const latest = await revisionData(tx, head.id, head.currentRevision);
      Object.assign(fields, workingFields(change.design, sameDesign(change.design, latest) ? head.currentRevision : null));
      const refused = approvalGuard(head, fields.workingFingerprint!, change.confirmApprovalChange);
      if (refused) return refused;
    }
    let next = Object.keys(fields).length === 0 ? head : await touchHead(tx, writer, head, fields);
    if (change.saveRevision) next = (await checkpointLocked(tx, writer, next, 'saved', change.note)).head;
    if (designChanged) await refreshApproval(tx, writer.shopId, id);
    return { ok: true, value: (await readDetail(tx, writer.shopId, id))! };
  });
}

/** Keeps the working copy as a revision with a note (nothing new when it already is one). */
export function saveRevision(writer: Writer, id: number, version: number | undefined, note: string): Promise<WriteResult<BoardDetail>> {
  return writeLocked(writer, id, version, async (tx, { head }) => {
    await checkpointLocked(tx, writer, head, 'saved', note);
    return { ok: true, value: (await readDetail(tx, writer.shopId, id))! };
  });
}

/**
 * The working copy as a revision for an export of the board (made when it has changes not yet in
 * one), so every print names a revision. Null when the shop has no such board.
 */
export async function exportRevision(writer: Writer, id: number): Promise<BoardDetail | null> {
  return withRetry(() =>
    db().transaction(async (tx) => {
      const locked = await lockHead(tx, writer.shopId, id);
      if (!locked) return null;
      const { revision } = await checkpointLocked(tx, writer, locked.head, 'export', 'Made for an export');
      return readDetail(tx, writer.shopId, id, revision);
    }),
  );
}

/**
 * Makes revision `revision` the working copy again. No revision is made: the working copy equals
 * that one exactly, so exports name it; restoring the approved revision makes the board approved again.
 */
export function restoreRevision(
  writer: Writer,
  id: number,
  revision: number,
  version: number,
  confirmApprovalChange?: boolean,
): Promise<WriteResult<BoardDetail>> {
  return writeLocked(writer, id, version, async (tx, { head }) => {
    const old = await readDetail(tx, writer.shopId, id, revision);
    if (!old) return { ok: false, reason: 'no_such_revision' };
    const fields = workingFields(old.design as Design, revision);
    const refused = approvalGuard(head, fields.workingFingerprint, confirmApprovalChange);
    if (refused) return refused;
    await touchHead(tx, writer, head, fields);
    await refreshApproval(tx, writer.shopId, id);
    return { ok: true, value: (await readDetail(tx, writer.shopId, id))! };
  });
}

/** Archives or unarchives a board (it keeps its status and revisions). */
export function setArchived(writer: Writer, id: number, archived: boolean, version?: number): Promise<WriteResult<BoardDetail>> {
  return writeLocked(writer, id, version, async (tx, { head }) => {
    if (archived === (head.archivedAt !== null)) return { ok: true, value: detailOf(head) };
    const next = await touchHead(tx, writer, head, { archivedAt: archived ? new Date() : null });
    return { ok: true, value: detailOf(next) };
  });
}

/**
 * `name`, or the first of "name (2)", "name (3)", … that no board of the shop has yet (archived
 * ones included, so bringing one back never makes two of a name). Cut to the longest name allowed.
 */
export async function freeBoardName(shopId: number, name: string): Promise<string> {
  const rows = await db()
    .select({ name: boards.name })
    .from(boards)
    .where(and(eq(boards.shopId, shopId), or(eq(boards.name, name), like(boards.name, `${likeLiteral(name)} (%)`))));
  const taken = new Set(rows.map((r) => r.name));
  if (!taken.has(name)) return name;
  for (let n = 2; ; n++) {
    const suffix = ` (${n})`;
    const candidate = `${name.slice(0, DESIGN_LIMITS.nameMaxChars - suffix.length)}${suffix}`;
    if (!taken.has(candidate)) return candidate;
  }
}

/** "Copy of <name>", cut to the longest name a design may have. */
export function copyName(name: string): string {
  return `Copy of ${name}`.slice(0, DESIGN_LIMITS.nameMaxChars);
}

/** A new board holding the current design of `id` (renamed), with its own revision history. */
export async function duplicateBoard(writer: Writer, id: number): Promise<BoardDetail | null> {
  return db().transaction(async (tx) => {
    const source = await readDetail(tx, writer.shopId, id);
    if (!source) return null;
    const design = { ...(source.design as Design), name: copyName(source.name) };
    const from = source.revision === null ? 'its working copy' : `revision ${source.revision}`;
    const copyId = await insertBoard(
      tx,
      writer,
      { design, instrumentType: source.instrumentType as InstrumentType, clientName: source.clientName, note: `Copied from "${source.name}", ${from}` },
      'created',
    );
    return readDetail(tx, writer.shopId, copyId);
  });
}

/** Every revision of a board, newest first; null when the shop has no such board. */
export async function listRevisions(shopId: number, id: number): Promise<BoardRevision[] | null> {
  if (!(await boardExists(shopId, id))) return null;
  const rows = await db()
    .select({
      revision: boardRevisions.revision,
      note: boardRevisions.note,
      reason: boardRevisions.reason,
      fingerprint: boardRevisions.fingerprint,
      authorName: users.displayName,
      createdAt: boardRevisions.createdAt,
      data: boardRevisions.data,
    })
    .from(boardRevisions)
    .leftJoin(users, eq(users.id, boardRevisions.authorId))
    .where(eq(boardRevisions.boardId, id))
    .orderBy(desc(boardRevisions.revision));
  return rows.map((row) => ({
    revision: row.revision,
    note: row.note,
    reason: row.reason,
    fingerprint: row.fingerprint ?? '',
    authorName: row.authorName ?? '',
    createdAt: row.createdAt.toISOString(),
    design: storedJson(row.data),
  }));
}

/** The few head-row fields another module needs to point at a design (e.g. a proof of its current revision). */
export interface BoardHead {
  id: number;
  shopId: number;
  name: string;
  currentRevision: number;
}

/** The design's head row, or null when it is not in this shop. */
export async function findShopBoard(reader: BoardReader, shopId: number, boardId: number): Promise<BoardHead | null> {
  const [row] = await reader
    .select({ id: boards.id, shopId: boards.shopId, name: boards.name, currentRevision: boards.currentRevision })
    .from(boards)
    .where(and(eq(boards.id, boardId), eq(boards.shopId, shopId)))
    .limit(1);
  return row ?? null;
}

/**
 * One revision's design, validated (defaults filled); null when missing or no longer valid. The
 * caller has already scoped `boardId` to a shop (a proof row, or findShopBoard).
 */
export async function findRevisionDesign(reader: BoardReader, boardId: number, revision: number): Promise<Design | null> {
  const [row] = await reader
    .select({ data: boardRevisions.data })
    .from(boardRevisions)
    .where(and(eq(boardRevisions.boardId, boardId), eq(boardRevisions.revision, revision)))
    .limit(1);
  if (!row) return null;
  const validation = validateDesign(storedJson(row.data));
  return validation.ok ? validation.design : null;
}

/** One revision's fingerprint, scoped to the shop; null when there is no such revision. */
export async function revisionFingerprint(shopId: number, boardId: number, revision: number): Promise<string | null> {
  const [row] = await db()
    .select({ fingerprint: boardRevisions.fingerprint })
    .from(boardRevisions)
    .innerJoin(boards, eq(boards.id, boardRevisions.boardId))
    .where(and(eq(boards.shopId, shopId), eq(boardRevisions.boardId, boardId), eq(boardRevisions.revision, revision)))
    .limit(1);
  return row?.fingerprint ?? null;
}
