/**
 * Adds up every suite's results in a folder and prints the closing line "N passed, N failed".
 * vitest JSON reports count tests; *.status files count one check each (type check, build).
 * A test file that failed to load counts as one failure; a missing report counts as one failure.
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

interface VitestReport {
  numPassedTests: number;
  numFailedTests: number;
  testResults: { status: string; assertionResults: unknown[]; name: string; message?: string }[];
}

const dir = process.argv[2] ?? '.';
let passed = 0;
let failed = 0;

for (const name of readdirSync(dir)) {
  const path = join(dir, name);
  if (name.endsWith('.status')) {
    if (readFileSync(path, 'utf8').trim() === 'pass') passed++;
    else failed++;
  } else if (name.endsWith('.json')) {
    const report = JSON.parse(readFileSync(path, 'utf8')) as VitestReport;
    passed += report.numPassedTests;
    failed += report.numFailedTests;
    for (const file of report.testResults) {
      if (file.status === 'failed' && file.assertionResults.length === 0) {
        console.log(`failed to load: ${file.name} ${file.message ?? ''}`);
        failed++;
      }
    }
  }
}
for (const expected of ['vitest.json', 'e2e.json']) {
  if (!existsSync(join(dir, expected))) {
    console.log(`missing report: ${expected}`);
    failed++;
  }
}
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
