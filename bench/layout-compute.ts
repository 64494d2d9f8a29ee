/**
 * Speed of computeLayout. Prints one JSON line per figure:
 * first the goal figure (8 strings x 36 frets, fanned), then how the time scales with frets and
 * strings. Times are medians over batches, after a warm-up; compare them as ratios within one run.
 * Run: npx tsx bench/layout-compute.ts
 */
import { computeLayout } from '~/lib/geometry/layout';
import { validateDesign, type Design } from '~/lib/schemas/design';

const BATCHES = 41;
const BATCH_SIZE = 250;
const WARM_UP = 3000;

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

console.log(
  JSON.stringify({
    figure: 'layout compute 8x36 fanned',
    value: round(medianMicroseconds(fannedDesign(8, 36))),
    unit: 'µs',
    goal: '< 20',
  }),
);

for (const strings of [4, 8, 16]) {
  for (const frets of [6, 12, 24, 36]) {
    const micros = medianMicroseconds(fannedDesign(strings, frets));
    console.log(
      JSON.stringify({
        figure: `layout compute ${strings}x${frets} fanned`,
        value: round(micros),
        unit: 'µs',
        perFretString: round(micros / (strings * frets)),
      }),
    );
  }
}
