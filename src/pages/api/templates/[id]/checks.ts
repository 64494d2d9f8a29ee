import type { APIRoute } from 'astro';
import { db } from '~/lib/db/client.server.ts';
import { readText } from '~/lib/http/body.server.ts';
import { invalid, json, problem, zodIssues } from '~/lib/http/problem.ts';
import { checkGridSchema, checkSettingsSchema } from '~/lib/schemas/template.ts';
import { MEASUREMENTS_CSV_MAX_BYTES } from '~/lib/templates/check/measurements-csv.ts';
import { runCheck, runCsvCheck, type CheckOutcome } from '~/lib/templates/check/run-check.ts';
import { shelfTemplate } from '~/lib/templates/route-context.server.ts';
import { listChecks, saveCheck, templateDesign } from '~/lib/templates/shelf.server.ts';

export const prerender = false;

/** GET /api/templates/{id}/checks: the template's saved checks. */
export const GET: APIRoute = async ({ locals, params }) => {
  const found = await shelfTemplate(locals.user, params.id);
  if (!found.ok) return found.response;
  return json({ items: await listChecks(db(), found.value.user.shopId, found.value.template.id) });
};

/**
 * POST /api/templates/{id}/checks: a check arrives as a grid (JSON) or as an uploaded CSV
 * (text/csv, with `units`, `tolerance` and optionally `along`, the line of rows that name none, in
 * the query). Bad input is answered with the line or field at fault and nothing is saved.
 */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const found = await shelfTemplate(locals.user, params.id);
  if (!found.ok) return found.response;
  const { template } = found.value;
  const body = await readText(request, { maxBytes: MEASUREMENTS_CSV_MAX_BYTES, types: ['application/json', 'text/csv', 'text/plain'] });
  if (!body.ok) return body.response;
  const reference = await templateDesign(db(), found.value.user.shopId, template);
  if (!reference) return problem(409, 'This template has no design to check against', { field: 'template' });

  let outcome: CheckOutcome;
  if ((request.headers.get('content-type') ?? '').toLowerCase().startsWith('application/json')) {
    let parsedJson: unknown;
    try {
      parsedJson = JSON.parse(body.value);
    } catch {
      return problem(400, 'Body is not valid JSON', { field: '(body)' });
    }
    const grid = checkGridSchema.safeParse(parsedJson);
    if (!grid.success) return invalid(zodIssues(grid.error));
    outcome = runCheck(reference.design, grid.data);
  } else {
    const url = new URL(request.url);
    const settings = checkSettingsSchema.safeParse({
      units: url.searchParams.get('units') ?? undefined,
      tolerance: url.searchParams.has('tolerance') ? Number(url.searchParams.get('tolerance')) : undefined,
      along: url.searchParams.get('along') ?? undefined,
    });
    if (!settings.success) return invalid(zodIssues(settings.error));
    outcome = runCsvCheck(reference.design, body.value, settings.data);
  }

  if (!outcome.ok) {
    if ('csvErrors' in outcome) {
      const first = outcome.csvErrors[0]!;
      return problem(400, `CSV line ${first.line}: ${first.message}`, {
        field: 'csv',
        line: first.line,
        issues: outcome.csvErrors.map((e) => ({ path: `csv.line.${e.line}`, message: e.message })),
      });
    }
    return invalid(outcome.errors.map((e) => ({ path: e.field, message: e.message })));
  }
  const saved = await saveCheck(db(), found.value.user.shopId, template.id, found.value.user.id, outcome.result);
  return json(saved, 201);
};
