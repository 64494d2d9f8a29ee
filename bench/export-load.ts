/**
 * Issue 15 under load, against the built server: 20 concurrent requests for the heaviest paper
 * template the caps allow (the largest design on 200 Letter pages), and meanwhile, one after
 * another, GET /api/health and a Boards list (GET /api/boards). Figures: health and list p95
 * during the exports (goal < 200 ms each), the server's peak RSS sampled from /proc during them
 * (worker threads share the process, so this is all of it; goal < 1 GiB), and how the 20 were
 * answered (200, 503 queue full, ...). Exports still unfinished after EXPORT_WINDOW_S are
 * cancelled by hanging up, as a client would. Prints one JSON line per figure (bench/README.md).
 */
import { readFileSync } from 'node:fs';
import { closeDb } from '~/lib/db/client.server.ts';
import { newShopUser } from '../tests/support/sessions.ts';
import { baseUrl, reportFigure } from './lib/figure.ts';
import { LARGEST_BOARD } from './lib/largest-board.ts';
import { pidOn } from './lib/process-cpu.ts';
import { percentile } from './lib/samples.ts';

const BASE_URL = baseUrl();
const CONCURRENT_EXPORTS = 20;
const EXPORT_WINDOW_S = 45;
const BASELINE_SAMPLES = 30;
const RSS_SAMPLE_MS = 50;

const HEAVIEST = {
  path: '/api/export?format=pdf&paper=letter&overlap=99.9',
  design: LARGEST_BOARD,
};

/** A line of /proc/<pid>/status in KiB, e.g. VmRSS or VmHWM. */
function statusKiB(pid: number, field: 'VmRSS' | 'VmHWM'): number {
  const match = new RegExp(`^${field}:\\s+(\\d+) kB`, 'm').exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
  return match ? Number(match[1]) : NaN;
}

async function timedGet(path: string, cookie?: string): Promise<number> {
  const start = performance.now();
  const response = await fetch(`${BASE_URL}${path}`, cookie ? { headers: { cookie } } : {});
  await response.arrayBuffer();
  if (!response.ok) throw new Error(`GET ${path} answered ${response.status}`);
  return performance.now() - start;
}

const builder = await newShopUser('builder', 'Bench export load shop');
const LIST_PATH = '/api/boards?sort=scale&dir=desc';
const pid = pidOn(new URL(BASE_URL).port);

const baseline: number[] = [];
for (let i = 0; i < BASELINE_SAMPLES; i++) baseline.push(await timedGet('/api/health'));

const hangUp = new AbortController();
const statuses = new Map<string, number>();
let settled = 0;
const exports = Array.from({ length: CONCURRENT_EXPORTS }, () =>
  fetch(`${BASE_URL}${HEAVIEST.path}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: BASE_URL },
    body: JSON.stringify(HEAVIEST.design),
    signal: hangUp.signal,
  })
    .then(async (response) => {
      await response.arrayBuffer();
      return String(response.status);
    })
    .catch(() => 'cancelled by the bench')
    .then((outcome) => {
      statuses.set(outcome, (statuses.get(outcome) ?? 0) + 1);
      settled++;
    }),
);

let peakRssKiB = statusKiB(pid, 'VmRSS');
const sampler = setInterval(() => {
  peakRssKiB = Math.max(peakRssKiB, statusKiB(pid, 'VmRSS'));
}, RSS_SAMPLE_MS);
const window = setTimeout(() => hangUp.abort(), EXPORT_WINDOW_S * 1000);

const health: number[] = [];
const list: number[] = [];
while (settled < CONCURRENT_EXPORTS) {
  health.push(await timedGet('/api/health'));
  list.push(await timedGet(LIST_PATH, builder.cookie));
}
await Promise.all(exports);
clearTimeout(window);
clearInterval(sampler);
const highWaterKiB = statusKiB(pid, 'VmHWM');
await closeDb();

const round = (value: number) => Math.round(value * 100) / 100;
const under = (figure: string, value: number, unit: string, limit: number) =>
  reportFigure({ figure, value: round(value), unit, goal: `< ${limit}`, met: value < limit });
const context = (figure: string, value: number, unit: string) => reportFigure({ figure, value: round(value), unit, goal: 'context' });

under(`GET /api/health p95 during ${CONCURRENT_EXPORTS} concurrent 200-page PDF exports (${health.length} requests)`, percentile(health, 95), 'ms', 200);
under(`Boards list p95 during ${CONCURRENT_EXPORTS} concurrent 200-page PDF exports (${list.length} requests)`, percentile(list, 95), 'ms', 200);
context('GET /api/health p95 with no exports running (baseline)', percentile(baseline, 95), 'ms');
under(`server peak RSS during ${CONCURRENT_EXPORTS} concurrent 200-page PDF exports (sampled every ${RSS_SAMPLE_MS} ms)`, peakRssKiB / 1024, 'MiB', 1024);
context('server VmHWM (peak RSS over its whole life, earlier bench scripts included)', highWaterKiB / 1024, 'MiB');
context(`export queue rejections (503) of ${CONCURRENT_EXPORTS} concurrent 200-page PDF exports`, statuses.get('503') ?? 0, 'count');
context(`200-page PDF exports finished (200) of ${CONCURRENT_EXPORTS}`, statuses.get('200') ?? 0, 'count');
const other = [...statuses].filter(([status]) => status !== '200' && status !== '503').reduce((sum, [, n]) => sum + n, 0);
context(`exports answered otherwise (504, 5xx) or cancelled by the bench after ${EXPORT_WINDOW_S} s`, other, 'count');
