/**
 * Demo seed step: the invented shop's five instruments as saved boards, each with three
 * revisions, so Boards, the revision history and proofs have something to show. Idempotent:
 * a board whose name already exists in the demo shop is left alone.
 * Clients, their answers and revision notes are demo data, invented for the shop in PRODUCT.md.
 */
import { and, eq } from 'drizzle-orm';
import { newToken, sha256Hex } from '~/lib/auth/tokens.server.ts';
import type { Db } from '~/lib/db/client.server.ts';
import { checkpointLocked, createBoard, lockBoard, refreshApproval, updateBoard } from '~/lib/boards/boards.server.ts';
import { boards, proofs } from '~/lib/db/schema.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import type { InstrumentType } from '~/lib/schemas/board.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';
import type { SeedStep } from './demo-shop.server.ts';

type DemoAnswer = 'approved' | 'changes_requested';

interface DemoBoard {
  instrumentType: InstrumentType;
  clientName: string;
  /** The client's answer to a proof of the newest revision (the seven-string's proof waits: demo-proof step). */
  answer?: DemoAnswer;
}

const BOARDS: Record<string, DemoBoard> = {
  'seven-string-fan': { instrumentType: 'guitar', clientName: 'Ines Calloway' },
  'short-scale-bass': { instrumentType: 'bass', clientName: 'Rafe Dunmore', answer: 'approved' },
  'classical-650': { instrumentType: 'classical', clientName: '' },
  mandolin: { instrumentType: 'mandolin', clientName: 'Ines Calloway', answer: 'changes_requested' },
  'tenor-ukulele': { instrumentType: 'ukulele', clientName: 'Rafe Dunmore' },
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
    const [existing] = await db.select({ id: boards.id }).from(boards).where(and(eq(boards.shopId, shopId), eq(boards.name, design.name))).limit(1);
    if (existing) continue;
    const [first, ...later] = history(design);
    let saved = await createBoard(owner, { design: first!.design, instrumentType: board.instrumentType, clientName: board.clientName, note: first!.note });
    for (const step of later) {
      const result = await updateBoard(builder, saved.id, { version: saved.version, design: step.design, note: step.note, saveRevision: true });
      if (!result.ok) throw new Error(`could not seed a revision of ${design.name}: ${result.reason}`);
      saved = result.value;
    }
    if (board.answer) await seedAnsweredProof(db, shopId, saved.id, builder.id, board.clientName, board.answer);
  }
};

/** A proof of the board's newest revision, already answered by the client (demo data). */
async function seedAnsweredProof(db: Db, shopId: number, boardId: number, builderId: string, clientName: string, answer: DemoAnswer): Promise<void> {
  await db.transaction(async (tx) => {
    const head = await lockBoard(tx, shopId, boardId);
    if (!head) return;
    const pinned = await checkpointLocked(tx, { id: builderId, shopId }, head, 'proof', `Sent to ${clientName} in a proof`);
    const decidedAt = new Date();
    await tx.insert(proofs).values({
      shopId,
      boardId,
      revision: pinned.revision,
      fingerprint: pinned.fingerprint,
      tokenHash: sha256Hex(newToken()),
      clientName,
      clientEmail: `${clientName.toLowerCase().replace(/[^a-z]+/g, '.')}@clients.example`,
      message: 'The layout for your build, for your approval.',
      expiresAt: new Date(decidedAt.getTime() + 30 * 86_400_000),
      createdBy: builderId,
      decision: answer,
      decidedAt,
      decidedName: clientName,
      decisionComment: answer === 'changes_requested' ? 'Could the side dots be a little smaller?' : '',
    });
    await refreshApproval(tx, shopId, boardId);
  });
}
