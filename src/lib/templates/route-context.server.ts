/** What every Template shelf route does first: the role check, then the template of this shop. */
import { parseRecordId } from '~/lib/http/record-id.ts';
import { CAN, requireRole, type SessionUser } from '~/lib/auth/index.server.ts';
import { db } from '~/lib/db/client.server.ts';
import { getTemplate } from '~/lib/templates/shelf.server.ts';
import { problem } from '~/lib/http/problem.ts';
import type { TemplateView } from '~/lib/schemas/template.ts';

export type Allowed<T> = { ok: true; value: T } | { ok: false; response: Response };

/** Builders and owners only (clients get 403, visitors 401). */
export function shelfUser(user: SessionUser | null): Allowed<SessionUser> {
  const guard = requireRole(user, CAN.design);
  return guard.ok ? { ok: true, value: guard.user } : { ok: false, response: guard.response };
}


/** The signed-in shop member and the template `rawId` of their shop; 404 for any other id. */
export async function shelfTemplate(user: SessionUser | null, rawId: string | undefined): Promise<Allowed<{ user: SessionUser; template: TemplateView }>> {
  const allowed = shelfUser(user);
  if (!allowed.ok) return allowed;
  const id = parseRecordId(rawId);
  const template = id === null ? null : await getTemplate(db(), allowed.value.shopId, id);
  if (!template) return { ok: false, response: problem(404, 'No such template') };
  return { ok: true, value: { user: allowed.value, template } };
}
