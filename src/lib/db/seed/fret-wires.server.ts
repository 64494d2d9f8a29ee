/**
 * Demo seed: three generic fret wire sizes on the invented shop's Fret wire list. The sizes are
 * from memory (typical narrow, medium and jumbo wire, no maker's sheet) and say so in their
 * source. Idempotent: a name the list already has is skipped.
 */
import type { FretWireInput } from '~/lib/schemas/fret-wire.ts';
import { createWire, listWires } from '~/lib/wire/fret-wires.server.ts';
import type { SeedContext } from './demo-shop.server.ts';

const FROM_MEMORY = 'from memory: a generic size, not a maker’s sheet';
/** Two-foot lengths, from memory. */
const STOCK_MM = 610;

export const DEMO_WIRES: readonly FretWireInput[] = [
  { name: 'Generic narrow', crownWidthMm: 2.0, crownHeightMm: 1.0, tangWidthMm: 0.5, tangDepthMm: 1.4, barbWidthMm: 0.7, stockLengthMm: STOCK_MM, source: FROM_MEMORY },
  { name: 'Generic medium', crownWidthMm: 2.5, crownHeightMm: 1.2, tangWidthMm: 0.5, tangDepthMm: 1.5, barbWidthMm: 0.7, stockLengthMm: STOCK_MM, source: FROM_MEMORY },
  { name: 'Generic jumbo', crownWidthMm: 2.8, crownHeightMm: 1.4, tangWidthMm: 0.55, tangDepthMm: 1.6, barbWidthMm: 0.75, stockLengthMm: STOCK_MM, source: FROM_MEMORY },
];

export async function seedDemoWires({ db, shopId }: SeedContext): Promise<void> {
  const have = new Set((await listWires(db, shopId)).map((wire) => wire.name));
  for (const wire of DEMO_WIRES) {
    if (!have.has(wire.name)) await createWire(db, shopId, wire);
  }
}
