/**
 * The role-by-route matrix: every page and API route with the status each kind of visitor gets.
 * Each feature lists its routes in its own file here and adds it to index.ts; the matrix test
 * (tests/e2e/route-matrix.test.ts, against the built server) fails when a file in src/pages has
 * no entry.
 */
export type Actor = 'anonymous' | 'client' | 'builder' | 'owner' | 'otherOwner';

/** Ids of the demo shop's rows, so routes with parameters can be called for real. */
export interface MatrixIds {
  boardId: number;
  templateId: number;
  /** The demo shop's first seeded fret wire. */
  wireId: number;
  proofToken: string;
  /** The demo shop's Builder (builder@wrenfield.example). */
  demoBuilderId: string;
}

export interface RouteCase {
  /** The file under src/pages that serves it, e.g. 'pages/api/boards/[id]/index.ts'. */
  file: string;
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  path: string | ((ids: MatrixIds) => string);
  /** JSON body for non-GET requests (a valid one, so the status shows authorisation, not validation). */
  body?: unknown | ((ids: MatrixIds) => unknown);
  /** Sends a string body as-is with this Content-Type instead of JSON (e.g. 'text/plain'). */
  contentType?: string;
  /** Expected status per actor; an array allows any of those statuses. */
  expect: Record<Actor, number | readonly number[]>;
}
