/**
 * A second process of the built app (scripts/serve-built-app.mjs, what `npm start` runs) on a
 * port of its own, with the test run's database and settings, for tests that stop and start it.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { nodeFlagsForCores } from '../../scripts/lib/process-cores.mjs';
import { freePort } from './free-port.ts';

export interface BuiltServer {
  url: string;
  port: number;
  /** Sends SIGTERM and waits until the process has exited. */
  stop(): Promise<void>;
  /** Sends SIGKILL (a crash: no clean-up) and waits until the process has gone. */
  kill(): Promise<void>;
}

async function answers(url: string): Promise<boolean> {
  return fetch(`${url}/api/version`, { signal: AbortSignal.timeout(1000) }).then((r) => r.ok, () => false);
}

export interface BuiltServerOptions {
  /** A free one by default. */
  port?: number;
  /** Settings on top of the test run's; `undefined` removes one (e.g. to get the app's default). */
  env?: Record<string, string | undefined>;
}

/** Starts the built server and waits up to 20 s for it to answer. */
export async function startBuiltServer(options: BuiltServerOptions = {}): Promise<BuiltServer> {
  const chosen = options.port ?? (await freePort());
  const url = `http://127.0.0.1:${chosen}`;
  // APP_ORIGIN is this server's own origin: the same-origin check compares Origin headers with it.
  const env: NodeJS.ProcessEnv = { ...process.env, HOST: '127.0.0.1', PORT: String(chosen), APP_ORIGIN: url };
  for (const [name, value] of Object.entries(options.env ?? {})) {
    if (value === undefined) delete env[name];
    else env[name] = value;
  }
  // Started as the launchers start it: node's flags for APP_PROCESS_CORES, when set.
  const flags = nodeFlagsForCores(env.APP_PROCESS_CORES);
  const child: ChildProcess = spawn(process.execPath, [...flags, 'scripts/serve-built-app.mjs'], { env, stdio: 'ignore' });
  const exited = once(child, 'exit');
  const end = async (signal: NodeJS.Signals) => {
    if (child.exitCode === null && child.signalCode === null) {
      child.kill(signal);
      await exited;
    }
  };
  const stop = () => end('SIGTERM');
  for (let i = 0; i < 80; i++) {
    if (await answers(url)) return { url, port: chosen, stop, kill: () => end('SIGKILL') };
    if (child.exitCode !== null) break;
    await new Promise((r) => setTimeout(r, 250));
  }
  await stop();
  throw new Error(`the built server did not answer on ${url} within 20 s`);
}
