/** The ordered list of demo seed steps; each feature appends its own (idempotent) step here. */
import type { SeedStep } from './demo-shop.server.ts';
import { seedDemoTemplates } from './templates.server.ts';

export const DEMO_SEED_STEPS: readonly SeedStep[] = [seedDemoTemplates];
