import type { RouteCase } from './types.ts';

/** Every feature's route list; add yours here. */
export const ROUTE_CASES: readonly RouteCase[] = [];
