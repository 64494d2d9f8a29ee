/** The ordered list of demo seed steps; each feature appends its own (idempotent) step here. */
import { seedDemoBoards } from './demo-boards.server.ts';
import type { SeedStep } from './demo-shop.server.ts';
import { seedDemoProof } from './demo-proof.server.ts';
import { seedDemoWires } from './fret-wires.server.ts';
import { seedDemoTemplates } from './templates.server.ts';

export const DEMO_SEED_STEPS: readonly SeedStep[] = [
  seedDemoBoards,
  // Both link to the demo designs by name: keep them after the step that seeds the designs.
  seedDemoTemplates,
  seedDemoProof,
  seedDemoWires,
];
