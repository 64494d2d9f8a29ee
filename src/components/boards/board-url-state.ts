/**
 * The Boards list's search, filters, sort and page, kept in the page URL so a view can be
 * bookmarked, shared and restored with Back. Defaults are left out of the URL.
 */
import { boardListQuerySchema, type BoardListQuery } from '~/lib/schemas/board.ts';
import * as urlState from '~/components/ui/list-url-state.ts';

export const DEFAULT_LIST_QUERY: BoardListQuery = boardListQuerySchema.parse({});

/** Reads the list query from a URL's search string; unknown or bad values fall back to defaults. */
export function listQueryFromSearch(search: string): BoardListQuery {
  return urlState.listQueryFromSearch(boardListQuerySchema, search);
}

/** The search string for a list query (with a leading "?", or "" for the default view), keys in a fixed order. */
export function searchFromListQuery(query: BoardListQuery): string {
  return urlState.searchFromListQuery(boardListQuerySchema, query);
}
