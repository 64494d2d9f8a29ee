/**
 * A ledger of Boards saves the server acknowledged (200), and the check that each of them is in
 * the database afterwards, in order: load, fault and restart tests share it.
 */
import { inArray } from 'drizzle-orm';
import { boardRevisions, boards } from '~/lib/db/schema.ts';
import { fixtureDesign } from './designs.ts';
import { db } from './test-db.ts';

export interface AcknowledgedSave {
  boardId: number;
  /** Revision and version the 200 answer named. */
  revision: number;
  version: number;
  /** The design name sent with this save, unique per save. */
  marker: string;
}

/** The demo seven-string design named `marker`: every save differs, so each one is a new revision. */
export function markedDesign(marker: string): Record<string, unknown> {
  return { ...fixtureDesign('seven-string-fan'), name: marker };
}

/** The PATCH body of a save over `version`, kept as a revision (so the ledger can check each one). */
export function saveBody(version: number, marker: string): string {
  return JSON.stringify({ version, design: markedDesign(marker), saveRevision: true });
}

interface SavedBoard {
  revision: number;
  version: number;
  design: { name?: unknown };
}

/** Reads a 200 answer of PATCH /api/boards/{id} into the ledger entry it acknowledges. */
export function acknowledgement(boardId: number, marker: string, body: string): AcknowledgedSave {
  const saved = JSON.parse(body) as SavedBoard;
  if (saved.design.name !== marker) throw new Error(`save of "${marker}" answered with design "${String(saved.design.name)}"`);
  return { boardId, revision: saved.revision, version: saved.version, marker };
}

/**
 * Problems with the acknowledged saves, as readable lines (none when all is well): every one is
 * stored as the revision its answer named, holding the design that was sent, and per board the
 * acknowledgements name rising revisions and versions in the order they arrived.
 */
export async function acknowledgedSaveProblems(saves: readonly AcknowledgedSave[]): Promise<string[]> {
  const problems: string[] = [];
  const ids = [...new Set(saves.map((s) => s.boardId))];
  if (ids.length === 0) return problems;
  const rows = await db()
    .select({ boardId: boardRevisions.boardId, revision: boardRevisions.revision, data: boardRevisions.data })
    .from(boardRevisions)
    .where(inArray(boardRevisions.boardId, ids));
  const stored = new Map(rows.map((r) => [`${r.boardId}/${r.revision}`, r.data]));
  const heads = new Map(
    (await db().select({ id: boards.id, currentRevision: boards.currentRevision, version: boards.version }).from(boards).where(inArray(boards.id, ids))).map(
      (h) => [h.id, h],
    ),
  );
  const last = new Map<number, AcknowledgedSave>();
  for (const save of saves) {
    const data = stored.get(`${save.boardId}/${save.revision}`);
    const name = (typeof data === 'string' ? (JSON.parse(data) as { name?: unknown }) : (data as { name?: unknown } | undefined))?.name;
    if (name !== save.marker) problems.push(`board ${save.boardId} revision ${save.revision} holds ${JSON.stringify(name)}, acknowledged as "${save.marker}"`);
    const before = last.get(save.boardId);
    if (before && !(save.revision > before.revision && save.version > before.version)) {
      problems.push(`board ${save.boardId}: "${save.marker}" (revision ${save.revision}) was acknowledged after "${before.marker}" (revision ${before.revision})`);
    }
    last.set(save.boardId, save);
  }
  for (const [id, save] of last) {
    const head = heads.get(id);
    if (!head || head.currentRevision < save.revision || head.version < save.version) {
      problems.push(`board ${id}: head at revision ${head?.currentRevision}, version ${head?.version}; last acknowledged ${save.revision}, ${save.version}`);
    }
  }
  return problems;
}
