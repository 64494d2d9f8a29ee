/**
 * The import boundaries (eslint.config.js) catch what they are meant to: each case lints a line
 * of code as if it lived at a given path in src/, with the project's own configuration.
 */
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

const eslint = new ESLint({ cwd: process.cwd() });

async function problems(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath });
  return (result?.messages ?? []).map((m) => m.message);
}

describe('import boundaries', () => {
  it.each([
    ['a browser component importing a .server module', 'src/components/editor/Example.tsx', "import { db } from '~/lib/db/client.server.ts';"],
    ['a pure lib module importing a .server module', 'src/lib/export/example.ts', "import { sendMail } from '~/lib/mail/send.server.ts';"],
    ['a pure module using a server-only package', 'src/lib/export/example.ts', "import makerjs from 'makerjs';"],
    ['a pure module using node: built-ins', 'src/lib/boards/example.ts', "import { readFileSync } from 'node:fs';"],
    ['geometry importing beyond geometry, units and the design schema', 'src/lib/geometry/example.ts', "import { exportFileName } from '~/lib/export/file-name.ts';"],
    ['lib importing a component', 'src/lib/boards/example.server.ts', "import { BoardsTable } from '~/components/boards/BoardsTable.tsx';"],
    ['the product importing test fixtures', 'src/lib/boards/example.ts', "import table from '../../../fixtures/tables/mandolin.csv?raw';"],
    ['lib importing a route file', 'src/lib/boards/example.server.ts', "import { GET } from '~/pages/api/boards/index.ts';"],
    ['lib importing a form action', 'src/lib/accounts/example.server.ts', "import { members } from '~/actions/members.ts';"],
    ['a route file importing another route file', 'src/pages/api/boards/example.ts', "import { GET } from '~/pages/api/boards/index.ts';"],
    ['a route file importing another by a relative path', 'src/pages/api/boards/[id]/example.ts', "import { POST } from '../import.ts';"],
    ['a form action importing a route file', 'src/actions/example.ts', "import { POST } from '~/pages/api/layout.ts';"],
  ])('refuses %s', async (_what, path, code) => {
    expect((await problems(path, code)).length).toBeGreaterThan(0);
  });

  it.each([
    ['a type-only import of a server type in a component', 'src/components/templates/Example.tsx', "import type { SavedCheck } from '~/lib/templates/shelf.server.ts';"],
    ['geometry importing geometry, units and the design schema', 'src/lib/geometry/example.ts', "import { lerpPoint } from './plane.ts';\nimport { fromMm } from '~/lib/format/units.ts';\nimport type { Design } from '~/lib/schemas/design.ts';"],
    ['a .server module using server packages and modules', 'src/lib/export/example.server.ts', "import makerjs from 'makerjs';\nimport { db } from '~/lib/db/client.server.ts';"],
    ['a route file importing lib, .server modules included', 'src/pages/api/boards/example.ts', "import { requireRole } from '~/lib/http/require-role.ts';\nimport { db } from '~/lib/db/client.server.ts';"],
    ['a form action importing lib, .server modules included', 'src/actions/example.ts', "import { formDone } from '~/lib/http/form-outcome.ts';\nimport { limitRequest } from '~/lib/accounts/limits.server.ts';"],
  ])('allows %s', async (_what, path, code) => {
    expect(await problems(path, code)).toEqual([]);
  });
});

describe('one import spelling', () => {
  it('refuses a project module named without its extension, and takes it with one', async () => {
    expect((await problems('src/lib/export/example.ts', "import { computeLayout } from '~/lib/geometry/layout';")).length).toBeGreaterThan(0);
    expect((await problems('src/lib/geometry/example.ts', "import { lerpPoint } from './plane';")).length).toBeGreaterThan(0);
    expect(await problems('src/lib/export/example.ts', "import { computeLayout } from '~/lib/geometry/layout.ts';")).toEqual([]);
    expect(await problems('src/lib/export/example.ts', "import { z } from 'zod';")).toEqual([]);
  });
});
