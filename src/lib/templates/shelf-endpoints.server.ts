/**
 * GET/POST /api/templates and GET/PATCH/DELETE /api/templates/{id}. A POST may carry `check`,
 * a Template check made against the design before the template was on the shelf: both are saved
 * together, or neither.
 */
import { db } from '~/lib/db/client.server.ts';
import { createTemplate, createTemplateWithCheck, listTemplates, retireTemplate, updateTemplate } from '~/lib/templates/shelf.server.ts';
import { readValidJson } from '~/lib/http/body.server.ts';
import { invalid, json, problem, zodIssues } from '~/lib/http/problem.ts';
import type { SessionUser } from '~/lib/auth/index.server.ts';
import { templateCreateSchema, templateListQuerySchema, templateUpdateSchema } from '~/lib/schemas/template.ts';
import { shelfTemplate, shelfUser } from '~/lib/templates/route-context.server.ts';

const BODY_MAX_BYTES = 16 * 1024;

export async function listRoute(user: SessionUser | null, url: URL): Promise<Response> {
  const allowed = shelfUser(user);
  if (!allowed.ok) return allowed.response;
  const query = templateListQuerySchema.safeParse(Object.fromEntries(url.searchParams));
  if (!query.success) return invalid(zodIssues(query.error));
  return json(await listTemplates(db(), allowed.value.shopId, query.data));
}

export async function createRoute(user: SessionUser | null, request: Request): Promise<Response> {
  const allowed = shelfUser(user);
  if (!allowed.ok) return allowed.response;
  const input = await readValidJson(request, BODY_MAX_BYTES, templateCreateSchema);
  if (!input.ok) return input.response;
  const { check, ...template } = input.value;
  const created = check
    ? await createTemplateWithCheck(db(), allowed.value.shopId, allowed.value.id, template, check)
    : await createTemplate(db(), allowed.value.shopId, template);
  if (!created.ok) {
    const { error } = created;
    return error.kind === 'invalid' ? invalid(error.issues) : problem(404, error.message, { field: error.field });
  }
  return json(created.value, 201, { location: `/api/templates/${created.value.id}` });
}

export async function readRoute(user: SessionUser | null, id: string | undefined): Promise<Response> {
  const found = await shelfTemplate(user, id);
  return found.ok ? json(found.value.template) : found.response;
}

export async function updateRoute(user: SessionUser | null, id: string | undefined, request: Request): Promise<Response> {
  const found = await shelfTemplate(user, id);
  if (!found.ok) return found.response;
  const patch = await readValidJson(request, BODY_MAX_BYTES, templateUpdateSchema);
  if (!patch.ok) return patch.response;
  const updated = await updateTemplate(db(), found.value.user.shopId, found.value.template.id, patch.value);
  return updated ? json(updated) : problem(404, 'No such template');
}

/** DELETE retires the template: it leaves the working shelf but its checks stay on record. */
export async function retireRoute(user: SessionUser | null, id: string | undefined): Promise<Response> {
  const found = await shelfTemplate(user, id);
  if (!found.ok) return found.response;
  const retired = await retireTemplate(db(), found.value.user.shopId, found.value.template.id);
  return retired ? json(retired) : problem(404, 'No such template');
}
