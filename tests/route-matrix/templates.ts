/** Template shelf and Template check routes: builders and owners of the shop only. */
import type { MatrixIds, RouteCase } from './types.ts';

const shelfOnly = { anonymous: 401, client: 403, builder: 200, owner: 200, otherOwner: 404 } as const;
const page = { anonymous: 302, client: 403, builder: 200, owner: 200, otherOwner: 404 } as const;

export const TEMPLATE_ROUTES: readonly RouteCase[] = [
  { file: 'pages/templates.astro', method: 'GET', path: '/templates', expect: { ...page, otherOwner: 200 } },
  { file: 'pages/templates/[id].astro', method: 'GET', path: (ids) => `/templates/${ids.templateId}`, expect: page },
  { file: 'pages/boards/[id]/check.astro', method: 'GET', path: (ids) => `/boards/${ids.boardId}/check`, expect: page },
  { file: 'pages/boards/[id]/check.astro', method: 'GET', path: (ids) => `/boards/${ids.boardId}/check?revision=1`, expect: page },
  {
    file: 'pages/boards/[id]/check.astro',
    method: 'GET',
    path: (ids) => `/boards/${ids.boardId}/check?revision=999999`,
    expect: { ...page, builder: 404, owner: 404 },
  },
  { file: 'pages/api/templates/index.ts', method: 'GET', path: '/api/templates?sort=name&dir=asc', expect: { ...shelfOnly, otherOwner: 200 } },
  {
    file: 'pages/api/templates/index.ts',
    method: 'POST',
    path: '/api/templates',
    body: { source: 'typed', name: 'Route matrix template', units: 'mm', trebleScale: 635, bassScale: 635, frets: 20, slotWidth: 0.6, keyWidth: 0.55 },
    expect: { anonymous: 401, client: 403, builder: 201, owner: 201, otherOwner: 201 },
  },
  {
    file: 'pages/api/templates/index.ts',
    method: 'POST',
    path: '/api/templates',
    body: (ids: MatrixIds) => ({
      source: 'design',
      boardId: ids.boardId,
      revision: 1,
      name: 'Route matrix template with a check',
      keyWidth: 0.5,
      check: { units: 'mm', tolerance: 0.1, measurements: [{ fret: 1, fromNut: 36.4 }] },
    }),
    // Another shop's design is not found, and nothing is saved for it.
    expect: { anonymous: 401, client: 403, builder: 201, owner: 201, otherOwner: 404 },
  },
  { file: 'pages/api/templates/[id]/index.ts', method: 'GET', path: (ids) => `/api/templates/${ids.templateId}`, expect: shelfOnly },
  { file: 'pages/api/templates/[id]/index.ts', method: 'DELETE', path: (ids) => `/api/templates/${ids.templateId}`, expect: shelfOnly },
  {
    file: 'pages/api/templates/[id]/index.ts',
    method: 'PATCH',
    path: (ids) => `/api/templates/${ids.templateId}`,
    body: { condition: 'in_use' },
    expect: shelfOnly,
  },
  { file: 'pages/api/templates/[id]/checks.ts', method: 'GET', path: (ids) => `/api/templates/${ids.templateId}/checks`, expect: shelfOnly },
  {
    file: 'pages/api/templates/[id]/checks.ts',
    method: 'POST',
    path: (ids) => `/api/templates/${ids.templateId}/checks`,
    body: { units: 'mm', tolerance: 0.1, measurements: [{ fret: 1, fromNut: 20 }] },
    expect: { anonymous: 401, client: 403, builder: 201, owner: 201, otherOwner: 404 },
  },
  { file: 'pages/api/templates/[id]/label.ts', method: 'GET', path: (ids) => `/api/templates/${ids.templateId}/label?size=62x29`, expect: shelfOnly },
  {
    file: 'pages/api/templates/[id]/index-template.ts',
    method: 'GET',
    path: (ids) => `/api/templates/${ids.templateId}/index-template?format=dxf`,
    expect: shelfOnly,
  },
];
