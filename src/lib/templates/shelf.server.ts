/**
 * Template shelf queries. Every function takes the caller's shopId and never reads or writes
 * another shop's rows: a template or design of another shop is simply "not found".
 */
import { and, asc, count, desc, eq, isNull, like, or, sql, type SQL } from 'drizzle-orm';
import type { Db } from '~/lib/db/client.server.ts';
import type { FieldIssue } from '~/lib/http/problem.ts';
import type { Failure } from '~/lib/http/result.ts';
import { MM_PER_INCH } from '~/lib/format/units.ts';
import { boardRevisions, boards, templateChecks, templates } from '~/lib/db/schema.ts';
import type { CheckResult } from '~/lib/templates/check/compare.ts';
import { runCheck } from '~/lib/templates/check/run-check.ts';
import { readSavedResult } from '~/lib/templates/check/saved-result.ts';
import { standInDesign } from '~/lib/templates/template-design.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';
import type { CheckGrid, TemplateCreate, TemplateListQuery, TemplatePage, TemplateUpdate, TemplateView } from '~/lib/schemas/template.ts';

type TemplateRow = typeof templates.$inferSelect;
type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
/** The pool or an open transaction: the functions below run in either. */
type Conn = Db | Tx;

export type ShelfFailure = Failure<'not_found', { message: string; field?: string }> | Failure<'invalid', { issues: FieldIssue[] }>;
export type ShelfResult<T> = { ok: true; value: T } | ShelfFailure;

const notFound = (message: string, field?: string): ShelfFailure => ({ ok: false, reason: 'not_found', message, ...(field ? { field } : {}) });

const viewColumns = { template: templates, boardName: boards.name };

function toView(row: { template: TemplateRow; boardName: string | null }): TemplateView {
  const t = row.template;
  return {
    id: t.id,
    name: t.name,
    boardId: t.boardId,
    boardName: row.boardName,
    revision: t.revision,
    units: t.units,
    trebleScale: t.trebleScale,
    bassScale: t.bassScale,
    frets: t.frets,
    slotWidth: t.slotWidth,
    keyWidth: t.keyWidth,
    material: t.material,
    storagePlace: t.storagePlace,
    condition: t.condition,
    madeOn: t.madeOn,
    lastCheckedOn: t.lastCheckedOn?.toISOString() ?? null,
    lastCheckPassed: t.lastCheckPassed,
    notes: t.notes,
    updatedAt: t.updatedAt.toISOString(),
  };
}

/** Scale lengths compared in mm so inch and mm templates sort together. */
const trebleScaleMm = sql`(CASE WHEN ${templates.units} = 'in' THEN ${templates.trebleScale} * ${sql.raw(String(MM_PER_INCH))} ELSE ${templates.trebleScale} END)`;

const SORT_COLUMNS: Record<TemplateListQuery['sort'], SQL | typeof templates.name> = {
  name: templates.name,
  scale: trebleScaleMm,
  madeOn: sql`${templates.madeOn}`,
  lastChecked: sql`${templates.lastCheckedOn}`,
  updated: sql`${templates.updatedAt}`,
};

/** Escapes LIKE wildcards so a search for "50%" means the text "50%". */
function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

export async function listTemplates(db: Db, shopId: number, query: TemplateListQuery): Promise<TemplatePage> {
  const filters: SQL[] = [eq(templates.shopId, shopId)];
  if (query.condition) filters.push(eq(templates.condition, query.condition));
  if (query.lastResult === 'never') filters.push(isNull(templates.lastCheckedOn));
  else if (query.lastResult) filters.push(eq(templates.lastCheckPassed, query.lastResult === 'pass'));
  if (query.q) {
    const pattern = likePattern(query.q);
    filters.push(
      or(
        like(templates.name, pattern),
        like(templates.material, pattern),
        like(templates.storagePlace, pattern),
        like(templates.notes, pattern),
        like(boards.name, pattern),
      )!,
    );
  }
  const where = and(...filters);
  const order = query.dir === 'asc' ? asc : desc;
  const [rows, [total]] = await Promise.all([
    db
      .select(viewColumns)
      .from(templates)
      .leftJoin(boards, and(eq(boards.id, templates.boardId), eq(boards.shopId, templates.shopId)))
      .where(where)
      .orderBy(order(SORT_COLUMNS[query.sort]), order(templates.id))
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize),
    db
      .select({ n: count() })
      .from(templates)
      .leftJoin(boards, and(eq(boards.id, templates.boardId), eq(boards.shopId, templates.shopId)))
      .where(where),
  ]);
  return { items: rows.map(toView), total: total?.n ?? 0, page: query.page, pageSize: query.pageSize };
}

export async function getTemplate(db: Conn, shopId: number, id: number): Promise<TemplateView | null> {
  const [row] = await db
    .select(viewColumns)
    .from(templates)
    .leftJoin(boards, and(eq(boards.id, templates.boardId), eq(boards.shopId, templates.shopId)))
    .where(and(eq(templates.shopId, shopId), eq(templates.id, id)))
    .limit(1);
  return row ? toView(row) : null;
}

/** The shop's templates made from `boardId` (any revision), newest first. */
export async function listTemplatesMadeFrom(db: Db, shopId: number, boardId: number): Promise<TemplateView[]> {
  const rows = await db
    .select(viewColumns)
    .from(templates)
    .leftJoin(boards, and(eq(boards.id, templates.boardId), eq(boards.shopId, templates.shopId)))
    .where(and(eq(templates.shopId, shopId), eq(templates.boardId, boardId)))
    .orderBy(desc(templates.updatedAt), desc(templates.id))
    .limit(50);
  return rows.map(toView);
}

/** A design revision of this shop, validated; null when the design or revision does not exist. */
export async function loadDesignRevision(
  db: Conn,
  shopId: number,
  boardId: number,
  revision?: number,
): Promise<{ design: Design; boardId: number; revision: number; name: string } | null> {
  const [head] = await db
    .select({ id: boards.id, name: boards.name, currentRevision: boards.currentRevision })
    .from(boards)
    .where(and(eq(boards.shopId, shopId), eq(boards.id, boardId)))
    .limit(1);
  if (!head) return null;
  const wanted = revision ?? head.currentRevision;
  const [row] = await db
    .select({ data: boardRevisions.data })
    .from(boardRevisions)
    .where(and(eq(boardRevisions.boardId, head.id), eq(boardRevisions.revision, wanted)))
    .limit(1);
  if (!row) return null;
  const validation = validateDesign(row.data);
  if (!validation.ok) return null;
  return { design: validation.design, boardId: head.id, revision: wanted, name: head.name };
}

/** The shop's boards a template can be made from (newest first). */
export async function listBoardChoices(db: Db, shopId: number): Promise<{ id: number; name: string; revision: number; units: 'mm' | 'in' }[]> {
  const rows = await db
    .select({ id: boards.id, name: boards.name, revision: boards.currentRevision, units: boards.units })
    .from(boards)
    .where(and(eq(boards.shopId, shopId), sql`${boards.archivedAt} IS NULL`))
    .orderBy(desc(boards.updatedAt))
    .limit(200);
  return rows;
}

export async function createTemplate(db: Conn, shopId: number, input: TemplateCreate): Promise<ShelfResult<TemplateView>> {
  const shelf = {
    keyWidth: input.keyWidth,
    material: input.material,
    storagePlace: input.storagePlace,
    condition: input.condition,
    madeOn: input.madeOn,
    notes: input.notes,
  };
  let values: typeof templates.$inferInsert;
  if (input.source === 'design') {
    const found = await loadDesignRevision(db, shopId, input.boardId, input.revision);
    if (!found) return notFound(input.revision ? 'No such board revision in this shop' : 'No such board in this shop', input.revision ? 'revision' : 'boardId');
    const { design } = found;
    values = {
      ...shelf,
      shopId,
      name: input.name ?? found.name,
      boardId: found.boardId,
      revision: found.revision,
      units: design.units,
      trebleScale: design.scale.treble,
      bassScale: design.scale.bass,
      frets: design.frets,
      slotWidth: input.slotWidth ?? design.slot.width,
    };
  } else {
    values = {
      ...shelf,
      shopId,
      name: input.name,
      units: input.units,
      trebleScale: input.trebleScale,
      bassScale: input.bassScale,
      frets: input.frets,
      slotWidth: input.slotWidth,
    };
  }
  const [inserted] = await db.insert(templates).values(values).$returningId();
  const view = await getTemplate(db, shopId, inserted!.id);
  return { ok: true, value: view! };
}

/** Thrown inside the transaction to undo the new template when its check cannot run. */
class CheckRefused extends Error {
  constructor(readonly issues: FieldIssue[]) {
    super('check refused');
  }
}

/**
 * Creates the template and saves its first check in one transaction, the check compared with
 * the design the template was made from. When the measurements do not fit that design (a fret
 * it lacks, a slot beyond the saddle) nothing is saved and the issues name `check.measurements.N`.
 */
export async function createTemplateWithCheck(
  db: Db,
  shopId: number,
  userId: string,
  input: TemplateCreate,
  check: CheckGrid,
): Promise<ShelfResult<TemplateView>> {
  try {
    return await db.transaction(async (tx) => {
      const created = await createTemplate(tx, shopId, input);
      if (!created.ok) return created;
      const reference = await templateDesign(tx, shopId, created.value);
      if (!reference) throw new CheckRefused([{ path: 'check', message: "the template's design could not be read" }]);
      const outcome = runCheck(reference.design, check);
      if (!outcome.ok) {
        const errors = 'errors' in outcome ? outcome.errors : [];
        throw new CheckRefused(errors.map((e) => ({ path: `check.${e.field}`, message: e.message })));
      }
      await saveCheck(tx, shopId, created.value.id, userId, outcome.result);
      return { ok: true as const, value: (await getTemplate(tx, shopId, created.value.id))! };
    });
  } catch (error) {
    if (error instanceof CheckRefused) return { ok: false, reason: 'invalid', issues: error.issues };
    throw error;
  }
}

export async function updateTemplate(db: Db, shopId: number, id: number, patch: TemplateUpdate): Promise<TemplateView | null> {
  const result = await db
    .update(templates)
    .set({ ...patch, updatedAt: new Date() })
    .where(and(eq(templates.shopId, shopId), eq(templates.id, id)));
  if (result[0].affectedRows === 0) return null;
  return getTemplate(db, shopId, id);
}

/** Templates are retired, not deleted: their checks stay on record. */
export async function retireTemplate(db: Db, shopId: number, id: number): Promise<TemplateView | null> {
  return updateTemplate(db, shopId, id, { condition: 'retired' });
}

/** The design a template is checked against (its revision, or a stand-in from typed scales). */
export async function templateDesign(db: Conn, shopId: number, template: TemplateView): Promise<{ design: Design; standIn: boolean } | null> {
  if (template.boardId !== null && template.revision !== null) {
    const found = await loadDesignRevision(db, shopId, template.boardId, template.revision);
    if (found) return { design: found.design, standIn: false };
  }
  const design = standInDesign(template);
  return design ? { design, standIn: true } : null;
}

export interface SavedCheck {
  id: number;
  checkedBy: string;
  tolerance: number;
  passed: boolean;
  result: CheckResult;
  createdAt: string;
}

/** Saves a check and records its date and verdict on the template, together. */
export async function saveCheck(db: Conn, shopId: number, templateId: number, userId: string, result: CheckResult): Promise<SavedCheck> {
  const now = new Date();
  const id = await db.transaction(async (tx) => {
    const [inserted] = await tx
      .insert(templateChecks)
      .values({ shopId, templateId, checkedBy: userId, tolerance: result.tolerance, passed: result.passed, result, createdAt: now })
      .$returningId();
    await tx
      .update(templates)
      .set({ lastCheckedOn: now, lastCheckPassed: result.passed, updatedAt: now })
      .where(and(eq(templates.shopId, shopId), eq(templates.id, templateId)));
    return inserted!.id;
  });
  return { id, checkedBy: userId, tolerance: result.tolerance, passed: result.passed, result, createdAt: now.toISOString() };
}

export async function listChecks(db: Db, shopId: number, templateId: number): Promise<SavedCheck[]> {
  const rows = await db
    .select()
    .from(templateChecks)
    .where(and(eq(templateChecks.shopId, shopId), eq(templateChecks.templateId, templateId)))
    .orderBy(desc(templateChecks.createdAt), desc(templateChecks.id))
    .limit(100);
  return rows.map((row) => ({
    id: row.id,
    checkedBy: row.checkedBy,
    tolerance: row.tolerance,
    passed: row.passed,
    result: readSavedResult(row.result),
    createdAt: row.createdAt.toISOString(),
  }));
}
