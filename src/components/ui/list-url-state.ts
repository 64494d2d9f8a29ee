/**
 * A list page's search, filters, sort and page kept in the page URL, so a view can be
 * bookmarked, shared and restored with Back. The list's own zod query schema (the one its API
 * route parses) decides what is valid; defaults are left out of the URL.
 */
import type { z } from 'zod';

type ListQuerySchema = z.ZodObject<z.ZodRawShape>;

/** Reads a list query from a URL's search string; unknown or bad values fall back to defaults. */
export function listQueryFromSearch<S extends ListQuerySchema>(schema: S, search: string): z.infer<S> {
  const params = new URLSearchParams(search);
  const query: Record<string, string> = {};
  for (const [key, field] of Object.entries(schema.shape)) {
    const value = params.get(key);
    if (value === null || value === '') continue;
    if (field.safeParse(value).success) query[key] = value;
  }
  return schema.parse(query);
}

/** The search string for a list query (with a leading "?", or "" for the default view), keys in the schema's order. */
export function searchFromListQuery<S extends ListQuerySchema>(schema: S, query: z.infer<S>): string {
  const defaults = schema.parse({}) as Record<string, unknown>;
  const values = query as Record<string, unknown>;
  const params = new URLSearchParams();
  for (const key of Object.keys(schema.shape)) {
    const value = values[key];
    if (value === undefined || value === defaults[key]) continue;
    params.set(key, String(value));
  }
  const text = params.toString();
  return text ? `?${text}` : '';
}
