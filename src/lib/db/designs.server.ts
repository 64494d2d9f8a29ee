/**
 * Saved designs (Boards) and their revisions: the one module that reads and writes them (Boards,
 * the editor's page and proofs all come here). Every query is scoped by shop: a design of another
 * shop is simply not found. Every write runs in one transaction, so a failure half-way leaves the
 * previous revision and the head row as they were. Revision rows are only ever inserted.
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
import { db, type Db } from './client.server.ts';
import { withRetry } from './with-retry.server.ts';
import { designRevisions, designs, users, type DesignStatus } from './schema.ts';

/** Who writes: the signed-in user's id and shop. */
export interface Writer {
  id: string;
  shopId: number;
}

export type WriteResult<T> =
  | { ok: true; value: T }
  | { ok: false; reason: 'not_found' }
  | { ok: false; reason: 'conflict'; current: BoardDetail }
  | { ok: false; reason: 'no_such_revision' };

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
/** The pool, or an open transaction of another module (proofs write their own rows beside these). */
export type DesignReader = Db | Tx;
type Head = typeof designs.$inferSelect;

const summaryColumns = {
  id: designs.id,
  name: designs.name,
  instrumentType: designs.instrumentType,
  clientName: designs.clientName,
  units: designs.units,
  status: designs.status,
  archivedAt: designs.archivedAt,
  trebleScaleMm: designs.trebleScaleMm,
  bassScaleMm: designs.bassScaleMm,
  currentRevision: designs.currentRevision,
  version: designs.version,
  updatedAt: designs.updatedAt,
  createdAt: designs.createdAt,
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
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
    createdAt: row.createdAt.toISOString(),
  };
}

/** A revision's stored JSON as a value: MariaDB stores JSON as text, so the driver may hand back a string. */
export function storedJson(value: unknown): unknown {
  return typeof value === 'string' ? (JSON.parse(value) as unknown) : value;
}

/** The head-row columns that mirror the design, so lists can search and sort without the JSON. */
function mirroredFields(design: Design) {
  return {
    name: design.name,
    units: design.units,
    trebleScaleMm: toMm(design.scale.treble, design.units),
    bassScaleMm: toMm(design.scale.bass, design.units),
  };
}

/** `text` for a LIKE pattern: `%`, `_` and a backslash in it are literal characters, not wildcards. */
function likeLiteral(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

function containsPattern(text: string): string {
  return `%${likeLiteral(text)}%`;
}

function listConditions(shopId: number, query: BoardListQuery): SQL | undefined {
  const conditions: (SQL | undefined)[] = [eq(designs.shopId, shopId)];
  if (query.q) {
    const pattern = containsPattern(query.q);
    conditions.push(or(like(designs.name, pattern), like(designs.clientName, pattern)));
  }
  if (query.status === 'active') conditions.push(isNull(designs.archivedAt));
  else if (query.status === 'archived') conditions.push(isNotNull(designs.archivedAt));
  else if (query.status !== 'all') conditions.push(isNull(designs.archivedAt), eq(designs.status, query.status));
  if (query.instrument) conditions.push(eq(designs.instrumentType, query.instrument));
  if (query.units) conditions.push(eq(designs.units, query.units));
  return and(...conditions);
}

function listOrder(query: BoardListQuery): SQL[] {
  const by = (query.dir ?? defaultDirection(query.sort)) === 'asc' ? asc : desc;
  switch (query.sort) {
    case 'name':
      return [by(designs.name), by(designs.id)];
    case 'scale':
      return [by(designs.trebleScaleMm), by(designs.bassScaleMm), by(designs.id)];
    case 'updated':
      return [by(designs.updatedAt), by(designs.id)];
  }
}

/** One page of the shop's boards, with the total matching the filters. */
export async function listDesigns(shopId: number, query: BoardListQuery): Promise<BoardList> {
  const where = listConditions(shopId, query);
  const [rows, totals] = await Promise.all([
    db()
      .select(summaryColumns)
      .from(designs)
      .where(where)
      .orderBy(...listOrder(query))
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize),
    db().select({ n: sql<number>`count(*)` }).from(designs).where(where),
  ]);
  return { items: rows.map(toSummary), total: Number(totals[0]?.n ?? 0), page: query.page, pageSize: query.pageSize };
}

async function readDetail(handle: Db | Tx, shopId: number, id: number, revision?: number): Promise<BoardDetail | null> {
  const [row] = await handle
    .select({ ...summaryColumns, revision: designRevisions.revision, data: designRevisions.data })
    .from(designs)
    .innerJoin(designRevisions, eq(designRevisions.designId, designs.id))
    .where(
      and(
        eq(designs.id, id),
        eq(designs.shopId, shopId),
        revision === undefined ? eq(designRevisions.revision, designs.currentRevision) : eq(designRevisions.revision, revision),
      ),
    )
    .limit(1);
  if (!row) return null;
  return { ...toSummary(row), revision: row.revision, design: storedJson(row.data) };
}

/** A board with its current design, or the given revision's; null when the shop has no such board or revision. */
export function getDesign(shopId: number, id: number, revision?: number): Promise<BoardDetail | null> {
  return readDetail(db(), shopId, id, revision);
}

/** True when the shop has a board with this id (to tell a missing board from a missing revision). */
export async function designExists(shopId: number, id: number): Promise<boolean> {
  const [row] = await db().select({ id: designs.id }).from(designs).where(and(eq(designs.id, id), eq(designs.shopId, shopId))).limit(1);
  return !!row;
}

export interface NewBoard {
  design: Design;
  instrumentType: InstrumentType;
  clientName: string;
  note: string;
}

async function insertBoard(tx: Tx, writer: Writer, board: NewBoard): Promise<number> {
  const [head] = await tx
    .insert(designs)
    .values({
      shopId: writer.shopId,
      ...mirroredFields(board.design),
      instrumentType: board.instrumentType,
      clientName: board.clientName,
      createdBy: writer.id,
      updatedBy: writer.id,
    })
    .$returningId();
  const id = head!.id;
  await tx.insert(designRevisions).values({ designId: id, revision: 1, data: board.design, note: board.note, authorId: writer.id });
  return id;
}

/** Saves a new board with its first revision. */
export async function createDesign(writer: Writer, board: NewBoard): Promise<BoardDetail> {
  return db().transaction(async (tx) => {
    const id = await insertBoard(tx, writer, board);
    return (await readDetail(tx, writer.shopId, id))!;
  });
}

/** The locked head row with its current revision's design. */
interface Locked {
  head: Head;
  design: unknown;
}

/** Locks the shop's head row for the rest of the transaction and reads its current design. */
async function lockHead(tx: Tx, shopId: number, id: number): Promise<Locked | undefined> {
  const [row] = await tx
    .select({ head: designs, data: designRevisions.data })
    .from(designs)
    .innerJoin(designRevisions, and(eq(designRevisions.designId, designs.id), eq(designRevisions.revision, designs.currentRevision)))
    .where(and(eq(designs.id, id), eq(designs.shopId, shopId)))
    .for('update');
  return row ? { head: row.head, design: storedJson(row.data) } : undefined;
}

function detailOf(head: Head, design: unknown): BoardDetail {
  return { ...toSummary(head), revision: head.currentRevision, design };
}

async function appendRevision(tx: Tx, writer: Writer, head: Head, design: Design, note: string): Promise<number> {
  const revision = head.currentRevision + 1;
  await tx.insert(designRevisions).values({ designId: head.id, revision, data: design, note, authorId: writer.id });
  return revision;
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
      return { ok: false, reason: 'conflict', current: detailOf(locked.head, locked.design) };
    }
    return change(tx, locked);
  }));
}

/** Writes `fields` to the head row with the next version; returns the row as it now is. */
async function touchHead(tx: Tx, writer: Writer, head: Head, fields: Partial<Head>): Promise<Head> {
  const next: Head = { ...head, ...fields, version: head.version + 1, updatedBy: writer.id, updatedAt: new Date() };
  await tx
    .update(designs)
    .set({ ...fields, version: next.version, updatedBy: next.updatedBy, updatedAt: next.updatedAt })
    .where(eq(designs.id, head.id));
  return next;
}

export interface BoardChange {
  version: number;
  design?: Design | undefined;
  instrumentType?: InstrumentType | undefined;
  clientName?: string | undefined;
  note: string;
}

/**
 * Updates a board the writer last saw at `change.version`. A design that differs from the current
 * revision becomes a new revision; an update that changes nothing writes nothing.
 */
export function updateDesign(writer: Writer, id: number, change: BoardChange): Promise<WriteResult<BoardDetail>> {
  return writeLocked(writer, id, change.version, async (tx, { head, design: current }) => {
    const designChanged = change.design !== undefined && JSON.stringify(change.design) !== JSON.stringify(current);
    const fields: Partial<Head> = {};
    if (change.instrumentType !== undefined && change.instrumentType !== head.instrumentType) fields.instrumentType = change.instrumentType;
    if (change.clientName !== undefined && change.clientName !== head.clientName) fields.clientName = change.clientName;
    if (designChanged && change.design) {
      fields.currentRevision = await appendRevision(tx, writer, head, change.design, change.note);
      Object.assign(fields, mirroredFields(change.design));
    }
    if (Object.keys(fields).length === 0) return { ok: true, value: detailOf(head, current) };
    const next = await touchHead(tx, writer, head, fields);
    return { ok: true, value: detailOf(next, designChanged ? change.design : current) };
  });
}

/** Makes revision `revision` current again by copying it into a new revision. */
export function restoreRevision(writer: Writer, id: number, revision: number, version: number): Promise<WriteResult<BoardDetail>> {
  return writeLocked(writer, id, version, async (tx, { head }) => {
    const old = await readDetail(tx, writer.shopId, id, revision);
    if (!old) return { ok: false, reason: 'no_such_revision' };
    const design = old.design as Design;
    const currentRevision = await appendRevision(tx, writer, head, design, `Restored revision ${revision}`);
    const next = await touchHead(tx, writer, head, { currentRevision, ...mirroredFields(design) });
    return { ok: true, value: detailOf(next, design) };
  });
}

/** Archives or unarchives a board (it keeps its status and revisions). */
export function setArchived(writer: Writer, id: number, archived: boolean, version?: number): Promise<WriteResult<BoardDetail>> {
  return writeLocked(writer, id, version, async (tx, { head, design }) => {
    if (archived === (head.archivedAt !== null)) return { ok: true, value: detailOf(head, design) };
    const next = await touchHead(tx, writer, head, { archivedAt: archived ? new Date() : null });
    return { ok: true, value: detailOf(next, design) };
  });
}

/**
 * `name`, or the first of "name (2)", "name (3)", … that no board of the shop has yet (archived
 * ones included, so bringing one back never makes two of a name). Cut to the longest name allowed.
 */
export async function freeBoardName(shopId: number, name: string): Promise<string> {
  const rows = await db()
    .select({ name: designs.name })
    .from(designs)
    .where(and(eq(designs.shopId, shopId), or(eq(designs.name, name), like(designs.name, `${likeLiteral(name)} (%)`))));
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
export async function duplicateDesign(writer: Writer, id: number): Promise<BoardDetail | null> {
  return db().transaction(async (tx) => {
    const source = await readDetail(tx, writer.shopId, id);
    if (!source) return null;
    const design = { ...(source.design as Design), name: copyName(source.name) };
    const copyId = await insertBoard(tx, writer, {
      design,
      instrumentType: source.instrumentType as InstrumentType,
      clientName: source.clientName,
      note: `Copied from "${source.name}" revision ${source.revision}`,
    });
    return readDetail(tx, writer.shopId, copyId);
  });
}

/** Every revision of a board, newest first; null when the shop has no such board. */
export async function listRevisions(shopId: number, id: number): Promise<BoardRevision[] | null> {
  if (!(await designExists(shopId, id))) return null;
  const rows = await db()
    .select({
      revision: designRevisions.revision,
      note: designRevisions.note,
      authorName: users.displayName,
      createdAt: designRevisions.createdAt,
      data: designRevisions.data,
    })
    .from(designRevisions)
    .leftJoin(users, eq(users.id, designRevisions.authorId))
    .where(eq(designRevisions.designId, id))
    .orderBy(desc(designRevisions.revision));
  return rows.map((row) => ({
    revision: row.revision,
    note: row.note,
    authorName: row.authorName ?? '',
    createdAt: row.createdAt.toISOString(),
    design: storedJson(row.data),
  }));
}

/** The few head-row fields another module needs to point at a design (e.g. a proof of its current revision). */
export interface DesignHead {
  id: number;
  shopId: number;
  name: string;
  currentRevision: number;
}

/** The design's head row, or null when it is not in this shop. */
export async function findShopDesign(reader: DesignReader, shopId: number, designId: number): Promise<DesignHead | null> {
  const [row] = await reader
    .select({ id: designs.id, shopId: designs.shopId, name: designs.name, currentRevision: designs.currentRevision })
    .from(designs)
    .where(and(eq(designs.id, designId), eq(designs.shopId, shopId)))
    .limit(1);
  return row ?? null;
}

/**
 * One revision's design, validated (defaults filled); null when missing or no longer valid. The
 * caller has already scoped `designId` to a shop (a proof row, or findShopDesign).
 */
export async function findRevisionDesign(reader: DesignReader, designId: number, revision: number): Promise<Design | null> {
  const [row] = await reader
    .select({ data: designRevisions.data })
    .from(designRevisions)
    .where(and(eq(designRevisions.designId, designId), eq(designRevisions.revision, revision)))
    .limit(1);
  if (!row) return null;
  const validation = validateDesign(storedJson(row.data));
  return validation.ok ? validation.design : null;
}

/**
 * Sets the design's status (a proof was sent, approved or answered with changes). The
 * optimistic-concurrency version is left alone on purpose: a client's answer is not an edit, and
 * must not turn the builder's next save into a conflict.
 */
export async function setDesignStatus(writer: DesignReader, shopId: number, designId: number, status: DesignStatus): Promise<void> {
  await writer.update(designs).set({ status }).where(and(eq(designs.id, designId), eq(designs.shopId, shopId)));
}
