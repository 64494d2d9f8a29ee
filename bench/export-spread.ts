/**
 * Heavy work spreads over app processes: 40 concurrent paper-template PDF exports of the largest
 * board the caps allow on Letter (about 0.6 s of CPU each here; the same board on 200 pages,
 * about 2.1 s each, would need some 130 s for both runs on a 2-core machine, past the bench's
 * per-script limit), first against one process of the built app, then through HAProxy over that
 * process and a second one on the same database. Both are started here with the same settings,
 * sized as `npm run cluster` sizes two processes on this machine: APP_PROCESS_CORES = cores ÷ 2
 * unless set (1 on 2 cores: one export thread and V8's garbage collector on that thread), so the
 * two runs differ only in the count of processes. A request refused because the export queue is full (503) is sent again after RETRY_MS, as HAProxy's clients would; each run
 * lasts until all 40 are done or WINDOW_S is up (then the rest are cancelled by hanging up).
 * Figures: exports finished per minute in each run, their ratio as "time for the 40 with two
 * processes ÷ with one" (goal about half), GET /api/health p95 during each run (goal for the
 * two-process run as for one process, < 200 ms), and the cores the processes kept busy (from
 * /proc), which bound the ratio one machine can give. Both runs in one bench run, so the ratio
 * compares like with like.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { closeDb } from '~/lib/db/client.server.ts';
import { nodeFlagsForCores } from '../scripts/lib/process-cores.mjs';
import { startBuiltServer, type BuiltServer } from '../tests/support/built-server.ts';
import { startBalancer, type Balancer } from '../tests/support/cluster.ts';
import { baseUrl, reportFigure } from './lib/figure.ts';
import { LARGEST_BOARD } from './lib/largest-board.ts';
import { cpuSeconds, pidOn } from './lib/process-cpu.ts';
import { percentile } from './lib/samples.ts';

const BASE_URL = baseUrl();
const CONCURRENT_EXPORTS = 40;
const WINDOW_S = 40;
const RETRY_MS = 500;
const HEALTH_GOAL_MS = 200;
/** The largest board the caps allow (as in export-load.ts) on Letter at the default overlap: about 0.45 s of one core each here. */
const EXPORT = {
  path: '/api/export?format=pdf&paper=letter',
  design: LARGEST_BOARD,
};

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

interface Run {
  finished: number;
  /** Cores the app processes kept busy on average over the run (their CPU seconds ÷ wall seconds). */
  cores: number;
  /** Answers other than 200 and 503 (queue full), by status; "none" for a cut connection. */
  other: Record<string, number>;
  seconds: number;
  healthMs: number[];
}

async function exportsThrough(url: string, pids: readonly number[]): Promise<Run> {
  const cpuBefore = cpuSeconds(pids);
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
  const seconds = (performance.now() - started) / 1000;
  return { finished, cores: (cpuSeconds(pids) - cpuBefore) / seconds, other, seconds, healthMs };
}

const perMinute = (run: Run) => (run.finished / run.seconds) * 60;
const round = (value: number) => Math.round(value * 100) / 100;

process.env.CLUSTER_DIR = mkdtempSync(join(tmpdir(), 'kerfline-spread-'));
const PROCESS_CORES = process.env.APP_PROCESS_CORES ?? String(Math.max(1, Math.floor(availableParallelism() / 2)));
// Two processes alike: the bench server's origin (the requests' Origin header) and scaled rate
// limits (one shared count), and the cores each is sized for.
const settings = { APP_ORIGIN: BASE_URL, RATE_LIMIT_SCALE: process.env.RATE_LIMIT_SCALE, APP_PROCESS_CORES: PROCESS_CORES };
const first = await startBuiltServer({ env: settings });
let second: BuiltServer | undefined;
let balancer: Balancer | undefined;
try {
  second = await startBuiltServer({ env: settings });
  balancer = await startBalancer([first.port, second.port]);
  const firstPid = pidOn(first.port);
  const one = await exportsThrough(first.url, [firstPid]);
  const two = await exportsThrough(balancer.url, [firstPid, pidOn(second.port)]);
  const ratio = perMinute(one) / perMinute(two);
  const others = (run: Run) => Object.entries(run.other).map(([status, n]) => `${n}× ${status}`).join(', ') || 'none';
  console.error(`export-spread: answered otherwise: one process ${others(one)}; two processes ${others(two)}`);
  console.error(`export-spread: each process APP_PROCESS_CORES=${PROCESS_CORES}, node flags: ${nodeFlagsForCores(PROCESS_CORES).join(' ') || 'none'}`);
  reportFigure({ figure: `template PDF exports finished per minute, one process (${one.finished} of ${CONCURRENT_EXPORTS} in ${round(one.seconds)} s; otherwise: ${others(one)})`, value: round(perMinute(one)), unit: '/min', goal: 'context' });
  reportFigure({ figure: `template PDF exports finished per minute, two processes behind HAProxy (${two.finished} of ${CONCURRENT_EXPORTS} in ${round(two.seconds)} s; otherwise: ${others(two)})`, value: round(perMinute(two)), unit: '/min', goal: 'context' });
  reportFigure({ figure: `time for ${CONCURRENT_EXPORTS} concurrent template PDF exports, two processes ÷ one (from the rates)`, value: round(ratio), unit: 'ratio', goal: '<= 0.6 (about half)', met: ratio <= 0.6 });
  reportFigure({ figure: `GET /api/health p95 during the one-process exports (${one.healthMs.length} requests)`, value: round(percentile(one.healthMs, 95)), unit: 'ms', goal: 'context' });
  // One process's exports may keep more than its share busy (the request thread beside the
  // worker thread, V8's background threads): a second process on the same machine can only add
  // the cores left, so the best ratio here is one's cores ÷ what two can get.
  const cores = availableParallelism();
  reportFigure({ figure: `cores kept busy by one process during its exports (CPU s ÷ wall s, all threads; ${cores} on this machine)`, value: round(one.cores), unit: 'cores', goal: 'context' });
  reportFigure({ figure: 'cores kept busy by the two processes together during theirs', value: round(two.cores), unit: 'cores', goal: 'context' });
  reportFigure({ figure: `best ratio ${cores} idle cores would allow: one process's cores ÷ min(${cores}, twice that)`, value: round(one.cores / Math.min(cores, 2 * one.cores)), unit: 'ratio', goal: 'context' });
  reportFigure({ figure: `ratio the cores each run got would give: one process's cores ÷ the two processes' cores`, value: round(one.cores / two.cores), unit: 'ratio', goal: 'context' });
  const p95 = percentile(two.healthMs, 95);
  reportFigure({ figure: `GET /api/health p95 through HAProxy during the two-process exports (${two.healthMs.length} requests)`, value: round(p95), unit: 'ms', goal: `< ${HEALTH_GOAL_MS}`, met: p95 < HEALTH_GOAL_MS });
} finally {
  await balancer?.stop();
  await second?.stop();
  await first.stop();
  await closeDb();
  rmSync(process.env.CLUSTER_DIR, { recursive: true, force: true });
}
