/**
 * Export speed: median time to build the paper template (seven-string fan on Letter tiles) and
 * its slot paths DXF. Prints one JSON line per figure: {"figure","value","unit","goal"}.
 * Run with `npm run bench` (or `npx tsx bench/export.ts`).
 */
import { exportDesign } from '~/lib/export/export-design.server.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { validateExportOptions, type ExportOptions } from '~/lib/schemas/export-options.ts';

const RUNS = 25;
const WARM_UP = 3;

const design = DEMO_DESIGNS.find((d) => d.id === 'seven-string-fan')?.design;
if (!design) throw new Error('the seven-string demo design is missing');

function options(input: Record<string, unknown>): ExportOptions {
  const result = validateExportOptions(input);
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.options;
}

async function medianMs(chosen: ExportOptions): Promise<number> {
  for (let i = 0; i < WARM_UP; i++) await exportDesign(design!, chosen);
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const start = performance.now();
    await exportDesign(design!, chosen);
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)]!;
}

function report(figure: string, valueMs: number, goalMs: number): void {
  const value = Number(valueMs.toFixed(2));
  console.log(JSON.stringify({ figure, value, unit: 'ms', goal: `< ${goalMs}`, met: value < goalMs }));
}

report('paper template PDF, seven-string fan on Letter tiles (median)', await medianMs(options({ format: 'pdf', paper: 'letter' })), 300);
report('slot paths DXF, seven-string fan (median)', await medianMs(options({ format: 'dxf' })), 30);
