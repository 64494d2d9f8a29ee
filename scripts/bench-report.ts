/**
 * Collects the JSON lines printed by each bench script (see bench/README.md), prints one table
 * and writes it to <resultsDir>/<time>.json. Exits 1 when a script failed or printed no figure.
 * Usage: tsx scripts/bench-report.ts <outDir> <resultsDir> <elapsedSeconds>
 */
import { execFileSync } from 'node:child_process';
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { cpus } from 'node:os';
import { join } from 'node:path';
import { z } from 'zod';

const figureSchema = z.object({
  figure: z.string().min(1),
  value: z.number().finite(),
  unit: z.string(),
  goal: z.string(),
  met: z.boolean().optional(),
});
type Figure = z.infer<typeof figureSchema>;

interface ScriptRun {
  script: string;
  status: string;
  ok: boolean;
  figures: number;
  problems: string[];
}

const [outDir, resultsDir, elapsed] = process.argv.slice(2);
if (!outDir || !resultsDir) throw new Error('usage: bench-report.ts <outDir> <resultsDir> <elapsedSeconds>');

function readLines(path: string): string[] {
  try {
    return readFileSync(path, 'utf8').split('\n');
  } catch {
    return [];
  }
}

const figures: (Figure & { script: string })[] = [];
const runs: ScriptRun[] = [];
for (const statusFile of readdirSync(outDir).filter((f) => f.endsWith('.status')).sort()) {
  const script = statusFile.replace(/\.status$/, '');
  const status = readFileSync(join(outDir, statusFile), 'utf8').trim();
  const problems: string[] = [];
  let count = 0;
  for (const line of readLines(join(outDir, `${script}.out`))) {
    if (!line.trim().startsWith('{')) continue;
    let parsed: unknown;
    try {
      parsed = JSON.parse(line);
    } catch {
      problems.push(`not JSON: ${line.slice(0, 120)}`);
      continue;
    }
    const figure = figureSchema.safeParse(parsed);
    if (figure.success) {
      figures.push({ ...figure.data, script });
      count++;
    } else {
      problems.push(`not a figure (${figure.error.issues[0]?.path.join('.')}: ${figure.error.issues[0]?.message}): ${line.slice(0, 120)}`);
    }
  }
  const skipped = status.startsWith('skipped');
  if (!skipped && !status.startsWith('exit 0')) problems.push(status);
  if (!skipped && count === 0) problems.push('printed no figure');
  if (problems.length > 0 && !skipped) {
    const stderr = readLines(join(outDir, `${script}.err`)).filter(Boolean).slice(-15);
    problems.push(...stderr.map((l) => `  stderr: ${l}`));
  }
  runs.push({ script, status, ok: problems.length === 0 && !skipped, figures: count, problems });
}

function formatValue(f: Figure): string {
  const digits = Math.abs(f.value) >= 100 || Number.isInteger(f.value) ? 0 : 3;
  return `${f.value.toFixed(digits)} ${f.unit}`;
}

const rows = figures.map((f) => [f.figure, formatValue(f), f.goal, f.met === undefined ? '-' : f.met ? 'yes' : 'NO', f.script]);
const header = ['figure', 'value', 'goal', 'met', 'script'];
const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]!.length)));
const line = (cells: string[]) => cells.map((c, i) => c.padEnd(widths[i]!)).join('  ').trimEnd();
console.log(['', line(header), line(widths.map((w) => '-'.repeat(w))), ...rows.map(line)].join('\n'));

for (const run of runs.filter((r) => !r.ok)) {
  console.log(`\n${run.script}: ${run.status.startsWith('skipped') ? run.status : 'FAILED'}`);
  for (const p of run.problems) console.log(`  ${p}`);
}

function commit(): string | null {
  try {
    return execFileSync('git', ['rev-parse', '--short', 'HEAD'], { encoding: 'utf8' }).trim();
  } catch {
    return null;
  }
}

const finishedAt = new Date();
const file = join(resultsDir, `${finishedAt.toISOString().replace(/[:.]/g, '-')}.json`);
const report = {
  finishedAt: finishedAt.toISOString(),
  commit: commit(),
  machine: { cpus: cpus().length, node: process.version },
  elapsedSeconds: Number(elapsed ?? 0),
  figures,
  scripts: runs,
};
writeFileSync(file, `${JSON.stringify(report, null, 2)}\n`);
const failed = runs.filter((r) => !r.ok && !r.status.startsWith('skipped')).length;
const unmet = figures.filter((f) => f.met === false).length;
console.log(`\n${figures.length} figures, ${unmet} goals not met, ${failed} scripts failed; written to ${file}`);
process.exit(failed > 0 || runs.some((r) => r.status.startsWith('skipped')) ? 1 : 0);
