/**
 * Saved designs for tests, saved through the designs module (head row, working copy, revision)
 * from the demo fixtures in src/lib/boards/demo.
 */
import { readFileSync } from 'node:fs';
import { and, asc, eq, like } from 'drizzle-orm';
import { db } from '~/lib/db/client.server.ts';
import { createDesign, updateDesign } from '~/lib/db/designs.server.ts';
import { designs } from '~/lib/db/schema.ts';
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

/** Saves a design as a new board with revision 1 (through the designs module) and returns its id. */
export async function insertDesign(shopId: number, userId: string, data: Record<string, unknown>): Promise<number> {
  const board = await createDesign({ id: userId, shopId }, { design: validated(data), instrumentType: 'guitar', clientName: '', note: '' });
  return board.id;
}

/** Saves `data` as the board's working copy and keeps it as the next revision; returns its number. */
export async function addRevision(designId: number, userId: string, data: Record<string, unknown>): Promise<number> {
  const [head] = await db().select({ shopId: designs.shopId, version: designs.version }).from(designs).where(eq(designs.id, designId));
  const saved = await updateDesign({ id: userId, shopId: head!.shopId }, designId, {
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
    .select({ id: designs.id })
    .from(designs)
    .where(and(eq(designs.shopId, shopId), like(designs.name, `%${text}%`)))
    // The oldest match: the seeded one, not a copy another test made ("Copy of …").
    .orderBy(asc(designs.id))
    .limit(1);
  return found?.id ?? insertDesign(shopId, userId, fixtureDesign(fixture));
}
