/**
 * Keeps the built web server up for `npm start`: runs scripts/serve-built-app.mjs as a child and,
 * when it exits without being asked to (a crash, running out of memory, SIGKILL), starts it again
 * after a short back-off: 1 s, doubling on each quick failure up to 30 s, back to 1 s once a
 * server has stayed up for a minute. Every exit and restart is logged on stderr. SIGTERM or SIGINT
 * stop the server, then this process. MariaDB is not this script's business: it keeps running
 * while the server comes back. Environment: as for serve-built-app.mjs (HOST, PORT, ...); APP_PROCESS_CORES also
 * chooses the server's node flags.
 */
import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { nodeFlagsForCores } from './lib/process-cores.mjs';

const SERVER = fileURLToPath(new URL('./serve-built-app.mjs', import.meta.url));
const FIRST_DELAY_MS = 1_000;
const MAX_DELAY_MS = 30_000;
/** A server that ran this long was healthy: the next failure starts the back-off afresh. */
const HEALTHY_AFTER_MS = 60_000;

/** The node flags for APP_PROCESS_CORES (scripts/lib/process-cores.mjs), checked before the first start. */
let nodeFlags;
try {
  nodeFlags = nodeFlagsForCores(process.env.APP_PROCESS_CORES);
} catch (error) {
  console.error(`kerfline: ${error.message}`);
  process.exit(1);
}

let child;
let stopping = false;
let delayMs = FIRST_DELAY_MS;
let restarts = 0;
let pendingStart;

const log = (line) => console.error(`kerfline: ${line}`);

function start() {
  pendingStart = undefined;
  const startedAt = Date.now();
  child = spawn(process.execPath, [...nodeFlags, SERVER], { stdio: 'inherit', env: process.env });
  log(`web server started (pid ${child.pid})`);
  child.on('exit', (code, signal) => {
    child = undefined;
    if (stopping) return process.exit(0);
    const ranMs = Date.now() - startedAt;
    if (ranMs >= HEALTHY_AFTER_MS) delayMs = FIRST_DELAY_MS;
    restarts++;
    const how = signal ? `signal ${signal}` : `exit code ${code}`;
    log(`web server exited unexpectedly (${how}) after ${Math.round(ranMs / 1000)} s; starting it again in ${delayMs / 1000} s (restart ${restarts})`);
    pendingStart = setTimeout(start, delayMs);
    delayMs = Math.min(delayMs * 2, MAX_DELAY_MS);
  });
}

function stop() {
  if (stopping) return;
  stopping = true;
  if (pendingStart) clearTimeout(pendingStart);
  if (child) child.kill('SIGTERM');
  else process.exit(0);
}

process.on('SIGTERM', stop);
process.on('SIGINT', stop);
start();
