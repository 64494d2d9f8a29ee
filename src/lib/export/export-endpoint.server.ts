import { LAYOUT_BODY_MAX_BYTES } from '~/lib/geometry-api/layout-endpoint.server.ts';
import { readJson } from '~/lib/http/body.server.ts';
import { invalid, problem } from '~/lib/http/problem.ts';
import { validateDesign } from '~/lib/schemas/design.ts';
import { validateExportOptions } from '~/lib/schemas/export-options.ts';
import { answerOrServerError } from '~/lib/http/server-error.server.ts';
import { designExportResponse } from './design-export.server.ts';
import type { SessionUser } from '~/lib/auth/index.server.ts';
import { boardWire } from '~/lib/wire/board-wire.server.ts';
import type { ExportPool } from './worker/export-pool.server.ts';

/**
 * POST /api/export?format=pdf|dxf|svg|csv|json|gcode|cutlist|cutsheet&paper=...: a design as JSON
 * in (saved or not), the file out as an attachment. Public like /api/layout: it stores nothing;
 * for a signed-in shop member, the cut list and cut sheet read the fret wire the design names from
 * the member's own shop list (a visitor's get none). Options come
 * from the query string; a bad option is a 400 naming it, a bad design the geometry's 400, an
 * export over a cap a 422 naming the option to change (docs/exports.md, "Limits").
 * `pool` is for tests; the server's own pool by default.
 */
export function handleExportRequest(request: Request, pool?: ExportPool, user: SessionUser | null = null): Promise<Response> {
  return answerOrServerError('The export', () => answerExport(request, pool, user));
}

async function answerExport(request: Request, pool: ExportPool | undefined, user: SessionUser | null): Promise<Response> {
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
  const wants = options.options.format === 'cutlist' || options.options.format === 'cutsheet';
  const context = wants ? { wire: await boardWire(user, design.design) } : {};
  return designExportResponse(design.design, options.options, context, request.signal, pool);
}
