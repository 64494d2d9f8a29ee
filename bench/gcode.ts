/**
 * Slot toolpath speed, in this process: median time to write the G-code of the largest design
 * the schema takes with a compound radius (16 strings, 36 frets, 864 to 940 mm, 184.15 to
 * 406.4 mm radius, through slots with 1 mm overrun, passes of 1 mm), and of the Export panel's
 * preview redraw (the same plan plus the preview's drawing data) for the demo fan and for that
 * largest design. Context: the ratio of G-code to slot paths DXF of the same design in this run.
 * Run with `npm run bench` (or `npx tsx bench/gcode.ts`).
 */
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { exportDesign } from '~/lib/export/export-design.server.ts';
import { designToolpath } from '~/lib/export/gcode-checks.ts';
import { toolpathPreview } from '~/lib/export/toolpath-preview.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';
import { validateExportOptions, type ExportOptions } from '~/lib/schemas/export-options.ts';
import { reportFigure } from './lib/figure.ts';

const RUNS = 25;
const WARM_UP = 3;

function valid(input: unknown): Design {
  const result = validateDesign(input);
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.design;
}
function options(input: Record<string, unknown>): ExportOptions {
  const result = validateExportOptions(input);
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.options;
}

const largest = valid({
  name: 'Bench: largest radiused board',
  units: 'mm',
  strings: 16,
  frets: 36,
  scale: { treble: 864, bass: 940 },
  perpendicularFret: 9,
  stringSpacing: { nut: 120, bridge: 200 },
  temperament: { kind: 'equal', divisions: 12 },
  radius: { nut: 184.15, end: 406.4 },
  overhang: { nut: 3, end: 3 },
  slot: { width: 0.6, depth: 3, overrun: 1 },
});
const fan = DEMO_DESIGNS.find((d) => d.id === 'seven-string-fan')!.design;
const gcode = options({ format: 'gcode' });

async function medianMs(work: () => unknown): Promise<number> {
  for (let i = 0; i < WARM_UP; i++) await work();
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const start = performance.now();
    await work();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)]!;
}

/** What the panel redraws on a change: the plan from the options, then the preview's paths. */
function redraw(design: Design): void {
  const layout = computeLayout(design);
  const planned = designToolpath(design, layout, gcode);
  if (!planned.ok) throw new Error(JSON.stringify(planned.issues));
  toolpathPreview(planned.plan, layout);
}

function report(figure: string, valueMs: number, goalMs: number): void {
  const value = Number(valueMs.toFixed(2));
  reportFigure({ figure, value, unit: 'ms', goal: `< ${goalMs}`, met: value < goalMs });
}

const largestGcode = await medianMs(() => exportDesign(largest, gcode));
const largestDxf = await medianMs(() => exportDesign(largest, options({ format: 'dxf' })));
const file = await exportDesign(largest, gcode);
report('G-code, largest design (16 strings, 36 frets, compound radius; median)', largestGcode, 100);
reportFigure({ figure: 'G-code file size, largest design', value: Math.round(file.bytes.byteLength / 1024), unit: 'KiB', goal: 'context' });
reportFigure({ figure: 'G-code / slot paths DXF time, largest design (same run)', value: Number((largestGcode / largestDxf).toFixed(2)), unit: 'ratio', goal: 'context' });
report('toolpath preview redraw, demo fan (plan + drawing data; median)', await medianMs(() => redraw(fan)), 16);
report('toolpath preview redraw, largest design (plan + drawing data; median)', await medianMs(() => redraw(largest)), 16);
