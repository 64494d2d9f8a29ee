/**
 * API paths that were renamed, and where they live now. `/api/designs/…` became `/api/boards/…`
 * when the saved entity took the name the screens give it; old clients get a 308 (method and
 * body kept) to the new path, with the query string unchanged.
 */
const RENAMED_PREFIXES: readonly (readonly [from: string, to: string])[] = [['/api/designs', '/api/boards']];

/** The new path and query for a renamed API path, or null when the path was not renamed. */
export function renamedPath(url: URL): string | null {
  for (const [from, to] of RENAMED_PREFIXES) {
    const rest = url.pathname.slice(from.length);
    if (url.pathname.startsWith(from) && (rest === '' || rest.startsWith('/'))) return `${to}${rest}${url.search}`;
  }
  return null;
}
