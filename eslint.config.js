/**
 * The import boundaries of docs/architecture.md, enforced (npm test runs `npx eslint .`). Type-only
 * imports across a boundary are allowed where they are erased (a pure module may name a server type).
 * - a module without `.server` in its name is pure and browser-safe: it imports no `*.server.ts`
 *   module and no server-only package;
 * - the geometry imports only geometry, the units and the design schema;
 * - src/lib never imports pages, components or actions (the route layer sits above it); route files
 *   and actions never import each other: what two routes share lives in lib;
 * - the product never imports tests or fixtures;
 * - one import spelling: the project's own modules are named with their extension.
 */
import tseslint from 'typescript-eslint';

const SERVER_ONLY_PACKAGES = [
  'node:*', 'fs', 'path', 'os', 'crypto', 'child_process', 'worker_threads',
  'mysql2', 'mysql2/*', 'nodemailer', 'smtp-server', 'mailparser', '@node-rs/argon2', 'lucia', '@lucia-auth/*',
  'piscina', 'rate-limiter-flexible', 'proxy-addr', 'makerjs', 'pdf-lib', '@pdf-lib/fontkit', 'qrcode', 'drizzle-orm/mysql2',
];

const serverModules = { group: ['**/*.server', '**/*.server.ts', '**/*.server.js'], allowTypeImports: true, message: 'a pure module (no .server in its name) must not import a .server module: it may run in the browser' };
const serverPackages = { group: SERVER_ONLY_PACKAGES, message: 'a pure module (no .server in its name) must not use a server-only package; move this code into a .server.ts file' };
const noPagesOrComponents = { group: ['~/pages/*', '~/components/*', '~/actions/*', '**/pages/**', '**/components/**', '**/actions/**'], message: 'src/lib is below pages, components and actions: it never imports them' };
const noOtherRoutes = { group: ['~/pages/*', '~/actions/*', '**/pages/**', '**/actions/**'], message: 'a route file or action never imports another: move what they share into src/lib' };
const noRelativeModules = { regex: '^\\.{1,2}/.*\\.tsx?$', message: 'a route file or action imports lib by `~/lib/…`, never a neighbour: move what they share into src/lib' };
const noTests = { group: ['**/tests/**', '**/fixtures/**', '**/bench/**'], message: 'the product never imports tests, fixtures or benchmarks' };

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.astro/**', 'test-results/**', 'bench/results/**', '.data/**', 'backups/**'] },
  {
    files: ['**/*.{ts,tsx,js,mjs}'],
    languageOptions: { parser: tseslint.parser, ecmaVersion: 'latest', sourceType: 'module' },
    plugins: { '@typescript-eslint': tseslint.plugin },
    linterOptions: { reportUnusedDisableDirectives: 'error' },
  },
  {
    // One import spelling: a module of the project is named with its extension.
    files: ['src/**/*.{ts,tsx}', 'tests/**/*.ts', 'scripts/**/*.ts', 'bench/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: [{ regex: '^(~|\\.{1,2})/(?!.*\\.(ts|tsx|astro|json|css|mjs|md|svg|js)$)', message: 'name the module with its extension (one import spelling: ./plane.ts, ~/lib/geometry/layout.ts)' }] },
      ],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    ignores: ['src/**/*.server.ts', 'src/middleware.ts', 'src/pages/**', 'src/actions/**'],
    rules: { '@typescript-eslint/no-restricted-imports': ['error', { patterns: [serverModules, serverPackages, noTests] }] },
  },
  {
    files: ['src/lib/**/*.server.ts', 'src/middleware.ts'],
    rules: { '@typescript-eslint/no-restricted-imports': ['error', { patterns: [noTests] }] },
  },
  {
    // The route layer: API routes (src/pages/**) and form actions (src/actions/**) call lib only.
    files: ['src/pages/**/*.ts', 'src/actions/**/*.ts'],
    ignores: ['src/actions/index.ts'],
    rules: { '@typescript-eslint/no-restricted-imports': ['error', { patterns: [noOtherRoutes, noRelativeModules, noTests] }] },
  },
  {
    files: ['src/actions/index.ts'],
    rules: { '@typescript-eslint/no-restricted-imports': ['error', { patterns: [noTests] }] },
  },
  {
    files: ['src/lib/**/*.{ts,tsx}'],
    ignores: ['src/lib/**/*.server.ts', 'src/lib/geometry/**'],
    rules: { '@typescript-eslint/no-restricted-imports': ['error', { patterns: [serverModules, serverPackages, noPagesOrComponents, noTests] }] },
  },
  {
    files: ['src/lib/**/*.server.ts'],
    rules: { '@typescript-eslint/no-restricted-imports': ['error', { patterns: [noPagesOrComponents, noTests] }] },
  },
  {
    files: ['src/lib/geometry/**/*.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^(?!\\./|~/lib/geometry/|~/lib/format/units(\\.ts)?$|~/lib/schemas/design(\\.ts)?$)',
              message: 'the geometry imports only geometry, ~/lib/format/units and the design schema',
            },
          ],
        },
      ],
    },
  },
);
