import { ActionError, type ActionAPIContext } from 'astro:actions';
import type { SessionUser } from '~/lib/auth/index.server.ts';
import { requireRole } from './require-role.ts';
import type { Role } from '~/lib/schemas/account.ts';

/**
 * The role check of every action (the one guard, requireRole): the signed-in user, or an
 * ActionError with its 401/403. The page that renders the result checks the role again itself.
 */
export function signedInAs(context: ActionAPIContext, allowed: readonly Role[]): SessionUser {
  const guard = requireRole(context.locals.user, allowed);
  if (guard.ok) return guard.value;
  const status = guard.response.status;
  throw new ActionError({ code: ActionError.statusToCode(status), message: status === 401 ? 'Sign in first' : 'Your role cannot do this' });
}
