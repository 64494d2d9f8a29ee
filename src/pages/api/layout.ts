import type { APIRoute } from 'astro';
import { compactLayoutJson } from '~/lib/export/layout-json.server.ts';
import { LAYOUT_FORMATS, isLayoutFormatName, type LayoutFormatName } from '~/lib/export/layout-formats.ts';
import { fretFractions } from '~/lib/geometry/layout.ts';
import { readJson } from '~/lib/http/body.server.ts';
import { invalid, problem } from '~/lib/http/problem.ts';
import { DESIGN_JSON_MAX_BYTES, validateDesignWithLayout } from '~/lib/schemas/design.ts';

export const prerender = false;

/**
 * POST /api/layout[?full=1]: a design as JSON in, its layout out. Public: it stores and reads
 * nothing. JSON by default, in the compact shape of docs/api.md (`?full=1`: the full Layout,
 * every derived value spelt out); the fret table CSV with `?format=csv` or `Accept: text/csv`.
 */
export const POST: APIRoute = async ({ request, url }) => {
  const format = requestedFormat(url, request);
  if (format === null) {
    return problem(400, `format must be one of: ${Object.keys(LAYOUT_FORMATS).join(', ')}`, { field: 'format' });
  }
  const body = await readJson(request, DESIGN_JSON_MAX_BYTES);
  if (!body.ok) return body.response;
  const validation = validateDesignWithLayout(body.value);
  if (!validation.ok) return invalid(validation.issues);
  const { design, layout } = validation;
  const output = LAYOUT_FORMATS[format];
  const text = format === 'json' && url.searchParams.get('full') !== '1' ? compactLayoutJson(layout, fretFractions(design.temperament, design.frets)) : output.render(layout);
  return new Response(text, { status: 200, headers: { 'content-type': output.contentType, 'cache-control': 'no-store' } });
};


/** `?format=` wins; otherwise `Accept: text/csv` asks for CSV; JSON is the default. */
function requestedFormat(url: URL, request: Request): LayoutFormatName | null {
  const query = url.searchParams.get('format');
  if (query !== null) return isLayoutFormatName(query) ? query : null;
  const accept = request.headers.get('accept') ?? '';
  return /(^|,)\s*text\/csv\s*(;|,|$)/i.test(accept) ? 'csv' : 'json';
}
