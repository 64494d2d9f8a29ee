/**
 * Adds up every suite's results in a folder and prints the closing line "N passed, N failed".
 * vitest JSON reports count tests; *.status files count one check each (type check, build).
 * A test file that failed to load counts as one failure; a missing report counts as one failure.
 * Before that line: the five slowest test files (from the reports' start and end times), and the
 * reports are copied to the folder named by the second argument (test-results/) to keep.
 * `--expect=a.json,b.json` names the reports that must be there (default vitest.json,e2e.json).
 */
import { copyFileSync, existsSync, mkdirSync, readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';

interface VitestReport {
  numPassedTests: number;
  numFailedTests: number;
  testResults: { status: string; assertionResults: unknown[]; name: string; message?: string; startTime?: number; endTime?: number }[];
}

const args = process.argv.slice(2);
const expectArg = args.find((a) => a.startsWith('--expect='));
const [dir = '.', keepIn] = args.filter((a) => !a.startsWith('--'));
const expectedReports = expectArg ? expectArg.slice('--expect='.length).split(',').filter(Boolean) : ['vitest.json', 'e2e.json'];
const SLOWEST_SHOWN = 5;
const durations: { file: string; ms: number }[] = [];
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
    if (keepIn) {
      mkdirSync(keepIn, { recursive: true });
      copyFileSync(path, join(keepIn, `timings-${name}`));
    }
    for (const file of report.testResults) {
      if (file.startTime !== undefined && file.endTime !== undefined) {
        durations.push({ file: relative(process.cwd(), file.name), ms: file.endTime - file.startTime });
      }
      if (file.status === 'failed' && file.assertionResults.length === 0) {
        console.log(`failed to load: ${file.name} ${file.message ?? ''}`);
        failed++;
      }
    }
  }
}
for (const expected of expectedReports) {
  if (!existsSync(join(dir, expected))) {
    console.log(`missing report: ${expected}`);
    failed++;
  }
}
if (durations.length > 0) {
  console.log(`slowest test files:`);
  for (const { file, ms } of durations.sort((a, b) => b.ms - a.ms).slice(0, SLOWEST_SHOWN)) {
    console.log(`  ${(ms / 1000).toFixed(1).padStart(6)} s  ${file}`);
  }
}
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
