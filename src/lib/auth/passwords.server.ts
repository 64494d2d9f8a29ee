/** Password hashing with argon2id (OWASP Password Storage Cheat Sheet parameters). */
import { hash, verify } from '@node-rs/argon2';

// algorithm 2 is Argon2id in @node-rs/argon2's const enum (not importable under verbatimModuleSyntax).
const OPTIONS = { algorithm: 2, memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export const MIN_PASSWORD_LENGTH = 10;

export function hashPassword(password: string): Promise<string> {
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
