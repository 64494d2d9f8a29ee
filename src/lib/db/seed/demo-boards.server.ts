/**
 * Demo seed step: the invented shop's five instruments as saved boards, each with three
 * revisions, so Boards, the revision history and proofs have something to show. Idempotent:
 * a board whose name already exists in the demo shop is left alone.
 * Clients, statuses and revision notes are demo data, invented for the shop in PRODUCT.md.
 */
import { and, eq } from 'drizzle-orm';
import { createDesign, updateDesign } from '~/lib/db/designs.server.ts';
import { designs } from '~/lib/db/schema.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import type { InstrumentType } from '~/lib/schemas/board.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';
import type { SeedStep } from './demo-shop.server.ts';

interface DemoBoard {
  instrumentType: InstrumentType;
  clientName: string;
  status: 'draft' | 'shared' | 'approved' | 'changes_requested';
}

const BOARDS: Record<string, DemoBoard> = {
  'seven-string-fan': { instrumentType: 'guitar', clientName: 'Ines Calloway', status: 'shared' },
  'short-scale-bass': { instrumentType: 'bass', clientName: 'Rafe Dunmore', status: 'approved' },
  'classical-650': { instrumentType: 'classical', clientName: '', status: 'draft' },
  mandolin: { instrumentType: 'mandolin', clientName: 'Ines Calloway', status: 'changes_requested' },
  'tenor-ukulele': { instrumentType: 'ukulele', clientName: 'Rafe Dunmore', status: 'draft' },
};

/** Three plausible steps toward the final design: fewer frets, then a wider slot, then the final. */
function history(final: Design): { design: Design; note: string }[] {
  const frets = final.frets - 2;
  const first: Design = {
    ...final,
    frets,
    perpendicularFret: Math.min(final.perpendicularFret, frets),
    markers: final.markers.filter((m) => m.fret <= frets),
    compensation: { nut: 0, saddleTreble: 0, saddleBass: 0 },
  };
  const second: Design = { ...final, slot: { ...final.slot, width: final.slot.width * 1.25 } };
  return [
    { design: first, note: 'First layout from the order form' },
    { design: second, note: 'Full fret count; slot width for the wider fret wire in stock' },
    { design: final, note: 'Standard slot width and saddle compensation' },
  ].map((step) => {
    const checked = validateDesign(step.design);
    if (!checked.ok) throw new Error(`demo board revision is invalid: ${checked.issues[0]?.path}`);
    return { design: checked.design, note: step.note };
  });
}

export const seedDemoBoards: SeedStep = async ({ db, shopId, people }) => {
  const builder = { id: people.get('builder@wrenfield.example')!, shopId };
  const owner = { id: people.get('owner@wrenfield.example')!, shopId };
  for (const { id: key, design } of DEMO_DESIGNS) {
    const board = BOARDS[key];
    if (!board) continue;
    const [existing] = await db.select({ id: designs.id }).from(designs).where(and(eq(designs.shopId, shopId), eq(designs.name, design.name))).limit(1);
    if (existing) continue;
    const [first, ...later] = history(design);
    let saved = await createDesign(owner, { design: first!.design, instrumentType: board.instrumentType, clientName: board.clientName, note: first!.note });
    for (const step of later) {
      const result = await updateDesign(builder, saved.id, { version: saved.version, design: step.design, note: step.note });
      if (!result.ok) throw new Error(`could not seed a revision of ${design.name}: ${result.reason}`);
      saved = result.value;
    }
    await db.update(designs).set({ status: board.status }).where(eq(designs.id, saved.id));
  }
};
