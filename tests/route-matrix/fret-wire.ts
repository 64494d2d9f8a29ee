/** The Fret wire list: builders and owners of the shop only; another shop's wire is a 404. */
import { DEMO_WIRES } from '~/lib/db/seed/fret-wires.server.ts';
import type { MatrixIds, RouteCase } from './types.ts';

const shopOnly = { anonymous: 401, client: 403, builder: 200, owner: 200, otherOwner: 404 } as const;
const page = { anonymous: 302, client: 403, builder: 200, owner: 200, otherOwner: 200 } as const;
const seeded = DEMO_WIRES[0]!;

export const FRET_WIRE_ROUTES: readonly RouteCase[] = [
  { file: 'pages/fret-wire.astro', method: 'GET', path: '/fret-wire', expect: page },
  { file: 'pages/api/fret-wire/index.ts', method: 'GET', path: '/api/fret-wire', expect: { ...shopOnly, otherOwner: 200 } },
  {
    file: 'pages/api/fret-wire/index.ts',
    method: 'POST',
    path: '/api/fret-wire',
    body: { ...seeded, name: 'Route matrix wire' },
    // The second member of the demo shop to add the same name gets the 409.
    expect: { anonymous: 401, client: 403, builder: [201, 409], owner: [201, 409], otherOwner: [201, 409] },
  },
  { file: 'pages/api/fret-wire/[id]/index.ts', method: 'GET', path: (ids: MatrixIds) => `/api/fret-wire/${ids.wireId}`, expect: shopOnly },
  { file: 'pages/api/fret-wire/[id]/index.ts', method: 'PUT', path: (ids: MatrixIds) => `/api/fret-wire/${ids.wireId}`, body: seeded, expect: shopOnly },
  { file: 'pages/api/fret-wire/[id]/index.ts', method: 'DELETE', path: '/api/fret-wire/2000000000', expect: { anonymous: 401, client: 403, builder: 404, owner: 404, otherOwner: 404 } },
];
