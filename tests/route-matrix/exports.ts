import type { RouteCase } from './types.ts';
import sevenStringFan from '../../src/lib/boards/demo/seven-string-fan.json';

/** Exports of unsaved designs are public, like POST /api/layout: they store and read nothing. */
const everyone = (status: number) => ({ anonymous: status, client: status, builder: status, owner: status, otherOwner: status });

export const EXPORT_ROUTES: readonly RouteCase[] = [
  { file: 'pages/export.astro', method: 'GET', path: '/export', expect: everyone(200) },
  { file: 'pages/api/export.ts', method: 'POST', path: '/api/export?format=csv', body: sevenStringFan, expect: everyone(200) },
];
