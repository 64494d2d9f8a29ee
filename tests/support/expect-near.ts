import { expect } from 'vitest';

/** |actual - expected| <= tolerance, where the tolerance carries the unit named at the call. */
export function expectNear(actual: number, expected: number, tolerance: number): void {
  const gap = Math.abs(actual - expected);
  if (!(gap <= tolerance)) {
    expect.fail(`expected ${actual} to be within ${tolerance} of ${expected} (off by ${gap})`);
  }
}
