import { ACCOUNT_ROUTES } from './accounts.ts';
import { BOARDS_ROUTES } from './boards.ts';
import { DEPOSIT_ROUTES } from './deposits.ts';
import { EXPORT_ROUTES } from './exports.ts';
import { FRET_WIRE_ROUTES } from './fret-wire.ts';
import { PROOF_ROUTES } from './proof.ts';
import { SITE_ROUTES } from './site.ts';
import { TEMPLATE_ROUTES } from './templates.ts';
import type { RouteCase } from './types.ts';

/** Every feature's route list; add yours here. */
export const ROUTE_CASES: readonly RouteCase[] = [
  ...SITE_ROUTES,
  ...ACCOUNT_ROUTES,
  ...EXPORT_ROUTES,
  ...PROOF_ROUTES,
  ...TEMPLATE_ROUTES,
  ...BOARDS_ROUTES,
  ...FRET_WIRE_ROUTES,
  ...DEPOSIT_ROUTES,
];
