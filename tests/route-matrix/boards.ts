/** Boards: every /api/boards route, and a board opened in Layout, for each kind of visitor (the Boards page is in site.ts). */
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import type { Actor, RouteCase } from './types.ts';

/** A name of its own, so boards the matrix saves are not mistaken for the seeded ones. */
const design = { ...DEMO_DESIGNS[0]!.design, name: 'Route matrix board' };

/** Owners and builders of the board's shop get `ok`; another shop's owner gets `other`. */
function writers(ok: number | readonly number[], other: number | readonly number[] = ok): Record<Actor, number | readonly number[]> {
  return { anonymous: 401, client: 403, builder: ok, owner: ok, otherOwner: other };
}

export const BOARDS_ROUTES: readonly RouteCase[] = [
  // Layout itself is public (site.ts); a saved board opens only for its shop's builders and owners.
  {
    file: 'pages/layout.astro',
    method: 'GET',
    path: (ids) => `/layout?board=${ids.boardId}`,
    expect: { anonymous: 302, client: 403, builder: 200, owner: 200, otherOwner: 404 },
  },
  { file: 'pages/layout.astro', method: 'GET', path: '/layout?board=not-a-board', expect: { anonymous: 302, client: 403, builder: 404, owner: 404, otherOwner: 404 } },
  { file: 'pages/api/boards/index.ts', method: 'GET', path: '/api/boards?sort=scale&pageSize=10', expect: writers(200) },
  { file: 'pages/api/boards/index.ts', method: 'POST', path: '/api/boards', body: { design }, expect: writers(201) },
  { file: 'pages/api/boards/import.ts', method: 'POST', path: '/api/boards/import', body: design, expect: writers(201) },
  { file: 'pages/api/boards/[id]/index.ts', method: 'GET', path: (ids) => `/api/boards/${ids.boardId}`, expect: writers(200, 404) },
  {
    file: 'pages/api/boards/[id]/index.ts',
    method: 'PATCH',
    path: (ids) => `/api/boards/${ids.boardId}`,
    // The version may be stale by the time the matrix runs: 409 also proves the write was allowed.
    body: { version: 1, clientName: 'Ines Calloway' },
    expect: writers([200, 409], 404),
  },
  { file: 'pages/api/boards/[id]/duplicate.ts', method: 'POST', path: (ids) => `/api/boards/${ids.boardId}/duplicate`, expect: writers(201, 404) },
  { file: 'pages/api/boards/[id]/revisions.ts', method: 'GET', path: (ids) => `/api/boards/${ids.boardId}/revisions`, expect: writers(200, 404) },
  {
    file: 'pages/api/boards/[id]/restore.ts',
    method: 'POST',
    path: (ids) => `/api/boards/${ids.boardId}/restore`,
    body: { revision: 1, version: 1 },
    expect: writers([200, 409], 404),
  },
  {
    file: 'pages/api/boards/[id]/archive.ts',
    method: 'POST',
    path: (ids) => `/api/boards/${ids.boardId}/archive`,
    body: { archived: false },
    expect: writers(200, 404),
  },
  { file: 'pages/api/boards/[id]/export.ts', method: 'GET', path: (ids) => `/api/boards/${ids.boardId}/export?format=csv`, expect: writers(200, 404) },
  { file: 'pages/api/boards/[id]/thumbnail.svg.ts', method: 'GET', path: (ids) => `/api/boards/${ids.boardId}/thumbnail.svg`, expect: writers(200, 404) },
];
