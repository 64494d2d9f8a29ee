import type { RouteCase } from './types.ts';
import { PROOF_ROUTES } from './proof.ts';

/** Every feature's route list; add yours here. */
export const ROUTE_CASES: readonly RouteCase[] = [...PROOF_ROUTES];
