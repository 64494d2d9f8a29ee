/**
 * Speed of computeLayout. Prints one JSON line per figure (bench/README.md): the goal figure
 * (8 strings x 36 frets, fanned), then how the time scales with frets x strings (6/12/24/36 frets,
 * 4/8/16 strings): per size the time per fret-string, then the ratio of the largest to the
 * smallest per-fret-string time (at most linear growth keeps it at or under 1) and a straight-line
 * fit of time against frets x strings. Times are medians over batches, after a warm-up; compare
 * them as ratios within one run.
 * Run: npx tsx bench/layout-compute.ts
 */
import { computeLayout } from '~/lib/geometry/layout.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';
import { reportFigure } from './lib/figure.ts';

const BATCHES = 41;
const BATCH_SIZE = 250;
const WARM_UP = 3000;
const GOAL_MICROSECONDS = 20;
/** Per-fret-string time of the largest board over the smallest's; above this growth is worse than linear. */
const LINEAR_RATIO_LIMIT = 1.25;

function fannedDesign(strings: number, frets: number): Design {
  const validation = validateDesign({
    name: `Bench ${strings}x${frets}`,
    units: 'mm',
    strings,
    scale: { treble: 648, bass: 686 },
    perpendicularFret: Math.min(8, frets),
    frets,
    stringSpacing: { nut: 6 * strings, bridge: 9 * strings },
    temperament: { kind: 'equal', divisions: 12 },
  });
  if (!validation.ok) throw new Error(JSON.stringify(validation.issues));
  return validation.design;
}

/** Median microseconds per computeLayout call. */
function medianMicroseconds(design: Design): number {
  let sink = 0;
  for (let i = 0; i < WARM_UP; i++) sink += computeLayout(design).frets.length;
  const perLayout: number[] = [];
  for (let batch = 0; batch < BATCHES; batch++) {
    const start = process.hrtime.bigint();
    for (let i = 0; i < BATCH_SIZE; i++) sink += computeLayout(design).frets.length;
    perLayout.push(Number(process.hrtime.bigint() - start) / 1000 / BATCH_SIZE);
  }
  if (sink === 0) throw new Error('nothing was computed');
  perLayout.sort((a, b) => a - b);
  return perLayout[Math.floor(perLayout.length / 2)] ?? Number.NaN;
}

const round = (value: number) => Math.round(value * 1000) / 1000;

const goal = medianMicroseconds(fannedDesign(8, 36));
reportFigure({ figure: 'layout compute 8x36 fanned (median)', value: round(goal), unit: 'µs', goal: `< ${GOAL_MICROSECONDS}`, met: goal < GOAL_MICROSECONDS });

const sizes: { cells: number; micros: number }[] = [];
for (const strings of [4, 8, 16]) {
  for (const frets of [6, 12, 24, 36]) {
    const micros = medianMicroseconds(fannedDesign(strings, frets));
    sizes.push({ cells: strings * frets, micros });
    reportFigure({ figure: `layout compute scaling: ${strings} strings x ${frets} frets, per fret-string`, value: round(micros / (strings * frets)), unit: 'µs', goal: `context (${round(micros)} µs per layout)` });
  }
}

const smallest = sizes.reduce((a, b) => (b.cells < a.cells ? b : a));
const largest = sizes.reduce((a, b) => (b.cells > a.cells ? b : a));
const perCellRatio = largest.micros / largest.cells / (smallest.micros / smallest.cells);
reportFigure({
  figure: `layout compute scaling: per fret-string time, ${largest.cells} over ${smallest.cells} fret-strings`,
  value: round(perCellRatio),
  unit: 'ratio',
  goal: `<= ${LINEAR_RATIO_LIMIT} (grows at most linearly)`,
  met: perCellRatio <= LINEAR_RATIO_LIMIT,
});

// Least-squares line time = fixed + perCell * cells: R² near 1 means the growth is linear.
const n = sizes.length;
const meanX = sizes.reduce((s, p) => s + p.cells, 0) / n;
const meanY = sizes.reduce((s, p) => s + p.micros, 0) / n;
const sxy = sizes.reduce((s, p) => s + (p.cells - meanX) * (p.micros - meanY), 0);
const sxx = sizes.reduce((s, p) => s + (p.cells - meanX) ** 2, 0);
const slope = sxy / sxx;
const intercept = meanY - slope * meanX;
const residual = sizes.reduce((s, p) => s + (p.micros - (intercept + slope * p.cells)) ** 2, 0);
const total = sizes.reduce((s, p) => s + (p.micros - meanY) ** 2, 0);
reportFigure({ figure: 'layout compute scaling: straight-line fit of time on fret-strings, R²', value: round(1 - residual / total), unit: 'ratio', goal: 'context (1 = exactly linear)' });
reportFigure({ figure: 'layout compute scaling: fit, time per fret-string', value: round(slope), unit: 'µs', goal: `context (fixed part ${round(intercept)} µs)` });
