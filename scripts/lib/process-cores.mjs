/**
 * APP_PROCESS_CORES: the cores one app process is sized for when several share a machine
 * (npm run cluster sets it to cores ÷ processes). The app follows it for its PDF worker threads
 * (src/lib/config/env.server.ts); this module gives the node command-line flags that keep the
 * process's own background threads within that share, for the launchers: the supervisor
 * (npm start, npm run cluster), scripts/lib/build.sh and tests/support/built-server.ts.
 * `node scripts/lib/process-cores.mjs` prints the flags for $APP_PROCESS_CORES, one a line.
 * Measured on 2 cores with one export thread kept busy (docs/operations.md, "Heavy work spreads"):
 * - one core: `--single-threaded-gc`. Otherwise V8 marks, sweeps and scavenges on its 4 helper
 *   threads alongside the export thread: 1.44 to 1.50 cores busy per busy export thread, 1.09
 *   with the flag (CPU per export about the same, 0.59 to 0.62 s). `--single-threaded` (also no
 *   background compiling) gave 1.01 but compiles on the request thread; `--v8-pool-size=1` and
 *   UV_THREADPOOL_SIZE=1 changed nothing measurable, so neither is used.
 * - more cores: no flags; the share only sets the worker threads (cores - 1, at least 1).
 */
import { pathToFileURL } from 'node:url';

/**
 * The node flags for a process sized to `setting` cores (the APP_PROCESS_CORES text); none when
 * unset. Throws a readable Error for anything but a whole number from 1.
 */
export function nodeFlagsForCores(setting) {
  if (setting === undefined || setting.trim() === '') return [];
  const cores = Number(setting);
  if (!Number.isInteger(cores) || cores < 1 || cores > 256) {
    throw new Error(`APP_PROCESS_CORES must be a whole number of cores from 1 to 256, not "${setting}"`);
  }
  return cores === 1 ? ['--single-threaded-gc'] : [];
}

/** The flags `setting` asks for that this process was not started with. */
export function missingNodeFlags(setting, execArgv = process.execArgv) {
  return nodeFlagsForCores(setting).filter((flag) => !execArgv.includes(flag));
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  try {
    for (const flag of nodeFlagsForCores(process.env.APP_PROCESS_CORES)) console.log(flag);
  } catch (error) {
    console.error(`kerfline: ${error.message}`);
    process.exit(1);
  }
}
