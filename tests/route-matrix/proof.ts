import type { RouteCase } from './types.ts';

/** Proof routes. A valid body so the status shows authorisation; revoke uses an id no shop has. */
const NEW_PROOF = { clientName: 'Route matrix', clientEmail: 'matrix@wrenfield.example', message: '', expiresInDays: 1 };
const SIGNED_IN_ONLY = { anonymous: 302, client: 200, builder: 200, owner: 200, otherOwner: 200 } as const;

export const PROOF_ROUTES: readonly RouteCase[] = [
  {
    file: 'pages/api/boards/[id]/proofs.ts',
    method: 'GET',
    path: (ids) => `/api/boards/${ids.boardId}/proofs`,
    expect: { anonymous: 401, client: 403, builder: 200, owner: 200, otherOwner: 404 },
  },
  {
    file: 'pages/api/boards/[id]/proofs.ts',
    method: 'POST',
    path: (ids) => `/api/boards/${ids.boardId}/proofs`,
    body: NEW_PROOF,
    expect: { anonymous: 401, client: 403, builder: 201, owner: 201, otherOwner: 404 },
  },
  {
    file: 'pages/api/proofs/[proofId]/revoke.ts',
    method: 'POST',
    path: '/api/proofs/999999999/revoke',
    expect: { anonymous: 401, client: 403, builder: 404, owner: 404, otherOwner: 404 },
  },
  {
    // Public: the link is the permission. The first answer wins; later ones are 409.
    file: 'pages/api/p/[token]/decision.ts',
    method: 'POST',
    path: (ids) => `/api/p/${ids.proofToken}/decision`,
    body: { decision: 'changes_requested', name: 'Route matrix', comment: 'Checking access' },
    expect: { anonymous: [200, 409], client: [200, 409], builder: [200, 409], owner: [200, 409], otherOwner: [200, 409] },
  },
  {
    file: 'pages/api/shared/[proofId]/decision.ts',
    method: 'POST',
    path: '/api/shared/999999999/decision',
    body: { decision: 'approved', name: 'Route matrix', confirmed: true },
    expect: { anonymous: 401, client: 404, builder: 404, owner: 404, otherOwner: 404 },
  },
  {
    file: 'pages/p/[token].astro',
    method: 'GET',
    path: (ids) => `/p/${ids.proofToken}`,
    expect: { anonymous: 200, client: 200, builder: 200, owner: 200, otherOwner: 200 },
  },
  {
    file: 'pages/shared.astro',
    method: 'GET',
    path: '/shared',
    expect: SIGNED_IN_ONLY,
  },
  {
    file: 'pages/shared/[proofId].astro',
    method: 'GET',
    path: '/shared/999999999',
    expect: { anonymous: 302, client: 404, builder: 404, owner: 404, otherOwner: 404 },
  },
  {
    file: 'pages/boards/[id]/proofs.astro',
    method: 'GET',
    path: (ids) => `/boards/${ids.boardId}/proofs`,
    expect: { anonymous: 302, client: 403, builder: 200, owner: 200, otherOwner: 404 },
  },
];
