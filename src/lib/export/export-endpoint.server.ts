import { LAYOUT_BODY_MAX_BYTES } from '~/lib/geometry-api/layout-endpoint.server';
import { readJson } from '~/lib/http/body.server';
import { invalid, problem } from '~/lib/http/problem';
import { validateDesign } from '~/lib/schemas/design';
import { validateExportOptions } from '~/lib/schemas/export-options';
import { exportDesign } from './export-design.server';
import { attachmentHeader } from './file-name';

/**
 * POST /api/export?format=pdf|dxf|svg|csv|json&paper=...: a design as JSON in (saved or not), the
 * file out as an attachment. Public like /api/layout: it stores and reads nothing. Options come
 * from the query string; a bad option is a 400 naming it, a bad design the geometry's 400.
 */
export async function handleExportRequest(request: Request): Promise<Response> {
  if (request.method !== 'POST') {
    return problem(405, 'Use POST with a design as JSON', {}, { allow: 'POST' });
  }
  const query = Object.fromEntries(new URL(request.url).searchParams);
  const options = validateExportOptions(query);
  if (!options.ok) return invalid(options.issues);
  const body = await readJson(request, LAYOUT_BODY_MAX_BYTES);
  if (!body.ok) return body.response;
  const design = validateDesign(body.value);
  if (!design.ok) return invalid(design.issues);
  const file = await exportDesign(design.design, options.options);
  return new Response(new Uint8Array(file.bytes), {
    status: 200,
    headers: {
      'content-type': file.contentType,
      'content-disposition': attachmentHeader(file.filename),
      'content-length': String(file.bytes.byteLength),
      'cache-control': 'no-store',
    },
  });
}
