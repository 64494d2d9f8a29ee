/**
 * A short fingerprint of a design's exact content, printed on machine files and the cut sheet so
 * a file found on the shop computer can be matched to the revision it came from: two files with
 * the same fingerprint were made from the same numbers. Not a security hash (FNV-1a, 64 bits).
 */
import type { Design } from '~/lib/schemas/design.ts';

const OFFSET = 0xcbf29ce484222325n;
const PRIME = 0x100000001b3n;
const MASK = (1n << 64n) - 1n;

/** 16 hex digits over the design as JSON (a parsed design always has the same key order). */
export function designFingerprint(design: Design): string {
  let hash = OFFSET;
  for (const byte of new TextEncoder().encode(JSON.stringify(design))) {
    hash = ((hash ^ BigInt(byte)) * PRIME) & MASK;
  }
  return hash.toString(16).padStart(16, '0');
}
