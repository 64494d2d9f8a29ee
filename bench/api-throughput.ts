/**
 * API throughput: POST /api/layout (the demo seven-string fanned design, computed per request)
 * against GET /api/version (constant JSON, the cost of the framework and middleware alone).
 * Both run in this one process, one after the other, with the same settings, so their ratio
 * says how much the layout work costs independently of how fast this machine is today.
 *
 * As context it also measures the same POST refused before its body is read (an unknown
 * `?format=`, answered 400 by the route's first line): the framework's cost of a POST with this
 * body, through the same middleware and route budget, with no layout work at all. No layout
 * request can be cheaper, so its ratio bounds the goal's figure from above. The server's CPU time
 * per request (all its threads, from /proc) is given for each, which holds up on a busy machine
 * where the throughputs do not.
 */
import { readFileSync } from 'node:fs';
import autocannon from 'autocannon';
import { baseUrl, benchSeconds, reportFigure } from './lib/figure.ts';
import { cpuSeconds, pidOn } from './lib/process-cpu.ts';

const CONNECTIONS = 10;
const WARM_UP_SECONDS = 1;
const RATIO_GOAL = 0.8;

interface Target {
  label: string;
  path: string;
  method: 'GET' | 'POST';
  /** The status every answer must have. */
  status: number;
  headers?: Record<string, string>;
  body?: string;
}

interface Run {
  requestsPerSecond: number;
  /** Server CPU time per answered request, µs. */
  serverCpuUs: number;
  /** Answers with another status than the target's, errors and timeouts. */
  failed: number;
}

const serverPid = pidOn(new URL(baseUrl()).port);

async function load(target: Target, seconds: number): Promise<Run> {
  const cpuBefore = cpuSeconds([serverPid]);
  const result = await autocannon({
    url: `${baseUrl()}${target.path}`,
    connections: CONNECTIONS,
    duration: seconds,
    method: target.method,
    ...(target.headers ? { headers: target.headers } : {}),
    ...(target.body ? { body: target.body } : {}),
  });
  const cpu = cpuSeconds([serverPid]) - cpuBefore;
  const stats = result.statusCodeStats ?? {};
  const expected = stats[String(target.status) as keyof typeof stats]?.count ?? 0;
  return {
    requestsPerSecond: result.requests.average,
    serverCpuUs: (cpu / Math.max(1, result.requests.total)) * 1e6,
    failed: result.requests.total - expected + result.errors + result.timeouts,
  };
}

/** One plain request first, so a broken route fails loudly instead of being timed. */
async function expectStatus(target: Target): Promise<void> {
  const response = await fetch(`${baseUrl()}${target.path}`, {
    method: target.method,
    ...(target.headers ? { headers: target.headers } : {}),
    ...(target.body ? { body: target.body } : {}),
  });
  if (response.status !== target.status) {
    throw new Error(`${target.label} answered ${response.status}, not ${target.status}: ${(await response.text()).slice(0, 300)}`);
  }
}

const design = readFileSync('src/lib/boards/demo/seven-string-fan.json', 'utf8');
const version: Target = { label: 'GET /api/version', path: '/api/version', method: 'GET', status: 200 };
const layout: Target = {
  label: 'POST /api/layout',
  path: '/api/layout',
  method: 'POST',
  status: 200,
  headers: { 'content-type': 'application/json', origin: baseUrl() },
  body: design,
};

/**
 * The smallest design the API takes (2 strings, 1 fret, no markers): its answer is ~1 KB instead
 * of ~7 KB, so its ratio shows how much of the gap is the POST itself rather than the layout.
 */
const tinyLayout: Target = {
  ...layout,
  label: 'POST /api/layout (2 strings, 1 fret)',
  body: JSON.stringify({ ...(JSON.parse(design) as object), strings: 2, frets: 1, perpendicularFret: 0, markers: [] }),
};

/** The same POST, refused (400, unknown format) before the route reads the body: no layout request costs less. */
const refusedLayout: Target = {
  ...layout,
  label: 'POST /api/layout refused before reading its body (400)',
  path: '/api/layout?format=none',
  status: 400,
};

const targets = [version, layout, tinyLayout, refusedLayout];
for (const target of targets) await expectStatus(target);
for (const target of [version, layout]) await load(target, WARM_UP_SECONDS);
const seconds = benchSeconds();
const [baseline, measured, tiny, refused] = [
  await load(version, seconds),
  await load(layout, seconds),
  await load(tinyLayout, seconds),
  await load(refusedLayout, seconds),
] as [Run, Run, Run, Run];
const ratio = measured.requestsPerSecond / baseline.requestsPerSecond;
const toBaseline = (run: Run) => Number((run.requestsPerSecond / baseline.requestsPerSecond).toFixed(3));

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
  value: toBaseline(tiny),
  unit: 'ratio',
  goal: 'context (the cost of a POST with a small answer)',
});
reportFigure({
  figure: `${refusedLayout.label} / ${version.label} throughput ratio`,
  value: toBaseline(refused),
  unit: 'ratio',
  goal: 'context (the most any layout request can reach)',
});
for (const [target, run] of [[version, baseline], [layout, measured], [refusedLayout, refused]] as const) {
  reportFigure({ figure: `server CPU per request: ${target.label}`, value: Math.round(run.serverCpuUs), unit: 'µs', goal: 'context' });
}
const failed = baseline.failed + measured.failed + tiny.failed + refused.failed;
reportFigure({ figure: 'API throughput runs: unexpected statuses and errors', value: failed, unit: 'count', goal: '= 0', met: failed === 0 });
