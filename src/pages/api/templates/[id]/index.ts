import type { APIRoute } from 'astro';
import { db } from '~/lib/db/client.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { json, problem } from '~/lib/http/problem.ts';
import { templateUpdateSchema } from '~/lib/schemas/template.ts';
import { shelfTemplate, TEMPLATE_BODY_MAX_BYTES } from '~/lib/templates/route-context.server.ts';
import { retireTemplate, updateTemplate } from '~/lib/templates/shelf.server.ts';

export const prerender = false;

const NOT_FOUND = 'No such template';

/** GET /api/templates/{id}: one template of the shop's shelf. */
export const GET: APIRoute = async ({ locals, params }) => {
  const found = await shelfTemplate(locals.user, params.id);
  return found.ok ? json(found.value.template) : found.response;
};

/** PATCH /api/templates/{id}: changes the template's fields. */
export const PATCH: APIRoute = async ({ locals, params, request }) => {
  const found = await shelfTemplate(locals.user, params.id);
  if (!found.ok) return found.response;
  const patch = await readValidJson(request, TEMPLATE_BODY_MAX_BYTES, templateUpdateSchema);
  if (!patch.ok) return patch.response;
  const updated = await updateTemplate(db(), found.value.user.shopId, found.value.template.id, patch.value);
  return updated ? json(updated) : problem(404, NOT_FOUND);
};

/** DELETE retires the template: it leaves the working shelf but its checks stay on record. */
export const DELETE: APIRoute = async ({ locals, params }) => {
  const found = await shelfTemplate(locals.user, params.id);
  if (!found.ok) return found.response;
  const retired = await retireTemplate(db(), found.value.user.shopId, found.value.template.id);
  return retired ? json(retired) : problem(404, NOT_FOUND);
};
