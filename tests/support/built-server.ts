/**
 * A second process of the built app (scripts/serve-built-app.mjs, what `npm start` runs) on a
 * port of its own, with the test run's database and settings, for tests that stop and start it.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { freePort } from './free-port.ts';

export interface BuiltServer {
  url: string;
  port: number;
  /** Sends SIGTERM and waits until the process has exited. */
  stop(): Promise<void>;
}

async function answers(url: string): Promise<boolean> {
  return fetch(`${url}/api/version`, { signal: AbortSignal.timeout(1000) }).then((r) => r.ok, () => false);
}

/**
 * Starts the built server on `port` (a free one by default) and waits up to 20 s for it to answer.
 * `env` adds settings such as TRUSTED_PROXIES or RATE_LIMIT_SCALE (README, Configuration).
 */
export async function startBuiltServer(port?: number, env: Record<string, string> = {}): Promise<BuiltServer> {
  const chosen = port ?? (await freePort());
  const url = `http://127.0.0.1:${chosen}`;
  // APP_ORIGIN is this server's own origin: the same-origin check compares Origin headers with it.
  const child: ChildProcess = spawn(process.execPath, ['scripts/serve-built-app.mjs'], {
    env: { ...process.env, HOST: '127.0.0.1', PORT: String(chosen), APP_ORIGIN: url, ...env },
    stdio: 'ignore',
  });
  const exited = once(child, 'exit');
  const stop = async () => {
    if (child.exitCode === null && child.signalCode === null) {
      child.kill('SIGTERM');
      await exited;
    }
  };
  for (let i = 0; i < 80; i++) {
    if (await answers(url)) return { url, port: chosen, stop };
    if (child.exitCode !== null) break;
    await new Promise((r) => setTimeout(r, 250));
  }
  await stop();
  throw new Error(`the built server did not answer on ${url} within 20 s`);
}
