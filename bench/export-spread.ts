/**
 * Heavy work spreads over app processes: 40 concurrent paper-template PDF exports (the demo
 * seven-string fanned board on Letter; the heaviest the caps allow takes longer than the window
 * on a 2-core machine, so it would measure nothing), first against the bench's one server, then through HAProxy over that server and
 * a second process of the built app on the same database. A request refused because the export
 * queue is full (503) is sent again after RETRY_MS, as HAProxy's clients would; each run lasts
 * until all 40 are done or WINDOW_S is up (then the rest are cancelled by hanging up). Figures:
 * exports finished per minute in each run, their ratio as "time for the 40 with two processes ÷
 * with one" (goal about half), and GET /api/health p95 through HAProxy during the two-process run
 * (goal as for one process, < 200 ms). Both runs in one bench run, so the ratio compares like with like.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { closeDb } from '~/lib/db/client.server.ts';
import { startBuiltServer } from '../tests/support/built-server.ts';
import { startBalancer, type Balancer } from '../tests/support/cluster.ts';
import { baseUrl, reportFigure } from './lib/figure.ts';
import { fixtureDesign } from '../tests/support/designs.ts';

const BASE_URL = baseUrl();
const CONCURRENT_EXPORTS = 40;
const WINDOW_S = 30;
const RETRY_MS = 500;
const HEALTH_GOAL_MS = 200;
const EXPORT = { path: '/api/export?format=pdf&paper=letter', design: fixtureDesign('seven-string-fan') };

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? NaN;
}

interface Run {
  finished: number;
  /** Answers other than 200 and 503 (queue full), by status; "none" for a cut connection. */
  other: Record<string, number>;
  seconds: number;
  healthMs: number[];
}

async function exportsThrough(url: string): Promise<Run> {
  const started = performance.now();
  const deadline = Date.now() + WINDOW_S * 1000;
  const hangUp = new AbortController();
  const timer = setTimeout(() => hangUp.abort(), WINDOW_S * 1000);
  let finished = 0;
  let settled = 0;
  const other: Record<string, number> = {};
  const one = async () => {
    while (Date.now() < deadline) {
      const response = await fetch(`${url}${EXPORT.path}`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', origin: BASE_URL },
        body: JSON.stringify(EXPORT.design),
        signal: hangUp.signal,
      }).catch(() => undefined);
      await response?.arrayBuffer().catch(() => undefined);
      if (response?.status === 200) finished++;
      else if (response?.status !== 503) other[String(response?.status ?? 'none')] = (other[String(response?.status ?? 'none')] ?? 0) + 1;
      if (response?.status !== 503) return;
      await pause(RETRY_MS);
    }
  };
  const clients = Array.from({ length: CONCURRENT_EXPORTS }, () => one().finally(() => settled++));
  const healthMs: number[] = [];
  while (settled < CONCURRENT_EXPORTS) {
    const t0 = performance.now();
    await fetch(`${url}/api/health`).then((r) => r.arrayBuffer(), () => undefined);
    healthMs.push(performance.now() - t0);
    await pause(100);
  }
  await Promise.all(clients);
  clearTimeout(timer);
  return { finished, other, seconds: (performance.now() - started) / 1000, healthMs };
}

const perMinute = (run: Run) => (run.finished / run.seconds) * 60;
const round = (value: number) => Math.round(value * 100) / 100;

process.env.CLUSTER_DIR = mkdtempSync(join(tmpdir(), 'kerfline-spread-'));
// The same settings as the bench's server, its scaled rate limits included (one shared count).
const second = await startBuiltServer({ env: { APP_ORIGIN: BASE_URL, RATE_LIMIT_SCALE: process.env.RATE_LIMIT_SCALE } });
let balancer: Balancer | undefined;
try {
  balancer = await startBalancer([Number(new URL(BASE_URL).port), second.port]);
  const one = await exportsThrough(BASE_URL);
  const two = await exportsThrough(balancer.url);
  const ratio = perMinute(one) / perMinute(two);
  const others = (run: Run) => Object.entries(run.other).map(([status, n]) => `${n}× ${status}`).join(', ') || 'none';
  console.error(`export-spread: answered otherwise: one process ${others(one)}; two processes ${others(two)}`);
  reportFigure({ figure: `template PDF exports finished per minute, one process (${one.finished} of ${CONCURRENT_EXPORTS} in ${round(one.seconds)} s; otherwise: ${others(one)})`, value: round(perMinute(one)), unit: '/min', goal: 'context' });
  reportFigure({ figure: `template PDF exports finished per minute, two processes behind HAProxy (${two.finished} of ${CONCURRENT_EXPORTS} in ${round(two.seconds)} s; otherwise: ${others(two)})`, value: round(perMinute(two)), unit: '/min', goal: 'context' });
  reportFigure({ figure: `time for ${CONCURRENT_EXPORTS} concurrent template PDF exports, two processes ÷ one (from the rates)`, value: round(ratio), unit: 'ratio', goal: '<= 0.6 (about half)', met: ratio <= 0.6 });
  const p95 = percentile(two.healthMs, 95);
  reportFigure({ figure: `GET /api/health p95 through HAProxy during the two-process exports (${two.healthMs.length} requests)`, value: round(p95), unit: 'ms', goal: `< ${HEALTH_GOAL_MS}`, met: p95 < HEALTH_GOAL_MS });
} finally {
  await balancer?.stop();
  await second.stop();
  await closeDb();
  rmSync(process.env.CLUSTER_DIR, { recursive: true, force: true });
}
