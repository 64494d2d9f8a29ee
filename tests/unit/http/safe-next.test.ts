import { describe, expect, it } from 'vitest';
import { safeNextPath } from '~/lib/http/safe-next.ts';

describe('safeNextPath (where sign-in may send a person)', () => {
  it('keeps same-site relative paths with their query and fragment', () => {
    expect(safeNextPath('/members', '/x')).toBe('/members');
    expect(safeNextPath('/boards?sort=name#top', '/x')).toBe('/boards?sort=name#top');
  });

  it.each([
    ['https://elsewhere.example/'],
    ['//elsewhere.example/path'],
    ['/\\elsewhere.example'],
    ['javascript:alert(1)'],
    ['members'],
    ['/\tfoo'],
    [''],
    ['//x'],
    ['/\\x'],
    // URL normalisation turns these into "//x" (another host to a browser).
    ['/.//x'],
    ['/./\\x'],
    ['/a/..//x'],
    ['%2F%2Fx'],
    ['https://x'],
    ['/'],
  ])('falls back for %j', (next) => {
    expect(safeNextPath(next, '/fallback')).toBe('/fallback');
  });

  it('keeps encoded slashes inside one path segment (a browser does not read them as a host)', () => {
    expect(safeNextPath('/%2F%2Fx', '/fallback')).toBe('/%2F%2Fx');
  });

  it('falls back when there is no next at all', () => {
    expect(safeNextPath(null, '/home')).toBe('/home');
    expect(safeNextPath(undefined, '/home')).toBe('/home');
  });
});
