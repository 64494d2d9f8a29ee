/**
 * Every API route file under src/pages/api, found by globbing, so tests that must cover all
 * routes (fuzzing, fault handling) include new ones without being edited.
 */
import { readFileSync, readdirSync } from 'node:fs';
import { join, relative } from 'node:path';

export const HTTP_METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'] as const;
export type HttpMethod = (typeof HTTP_METHODS)[number];

export interface ApiRoute {
  /** e.g. 'src/pages/api/boards/[id]/index.ts' */
  file: string;
  /** Path segments; dynamic ones as `{ param: 'id', rest: false }`. */
  segments: (string | { param: string; rest: boolean })[];
  /** Methods the file exports (ALL counts as every method). */
  methods: HttpMethod[];
}

const API_DIR = 'src/pages/api';

function files(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) =>
    entry.isDirectory() ? files(join(dir, entry.name)) : /\.(ts|js)$/.test(entry.name) ? [join(dir, entry.name)] : [],
  );
}

function segmentOf(part: string): ApiRoute['segments'][number] {
  const dynamic = /^\[(\.\.\.)?([^\]]+)\]$/.exec(part);
  return dynamic ? { param: dynamic[2]!, rest: Boolean(dynamic[1]) } : part;
}

export function apiRoutes(): ApiRoute[] {
  return files(API_DIR)
    .sort()
    .map((file) => {
      const source = readFileSync(file, 'utf8');
      const exported = new Set([...source.matchAll(/export\s+(?:const|async\s+function|function)\s+([A-Z]+)\b/g)].map((m) => m[1]!));
      const methods = exported.has('ALL') ? [...HTTP_METHODS] : HTTP_METHODS.filter((m) => exported.has(m));
      const parts = relative('src/pages', file).replace(/\.(ts|js)$/, '').split('/');
      if (parts.at(-1) === 'index') parts.pop();
      return { file, segments: parts.map(segmentOf), methods };
    });
}

/** The route's URL path with each dynamic segment replaced by `fill(param)` (URL-encoded). */
export function routePath(route: ApiRoute, fill: (param: string, rest: boolean) => string): string {
  return `/${route.segments.map((s) => (typeof s === 'string' ? s : s.rest ? fill(s.param, true).split('/').map(encodeURIComponent).join('/') : encodeURIComponent(fill(s.param, false)))).join('/')}`;
}
