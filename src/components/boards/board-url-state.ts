/**
 * The Boards list's search, filters, sort and page, kept in the page URL so a view can be
 * bookmarked, shared and restored with Back. Defaults are left out of the URL.
 */
import { boardListQuerySchema, type BoardListQuery } from '~/lib/schemas/board.ts';

export const DEFAULT_LIST_QUERY: BoardListQuery = boardListQuerySchema.parse({});

/** Reads the list query from a URL's search string; unknown or bad values fall back to defaults. */
export function listQueryFromSearch(search: string): BoardListQuery {
  const params = new URLSearchParams(search);
  const query: Record<string, string> = {};
  for (const key of Object.keys(boardListQuerySchema.shape)) {
    const value = params.get(key);
    if (value === null || value === '') continue;
    const single = boardListQuerySchema.shape[key as keyof BoardListQuery].safeParse(value);
    if (single.success) query[key] = value;
  }
  return boardListQuerySchema.parse(query);
}

/** The search string for a list query (with a leading "?", or "" for the default view), keys in a fixed order. */
export function searchFromListQuery(query: BoardListQuery): string {
  const params = new URLSearchParams();
  for (const key of Object.keys(boardListQuerySchema.shape) as (keyof BoardListQuery)[]) {
    const value = query[key];
    if (value === undefined || value === DEFAULT_LIST_QUERY[key]) continue;
    params.set(key, String(value));
  }
  const text = params.toString();
  return text ? `?${text}` : '';
}
