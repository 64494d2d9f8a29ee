import { LAYOUT_BODY_MAX_BYTES } from '~/lib/geometry-api/layout-endpoint.server.ts';
import { readJson } from '~/lib/http/body.server.ts';
import { invalid, problem } from '~/lib/http/problem.ts';
import { validateDesign } from '~/lib/schemas/design.ts';
import { validateExportOptions } from '~/lib/schemas/export-options.ts';
import { answerOrServerError } from '~/lib/http/server-error.server.ts';
import { designExportResponse } from './design-export.server.ts';
import type { ExportPool } from './worker/export-pool.server.ts';

/**
 * POST /api/export?format=pdf|dxf|svg|csv|json&paper=...: a design as JSON in (saved or not), the
 * file out as an attachment. Public like /api/layout: it stores and reads nothing. Options come
 * from the query string; a bad option is a 400 naming it, a bad design the geometry's 400, an
 * export over a cap a 422 naming the option to change (docs/exports.md, "Limits").
 * `pool` is for tests; the server's own pool by default.
 */
export function handleExportRequest(request: Request, pool?: ExportPool): Promise<Response> {
  return answerOrServerError('The export', () => answerExport(request, pool));
}

async function answerExport(request: Request, pool: ExportPool | undefined): Promise<Response> {
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
  return designExportResponse(design.design, options.options, {}, request.signal, pool);
}
