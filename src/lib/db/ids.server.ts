import { randomBytes } from 'node:crypto';

/** A user id: 120 random bits as hex; it never reveals how many users exist. */
export function newUserId(): string {
  return randomBytes(15).toString('hex');
}
