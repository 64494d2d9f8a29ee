/**
 * The few design reads and the one status write that proofs need, each scoped by shop. Kept apart
 * so they can be folded into the designs module without touching the proof code's callers.
 */
import { and, eq } from 'drizzle-orm';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';
import type { Db } from './client.server.ts';
import { designRevisions, designs, type DesignStatus } from './schema.ts';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
type Reader = Db | Tx;

export interface ProofDesignHead {
  id: number;
  shopId: number;
  name: string;
  currentRevision: number;
}

/** The design's head row, or null when it is not in this shop. */
export async function findShopDesign(reader: Reader, shopId: number, designId: number): Promise<ProofDesignHead | null> {
  const [row] = await reader
    .select({ id: designs.id, shopId: designs.shopId, name: designs.name, currentRevision: designs.currentRevision })
    .from(designs)
    .where(and(eq(designs.id, designId), eq(designs.shopId, shopId)))
    .limit(1);
  return row ?? null;
}

/** MariaDB stores JSON as text, so the driver may hand back a string. */
function storedJson(value: unknown): unknown {
  return typeof value === 'string' ? (JSON.parse(value) as unknown) : value;
}

/** One revision's design, validated (defaults filled); null when missing or no longer valid. */
export async function findRevisionDesign(reader: Reader, designId: number, revision: number): Promise<Design | null> {
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
 * Sets the design's status. The optimistic-concurrency version is left alone on purpose: a
 * client's answer is not an edit, and must not turn the builder's next save into a conflict.
 */
export async function setDesignStatus(writer: Reader, shopId: number, designId: number, status: DesignStatus): Promise<void> {
  await writer.update(designs).set({ status }).where(and(eq(designs.id, designId), eq(designs.shopId, shopId)));
}
