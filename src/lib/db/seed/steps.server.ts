/** The ordered list of demo seed steps; each feature appends its own (idempotent) step here. */
import type { SeedStep } from './demo-shop.server.ts';
import { seedDemoProof } from './demo-proof.server.ts';

export const DEMO_SEED_STEPS: readonly SeedStep[] = [
  // Shares the demo seven-string design: keep it after the step that seeds the designs.
  seedDemoProof,
];
