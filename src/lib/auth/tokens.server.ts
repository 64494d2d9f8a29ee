/** Random tokens for cookies and links; only their SHA-256 is ever stored. */
import { createHash, randomBytes } from 'node:crypto';

/** 128 bits of randomness, URL-safe (base64url, 22 characters). */
export function newToken(): string {
  return randomBytes(16).toString('base64url');
}

export function sha256Hex(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('hex');
}

/** True when `text` looks like a token we issued (guards lookups from junk input). */
export function isWellFormedToken(text: string): boolean {
  return /^[A-Za-z0-9_-]{22}$/.test(text);
}
