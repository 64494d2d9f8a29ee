import { describe, expect, it } from 'vitest';
import { renamedPath } from '~/lib/http/renamed-routes.ts';

const at = (path: string) => renamedPath(new URL(path, 'http://127.0.0.1'));

describe('renamedPath', () => {
  it('sends the old board paths to /api/boards, keeping the rest of the path and the query', () => {
    expect(at('/api/designs')).toBe('/api/boards');
    expect(at('/api/designs?q=tenor&status=all')).toBe('/api/boards?q=tenor&status=all');
    expect(at('/api/designs/12/export?format=dxf')).toBe('/api/boards/12/export?format=dxf');
    expect(at('/api/designs/import')).toBe('/api/boards/import');
  });

  it('leaves every other path alone, including look-alike prefixes', () => {
    expect(at('/api/boards/12')).toBeNull();
    expect(at('/api/designsX')).toBeNull();
    expect(at('/api/layout')).toBeNull();
    expect(at('/designs')).toBeNull();
  });
});
