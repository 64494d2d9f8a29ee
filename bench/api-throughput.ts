/**
 * API throughput: POST /api/layout (the demo seven-string fanned design, computed per request)
 * against GET /api/version (constant JSON, the cost of the framework and middleware alone).
 * Both run in this one process, one after the other, with the same settings, so their ratio
 * says how much the layout work costs independently of how fast this machine is today.
 */
import { readFileSync } from 'node:fs';
import autocannon from 'autocannon';
import { baseUrl, benchSeconds, reportFigure } from './lib/figure.ts';

const CONNECTIONS = 10;
const WARM_UP_SECONDS = 1;
const RATIO_GOAL = 0.8;

interface Target {
  label: string;
  path: string;
  method: 'GET' | 'POST';
  headers?: Record<string, string>;
  body?: string;
}

interface Run {
  requestsPerSecond: number;
  failed: number;
}

async function load(target: Target, seconds: number): Promise<Run> {
  const result = await autocannon({
    url: `${baseUrl()}${target.path}`,
    connections: CONNECTIONS,
    duration: seconds,
    method: target.method,
    ...(target.headers ? { headers: target.headers } : {}),
    ...(target.body ? { body: target.body } : {}),
  });
  return { requestsPerSecond: result.requests.average, failed: result.non2xx + result.errors + result.timeouts };
}

/** One plain request first, so a broken route fails loudly instead of being timed. */
async function expectOk(target: Target): Promise<void> {
  const response = await fetch(`${baseUrl()}${target.path}`, {
    method: target.method,
    ...(target.headers ? { headers: target.headers } : {}),
    ...(target.body ? { body: target.body } : {}),
  });
  if (!response.ok) throw new Error(`${target.label} answered ${response.status}: ${(await response.text()).slice(0, 300)}`);
}

const design = readFileSync('src/lib/boards/demo/seven-string-fan.json', 'utf8');
const version: Target = { label: 'GET /api/version', path: '/api/version', method: 'GET' };
const layout: Target = {
  label: 'POST /api/layout',
  path: '/api/layout',
  method: 'POST',
  headers: { 'content-type': 'application/json', origin: baseUrl() },
  body: design,
};

/**
 * The smallest design the API takes (2 strings, 1 fret, no markers): its answer is ~1.5 KB instead
 * of ~30 KB, so its ratio shows how much of the gap is the POST itself rather than the layout.
 */
const tinyLayout: Target = {
  ...layout,
  label: 'POST /api/layout (2 strings, 1 fret)',
  body: JSON.stringify({ ...(JSON.parse(design) as object), strings: 2, frets: 1, perpendicularFret: 0, markers: [] }),
};

for (const target of [version, layout, tinyLayout]) await expectOk(target);
for (const target of [version, layout]) await load(target, WARM_UP_SECONDS);
const seconds = benchSeconds();
const baseline = await load(version, seconds);
const measured = await load(layout, seconds);
const tiny = await load(tinyLayout, seconds);
const ratio = measured.requestsPerSecond / baseline.requestsPerSecond;

reportFigure({ figure: `${version.label} throughput (baseline)`, value: Math.round(baseline.requestsPerSecond), unit: 'req/s', goal: 'baseline' });
reportFigure({ figure: `${layout.label} throughput (7-string fanned)`, value: Math.round(measured.requestsPerSecond), unit: 'req/s', goal: 'context' });
reportFigure({
  figure: `${layout.label} / ${version.label} throughput ratio`,
  value: Number(ratio.toFixed(3)),
  unit: 'ratio',
  goal: `>= ${RATIO_GOAL}`,
  met: ratio >= RATIO_GOAL,
});
reportFigure({
  figure: `${tinyLayout.label} / ${version.label} throughput ratio`,
  value: Number((tiny.requestsPerSecond / baseline.requestsPerSecond).toFixed(3)),
  unit: 'ratio',
  goal: 'context (the cost of a POST with a small answer)',
});
const failed = baseline.failed + measured.failed + tiny.failed;
reportFigure({ figure: 'API throughput runs: non-2xx responses and errors', value: failed, unit: 'count', goal: '= 0', met: failed === 0 });
