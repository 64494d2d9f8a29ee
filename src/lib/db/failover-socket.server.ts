/**
 * Connections to a cluster (several hosts in DATABASE_URL): each new pool connection goes to the
 * first listed host that accepts it, skipping hosts seen down in the last few seconds. Every
 * process lists the hosts in the same order, so all of them write through one node while it is
 * up (no certification conflicts between processes in normal running) and move to the next one
 * together when it goes away. A node that accepts connections but is not part of the cluster's
 * primary component (it lost its quorum) is found by the readiness check of `watchReadiness`.
 */
import net from 'node:net';
import { Duplex } from 'node:stream';
import type { Pool as CallbackPool, PoolConnection as CallbackConnection } from 'mysql2';
import type { DatabaseHost } from '~/lib/config/database-url.ts';

/** A host that refused or was not ready is tried last for this long. */
export const HOST_DOWN_MS = 5_000;

export class HostList {
  private readonly downUntil = new Map<string, number>();

  constructor(
    readonly hosts: readonly DatabaseHost[],
    private readonly now: () => number = Date.now,
  ) {}

  /** Hosts in the order to try: listed order, those seen down recently at the end. */
  order(): DatabaseHost[] {
    const t = this.now();
    const up = this.hosts.filter((h) => (this.downUntil.get(keyOf(h)) ?? 0) <= t);
    return [...up, ...this.hosts.filter((h) => !up.includes(h))];
  }

  markDown(host: DatabaseHost): void {
    this.downUntil.set(keyOf(host), this.now() + HOST_DOWN_MS);
  }
}

function keyOf(host: DatabaseHost): string {
  return `${host.host}:${host.port}`;
}

/** An error shaped like the one net gives, so db-errors.ts reads it as "database unreachable". */
function unreachable(tried: readonly DatabaseHost[], last: Error | undefined): Error {
  const error = new Error(`No database host answered (tried ${tried.map(keyOf).join(', ')}): ${last?.message ?? 'no host'}`);
  return Object.assign(error, { code: 'ECONNREFUSED', cause: last });
}

/**
 * A socket for mysql2's `stream` option: connects to the hosts in `list.order()` one after the
 * other until one accepts, then passes bytes both ways. mysql2 writes nothing before the server's
 * greeting, so nothing is lost while hosts are tried.
 */
export class FailoverSocket extends Duplex {
  /** The host this socket reached; undefined until connected. */
  connectedTo: DatabaseHost | undefined;
  private socket: net.Socket | undefined;

  constructor(
    private readonly list: HostList,
    private readonly perHostTimeoutMs: number,
  ) {
    super();
    this.tryFrom(list.order(), 0, undefined);
  }

  private tryFrom(order: DatabaseHost[], index: number, last: Error | undefined): void {
    if (this.destroyed) return;
    const host = order[index];
    if (!host) {
      this.destroy(unreachable(order, last));
      return;
    }
    const socket = net.connect({ host: host.host, port: host.port });
    socket.setNoDelay(true);
    socket.setTimeout(this.perHostTimeoutMs);
    const giveUp = (error: Error) => {
      socket.destroy();
      this.list.markDown(host);
      this.tryFrom(order, index + 1, error);
    };
    socket.once('timeout', () => giveUp(Object.assign(new Error(`connect to ${keyOf(host)} timed out`), { code: 'ETIMEDOUT' })));
    socket.once('error', giveUp);
    socket.once('connect', () => {
      socket.removeAllListeners('error').removeAllListeners('timeout');
      socket.setTimeout(0);
      socket.setKeepAlive(true, 10_000);
      this.connectedTo = host;
      this.socket = socket;
      socket.on('data', (chunk: Buffer) => {
        if (!this.push(chunk)) socket.pause();
      });
      socket.on('end', () => this.push(null));
      socket.on('error', (error) => this.destroy(error));
      socket.on('close', () => {
        if (!this.destroyed) this.destroy();
      });
      this.emit('connect');
    });
  }

  override _read(): void {
    this.socket?.resume();
  }

  override _write(chunk: Buffer, encoding: BufferEncoding, done: (error?: Error | null) => void): void {
    if (this.socket) this.socket.write(chunk, encoding, done);
    else this.once('connect', () => this.socket!.write(chunk, encoding, done));
  }

  override _final(done: (error?: Error | null) => void): void {
    this.socket?.end();
    done();
  }

  override _destroy(error: Error | null, done: (error?: Error | null) => void): void {
    this.socket?.destroy();
    done(error);
  }
}

/**
 * One row `{ ready: 1 }` when the server takes queries: Galera off (a single server; MariaDB's
 * `wsrep_on` is 0 there), or a Galera node with `wsrep_ready` ON. A node outside the primary
 * component (it lost its quorum, or is still joining) gives `{ ready: 0 }`.
 */
export const NODE_READY_SQL =
  "SELECT (@@global.wsrep_on = 0 OR COALESCE((SELECT VARIABLE_VALUE FROM information_schema.GLOBAL_STATUS WHERE VARIABLE_NAME = 'WSREP_READY'), 'OFF') = 'ON') AS ready";

/** Reads the answer of NODE_READY_SQL. */
export function isReadyAnswer(rows: unknown): boolean {
  return Array.isArray(rows) && Number((rows[0] as { ready?: unknown } | undefined)?.ready) === 1;
}

/**
 * 1047 (the node left the primary component) and 1053 (the server is shutting down): every later
 * query on a connection to that node fails the same way, so such a connection must not go back
 * to the pool.
 */
const NODE_LEAVING_CODES = new Set(['ER_UNKNOWN_COM_ERROR', 'ER_SERVER_SHUTDOWN']);

type Command = { onResult?: (error: unknown, ...rest: unknown[]) => unknown };

/**
 * Once a query on `connection` is refused because its node is leaving, the node is marked down
 * (new connections go to the next host) and the connection is closed when released instead of
 * pooled, so a retry gets a fresh connection rather than the next one to the same node.
 */
export function retireWhenNodeLeaves(connection: CallbackConnection, list: HostList): void {
  const internals = connection as unknown as { addCommand(cmd: Command): unknown; stream?: unknown };
  let leaving = false;
  const addCommand = internals.addCommand.bind(connection);
  internals.addCommand = (cmd: Command) => {
    const onResult = cmd.onResult;
    if (typeof onResult === 'function') {
      cmd.onResult = (error: unknown, ...rest: unknown[]) => {
        const code = (error as { code?: unknown } | null)?.code;
        if (typeof code === 'string' && NODE_LEAVING_CODES.has(code)) {
          leaving = true;
          if (internals.stream instanceof FailoverSocket && internals.stream.connectedTo) list.markDown(internals.stream.connectedTo);
        }
        return onResult.call(cmd, error, ...rest);
      };
    }
    return addCommand(cmd);
  };
  const release = connection.release.bind(connection);
  connection.release = () => (leaving ? connection.destroy() : release());
}

/**
 * Before a new connection's first query, asks the node whether it takes queries
 * (NODE_READY_SQL). A node that is not ready is marked down and the connection closed, so the
 * request fails over to 503 or its retry, and the next connection goes to another node.
 * A connection whose node leaves later is retired (retireWhenNodeLeaves).
 */
export function watchReadiness(pool: CallbackPool, list: HostList): void {
  pool.on('connection', (connection: CallbackConnection) => {
    retireWhenNodeLeaves(connection, list);
    connection.query(NODE_READY_SQL, (error, rows) => {
      if (!error && isReadyAnswer(rows)) return;
      const host = (connection as unknown as { stream?: unknown }).stream;
      if (host instanceof FailoverSocket && host.connectedTo) list.markDown(host.connectedTo);
      connection.destroy();
    });
  });
}
