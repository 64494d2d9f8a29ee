/** What every Template shelf route does first: the role check, then the template of this shop. */
import { parseRecordId } from '~/lib/http/record-id.ts';
import { CAN, type SessionUser } from '~/lib/auth/index.server.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { db } from '~/lib/db/client.server.ts';
import { getTemplate } from '~/lib/templates/shelf.server.ts';
import { problem, type Checked } from '~/lib/http/problem.ts';
import type { TemplateView } from '~/lib/schemas/template.ts';

/** Largest JSON body of the shelf's routes (a template, a change, a check grid fits easily). */
export const TEMPLATE_BODY_MAX_BYTES = 16 * 1024;

/**
 * The signed-in shop member (Builders and Owners; Clients get 403, visitors 401) and the template
 * `rawId` of their shop; 404 for any other id.
 */
export async function shelfTemplate(user: SessionUser | null, rawId: string | undefined): Promise<Checked<{ user: SessionUser; template: TemplateView }>> {
  const allowed = requireRole(user, CAN.design);
  if (!allowed.ok) return allowed;
  const id = parseRecordId(rawId);
  const template = id === null ? null : await getTemplate(db(), allowed.value.shopId, id);
  if (!template) return { ok: false, response: problem(404, 'No such template') };
  return { ok: true, value: { user: allowed.value, template } };
}
