/** Password hashing with argon2id (OWASP Password Storage Cheat Sheet parameters). */
import { hash, verify } from '@node-rs/argon2';
import { MIN_PASSWORD_LENGTH } from '~/lib/schemas/account.ts';

// algorithm 2 is Argon2id in @node-rs/argon2's const enum (not importable under verbatimModuleSyntax).
const OPTIONS = { algorithm: 2, memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export { MIN_PASSWORD_LENGTH };

/** Refuses short passwords here too, so no caller can store one that skipped the form's check. */
export function hashPassword(password: string): Promise<string> {
  if (password.length < MIN_PASSWORD_LENGTH) return Promise.reject(new Error(`password shorter than ${MIN_PASSWORD_LENGTH} characters`));
  return hash(password, OPTIONS);
}

// A real hash of a random password, so unknown e-mails cost the same verify work as known ones.
let dummyHash: Promise<string> | undefined;

/** Verifies `password`; with no stored hash it still does one verify so timing does not tell. */
export async function verifyPassword(storedHash: string | null | undefined, password: string): Promise<boolean> {
  if (!storedHash) {
    dummyHash ??= hashPassword(`no-such-user-${Math.random()}`);
    await verify(await dummyHash, password).catch(() => false);
    return false;
  }
  return verify(storedHash, password).catch(() => false);
}
