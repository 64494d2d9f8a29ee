import type { APIRoute } from 'astro';
import { designExportResponse } from '~/lib/export/design-export.server.ts';
import { readJson } from '~/lib/http/body.server.ts';
import { invalid } from '~/lib/http/problem.ts';
import { answerOrServerError } from '~/lib/http/server-error.server.ts';
import { DESIGN_JSON_MAX_BYTES, validateDesign } from '~/lib/schemas/design.ts';
import { validateExportOptions } from '~/lib/schemas/export-options.ts';
import { boardWire } from '~/lib/wire/board-wire.server.ts';

export const prerender = false;

/**
 * POST /api/export?format=pdf|dxf|svg|csv|json|gcode|cutlist|cutsheet&paper=...: a design as JSON
 * in (saved or not), the file out as an attachment. Public like /api/layout: it stores nothing;
 * for a signed-in shop member, the cut list and cut sheet read the fret wire the design names from
 * the member's own shop list (a visitor's get none). Options come
 * from the query string; a bad option is a 400 naming it, a bad design the geometry's 400, an
 * export over a cap a 422 naming the option to change (docs/exports.md, "Limits").
 */
export const POST: APIRoute = ({ request, url, locals }) => answerOrServerError('The export', async () => {
  const options = validateExportOptions(Object.fromEntries(url.searchParams));
  if (!options.ok) return invalid(options.issues);
  const body = await readJson(request, DESIGN_JSON_MAX_BYTES);
  if (!body.ok) return body.response;
  const design = validateDesign(body.value);
  if (!design.ok) return invalid(design.issues);
  const wantsWire = options.options.format === 'cutlist' || options.options.format === 'cutsheet';
  const context = wantsWire ? { wire: await boardWire(locals.user, design.design) } : {};
  return designExportResponse(design.design, options.options, context, request.signal);
});

