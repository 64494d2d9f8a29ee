import type { APIRoute } from 'astro';
import { CAN } from '~/lib/auth/index.server.ts';
import { db } from '~/lib/db/client.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { invalid, json, problem, zodIssues } from '~/lib/http/problem.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { failureAnswer, type FailureAnswers } from '~/lib/http/result.ts';
import { templateCreateSchema, templateListQuerySchema } from '~/lib/schemas/template.ts';
import { TEMPLATE_BODY_MAX_BYTES } from '~/lib/templates/route-context.server.ts';
import { createTemplate, createTemplateWithCheck, listTemplates, type ShelfFailure } from '~/lib/templates/shelf.server.ts';

export const prerender = false;

const SHELF_FAILURES: FailureAnswers<ShelfFailure> = {
  invalid: (failure) => invalid(failure.issues),
  not_found: (failure) => problem(404, failure.message, { field: failure.field }),
};

/** GET /api/templates?…: one page of the shop's Template shelf. */
export const GET: APIRoute = async ({ locals, url }) => {
  const allowed = requireRole(locals.user, CAN.design);
  if (!allowed.ok) return allowed.response;
  const query = templateListQuerySchema.safeParse(Object.fromEntries(url.searchParams));
  if (!query.success) return invalid(zodIssues(query.error));
  return json(await listTemplates(db(), allowed.value.shopId, query.data));
};

/**
 * POST /api/templates: a template on the shelf. It may carry `check`, a Template check made
 * against the design before the template was on the shelf: both are saved together, or neither.
 */
export const POST: APIRoute = async ({ locals, request }) => {
  const allowed = requireRole(locals.user, CAN.design);
  if (!allowed.ok) return allowed.response;
  const input = await readValidJson(request, TEMPLATE_BODY_MAX_BYTES, templateCreateSchema);
  if (!input.ok) return input.response;
  const { check, ...template } = input.value;
  const created = check
    ? await createTemplateWithCheck(db(), allowed.value.shopId, allowed.value.id, template, check)
    : await createTemplate(db(), allowed.value.shopId, template);
  if (!created.ok) return failureAnswer(created, SHELF_FAILURES);
  return json(created.value, 201, { location: `/api/templates/${created.value.id}` });
};
