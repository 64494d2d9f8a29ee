import { LAYOUT_FORMATS, isLayoutFormatName, type LayoutFormatName } from '~/lib/export/layout-formats.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { readJson } from '~/lib/http/body.server.ts';
import { invalid, problem } from '~/lib/http/problem.ts';
import { validateDesign } from '~/lib/schemas/design.ts';

/** Largest design body accepted by POST /api/layout. */
export const LAYOUT_BODY_MAX_BYTES = 64 * 1024;

/**
 * POST /api/layout: a design as JSON in, its layout out (JSON by default; the fret table CSV with
 * `?format=csv` or `Accept: text/csv`). Public: it stores nothing and reads nothing.
 */
export async function handleLayoutRequest(request: Request): Promise<Response> {
  if (request.method !== 'POST') {
    return problem(405, 'Use POST with a design as JSON', {}, { allow: 'POST' });
  }
  const format = requestedFormat(request);
  if (format === null) {
    return problem(400, `format must be one of: ${Object.keys(LAYOUT_FORMATS).join(', ')}`, {
      field: 'format',
    });
  }
  const body = await readJson(request, LAYOUT_BODY_MAX_BYTES);
  if (!body.ok) return body.response;
  const validation = validateDesign(body.value);
  if (!validation.ok) return invalid(validation.issues);
  const output = LAYOUT_FORMATS[format];
  return new Response(output.render(computeLayout(validation.design)), {
    status: 200,
    headers: { 'content-type': output.contentType, 'cache-control': 'no-store' },
  });
}

/** `?format=` wins; otherwise `Accept: text/csv` asks for CSV; JSON is the default. */
function requestedFormat(request: Request): LayoutFormatName | null {
  const query = new URL(request.url).searchParams.get('format');
  if (query !== null) return isLayoutFormatName(query) ? query : null;
  const accept = request.headers.get('accept') ?? '';
  return /(^|,)\s*text\/csv\s*(;|,|$)/i.test(accept) ? 'csv' : 'json';
}
