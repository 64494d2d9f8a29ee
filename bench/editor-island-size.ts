/**
 * Bench: size of the Layout editor island's JavaScript, as a browser loads it for /layout.
 * Usage: npm run bench, or tsx bench/editor-island-size.ts <base URL of a running built server> [dist/client]
 *
 * Reads the island's component and renderer scripts from the page, follows their static imports
 * through the built files in dist/client/_astro, and reports the total gzip size as JSON lines.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { baseUrl, reportFigure } from './lib/figure.ts';

const origin = process.argv[2] ?? baseUrl();
const clientDir = process.argv[3] ?? 'dist/client';

const html = await (await fetch(new URL('/layout', origin))).text();
const island = /<astro-island\b[^>]*>/.exec(html)?.[0] ?? '';
const entries = [...island.matchAll(/(?:component|renderer)-url="([^"]+)"/g)].map((match) => match[1] ?? '');
if (entries.length < 2) {
  console.error('could not find the editor island (component-url and renderer-url) on /layout');
  process.exit(1);
}

/** Every script loaded before the island runs: the entries and their static imports. */
const files = new Set<string>();
const pending = entries.map((url) => url.replace(/^\//, ''));
while (pending.length > 0) {
  const file = pending.pop() ?? '';
  if (files.has(file)) continue;
  files.add(file);
  const code = readFileSync(join(clientDir, file), 'utf8');
  const directory = file.slice(0, file.lastIndexOf('/') + 1);
  for (const match of code.matchAll(/(?:\bfrom|\bimport)\s*["']\.\/([^"']+\.js)["']/g)) pending.push(directory + (match[1] ?? ''));
}

let raw = 0;
let gzip = 0;
for (const file of files) {
  const bytes = readFileSync(join(clientDir, file));
  raw += bytes.length;
  gzip += gzipSync(bytes).length;
}
const kib = (bytes: number) => Math.round((bytes / 1024) * 10) / 10;
reportFigure({ figure: 'editor island JavaScript (gzip)', value: kib(gzip), unit: 'KiB', goal: '< 250', met: kib(gzip) < 250 });
reportFigure({ figure: `editor island JavaScript (uncompressed, ${files.size} files)`, value: kib(raw), unit: 'KiB', goal: 'context' });
