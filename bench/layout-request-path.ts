/**
 * Where the time of one POST /api/layout goes inside the route (the demo seven-string fanned
 * design), measured in this process with the app's own functions: reading the body (size limit,
 * UTF-8, JSON.parse), validating the design, computing the layout, serialising the answer. Next
 * to the throughput ratio in api-throughput.ts this shows what the layout work adds to a request
 * and what a constant answer (GET /api/version) never pays. Medians over batches after a warm-up.
 */
import { readFileSync } from 'node:fs';
import type { APIContext } from 'astro';
import { compactLayoutJson } from '~/lib/export/layout-json.server.ts';
import { LAYOUT_FORMATS } from '~/lib/export/layout-formats.ts';
import { computeLayout, fretFractions } from '~/lib/geometry/layout.ts';
import { readJson } from '~/lib/http/body.server.ts';
import { DESIGN_JSON_MAX_BYTES, validateDesign } from '~/lib/schemas/design.ts';
import { POST } from '~/pages/api/layout.ts';
import { reportFigure } from './lib/figure.ts';

const BATCHES = 31;
const BATCH_SIZE = 200;
const WARM_UP = 1000;

const text = readFileSync('src/lib/boards/demo/seven-string-fan.json', 'utf8');
const request = () => new Request('http://127.0.0.1/api/layout', { method: 'POST', headers: { 'content-type': 'application/json' }, body: text });
const validation = validateDesign(JSON.parse(text));
if (!validation.ok) throw new Error('the demo design does not validate');
const design = validation.design;
const layout = computeLayout(design);
const fractions = fretFractions(design.temperament, design.frets);
const callRoute = (request: Request) => POST({ request, url: new URL(request.url) } as unknown as APIContext);

async function medianMicroseconds(work: () => unknown): Promise<number> {
  for (let i = 0; i < WARM_UP; i++) await work();
  const perCall: number[] = [];
  for (let batch = 0; batch < BATCHES; batch++) {
    const start = process.hrtime.bigint();
    for (let i = 0; i < BATCH_SIZE; i++) await work();
    perCall.push(Number(process.hrtime.bigint() - start) / 1000 / BATCH_SIZE);
  }
  perCall.sort((a, b) => a - b);
  return perCall[Math.floor(perCall.length / 2)]!;
}

const stages: [string, () => unknown][] = [
  ['build the Request (as the adapter does)', request],
  ['read the body (limit, UTF-8, JSON.parse)', () => readJson(request(), DESIGN_JSON_MAX_BYTES)],
  ['validate the design', () => validateDesign(JSON.parse(text))],
  ['compute the layout', () => computeLayout(design)],
  ['serialise the compact layout JSON (the answer)', () => compactLayoutJson(layout, fractions)],
  ['serialise the full layout JSON (?full=1)', () => LAYOUT_FORMATS.json.render(layout)],
  ['whole route, answer streamed out as the adapter writes it', async () => {
    const response = await callRoute(request());
    for await (const chunk of response.body!) void chunk;
  }],
];
const round = (value: number) => Math.round(value * 10) / 10;
for (const [stage, work] of stages) {
  reportFigure({ figure: `POST /api/layout inside the route: ${stage} (median)`, value: round(await medianMicroseconds(work)), unit: 'µs', goal: 'context' });
}
reportFigure({ figure: 'POST /api/layout answer size (7-string fanned, compact JSON)', value: Buffer.byteLength(compactLayoutJson(layout, fractions)), unit: 'bytes', goal: 'context' });
reportFigure({ figure: 'POST /api/layout?full=1 answer size (7-string fanned, full JSON)', value: Buffer.byteLength(LAYOUT_FORMATS.json.render(layout)), unit: 'bytes', goal: 'context' });
