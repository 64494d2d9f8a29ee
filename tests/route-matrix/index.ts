import type { RouteCase } from './types.ts';
import { TEMPLATE_ROUTES } from './templates.ts';

/** Every feature's route list; add yours here. */
export const ROUTE_CASES: readonly RouteCase[] = [...TEMPLATE_ROUTES];
