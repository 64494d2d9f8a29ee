import { LAYOUT_ROUTES } from './layout.ts';
import type { RouteCase } from './types.ts';

/** Every feature's route list; add yours here. */
export const ROUTE_CASES: readonly RouteCase[] = [...LAYOUT_ROUTES];
