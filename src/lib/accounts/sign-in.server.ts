/** Checking an e-mail and password; unknown e-mails cost the same hashing work as known ones. */
import { verifyPassword } from '~/lib/auth/index.server.ts';
import type { Role } from '~/lib/db/schema.ts';
import { findUserByEmail } from './users.server.ts';

export async function checkCredentials(email: string, password: string): Promise<{ ok: true; userId: string; role: Role } | { ok: false }> {
  const user = await findUserByEmail(email);
  const matches = await verifyPassword(user?.passwordHash, password);
  return matches && user ? { ok: true, userId: user.id, role: user.role } : { ok: false };
}

/** Where a person lands after signing in when no `next` page was asked for. */
export function homeFor(role: Role): string {
  return role === 'client' ? '/shared' : '/boards';
}
