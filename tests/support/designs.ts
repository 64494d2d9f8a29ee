/**
 * Saved designs for tests, inserted as rows (head + revision) the way the designs module stores
 * them, from the demo fixtures in src/lib/boards/demo.
 */
import { readFileSync } from 'node:fs';
import { and, asc, eq, like } from 'drizzle-orm';
import { toMm } from '~/lib/format/units.ts';
import { db } from '~/lib/db/client.server.ts';
import { designRevisions, designs } from '~/lib/db/schema.ts';
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

/** Inserts a design with revision 1 and returns its id. */
export async function insertDesign(shopId: number, userId: string, data: Record<string, unknown>): Promise<number> {
  const design = validated(data);
  const [head] = await db()
    .insert(designs)
    .values({
      shopId,
      name: design.name,
      units: design.units,
      trebleScaleMm: toMm(design.scale.treble, design.units),
      bassScaleMm: toMm(design.scale.bass, design.units),
      createdBy: userId,
      updatedBy: userId,
    })
    .$returningId();
  await db().insert(designRevisions).values({ designId: head!.id, revision: 1, data, authorId: userId });
  return head!.id;
}

/** Adds the next revision with `data` and makes it current. */
export async function addRevision(designId: number, userId: string, data: Record<string, unknown>): Promise<number> {
  validated(data);
  const [head] = await db().select({ currentRevision: designs.currentRevision }).from(designs).where(eq(designs.id, designId));
  const revision = head!.currentRevision + 1;
  await db().insert(designRevisions).values({ designId, revision, data, authorId: userId });
  await db().update(designs).set({ currentRevision: revision }).where(eq(designs.id, designId));
  return revision;
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
