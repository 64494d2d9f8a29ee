/**
 * The shop's Fret wire list. Every function takes the caller's shopId and never reads or writes
 * another shop's rows: another shop's wire is simply "not found".
 */
import { and, asc, eq } from 'drizzle-orm';
import type { Db } from '~/lib/db/client.server.ts';
import { fretWires } from '~/lib/db/schema.ts';
import type { FretWire, FretWireInput } from '~/lib/schemas/fret-wire.ts';
import type { Failure } from '~/lib/http/result.ts';

export type WireFailure = Failure<'not_found' | 'duplicate_name'>;
export type WireResult = { ok: true; wire: FretWire } | WireFailure;

function toWire(row: typeof fretWires.$inferSelect): FretWire {
  const { shopId: _shopId, createdAt: _createdAt, ...wire } = row;
  return wire;
}

function isDuplicate(error: unknown): boolean {
  for (let e: unknown = error, depth = 0; e && depth < 5; depth++) {
    if ((e as { code?: unknown }).code === 'ER_DUP_ENTRY') return true;
    e = (e as { cause?: unknown }).cause;
  }
  return false;
}

export async function listWires(db: Db, shopId: number): Promise<FretWire[]> {
  const rows = await db.select().from(fretWires).where(eq(fretWires.shopId, shopId)).orderBy(asc(fretWires.name), asc(fretWires.id));
  return rows.map(toWire);
}

export async function getWire(db: Db, shopId: number, id: number): Promise<FretWire | null> {
  const [row] = await db.select().from(fretWires).where(and(eq(fretWires.shopId, shopId), eq(fretWires.id, id))).limit(1);
  return row ? toWire(row) : null;
}

export async function createWire(db: Db, shopId: number, input: FretWireInput): Promise<WireResult> {
  try {
    const [inserted] = await db.insert(fretWires).values({ ...input, shopId }).$returningId();
    return { ok: true, wire: { ...input, id: inserted!.id } };
  } catch (error) {
    if (isDuplicate(error)) return { ok: false, reason: 'duplicate_name' };
    throw error;
  }
}

export async function updateWire(db: Db, shopId: number, id: number, input: FretWireInput): Promise<WireResult> {
  if (!(await getWire(db, shopId, id))) return { ok: false, reason: 'not_found' };
  try {
    await db.update(fretWires).set(input).where(and(eq(fretWires.shopId, shopId), eq(fretWires.id, id)));
    return { ok: true, wire: { ...input, id } };
  } catch (error) {
    if (isDuplicate(error)) return { ok: false, reason: 'duplicate_name' };
    throw error;
  }
}

/** Boards naming a removed wire show "no such wire" in their checks until another is chosen. */
export async function deleteWire(db: Db, shopId: number, id: number): Promise<boolean> {
  const [result] = await db.delete(fretWires).where(and(eq(fretWires.shopId, shopId), eq(fretWires.id, id)));
  return result.affectedRows > 0;
}
