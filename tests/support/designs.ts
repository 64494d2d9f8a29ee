/**
 * Saved boards for tests, saved through the boards module (head row, working copy, revision)
 * from the demo fixtures in src/lib/boards/demo.
 */
import { readFileSync } from 'node:fs';
import { and, asc, eq, like } from 'drizzle-orm';
import { db } from '~/lib/db/client.server.ts';
import { createBoard, updateBoard } from '~/lib/boards/boards.server.ts';
import { boards } from '~/lib/db/schema.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';

export type FixtureName = 'seven-string-fan' | 'short-scale-bass' | 'classical-650' | 'mandolin' | 'tenor-ukulele';

/** The fixture as stored JSON (the input shape, not the defaults-filled one). */
export function fixtureDesign(name: FixtureName): Record<string, unknown> {
  return JSON.parse(readFileSync(new URL(`../../src/lib/boards/demo/${name}.json`, import.meta.url), 'utf8')) as Record<string, unknown>;
}

function validated(data: unknown): Design {
  const result = validateDesign(data);
  if (!result.ok) throw new Error(`test design is invalid: ${result.issues[0]?.path}: ${result.issues[0]?.message}`);
  return result.design;
}

/** Saves a design as a new board with revision 1 (through the boards module) and returns its id. */
export async function insertBoard(shopId: number, userId: string, data: Record<string, unknown>): Promise<number> {
  const board = await createBoard({ id: userId, shopId }, { design: validated(data), instrumentType: 'guitar', clientName: '', note: '' });
  return board.id;
}

/** Saves `data` as the board's working copy and keeps it as the next revision; returns its number. */
export async function addRevision(boardId: number, userId: string, data: Record<string, unknown>): Promise<number> {
  const [head] = await db().select({ shopId: boards.shopId, version: boards.version }).from(boards).where(eq(boards.id, boardId));
  const saved = await updateBoard({ id: userId, shopId: head!.shopId }, boardId, {
    version: head!.version,
    design: validated(data),
    note: '',
    saveRevision: true,
    confirmApprovalChange: true,
  });
  if (!saved.ok || saved.value.revision === null) throw new Error(`could not add a revision: ${saved.ok ? 'none made' : saved.reason}`);
  return saved.value.revision;
}

/** The shop's design whose name contains `text`, inserting it from `fixture` when missing. */
export async function ensureDesign(shopId: number, userId: string, text: string, fixture: FixtureName): Promise<number> {
  const [found] = await db()
    .select({ id: boards.id })
    .from(boards)
    .where(and(eq(boards.shopId, shopId), like(boards.name, `%${text}%`)))
    // The oldest match: the seeded one, not a copy another test made ("Copy of …").
    .orderBy(asc(boards.id))
    .limit(1);
  return found?.id ?? insertBoard(shopId, userId, fixtureDesign(fixture));
}
